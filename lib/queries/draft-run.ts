"use client";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { Report } from "@/checks";
import { apiJson } from "./http";

/** GET /api/v1/draft-runs/{id}: a simulation of values on screen, nothing stored. */
export interface DraftRunAnswer {
  id: string; slug: string; status: "queued" | "running" | "done" | "error" | "cancelled";
  progress: { done: number; total: number }; report: Report | null; error: string | null;
}

export const draftRunOpen = (r?: DraftRunAnswer) => r?.status === "queued" || r?.status === "running";
const key = (id: string) => ["draft-runs", id] as const;

/** A draft run, polled twice a second while it is queued or running. */
export const useDraftRun = (id: string | null) =>
  useQuery({
    queryKey: key(id ?? ""),
    queryFn: ({ signal }) => apiJson<DraftRunAnswer>(`/api/v1/draft-runs/${encodeURIComponent(id!)}`, { signal }),
    enabled: Boolean(id),
    refetchInterval: (q) => (draftRunOpen(q.state.data) ? 500 : false),
    retry: false,
  });

/** What to simulate: values over the head (the retune and fork form), or the whole edited file (the editor). */
export type Draft = { params: Record<string, string> } | { text: string };

/** Start simulating a draft of a block; the answer seeds the poll. */
export function useStartDraftRun(slug: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (draft: Draft) =>
      apiJson<DraftRunAnswer>(`/api/v1/blocks/${encodeURIComponent(slug)}/draft-runs`, "text" in draft
        ? { method: "POST", body: draft.text, headers: { "Content-Type": "text/markdown" } }
        : { method: "POST", body: JSON.stringify({ params: draft.params }) }),
    onSuccess: (run) => client.setQueryData(key(run.id), run),
  });
}

/** Cancel a draft run; the server answers once its simulations have stopped. */
export function useCancelDraftRun() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiJson<DraftRunAnswer>(`/api/v1/draft-runs/${encodeURIComponent(id)}`, { method: "DELETE" }),
    onSuccess: (run) => client.setQueryData(key(run.id), run),
  });
}
