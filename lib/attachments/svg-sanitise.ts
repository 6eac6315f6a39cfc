import createDOMPurify, { type Config, type DOMPurify } from "dompurify";
import { JSDOM } from "jsdom";

// Uploaded SVG goes through DOMPurify's SVG profile on a server DOM (jsdom): a maintained sanitiser that follows
// what browsers actually parse (CDATA, namespaces, mutation tricks), not a list of our own.
let purifier: { purify: DOMPurify; window: JSDOM["window"] } | undefined;
function shared() {
  if (!purifier) {
    const { window } = new JSDOM("");
    const purify = createDOMPurify(window as unknown as Parameters<typeof createDOMPurify>[0]);
    // A drawing refers only to its own parts: href to a fragment, no style that fetches (DOMPurify leaves CSS alone).
    purify.addHook("uponSanitizeAttribute", (_node, data) => {
      const name = data.attrName.toLowerCase();
      if ((name === "href" || name === "xlink:href") && !data.attrValue.trim().startsWith("#")) data.keepAttr = false;
      if (name === "style" && /url\s*\(\s*['"]?\s*(?!#)|@import|expression\s*\(/i.test(data.attrValue)) data.keepAttr = false;
    });
    purifier = { purify, window };
  }
  return purifier;
}

const OPTIONS: Config & { RETURN_DOM: true } = {
  USE_PROFILES: { svg: true, svgFilters: true },
  FORBID_TAGS: ["style", "foreignObject", "a"], // style sheets and links: a drawing needs neither
  RETURN_DOM: true,
};

/** The SVG with everything but drawing removed, as an XML document; throws when it is not an SVG document. */
export function sanitiseSvg(source: string): string {
  if (/<!DOCTYPE|<!ENTITY/i.test(source)) throw new Error("SVG with a DOCTYPE or entities is refused");
  const { purify, window } = shared();
  const body = purify.sanitize(source, OPTIONS);
  const roots = [...body.children];
  if (roots.length !== 1 || roots[0].localName !== "svg") throw new Error("not an SVG document (the root element must be <svg>)");
  // XML serialisation: the file is served as image/svg+xml on its own, where HTML's serialisation is not valid XML.
  return new window.XMLSerializer().serializeToString(roots[0]);
}
