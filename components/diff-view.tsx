export type DiffPart = { value: string; added?: boolean; removed?: boolean };

/** How many lines a diff adds and removes. */
export function lineCounts(parts: DiffPart[]): { added: number; removed: number } {
  const lines = (p: DiffPart) => p.value.replace(/\n$/, "").split("\n").length;
  return {
    added: parts.filter((p) => p.added).reduce((n, p) => n + lines(p), 0),
    removed: parts.filter((p) => p.removed).reduce((n, p) => n + lines(p), 0),
  };
}

/** The lines of a diff: removed lines struck in brick with "−", added lines in verdigris with "+", so it reads without colour. */
export function DiffLines({ parts, className = "max-h-[28rem]" }: { parts: DiffPart[]; className?: string }) {
  return (
    <pre className={`${className} overflow-auto py-1 font-mono text-xs leading-5`}>
      {parts.flatMap((p, i) =>
        p.value.replace(/\n$/, "").split("\n").map((line, j) => (
          <div key={`${i}-${j}`} className={p.added ? "bg-verdigris/10 text-verdigris" : p.removed ? "bg-brick/10 text-brick" : "text-graphite"}>
            <span aria-hidden className="inline-block w-6 select-none text-center">{p.added ? "+" : p.removed ? "−" : " "}</span>
            <span className="sr-only">{p.added ? "added: " : p.removed ? "removed: " : ""}</span>{line}
          </div>
        )),
      )}
    </pre>
  );
}

/** A titled line diff, or the word that nothing changed. */
export function DiffView({ title, parts }: { title: string; parts: DiffPart[] }) {
  const changed = parts.some((p) => p.added || p.removed);
  return (
    <section aria-label={`${title} changes`} className="rounded border border-rule bg-panel">
      <h2 className="border-b border-rule px-3 py-1.5 text-sm font-semibold">{title} {changed ? "" : <span className="font-normal text-graphite">— unchanged</span>}</h2>
      {changed ? <DiffLines parts={parts} /> : null}
    </section>
  );
}
