// Block documents of the demo teams (Fenwick Analog Works, Larkspur
// Instruments) in the shape Assay indexes, plus the fields the filter checks
// need: `hazard` absent, empty, null and set; `owner` with spaces in values.
export const blockDocs = [
  { id: 1, slug: "wien-bridge-sine", title: "Wien bridge oscillator", summary: "Low-distortion sine source with lamp amplitude control", tags: ["sine", "audio"], category: "oscillator", badge: "verified", approved: true, team: "fenwick", teamId: 1, visibility: "public", version: 3, owner: "Mara Quill", updatedAt: 1_700_000_003_000 },
  { id: 2, slug: "precision-diode-clamp", title: "Precision diode clamp", summary: "Clamps a sensor input to the supply rails", tags: ["clamp", "protection"], category: "limiter", badge: "failing", approved: false, team: "fenwick", teamId: 1, visibility: "team", version: 1, owner: "Teodor Vance", hazard: [], updatedAt: 1_700_000_006_000 },
  { id: 3, slug: "sallen-key-lowpass", title: "Sallen-Key low-pass filter", summary: "Second-order active filter for anti-alias duty", tags: ["anti-alias", "active"], category: "filter", badge: "verified", approved: true, team: "larkspur", teamId: 2, visibility: "public", version: 7, owner: "Mara Quill", hazard: null, updatedAt: 1_700_000_001_000 },
  { id: 4, slug: "bandgap-reference", title: "Bandgap voltage reference", summary: "Temperature-stable reference for data converters", tags: ["Precision"], category: "reference", badge: "pending", approved: false, team: "larkspur", teamId: 2, visibility: "team", version: 2, owner: "Ines Harrow", hazard: ["heat"], updatedAt: 1_700_000_005_000 },
  { id: 5, slug: "phase-shift-sine", title: "Phase shift oscillator", summary: "Three RC sections and one gain stage", tags: ["sine"], category: "oscillator", badge: "stale", approved: false, team: "fenwick", teamId: 1, visibility: "public", version: 5, owner: "Teodor Vance", hazard: ["mains", "high-voltage"], updatedAt: 1_700_000_002_000 },
  { id: 6, slug: "soft-zener-limiter", title: "Soft zener limiter", summary: "Rounds the peaks of a line level signal", tags: [], category: "limiter", badge: "unchecked", approved: true, team: "larkspur", teamId: 2, visibility: "public", version: 4, owner: "Ines Harrow", hazard: ["high-current"], updatedAt: 1_700_000_004_000 },
];

// Assay's own index settings (lib/search/settings.ts) plus the fixture-only fields.
export const blockSettings = {
  searchableAttributes: ["title", "summary", "tags", "params", "body"],
  filterableAttributes: ["category", "badge", "tags", "team", "teamId", "visibility", "approved", "version", "hazard", "owner"],
  sortableAttributes: ["updatedAt", "title", "version"],
  displayedAttributes: ["*"],
};
