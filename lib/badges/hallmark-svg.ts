// The hallmark: a rounded, elongated hexagon struck with the state word and the version, as in an assay office.
// Each state has its own fill, edge and glyph so the mark reads without colour; the approved seal sits beside it.

export type BadgeState = "unchecked" | "pending" | "verified" | "failing" | "error" | "stale";

export interface HallmarkInput {
  badge: BadgeState;
  version: number | null;
  approved?: boolean;
  /** Used to keep pattern ids unique when several marks share one HTML page. */
  idPrefix?: string;
}

interface Look {
  fill: string;
  stroke: string;
  ink: string;
  dash?: string;
  hatch?: boolean;
  inset?: "solid" | "dotted";
  glyph: (x: number, y: number, ink: string) => string;
}

const INK = "#1d2430";
const H = 22;
const POINT = 8;

const check = (x: number, y: number, c: string) =>
  `<path d="M${x - 3.5} ${y} l2.4 2.6 l4.6 -5.2" fill="none" stroke="${c}" stroke-width="1.8" stroke-linecap="round" stroke-linejoin="round"/>`;
const cross = (x: number, y: number, c: string) =>
  `<path d="M${x - 3} ${y - 3} l6 6 M${x + 3} ${y - 3} l-6 6" stroke="${c}" stroke-width="1.8" stroke-linecap="round"/>`;
const bang = (x: number, y: number, c: string) =>
  `<path d="M${x} ${y - 4} v4.6" stroke="${c}" stroke-width="1.9" stroke-linecap="round"/><circle cx="${x}" cy="${y + 3.4}" r="1.1" fill="${c}"/>`;
const clock = (x: number, y: number, c: string) =>
  `<circle cx="${x}" cy="${y}" r="4" fill="none" stroke="${c}" stroke-width="1.3"/><path d="M${x} ${y - 2.3} V${y} l1.8 1.2" fill="none" stroke="${c}" stroke-width="1.3" stroke-linecap="round"/>`;
const ring = (x: number, y: number, c: string) =>
  `<circle cx="${x}" cy="${y}" r="3.5" fill="none" stroke="${c}" stroke-width="1.3" stroke-dasharray="1.6 1.6"/>`;
const hourglass = (x: number, y: number, c: string) =>
  `<path d="M${x - 3} ${y - 4} h6 l-6 8 h6 z" fill="none" stroke="${c}" stroke-width="1.3" stroke-linejoin="round"/>`;

const LOOKS: Record<BadgeState, Look> = {
  verified: { fill: "#2f7d70", stroke: "#1f5a50", ink: "#ffffff", inset: "solid", glyph: check },
  failing: { fill: "#a8412f", stroke: "#7a2c1f", ink: "#ffffff", glyph: cross },
  pending: { fill: "#fffaf0", stroke: "#b7862a", ink: "#6e4f12", dash: "4 2", glyph: clock },
  stale: { fill: "#d5dbe1", stroke: "#5b6874", ink: "#28323c", hatch: true, glyph: hourglass },
  error: { fill: "#6d3a66", stroke: "#4b2746", ink: "#ffffff", inset: "dotted", glyph: bang },
  unchecked: { fill: "none", stroke: "#8a9097", ink: "#5a6068", glyph: ring },
};

const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

// Text width estimate for an 11px sans (there is no font metrics on the server); generous so text never clips.
const textWidth = (s: string, perChar = 7.3) => Math.ceil(s.length * perChar + 2);

/** Hexagon with pointed ends and rounded corners (r) inset by `d` from the outer box. */
function hexPath(w: number, d: number): string {
  const top = d;
  const bottom = H - d;
  const mid = H / 2;
  const left = d * 0.8;
  const right = w - d * 0.8;
  const p = POINT - d * 0.4;
  const r = 2;
  return [
    `M${left + r * 0.6} ${mid - r * 0.8}`,
    `L${left + p - r} ${top + r * 0.3}`,
    `Q${left + p} ${top} ${left + p + r} ${top}`,
    `L${right - p - r} ${top}`,
    `Q${right - p} ${top} ${right - p + r} ${top + r * 0.3}`,
    `L${right - r * 0.6} ${mid - r * 0.8}`,
    `Q${right} ${mid} ${right - r * 0.6} ${mid + r * 0.8}`,
    `L${right - p + r} ${bottom - r * 0.3}`,
    `Q${right - p} ${bottom} ${right - p - r} ${bottom}`,
    `L${left + p + r} ${bottom}`,
    `Q${left + p} ${bottom} ${left + p - r} ${bottom - r * 0.3}`,
    `L${left + r * 0.6} ${mid + r * 0.8}`,
    `Q${left} ${mid} ${left + r * 0.6} ${mid - r * 0.8}`,
    "Z",
  ].join(" ");
}

/**
 * The approval seal: an ink countermark struck beside the state, as an assay office strikes its sponsor's mark:
 * a rounded-square cartouche, double-ruled, holding a serif "A". No rays, no scallops, no tick.
 */
function seal(x: number): string {
  const s = H - 2;
  const y = 1;
  return `<g class="seal"><rect x="${x}" y="${y}" width="${s}" height="${s}" rx="3.5" fill="#fffdf8" stroke="${INK}" stroke-width="1.4"/>` +
    `<rect x="${x + 2.6}" y="${y + 2.6}" width="${s - 5.2}" height="${s - 5.2}" rx="1.6" fill="none" stroke="${INK}" stroke-width="0.7"/>` +
    `<text x="${x + s / 2}" y="${y + s / 2 + 4.4}" text-anchor="middle" font-size="12.5" font-weight="600" fill="${INK}" font-family="Literata, Georgia, serif">A</text></g>`;
}

// Every mark has the same width (the longest word and a three-digit version), so a column of marks aligns.
const WORD_SLOT = textWidth("unchecked");
const VERSION_SLOT = textWidth("v999", 6.8) + 4;

export function hallmarkSvg({ badge, version, approved = false, idPrefix = "hm" }: HallmarkInput): string {
  const look = LOOKS[badge] ?? LOOKS.unchecked;
  const word = badge;
  const ver = version == null ? "" : `v${version}`;
  const glyphX = POINT + 7;
  const wordX = glyphX + 9;
  const verX = wordX + WORD_SLOT + 9;
  const verW = Math.max(VERSION_SLOT, ver ? textWidth(ver, 6.8) : 0);
  const w = Math.ceil(verX + verW + POINT + 3);
  const total = approved ? w + 4 + H - 2 : w;
  const label = `assay ${word}${ver ? `, version ${version}` : ""}${approved ? ", approved" : ""}`;
  const hatchId = `${idPrefix}-hatch`;
  const defs = look.hatch
    ? `<defs><pattern id="${hatchId}" width="4" height="4" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><rect width="4" height="4" fill="${look.fill}"/><line x1="0" y1="0" x2="0" y2="4" stroke="${look.stroke}" stroke-width="0.9" stroke-opacity="0.55"/></pattern></defs>`
    : "";
  const fill = look.hatch ? `url(#${hatchId})` : look.fill;
  const outer = `<path d="${hexPath(w, 0.75)}" fill="${fill}" stroke="${look.stroke}" stroke-width="${look.dash ? 1.6 : 1.2}"${look.dash ? ` stroke-dasharray="${look.dash}"` : ""}/>`;
  const inset = look.inset
    ? `<path d="${hexPath(w, 2.6)}" fill="none" stroke="${look.ink}" stroke-opacity="0.75" stroke-width="0.8"${look.inset === "dotted" ? ' stroke-dasharray="1 1.6"' : ""}/>`
    : "";
  const text = `font-size="11" fill="${look.ink}"`;
  const sans = `font-family="Inter, 'DejaVu Sans', Verdana, sans-serif"`;
  const rule = ver ? `<path d="M${verX - 5} 6 V${H - 6}" stroke="${look.ink}" stroke-opacity="0.6" stroke-width="0.8"/>` : "";
  const verText = ver ? `<text x="${verX + verW / 2}" text-anchor="middle" y="15" ${text} font-family="'IBM Plex Mono', 'DejaVu Sans Mono', monospace">${esc(ver)}</text>` : "";
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${total}" height="${H}" viewBox="0 0 ${total} ${H}" role="img" aria-label="${esc(label)}" data-badge="${esc(word)}">`,
    `<title>${esc(label)}</title>`,
    defs,
    outer,
    inset,
    look.glyph(glyphX, H / 2, look.ink),
    `<text x="${wordX}" y="15" ${text} ${sans} font-weight="600" letter-spacing="0.2">${esc(word)}</text>`,
    rule,
    verText,
    approved ? seal(w + 4) : "",
    "</svg>",
  ].join("");
}
