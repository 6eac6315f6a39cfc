/** A failed API call, carrying the problem document's title/detail and any extra members (errors, head). */
export class ApiError extends Error {
  constructor(readonly status: number, message: string, readonly problem: Record<string, unknown>) {
    super(message);
  }
}

export async function apiJson<T>(url: string, init?: RequestInit): Promise<T> {
  const res = await fetch(url, { ...init, headers: { Accept: "application/json", ...(init?.body ? { "Content-Type": "application/json" } : {}), ...init?.headers } });
  if (!res.ok) {
    const problem = (await res.json().catch(() => ({}))) as Record<string, unknown>;
    throw new ApiError(res.status, String(problem.detail ?? problem.title ?? res.statusText), problem);
  }
  return (await res.json()) as T;
}
