#!/usr/bin/env bash
# npm test: the same installs as npm start, then every suite. Test services use temp dirs and free ports,
# so this runs beside a running npm start; global-setup removes them at the end, pass or fail.
set -euo pipefail
ROOT="$(cd "$(dirname "$0")/.." && pwd)"
export ROOT
# shellcheck source=common.sh
source "$ROOT/scripts/common.sh"
cd "$ROOT"

export ASSAY_E2E=1
ensure_system_packages
ensure_node_modules
export ASSAY_ROOT="$ROOT"
node scripts/engine-build.mjs # the CLI and the sandbox child as plain JavaScript, rebuilt when checks/ changed
export VITE_CONFIG_NATIVE_IGNORE_WARNING=true

status=0
say "type check"
npx tsc --noEmit -p . || status=$?
say "import rules (.dependency-cruiser.cjs)"
npm run -s lint:imports || status=$?
say "unit and integration tests"
npx vitest run || status=$?
if [ -f vitest.e2e.config.mts ] && [ "$status" -eq 0 ]; then
  say "browser tests"
  npx vitest run --config vitest.e2e.config.mts || status=$?
fi
exit "$status"
