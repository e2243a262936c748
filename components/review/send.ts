/** The review panel's one way to call the API: JSON in, the error body's message out (for display). */
export interface Sent<T> {
  ok: boolean;
  status: number;
  data?: T;
  error?: string;
  issues?: Array<{ path: string; message: string }>;
}

export async function send<T = unknown>(url: string, method: string, body?: unknown): Promise<Sent<T>> {
  try {
    const res = await fetch(url, { method, headers: { "content-type": "application/json" }, body: body === undefined ? undefined : JSON.stringify(body) });
    const json = await res.json().catch(() => ({}));
    if (res.ok) return { ok: true, status: res.status, data: json as T };
    const issues = json?.error?.issues as Sent<T>["issues"];
    const detail = issues?.length ? ` ${issues.map((i) => i.message).join(" ")}` : "";
    return { ok: false, status: res.status, error: `${json?.error?.message ?? `The server answered ${res.status}.`}${detail}`, issues };
  } catch {
    return { ok: false, status: 0, error: "Could not reach Cairn; check the connection and try again." };
  }
}
