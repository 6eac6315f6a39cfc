import type { ReferenceObject, SchemaObject } from "openapi3-ts/oas31";

export type AnySchema = SchemaObject | ReferenceObject;

export const refName = (s: AnySchema) => ("$ref" in s && s.$ref ? s.$ref.split("/").pop()! : null);

/** A schema as a short type expression with links to named components, e.g. `Block | null`, `string[]`. */
export function SchemaType({ schema }: { schema: AnySchema | undefined }) {
  if (!schema) return <span>—</span>;
  const name = refName(schema);
  if (name) return <a className="text-copper-dark underline" href={`#schema-${name}`}>{name}</a>;
  const s = schema as SchemaObject;
  const alts = s.oneOf ?? s.anyOf;
  if (alts) return <>{alts.map((a, i) => <span key={i}>{i > 0 ? " | " : ""}<SchemaType schema={a} /></span>)}</>;
  if (s.enum) return <span>{s.enum.map((v) => JSON.stringify(v)).join(" | ")}</span>;
  const types = Array.isArray(s.type) ? s.type : s.type ? [s.type] : [];
  const nullable = types.includes("null");
  const base = types.filter((t) => t !== "null")[0];
  let body;
  if (base === "array") body = <><SchemaType schema={s.items as AnySchema} />[]</>;
  else if (base === "object" && s.additionalProperties && typeof s.additionalProperties === "object")
    body = <>map of <SchemaType schema={s.additionalProperties as AnySchema} /></>;
  else body = <span>{base ?? "any"}{s.format ? ` (${s.format})` : ""}</span>;
  return <>{body}{nullable ? " | null" : ""}</>;
}

/** Bounds and patterns a reader needs to build a valid request. */
export function constraints(schema: AnySchema | undefined): string {
  if (!schema || "$ref" in schema) return "";
  const s = schema;
  const parts: string[] = [];
  if (s.minimum !== undefined) parts.push(`≥ ${s.minimum}`);
  if (s.maximum !== undefined) parts.push(`≤ ${s.maximum}`);
  if (s.minLength !== undefined) parts.push(`length ≥ ${s.minLength}`);
  if (s.maxLength !== undefined) parts.push(`length ≤ ${s.maxLength}`);
  if (s.pattern) parts.push(`pattern ${s.pattern}`);
  if (s.default !== undefined) parts.push(`default ${JSON.stringify(s.default)}`);
  return parts.join(", ");
}
