/** The browser's side of the JSON API: one error shape, issues per field, the 409 payloads. */

export interface ApiIssue {
  path: string;
  message: string;
}

export class ApiError extends Error {
  constructor(readonly status: number, message: string, readonly body: { code?: string; issues?: ApiIssue[]; [key: string]: unknown }) {
    super(message);
    this.name = "ApiError";
  }
}

export async function apiFetch<T>(url: string, init?: { method?: string; body?: unknown }): Promise<T> {
  const res = await fetch(url, {
    method: init?.method ?? "GET",
    headers: init?.body !== undefined ? { "content-type": "application/json" } : undefined,
    body: init?.body !== undefined ? JSON.stringify(init.body) : undefined,
  });
  const data = await res.json().catch(() => null);
  if (!res.ok) {
    const error = (data as { error?: { message?: string } } | null)?.error ?? {};
    throw new ApiError(res.status, error.message ?? `The server answered ${res.status}.`, error as ApiError["body"]);
  }
  return data as T;
}

/** For SWR: `useSWR(url, jsonFetcher)`. */
export const jsonFetcher = <T,>(url: string) => apiFetch<T>(url);
