"use client";
import { useMutation } from "@tanstack/react-query";
import type { Report } from "@/checks";
import { apiJson } from "./http";

export interface RetuneRequest { param: string; target: { quantity: string; value: string }; series: string; params?: Record<string, string> }
export interface RetuneAnswer { value: string; snapped: string; report: Report }

export const fetchRetuneBlock = (slug: string, req: RetuneRequest) =>
  apiJson<RetuneAnswer>(`/api/v1/blocks/${encodeURIComponent(slug)}/retune`, { method: "POST", body: JSON.stringify(req) });

export const retuneBlockMutationOptions = (slug: string) => ({
  mutationKey: ["blocks", slug, "retune"],
  mutationFn: (req: RetuneRequest) => fetchRetuneBlock(slug, req),
});

export const useRetuneBlock = (slug: string) => useMutation(retuneBlockMutationOptions(slug));
