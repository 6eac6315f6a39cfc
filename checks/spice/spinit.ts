import fs from "node:fs";
import path from "node:path";

// ngspice translates POLY(n) controlled sources into instances of the spice2poly code model,
// so the engine's start-up file loads that one model and no other: the other code-model
// libraries hold models that read files (filesource, d_source, state machines).
const CODE_MODEL_DIRS = ["/usr/lib/x86_64-linux-gnu/ngspice", "/usr/lib/aarch64-linux-gnu/ngspice", "/usr/lib/ngspice", "/usr/local/lib/ngspice"];
const POLY_MODEL = "spice2poly.cm";

let cached: string | undefined;

/** The engine's spinit: `codemodel …/spice2poly.cm` where ngspice's package installed it, else empty. */
export function engineSpinit(): string {
  if (cached !== undefined) return cached;
  const dirs = process.env.ASSAY_NGSPICE_CODEMODELS ? [process.env.ASSAY_NGSPICE_CODEMODELS] : CODE_MODEL_DIRS;
  const file = dirs.map((d) => path.join(d, POLY_MODEL)).find((f) => fs.existsSync(f));
  return (cached = file ? `codemodel ${file}\n` : "");
}
