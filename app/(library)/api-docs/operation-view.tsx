import type { OperationObject, ParameterObject, RequestBodyObject, ResponseObject } from "openapi3-ts/oas31";
import { constraints, SchemaType, type AnySchema } from "./schema-type";
import { InlineCode } from "./inline-code";

function MediaList({ content }: { content: Record<string, { schema?: AnySchema }> | undefined }) {
  if (!content) return null;
  return (
    <ul className="mt-0.5 space-y-0.5">
      {Object.entries(content).map(([type, media]) => (
        <li key={type} className="font-mono text-xs"><span className="text-graphite">{type}</span> <SchemaType schema={media.schema} /></li>
      ))}
    </ul>
  );
}

/** One operation: method and path, what it does, its parameters, body and answers. */
export function OperationView({ method, path, op }: { method: string; path: string; op: OperationObject }) {
  const params = (op.parameters ?? []) as ParameterObject[];
  const body = op.requestBody as RequestBodyObject | undefined;
  const anonymousOnly = op.security?.length === 1 && Object.keys(op.security[0]).length === 0;
  return (
    <article id={op.operationId} className="scroll-mt-20 rounded border border-rule bg-panel p-4">
      <h3 className="flex flex-wrap items-baseline gap-2 font-mono text-sm">
        <span className="rounded bg-copper-pale px-1.5 py-0.5 font-semibold uppercase text-copper-dark">{method}</span>
        <span className="break-all">{path}</span>
      </h3>
      <p className="mt-1 font-serif">{op.summary}</p>
      {op.description ? <p className="mt-1 text-sm text-graphite"><InlineCode text={op.description} /></p> : null}
      {anonymousOnly ? <p className="mt-1 text-xs text-graphite">No credentials needed.</p> : null}
      {params.length ? (
        <table className="mt-3 w-full text-left text-sm">
          <caption className="text-left text-xs font-semibold uppercase tracking-wide text-graphite">Parameters</caption>
          <tbody>
            {params.map((p) => (
              <tr key={`${p.in}-${p.name}`} className="border-t border-rule align-top">
                <td className="py-1 pr-3 font-mono text-xs">{p.name}{p.required ? "" : "?"}</td>
                <td className="py-1 pr-3 text-xs text-graphite">{p.in}</td>
                <td className="py-1 pr-3 font-mono text-xs"><SchemaType schema={p.schema as AnySchema} /></td>
                <td className="py-1 text-xs text-graphite"><InlineCode text={[p.description, constraints(p.schema as AnySchema)].filter(Boolean).join(" · ")} /></td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {body ? (
        <div className="mt-3">
          <h4 className="text-xs font-semibold uppercase tracking-wide text-graphite">Body{body.required ? "" : " (optional)"}</h4>
          <MediaList content={body.content as never} />
        </div>
      ) : null}
      <div className="mt-3">
        <h4 className="text-xs font-semibold uppercase tracking-wide text-graphite">Responses</h4>
        <ul className="mt-1 space-y-1">
          {Object.entries(op.responses as Record<string, ResponseObject>).map(([status, res]) => (
            <li key={status} className="text-sm">
              <span className="font-mono font-semibold">{status}</span> <InlineCode text={res.description ?? ""} />
              <MediaList content={res.content as never} />
            </li>
          ))}
        </ul>
      </div>
    </article>
  );
}
