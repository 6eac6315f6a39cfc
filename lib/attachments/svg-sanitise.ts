import { XMLBuilder, XMLParser } from "fast-xml-parser";

// Drawing elements only: no script, foreignObject, style sheets, animation or external references.
const ELEMENTS = new Set([
  "svg", "g", "path", "rect", "circle", "ellipse", "line", "polyline", "polygon", "text", "tspan", "textPath", "defs",
  "marker", "title", "desc", "use", "symbol", "linearGradient", "radialGradient", "stop", "clipPath", "mask", "pattern",
]);
const ATTRIBUTES = new Set([
  "xmlns", "xmlns:xlink", "version", "id", "class", "viewBox", "width", "height", "x", "y", "x1", "y1", "x2", "y2", "cx", "cy",
  "r", "rx", "ry", "d", "points", "transform", "fill", "fill-opacity", "fill-rule", "stroke", "stroke-width", "stroke-opacity",
  "stroke-linecap", "stroke-linejoin", "stroke-dasharray", "stroke-dashoffset", "stroke-miterlimit", "opacity", "font-family",
  "font-size", "font-weight", "font-style", "text-anchor", "dominant-baseline", "alignment-baseline", "letter-spacing", "dx", "dy",
  "preserveAspectRatio", "marker-start", "marker-mid", "marker-end", "markerWidth", "markerHeight", "refX", "refY", "orient",
  "markerUnits", "offset", "stop-color", "stop-opacity", "gradientUnits", "gradientTransform", "clip-path", "clipPathUnits",
  "mask", "patternUnits", "patternTransform", "href", "xlink:href", "style", "visibility", "display", "vector-effect",
]);
const A = "@_";

type XNode = Record<string, unknown>;

function safeValue(name: string, value: string): boolean {
  const v = value.replace(/[\s\u0000-\u001f]/g, "").toLowerCase();
  if (name === "href" || name === "xlink:href") return value.startsWith("#");
  if (/javascript:|expression\(|@import|data:|url\((?!#)|url\(['"](?!#)/.test(v)) return false;
  return true;
}

function clean(nodes: XNode[]): XNode[] {
  const out: XNode[] = [];
  for (const node of nodes) {
    if ("#text" in node) {
      out.push(node);
      continue;
    }
    const tag = Object.keys(node).find((k) => k !== ":@");
    if (!tag || !ELEMENTS.has(tag)) continue;
    const attrs = (node[":@"] ?? {}) as Record<string, string>;
    const kept: Record<string, string> = {};
    for (const [k, v] of Object.entries(attrs)) {
      const name = k.slice(A.length);
      if (ATTRIBUTES.has(name) && safeValue(name, String(v))) kept[k] = String(v);
    }
    out.push({ [tag]: clean((node[tag] ?? []) as XNode[]), ...(Object.keys(kept).length ? { ":@": kept } : {}) });
  }
  return out;
}

/** An SVG reduced to drawing elements and presentation attributes; throws when it is not an SVG document. */
export function sanitiseSvg(source: string): string {
  if (/<!DOCTYPE|<!ENTITY/i.test(source)) throw new Error("SVG with a DOCTYPE or entities is refused");
  const parser = new XMLParser({ preserveOrder: true, ignoreAttributes: false, attributeNamePrefix: A, processEntities: false, trimValues: false });
  const tree = parser.parse(source) as XNode[];
  const roots = tree.filter((n) => !("#text" in n) && !Object.keys(n).some((k) => k.startsWith("?")));
  if (roots.length !== 1 || !("svg" in roots[0])) throw new Error("not an SVG document (the root element must be <svg>)");
  const cleaned = clean(roots);
  const svg = cleaned[0];
  const attrs = (svg[":@"] ?? {}) as Record<string, string>;
  svg[":@"] = { ...attrs, [`${A}xmlns`]: "http://www.w3.org/2000/svg" };
  const builder = new XMLBuilder({ preserveOrder: true, ignoreAttributes: false, attributeNamePrefix: A, suppressEmptyNode: true, processEntities: false });
  return builder.build(cleaned) as string;
}
