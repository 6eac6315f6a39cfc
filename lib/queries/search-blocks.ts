"use client";
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { SearchResult } from "@/lib/search/types";
import type { SearchFilters } from "@/lib/validation/blocks";
import { ApiError, apiJson } from "./http";

export type { SearchFilters, SearchResult };

/** The filters as a query string, empty values left out: the API's address and the library page's. */
export function searchQueryString(f: Record<string, string | number | boolean | undefined>): string {
  const qs = new URLSearchParams();
  for (const [k, v] of Object.entries(f)) if (v !== undefined && v !== "") qs.set(k, String(v));
  return qs.toString();
}

export const searchUrl = (f: SearchFilters): string => `/api/v1/blocks?${searchQueryString({ ...f, limit: 50 })}`;

export const fetchSearchBlocks = (f: SearchFilters, signal?: AbortSignal) => apiJson<SearchResult>(searchUrl(f), { signal });

/** `initial` is what the server rendered for `initialFor`: that search is not asked again on arrival. */
export const searchBlocksQueryOptions = (f: SearchFilters, initial?: { for: string; data: SearchResult | null }) =>
  queryOptions({
    queryKey: ["blocks", "search", f],
    queryFn: ({ signal }) => fetchSearchBlocks(f, signal),
    placeholderData: keepPreviousData,
    initialData: initial?.data && initial.for === searchQueryString(f) ? initial.data : undefined,
    staleTime: 30_000,
    // An answer from the server (search unavailable, a bad filter) is shown at once instead of retried behind
    // "Searching…"; only a request that got no answer is tried again.
    retry: (failures, err) => !(err instanceof ApiError) && failures < 2,
  });

export const useSearchBlocks = (f: SearchFilters, initial?: { for: string; data: SearchResult | null }) =>
  useQuery(searchBlocksQueryOptions(f, initial));
