"use client";
import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { Report } from "@/checks";
import { apiJson } from "./http";

export const fetchEvaluateBlock = (slug: string, params: Record<string, string>, signal?: AbortSignal) =>
  apiJson<Report>(`/api/v1/blocks/${encodeURIComponent(slug)}/evaluate`, { method: "POST", body: JSON.stringify({ params }), signal });

/** The live preview: quantities and expression checks at draft values, no simulation, nothing stored. */
export const evaluateBlockQueryOptions = (slug: string, params: Record<string, string>) =>
  queryOptions({
    queryKey: ["blocks", slug, "evaluate", params],
    queryFn: ({ signal }) => fetchEvaluateBlock(slug, params, signal),
    placeholderData: keepPreviousData,
    staleTime: 60_000,
    retry: false,
  });

export const useEvaluateBlock = (slug: string, params: Record<string, string>) => useQuery(evaluateBlockQueryOptions(slug, params));
