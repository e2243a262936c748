/** The browser's side of the JSON API: one error shape, issues per field, the 409 payloads. */

export interface ApiIssue {
  path: string;
  message: string;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly body: { code?: string; issues?: ApiIssue[]; [key: string]: unknown },
  ) {
    super(message);
    this.name = "ApiError";
  }
}

/** Calls a JSON route: the parsed answer, or ApiError with the server's message; `signal` stops the call (fetch's AbortError). */
export async function apiFetch<T>(url: string, init?: { method?: string; body?: unknown; signal?: AbortSignal }): Promise<T> {
  const res = await fetch(url, {
    method: init?.method ?? "GET",
    headers: init?.body !== undefined ? { "content-type": "application/json" } : undefined,
    body: init?.body !== undefined ? JSON.stringify(init.body) : undefined,
    signal: init?.signal,
  });
  const data = await res.json().catch(() => null);
  if (!res.ok) {
    const error = (data as { error?: { message?: string } } | null)?.error ?? {};
    throw new ApiError(res.status, error.message ?? `The server answered ${res.status}.`, error as ApiError["body"]);
  }
  return data as T;
}

/** For SWR: `useSWR(url, jsonFetcher)`. */
export const jsonFetcher = <T>(url: string) => apiFetch<T>(url);

/** The outcome of a call as forms display it: never throws; a network failure is status 0 with a message. */
export interface Sent<T> {
  ok: boolean;
  status: number;
  data?: T;
  error?: string;
  issues?: ApiIssue[];
}

/** `apiFetch` for forms that show the outcome inline: the error's message with each field's issue appended. */
export async function send<T = unknown>(url: string, method: string, body?: unknown): Promise<Sent<T>> {
  try {
    const data = await apiFetch<T>(url, { method, body });
    return { ok: true, status: 200, data };
  } catch (e) {
    if (!(e instanceof ApiError)) return { ok: false, status: 0, error: "Could not reach Cairn; check the connection and try again." };
    const issues = e.body.issues;
    const detail = issues?.length ? ` ${issues.map((i) => i.message).join(" ")}` : "";
    return { ok: false, status: e.status, error: `${e.message}${detail}`, issues };
  }
}
