import type { Metadata } from "next";
import type { OperationObject, PathItemObject } from "openapi3-ts/oas31";
import { FINER_PROBLEM_TYPES, PROBLEM_BASE, problemTypes } from "@/lib/api/problem";
import { openApiDocument } from "@/lib/openapi/document";
import { tokenRules } from "@/lib/tokens/rules";
import { OperationView } from "./operation-view";
import { SchemaView } from "./schema-view";
import type { AnySchema } from "./schema-type";
import { InlineCode } from "./inline-code";

export const metadata: Metadata = { title: "API reference · Assay" };

const METHODS = ["get", "post", "put", "patch", "delete"] as const;

// Rendered from the same OpenAPI document /api/v1/openapi.json serves, so the page cannot disagree with the API.
export default function ApiDocsPage() {
  const doc = openApiDocument();
  const ops = Object.entries(doc.paths ?? {}).flatMap(([path, item]) =>
    METHODS.filter((m) => (item as PathItemObject)[m]).map((m) => ({ path, method: m, op: (item as PathItemObject)[m] as OperationObject })),
  );
  const schemas = Object.entries((doc.components?.schemas ?? {}) as Record<string, AnySchema>);
  const tokens = tokenRules();
  return (
    <div className="grid gap-8 lg:grid-cols-[14rem_minmax(0,1fr)]">
      <nav aria-label="API sections" className="text-sm lg:sticky lg:top-20 lg:self-start">
        {(doc.tags ?? []).map((t) => (
          <div key={t.name} className="mb-3">
            <p className="text-xs font-semibold uppercase tracking-wide text-graphite">{t.name}</p>
            <ul>
              {ops.filter((o) => o.op.tags?.includes(t.name)).map((o) => (
                <li key={o.op.operationId}><a className="font-mono text-xs text-copper-dark hover:underline" href={`#${o.op.operationId}`}>{o.method.toUpperCase()} {o.path.replace("/api/v1", "")}</a></li>
              ))}
            </ul>
          </div>
        ))}
        <a className="text-xs text-copper-dark underline" href="#schemas">Schemas</a>
      </nav>
      <div className="min-w-0 space-y-8">
        <header className="max-w-[70ch] space-y-2">
          <h1 className="font-serif text-2xl">{doc.info.title} <span className="font-mono text-base text-graphite">v{doc.info.version}</span></h1>
          <p className="font-serif leading-relaxed"><InlineCode text={doc.info.description ?? ""} /></p>
          <p className="text-sm leading-relaxed" data-testid="token-rules">
            Send an API token as <code className="font-mono">Authorization: Bearer $ASSAY_TOKEN</code>. {tokens.create} They are made under{" "}
            <a className="text-copper-dark underline" href="/settings/tokens">Settings → API tokens</a>; on the server itself,{" "}
            <code className="font-mono">npm run -s token -- EMAIL --team SLUG</code> prints one for any member. {tokens.reach} {tokens.manage}
          </p>
          <p className="text-sm leading-relaxed">
            Public blocks answer without credentials; team blocks answer 404 outside their team. The whole description is at{" "}
            <a className="text-copper-dark underline" href="/api/v1/openapi.json">/api/v1/openapi.json</a>.
          </p>
          <p className="text-sm leading-relaxed">
            Caching: Block JSON carries a strong ETag over the exact body with <code className="font-mono">no-cache</code> — send it back in
            <code className="font-mono"> If-None-Match</code> and get 304 while nothing changed (the badge and approval of a version do change).
            <code className="font-mono"> ?format=md</code> of a numbered version never changes and is cached for a year; <code className="font-mono">?format=spice</code> inlines the model files and analyses of the version's latest run, so it is revalidated.
          </p>
        </header>
        <section aria-labelledby="problems" className="max-w-[70ch]">
          <h2 id="problems" className="mb-1 font-serif text-xl">Problem types</h2>
          <p className="text-sm">Every error is <code className="font-mono">application/problem+json</code> (RFC 9457) with one of these <code className="font-mono">type</code>s:</p>
          <ul className="mt-1 font-mono text-xs">
            {[...Object.values(problemTypes), ...Object.keys(FINER_PROBLEM_TYPES)].sort().map((t) => (
              <li key={t}>{t.replace(PROBLEM_BASE, "…/problems/")}{FINER_PROBLEM_TYPES[t] ? <span className="font-sans text-graphite"> <InlineCode text={FINER_PROBLEM_TYPES[t]} /></span> : null}</li>
            ))}
          </ul>
        </section>
        <section aria-labelledby="operations" className="space-y-4">
          <h2 id="operations" className="font-serif text-xl">Operations</h2>
          {ops.map((o) => <OperationView key={o.op.operationId} method={o.method} path={o.path} op={o.op} />)}
        </section>
        <section id="schemas" aria-labelledby="schemas-h" className="space-y-3">
          <h2 id="schemas-h" className="font-serif text-xl">Schemas</h2>
          {schemas.map(([name, s]) => <SchemaView key={name} name={name} schema={s} />)}
        </section>
      </div>
    </div>
  );
}
