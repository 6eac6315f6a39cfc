#!/usr/bin/env bash
# npm start: set everything up on this machine and serve Assay on http://127.0.0.1:${PORT:-3000}.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
export ROOT
# shellcheck source=common.sh
source "$ROOT/scripts/common.sh"
cd "$ROOT"

ensure_system_packages
ensure_node_modules
mkdir -p var
export PORT="${PORT:-3000}"
export APP_URL="${APP_URL:-http://127.0.0.1:$PORT}"
export NEXTAUTH_URL="$APP_URL"
export ASSAY_ROOT="$ROOT"
node --import tsx scripts/env-secrets.ts var >/dev/null
node scripts/engine-build.mjs # the CLI and the sandbox child as plain JavaScript, rebuilt when checks/ changed
# Generated once into var/ and never committed.
NEXTAUTH_SECRET="${NEXTAUTH_SECRET:-$(cat var/nextauth-secret)}"; export NEXTAUTH_SECRET
MEILI_MASTER_KEY="${MEILI_MASTER_KEY:-$(cat var/search-key)}"; export MEILI_MASTER_KEY

SUPERVISOR=""
OWN_PG=""
stop_all() {
  trap - INT TERM EXIT
  say "stopping"
  if [ -n "$SUPERVISOR" ]; then kill -TERM "$SUPERVISOR" 2>/dev/null || true; wait "$SUPERVISOR" 2>/dev/null || true; fi
  [ -n "$OWN_PG" ] && pg_stop "$OWN_PG"
  say "stopped; data kept in var/"
}
trap stop_all EXIT
trap "stop_all; exit 0" INT TERM

if [ -z "${DATABASE_URL:-}" ]; then
  export ASSAY_DB_PORT="${ASSAY_DB_PORT:-54329}"
  OWN_PG="$ROOT/var/pg"
  pg_start "$OWN_PG" "$ASSAY_DB_PORT"
fi
db_reachable
npm run -s migrate
npm run -s seed

port_in_use "$PORT" && die "port $PORT is already in use: set PORT to another port"

PARTS=()
if [ -z "${MEILI_URL:-}" ]; then
  export LOCAL_SEARCH_PORT="${LOCAL_SEARCH_PORT:-7700}"
  port_in_use "$LOCAL_SEARCH_PORT" && die "port $LOCAL_SEARCH_PORT (search) is already in use: set LOCAL_SEARCH_PORT"
  export MEILI_URL="http://127.0.0.1:$LOCAL_SEARCH_PORT"
  export LOCAL_SEARCH_DIR="$ROOT/var/search"
  PARTS+=(search "node --import tsx lib/search/server/main.ts")
fi
if [ -z "${SMTP_URL:-}" ]; then
  export LOCAL_SMTP_PORT="${LOCAL_SMTP_PORT:-2525}"
  port_in_use "$LOCAL_SMTP_PORT" && die "port $LOCAL_SMTP_PORT (mail sink) is already in use: set LOCAL_SMTP_PORT"
  export SMTP_URL="smtp://127.0.0.1:$LOCAL_SMTP_PORT"
  export ASSAY_MAIL_SINK_DIR="$ROOT/var/mail"
  PARTS+=(mail "node --import tsx lib/mail/sink-main.ts")
fi

PARTS+=(worker "node --import tsx scripts/worker.ts")
PARTS+=(consumers "node --import tsx scripts/consumers.ts")

if [ ! -f .next/BUILD_ID ] || [ -n "$(find app components lib entities checks migrations next.config.ts package-lock.json -newer .next/BUILD_ID -type f 2>/dev/null | head -1)" ]; then
  say "building the web app"
  node node_modules/next/dist/bin/next build >var/build.log 2>&1 || { tail -40 var/build.log; die "next build failed, see var/build.log"; }
fi

# Started directly (not through npx) so stopping that PID frees the port.
PARTS+=(web "node node_modules/next/dist/bin/next start -H 127.0.0.1 -p $PORT")
# One part that exits is restarted with a growing pause and logged; only Ctrl-C or SIGTERM stops the whole.
export ASSAY_PARTS_FILE="${ASSAY_PARTS_FILE:-$ROOT/var/parts.json}"
node --import tsx scripts/supervise.ts "${PARTS[@]}" & SUPERVISOR=$!
say "Assay is at $APP_URL"
say "demo sign-ins (password assay-demo): iris.calder@fenwick.test (admin), tomas.reyes@fenwick.test (maintainer),"
say "  nadia.okafor@fenwick.test (author), felix.brandt@fenwick.test (viewer), maren.holt@larkspur.test (admin, Larkspur)"
say "Ctrl-C stops everything"
wait "$SUPERVISOR" || true
