/** Signs in through next-auth's own endpoints (CSRF token, then the credentials callback) and returns the session cookie header. */
import { DEMO_PASSWORD } from "@/seeders/demo-content";

export async function signInByFetch(base: string, email: string, password = DEMO_PASSWORD): Promise<string> {
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const jar = csrf.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: jar },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }),
  });
  const session = res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .filter((c) => c.includes("session-token"));
  if (!session.length) throw new Error(`sign-in gave no session cookie (${res.status})`);
  return session.join("; ");
}
