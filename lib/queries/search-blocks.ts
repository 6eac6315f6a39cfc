"use client";
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { BlockRow } from "@/components/block-table";
import { apiJson } from "./http";

export interface SearchFilters { q?: string; category?: string; badge?: string; tag?: string; team?: string; approved?: string; sort?: string }
export interface SearchAnswer { items: BlockRow[]; nextCursor: string | null; estimatedTotal: number; facets?: Record<string, Record<string, number>> }

export function searchUrl(f: SearchFilters): string {
  const qs = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v) qs.set(k, v);
  qs.set("limit", "50");
  return `/api/v1/blocks?${qs}`;
}

export const fetchSearchBlocks = (f: SearchFilters, signal?: AbortSignal) => apiJson<SearchAnswer>(searchUrl(f), { signal });

export const searchBlocksQueryOptions = (f: SearchFilters) =>
  queryOptions({ queryKey: ["blocks", "search", f], queryFn: ({ signal }) => fetchSearchBlocks(f, signal), placeholderData: keepPreviousData });

export const useSearchBlocks = (f: SearchFilters) => useQuery(searchBlocksQueryOptions(f));
