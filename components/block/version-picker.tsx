"use client";
import { useRouter } from "next/navigation";
import { useLiveBadge } from "./live-badge";

export interface VersionOption { version: number; badge: string; approved: boolean; createdAt: string }

/** Jump between versions; the head lives at the block's own address. */
export function VersionPicker({ slug, versions, current, head }: { slug: string; versions: VersionOption[]; current: number; head: number }) {
  const router = useRouter();
  const live = useLiveBadge().badge;
  return (
    <label className="inline-flex items-center gap-2 text-sm">
      <span className="text-graphite">Version</span>
      <select value={current} onChange={(e) => {
        const n = Number(e.target.value);
        router.push(n === head ? `/blocks/${slug}` : `/blocks/${slug}/versions/${n}`);
      }} className="rounded border border-rule bg-panel px-2 py-1 font-mono text-sm">
        {versions.map((v) => (
          <option key={v.version} value={v.version}>
            v{v.version} · {v.version === current && live ? live : v.badge}{v.approved ? " · approved" : ""}{v.version === head ? " · head" : ""}
          </option>
        ))}
      </select>
    </label>
  );
}
