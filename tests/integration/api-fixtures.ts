import { randomBytes } from "node:crypto";
import { readFileSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { encode } from "next-auth/jwt";
import createClient from "openapi-fetch";
import { MembershipSchema, TeamSchema, UserSchema, type Role } from "@/entities";
import { closeOrm, getEm } from "@/lib/db/orm";
import { startSearchServer } from "@/lib/search/server";
import { createToken } from "@/lib/tokens/tokens";
import { startApp, startWorker, type AppServer } from "../support/app-server";

// Shared set-up of the API tests: two teams of their own, one person per role, tokens, the built app, a search
// server and a worker. Names carry a random tag so these tests share the database with others without clashing.

export const ROLES_IN_ORDER: Role[] = ["viewer", "author", "maintainer", "admin"];

export interface Person {
  id: number;
  email: string;
  write: string;
  read: string;
}

export interface ApiWorld {
  tag: string;
  teamA: { id: number; slug: string };
  teamB: { id: number; slug: string };
  people: Record<Role, Person>;
  outsider: Person;
  app: AppServer;
  secret: string;
  client: ReturnType<typeof createClient<AnyPaths>>;
  cookieFor: (userId: number) => Promise<string>;
  stop: () => Promise<void>;
}

// The client fills in paths and queries; what comes back is checked by the zod schemas the OpenAPI document is
// built from (lib/openapi/responses.ts), so the tests hold the server to the contract at run time, not just tsc.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type AnyPaths = Record<string, any>;

const tagOf = () => randomBytes(3).toString("hex");

async function person(teamId: number, role: Role, tag: string): Promise<Person> {
  const em = await getEm();
  const email = `${role}-${tag}@fenwick.test`;
  const user = em.create(UserSchema, { email, name: `${role[0].toUpperCase()}${role.slice(1)} ${tag}`, passwordHash: null });
  await em.flush();
  em.create(MembershipSchema, { user, team: teamId, role });
  await em.flush();
  const write = await createToken(em, { userId: user.id, teamId, name: "api test write", scope: "write", expiresAt: null });
  const read = await createToken(em, { userId: user.id, teamId, name: "api test read", scope: "read", expiresAt: null });
  return { id: user.id, email, write: write.token, read: read.token };
}

/** `env` adds variables for the app only (e.g. small engine budgets for the rate-limit test). */
export async function makeWorld(opts: { worker?: boolean; env?: Record<string, string> } = {}): Promise<ApiWorld> {
  const tag = tagOf();
  const em = await getEm();
  const a = em.create(TeamSchema, { slug: `api-fen-${tag}`, name: `Fenwick Analog Works ${tag}` });
  const b = em.create(TeamSchema, { slug: `api-lark-${tag}`, name: `Larkspur Instruments ${tag}` });
  await em.flush();
  const people = {} as Record<Role, Person>;
  for (const role of ROLES_IN_ORDER) people[role] = await person(a.id, role, tag);
  const outsider = await person(b.id, "admin", `${tag}-b`);

  const searchDir = mkdtempSync(path.join(tmpdir(), "assay-api-search-"));
  const searchKey = randomBytes(16).toString("hex");
  const search = await startSearchServer({ port: 0, key: searchKey, dir: searchDir });
  const secret = randomBytes(32).toString("base64url");
  const env = { MEILI_URL: search.url, MEILI_MASTER_KEY: searchKey, NEXTAUTH_SECRET: secret, ASSAY_SEARCH_INDEX: `blocks-${tag}` };
  // The test process indexes too (processIndexBacklog), so it must point at the same server and index.
  Object.assign(process.env, env);
  const app = await startApp({ env: { ...env, ...opts.env } });
  const worker = opts.worker ? startWorker({ env }) : null;
  return {
    tag,
    teamA: { id: a.id, slug: a.slug },
    teamB: { id: b.id, slug: b.slug },
    people,
    outsider,
    app,
    secret,
    client: createClient<AnyPaths>({ baseUrl: app.url }),
    cookieFor: async (userId) => `next-auth.session-token=${await encode({ token: { sub: String(userId) }, secret })}`,
    stop: async () => {
      await worker?.stop();
      await app.stop();
      await search.close();
      rmSync(searchDir, { recursive: true, force: true });
      await closeOrm();
    },
  };
}

const RC = readFileSync(path.resolve("content/blocks/rc-lowpass-antialias.md"), "utf8");

/** Our demo RC low-pass under a new slug: a real block whose checks pass (equations, corners and an AC sweep). */
export const rcBlockText = (slug: string) => RC.replace(/^slug: .*$/m, `slug: ${slug}`);

export const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });
