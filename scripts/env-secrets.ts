import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";

// Development secrets are generated once into var/ (git-ignored); the environment always wins.
const dir = process.argv[2] ?? "var";
mkdirSync(dir, { recursive: true });
for (const name of ["nextauth-secret", "search-key"]) {
  const file = path.join(dir, name);
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString("hex"), { mode: 0o600 });
}
