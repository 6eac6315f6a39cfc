// The one list of badge states a version can carry (DESIGN.md), shared by the API schema, the derivation in
// lib/runs/badge.ts and the pages.
export const BADGES = ["unchecked", "pending", "verified", "failing", "error", "stale"] as const;
export type Badge = (typeof BADGES)[number];
