export type DiffPart = { value: string; added?: boolean; removed?: boolean };

/** A line diff: removed lines struck in brick with "−", added lines in verdigris with "+", so it reads without colour. */
export function DiffView({ title, parts }: { title: string; parts: DiffPart[] }) {
  const changed = parts.some((p) => p.added || p.removed);
  return (
    <section aria-label={`${title} changes`} className="rounded border border-rule bg-panel">
      <h2 className="border-b border-rule px-3 py-1.5 text-sm font-semibold">{title} {changed ? "" : <span className="font-normal text-graphite">— unchanged</span>}</h2>
      {changed ? (
        <pre className="max-h-[28rem] overflow-auto py-1 font-mono text-xs leading-5">
          {parts.flatMap((p, i) =>
            p.value.replace(/\n$/, "").split("\n").map((line, j) => (
              <div key={`${i}-${j}`} className={p.added ? "bg-verdigris/10 text-verdigris" : p.removed ? "bg-brick/10 text-brick" : "text-graphite"}>
                <span aria-hidden className="inline-block w-6 select-none text-center">{p.added ? "+" : p.removed ? "−" : " "}</span>
                <span className="sr-only">{p.added ? "added: " : p.removed ? "removed: " : ""}</span>{line}
              </div>
            )),
          )}
        </pre>
      ) : null}
    </section>
  );
}
