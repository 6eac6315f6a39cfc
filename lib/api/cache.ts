import "server-only";
// Cache policy of the API, in one place.
// - JSON of a head or a version: `no-cache` + a strong ETag over the exact body. A version's text never changes,
//   but its badge, approval, latest report and lineage do, so clients revalidate every time and get 304 while the body
//   is byte-identical.
// - ?format=md / ?format=spice of a numbered version: the text is immutable, so a year and `immutable`.
// - The badge SVG: a minute, so README embeds follow a new verdict soon.
// Team blocks are `private`: a shared cache must never hand one reader's team block to another.
// Everything varies on the credentials, since what a caller may see (lineage, team blocks) depends on who asks.

export type Visibility = "team" | "public";

const scope = (v: Visibility) => (v === "public" ? "public" : "private");

export const VARY = "Authorization, Cookie";

export const revalidateHeaders = (v: Visibility) => ({ "Cache-Control": `${scope(v)}, no-cache`, Vary: VARY });
export const immutableHeaders = (v: Visibility) => ({ "Cache-Control": `${scope(v)}, max-age=31536000, immutable`, Vary: VARY });
export const badgeHeaders = (v: Visibility) => ({ "Cache-Control": `${scope(v)}, max-age=60`, Vary: VARY });
export const noStore = { "Cache-Control": "no-store" };
