// Reading a model file or circuit for what it defines and includes, and inlining includes into one deck.

export type ModelDefinition = { kind: "subckt" | "model"; name: string; type?: string };

const lines = (text: string) => text.replace(/\r\n?/g, "\n").split("\n");
const INCLUDE = /^\s*\.inc(?:lude)?\s+["']?([^"'\s;]+)["']?/i;

/** The `.subckt` and `.model` names a file defines, in file order (as a team's library lists them). */
export function modelDefinitions(text: string): ModelDefinition[] {
  const out: ModelDefinition[] = [];
  for (const l of lines(text)) {
    const sub = /^\s*\.subckt\s+([^\s(]+)/i.exec(l);
    if (sub) out.push({ kind: "subckt", name: sub[1] });
    const model = /^\s*\.model\s+([^\s(]+)\s+([A-Za-z_][\w]*)/i.exec(l);
    if (model) out.push({ kind: "model", name: model[1], type: model[2].toLowerCase() });
  }
  return out;
}

/** The names a circuit or model file pulls in with `.include NAME`, each once, in order. */
export function includedNames(text: string): string[] {
  const out: string[] = [];
  for (const l of lines(text)) {
    const m = INCLUDE.exec(l);
    if (m && !out.includes(m[1])) out.push(m[1]);
  }
  return out;
}

export type InlineModel = { text: string; sha256: string };

/**
 * A circuit with each `.include NAME` replaced by that file's text between two comment lines naming it and its
 * sha256; a file included again (directly or by another file) is inlined once. Names not in `models` are left.
 */
export function inlineIncludes(circuit: string, models: Record<string, InlineModel>, done = new Set<string>()): string {
  return lines(circuit).map((l) => {
    const name = INCLUDE.exec(l)?.[1];
    if (!name || !Object.hasOwn(models, name)) return l;
    if (done.has(name)) return `* ${name} is inlined above`;
    done.add(name);
    const m = models[name];
    const body = inlineIncludes(m.text.replace(/\s+$/, ""), models, done);
    return [`* ---- model file ${name} sha256 ${m.sha256}`, body, `* ---- end of ${name}`].join("\n");
  }).join("\n");
}
