import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";

/** Every `METHOD /api/v1/...` the app serves, read from the route files themselves (Next's [param] segments kept). */
export function servedRoutes(): string[] {
  const root = path.resolve("app/api/v1");
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const name of readdirSync(dir)) {
      const full = path.join(dir, name);
      if (statSync(full).isDirectory()) walk(full);
      else if (/^route\.(ts|tsx|js)$/.test(name)) {
        const src = readFileSync(full, "utf8");
        const url = "/api/v1" + path.relative(root, dir).split(path.sep).map((s) => `/${s}`).join("").replace(/^\/$/, "");
        for (const m of src.matchAll(/export\s+(?:const|async\s+function|function)\s+(GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS)\b/g)) out.push(`${m[1]} ${url}`);
      }
    }
  };
  walk(root);
  return out.sort();
}

/** The same routes as OpenAPI spells them: `get /api/v1/blocks/{slug}`. */
export const asOpenApi = (r: string) => {
  const [method, url] = r.split(" ");
  return `${method.toLowerCase()} ${url.replace(/\[([^\]]+)\]/g, "{$1}")}`;
};
