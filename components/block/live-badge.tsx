"use client";
import { createContext, useContext, useState, type ReactNode } from "react";

// The mark polls the open run; the version picker reads the same state, so both change in the same render.
const LiveBadge = createContext<{ badge: string | null; set: (b: string | null) => void }>({ badge: null, set: () => {} });

export function LiveBadgeProvider({ children }: { children: ReactNode }) {
  const [badge, set] = useState<string | null>(null);
  return <LiveBadge.Provider value={{ badge, set }}>{children}</LiveBadge.Provider>;
}

export const useLiveBadge = () => useContext(LiveBadge);
