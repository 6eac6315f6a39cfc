"use client";
import { queryOptions, useQuery } from "@tanstack/react-query";
import { apiJson } from "./http";

export interface RunAnswer {
  id: string; status: "queued" | "running" | "done" | "error"; badge: string; report: unknown;
  progress?: { done: number; total: number };
}

export const fetchRun = (id: string, signal?: AbortSignal) => apiJson<RunAnswer>(`/api/v1/runs/${encodeURIComponent(id)}`, { signal });

const settled = (r?: RunAnswer) => r?.status === "done" || r?.status === "error";

/** A check run, polled every second until the worker has finished it. */
export const runQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ["runs", id],
    queryFn: ({ signal }) => fetchRun(id, signal),
    refetchInterval: (q) => (settled(q.state.data) ? false : 1000),
  });

export const useRun = (id: string, enabled = true) => useQuery({ ...runQueryOptions(id), enabled });
