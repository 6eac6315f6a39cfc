import { appUrl } from "@/lib/auth/config";

/**
 * The API panel of the block page: ready `curl` lines for this block. The token stays a shell variable
 * (`$ASSAY_TOKEN`) so nothing secret is ever printed on the page; public blocks answer without it too.
 */
export function ApiPanel({ slug, version, isHead = true, visibility, baseUrl = appUrl() }: {
  slug: string;
  version: number;
  isHead?: boolean;
  visibility: "team" | "public";
  baseUrl?: string;
}) {
  const api = `${baseUrl}/api/v1/blocks/${slug}`;
  const auth = `-H "Authorization: Bearer $ASSAY_TOKEN"`;
  const lines = [
    { label: "The head as JSON", cmd: `curl -s ${auth} "${api}"` },
    { label: `Version ${version}, immutable (revalidate with If-None-Match)`, cmd: `curl -s ${auth} "${api}/versions/${version}"` },
    { label: "The SPICE deck, saved under its own name", cmd: `curl -sOJ ${auth} "${api}/versions/${version}?format=spice"` },
    { label: "The block file", cmd: `curl -s ${auth} "${api}/versions/${version}?format=md"` },
  ];
  return (
    <details className="group rounded border border-rule bg-panel p-3" data-testid="api-panel">
      <summary className="cursor-pointer text-xs font-semibold uppercase tracking-wide text-graphite">
        API <span className="font-normal normal-case tracking-normal">· curl lines for scripts and the README badge</span>
      </summary>
      <ul className="mt-2 space-y-2">
        {lines.map((l) => (
          <li key={l.label}>
            <p className="text-xs text-graphite">{l.label}</p>
            <pre className="whitespace-pre-wrap break-all rounded border border-rule bg-paper px-2 py-1 font-mono text-xs select-all"><code>{l.cmd}</code></pre>
          </li>
        ))}
      </ul>
      {visibility === "public" ? (
        <p className="mt-2 text-xs text-graphite">
          Badge for a README: <code className="font-mono select-all break-all">{`![assay](${api}/badge.svg${isHead ? "" : `?version=${version}`})`}</code>
        </p>
      ) : (
        <p className="mt-2 text-xs text-graphite">A team block: the token must belong to a member of its team.</p>
      )}
      <p className="mt-2 text-xs">
        <a className="text-copper-dark underline" href="/api-docs">API reference</a> · <a className="text-copper-dark underline" href="/api/v1/openapi.json">OpenAPI document</a>
      </p>
    </details>
  );
}
