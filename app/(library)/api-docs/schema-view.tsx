import type { SchemaObject } from "openapi3-ts/oas31";
import { constraints, SchemaType, type AnySchema } from "./schema-type";
import { InlineCode } from "./inline-code";

/** One named component: its properties as a table (name, type, required, what it means). */
export function SchemaView({ name, schema }: { name: string; schema: AnySchema }) {
  const s = schema as SchemaObject;
  const props = Object.entries((s.properties ?? {}) as Record<string, AnySchema>);
  const required = new Set(s.required ?? []);
  return (
    <section id={`schema-${name}`} className="scroll-mt-20 rounded border border-rule bg-panel p-3">
      <h3 className="font-mono text-sm font-semibold">{name}</h3>
      {s.description ? <p className="mt-1 text-sm text-graphite"><InlineCode text={s.description} /></p> : null}
      {props.length ? (
        <table className="mt-2 w-full text-left text-sm">
          <thead className="text-xs text-graphite">
            <tr><th className="py-1 pr-3 font-medium">field</th><th className="py-1 pr-3 font-medium">type</th><th className="py-1 font-medium">notes</th></tr>
          </thead>
          <tbody>
            {props.map(([field, p]) => {
              const desc = "$ref" in p ? "" : (p.description ?? "");
              const extra = constraints(p);
              return (
                <tr key={field} className="border-t border-rule align-top">
                  <td className="py-1 pr-3 font-mono text-xs">{field}{required.has(field) ? "" : "?"}</td>
                  <td className="py-1 pr-3 font-mono text-xs"><SchemaType schema={p} /></td>
                  <td className="py-1 text-xs text-graphite"><InlineCode text={[desc, extra].filter(Boolean).join(" · ")} /></td>
                </tr>
              );
            })}
          </tbody>
        </table>
      ) : (
        <p className="mt-1 font-mono text-xs"><SchemaType schema={schema} /></p>
      )}
    </section>
  );
}
