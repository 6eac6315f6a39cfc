import type { BlockError } from "./types";

export type Fence = { info: string; content: string; line: number; startIdx: number; endIdx: number };

const OPEN = /^ {0,3}(`{3,}|~{3,})[ \t]*([^`\s]*)[^`]*$/;

/** Fenced code blocks of a markdown body (CommonMark fences), with the file line of their first content line. */
export function findFences(body: string, bodyLine: number, errors: BlockError[]): Fence[] {
  const lines = body.split("\n");
  const fences: Fence[] = [];
  for (let i = 0; i < lines.length; i++) {
    const m = OPEN.exec(lines[i].replace(/\r$/, ""));
    if (!m) continue;
    const mark = m[1];
    const close = new RegExp(`^ {0,3}${mark[0] === "`" ? "`" : "~"}{${mark.length},}[ \\t]*$`);
    let j = i + 1;
    while (j < lines.length && !close.test(lines[j].replace(/\r$/, ""))) j++;
    const info = m[2].toLowerCase();
    if (j >= lines.length && (info === "spice" || info === "check"))
      errors.push({ message: `the \`\`\`${info} fence is never closed`, line: bodyLine + i });
    fences.push({ info, content: lines.slice(i + 1, j).join("\n"), line: bodyLine + i + 1, startIdx: i, endIdx: j });
    i = j;
  }
  return fences;
}

/** The body without the given fences (what the page renders as the design note). */
export function withoutFences(body: string, drop: Fence[]): string {
  const lines = body.split("\n");
  const gone = new Set<number>();
  for (const f of drop) for (let i = f.startIdx; i <= f.endIdx; i++) gone.add(i);
  return lines.filter((_, i) => !gone.has(i)).join("\n").replace(/\n{3,}/g, "\n\n").trim() + "\n";
}
