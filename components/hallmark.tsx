import { hallmarkSvg, type BadgeState } from "@/lib/badges/hallmark-svg";

/** The state mark: the same SVG the API serves as the embeddable badge, struck inline. */
export function Hallmark({ badge, version, approved = false, id, className }: {
  badge: string; version: number | null; approved?: boolean; id?: string; className?: string;
}) {
  const svg = hallmarkSvg({ badge: badge as BadgeState, version, approved, idPrefix: id ?? `hm-${badge}-${version ?? "x"}` });
  return <span className={`inline-flex align-middle ${className ?? ""}`} data-testid="hallmark" data-badge={badge} dangerouslySetInnerHTML={{ __html: svg }} />;
}
