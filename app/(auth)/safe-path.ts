/** Only a path on this site may follow sign-in: never another origin, never a protocol-relative URL. */
export function safePath(raw: unknown, fallback = "/"): string {
  const s = typeof raw === "string" ? raw : "";
  return s.startsWith("/") && !s.startsWith("//") && !s.startsWith("/\\") ? s : fallback;
}
