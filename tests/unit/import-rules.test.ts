import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { cruise } from "dependency-cruiser";

// The rules of .dependency-cruiser.cjs (run over the real tree by `npm test`) applied to a small tree of our own:
// each planted back-import must be refused by its rule, and the same tree without them must pass.
const { forbidden } = createRequire(import.meta.url)(path.resolve(".dependency-cruiser.cjs")) as { forbidden: unknown[] };

let dir: string;
const put = (file: string, text: string) => {
  mkdirSync(path.dirname(path.join(dir, file)), { recursive: true });
  writeFileSync(path.join(dir, file), text);
};

async function violations(): Promise<string[]> {
  const cwd = process.cwd();
  process.chdir(dir); // rule paths are relative to the cruise's working directory
  try {
    const result = await cruise(["app", "lib", "components", "checks", "scripts"], {
      validate: true, ruleSet: { forbidden } as never, doNotFollow: { path: "node_modules" }, outputType: "json",
    });
    const out = typeof result.output === "string" ? JSON.parse(result.output) : result.output;
    return (out.summary.violations as { rule: { name: string }; from: string; to: string }[]).map((v) => `${v.rule.name}: ${v.from} → ${v.to}`).sort();
  } finally {
    process.chdir(cwd);
  }
}

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), "assay-import-rules-"));
  put("node_modules/server-only/package.json", JSON.stringify({ name: "server-only", main: "index.js" }));
  put("node_modules/server-only/index.js", "throw new Error('server-only');\n");
  put("checks/engine.js", "export const run = (text) => text.length;\n");
  put("lib/next-only.js", "import 'server-only';\nexport const pageThing = 1;\n");
  put("lib/service.js", "import { run } from '../checks/engine.js';\nexport const service = (t) => run(t);\n");
  put("app/page.js", "import { service } from '../lib/service.js';\nimport { pageThing } from '../lib/next-only.js';\nexport default () => service('x') + pageThing;\n");
  put("components/view.js", "import { service } from '../lib/service.js';\nexport const View = () => service('y');\n");
  put("scripts/cli.js", "import { service } from '../lib/service.js';\nservice('z');\n");
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("the import rules", () => {
  it("pass a tree whose arrows run app → lib → checks", async () => {
    expect(await violations()).toEqual([]);
  });

  it("refuse each planted back-import by its own rule", async () => {
    put("components/planted.js", "import Page from '../app/page.js';\nexport const x = Page;\n");
    put("checks/planted.js", "import { service } from '../lib/service.js';\nexport const y = service;\n");
    put("lib/planted.js", "import { View } from '../components/view.js';\nexport const z = View;\n");
    put("scripts/planted.js", "import { pageThing } from '../lib/next-only.js';\nconsole.log(pageThing);\n");
    expect(await violations()).toEqual([
      "checks-stands-alone: checks/planted.js → lib/service.js",
      "components-do-not-import-app: components/planted.js → app/page.js",
      "lib-does-not-import-app-or-components: lib/planted.js → components/view.js",
      "worker-and-clis-run-without-server-only: scripts/planted.js → node_modules/server-only/index.js",
    ]);
  });
});
