/**
 * Sessions end (issue 10, defect 9): a session cookie captured before sign-out, or before a password
 * change, stops working at once — 401 from the API, the sign-in page instead of a workspace page — for
 * that session and for every other session of the person. The person signs in again with the new password.
 * The JWT lives 8 h, so without a server-side check the captured cookie kept working (200) until then.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, BrowserContext } from "playwright-core";
import { launchBrowser, signedInContext } from "./browser";
import { db } from "./access-fixture";
import { DEMO_PASSWORD, demoPeople } from "@/seeders/demo-content";

const baseUrl = inject("baseUrl");
let browser: Browser;

/** Two people of this file only (a password change must not touch the demo accounts other files sign in with). */
const PEOPLE = {
  leaver: { name: "Ines Marwood", email: "ines.marwood@tarnhollow.example" },
  changer: { name: "Oskar Fennimore", email: "oskar.fennimore@tarnhollow.example" },
};
const NEW_PASSWORD = "a-new-password-for-oskar";

async function signedIn(email: string, password = DEMO_PASSWORD): Promise<{ context: BrowserContext; cookie: string }> {
  const context = await signedInContext(browser, baseUrl, email, password);
  const cookie = (await context.cookies(baseUrl))
    .filter((c) => c.name.includes("session-token"))
    .map((c) => `${c.name}=${c.value}`)
    .join("; ");
  expect(cookie).not.toBe("");
  return { context, cookie };
}

interface Replay {
  api: number;
  page: number;
  location: string | null;
  /** Whom next-auth's own session endpoint (what the browser's useSession reads) says the cookie belongs to, or null. */
  session: string | null;
  /** Whether that endpoint's answer expired the session cookie. */
  sessionCleared: boolean;
}

/** What a captured cookie still opens: the API's proof list, the proofs page (no redirect followed) and GET /api/auth/session. */
async function replay(cookie: string): Promise<Replay> {
  const api = await fetch(`${baseUrl}/api/proofs`, { headers: { cookie } });
  const page = await fetch(`${baseUrl}/proofs`, { headers: { cookie }, redirect: "manual" });
  const auth = await fetch(`${baseUrl}/api/auth/session`, { headers: { cookie } });
  const body = (await auth.json()) as { user?: { email?: string } };
  const sessionCleared = auth.headers.getSetCookie().some((c) => c.includes("session-token=;") && /max-age=0|expires=thu, 01 jan 1970/i.test(c));
  return { api: api.status, page: page.status, location: page.headers.get("location"), session: body.user?.email ?? null, sessionCleared };
}

function expectEnded(r: Replay) {
  expect(r.api).toBe(401);
  // next-auth's session endpoint answered the stale cookie with its user until it checked the version too.
  expect(r.session).toBeNull();
  expect(r.sessionCleared).toBe(true);
  // A page sends the visitor to sign in (or refuses outright); it never renders for the old session.
  if (r.page >= 300 && r.page < 400) expect(new URL(r.location!, baseUrl).pathname).toBe("/sign-in");
  else expect([401, 403]).toContain(r.page);
}

const changePassword = (cookie: string, body: unknown, origin = baseUrl) =>
  fetch(`${baseUrl}/api/account/password`, { method: "POST", headers: { cookie, origin, "content-type": "application/json" }, body: JSON.stringify(body) });

beforeAll(async () => {
  browser = await launchBrowser();
  await db(async (c) => {
    for (const person of Object.values(PEOPLE)) {
      await c.query("DELETE FROM users WHERE email = ?", [person.email]);
      await c.query(
        "INSERT INTO users (email, name, password_hash, role, created_at, updated_at) SELECT ?, ?, password_hash, 'member', NOW(3), NOW(3) FROM users WHERE email = ?",
        [person.email, person.name, demoPeople.find((p) => p.key === "outsider")!.email],
      );
    }
  });
});
afterAll(async () => {
  await browser?.close();
});

describe("ending sessions", () => {
  it("sign-out ends the session: its captured cookie gets 401 from the API and the sign-in page instead of a page", async () => {
    const { context, cookie } = await signedIn(PEOPLE.leaver.email);
    const other = await signedIn(PEOPLE.leaver.email); // the same person on a second device
    expect(await replay(cookie)).toMatchObject({ api: 200, page: 200, session: PEOPLE.leaver.email });

    const page = await context.newPage();
    await page.goto(`${baseUrl}/proofs`);
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(`${baseUrl}/`);
    expectEnded(await replay(cookie));
    // Sign-out ends the person's sessions everywhere (one version per person).
    expectEnded(await replay(other.cookie));

    // Signing in again gives a working session.
    const again = await signedIn(PEOPLE.leaver.email);
    expect(await replay(again.cookie)).toMatchObject({ api: 200, page: 200, session: PEOPLE.leaver.email });
    await Promise.all([context.close(), other.context.close(), again.context.close()]);
  });

  it("the password route refuses a missing session, a foreign site, a wrong current password and a short new one (4xx, one error shape)", async () => {
    const { context, cookie } = await signedIn(PEOPLE.changer.email);
    const noSession = await changePassword("", { currentPassword: DEMO_PASSWORD, newPassword: NEW_PASSWORD });
    expect(noSession.status).toBe(401);
    expect((await noSession.json()).error.code).toBe("unauthenticated");
    expect((await changePassword(cookie, { currentPassword: DEMO_PASSWORD, newPassword: NEW_PASSWORD }, "https://elsewhere.example")).status).toBe(403);
    const wrong = await changePassword(cookie, { currentPassword: "not-the-password", newPassword: NEW_PASSWORD });
    expect(wrong.status).toBe(422);
    const wrongBody = await wrong.json();
    expect(wrongBody.error.issues).toEqual([expect.objectContaining({ path: "currentPassword" })]);
    const short = await changePassword(cookie, { currentPassword: DEMO_PASSWORD, newPassword: "short" });
    expect(short.status).toBe(422);
    expect((await short.json()).error.issues.map((i: { path: string }) => i.path)).toContain("newPassword");
    // None of these changed anything: the session still works.
    expect(await replay(cookie)).toMatchObject({ api: 200, page: 200 });
    await context.close();
  });

  it("a password change on the account page ends every session of the person; the new password signs in, the old one does not", async () => {
    const first = await signedIn(PEOPLE.changer.email);
    const second = await signedIn(PEOPLE.changer.email);
    expect(await replay(second.cookie)).toMatchObject({ api: 200, page: 200 });

    const page = await first.context.newPage();
    await page.goto(`${baseUrl}/account`);
    await page.getByLabel("Current password").fill("not-the-password");
    await page.getByLabel("New password").fill(NEW_PASSWORD);
    await page.getByRole("button", { name: "Change password" }).click();
    await page.getByText("This is not your current password").waitFor();
    expect(await replay(second.cookie)).toMatchObject({ api: 200, page: 200 });

    await page.getByLabel("Current password").fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Change password" }).click();
    await page.waitForURL(/\/sign-in/);
    expectEnded(await replay(first.cookie));
    expectEnded(await replay(second.cookie));

    const login = await browser.newContext();
    const p = await login.newPage();
    await p.goto(`${baseUrl}/sign-in`);
    await p.getByLabel("E-mail").fill(PEOPLE.changer.email);
    await p.getByLabel("Password").fill(DEMO_PASSWORD);
    await p.getByRole("button", { name: "Sign in" }).click();
    await p.getByTestId("sign-in-failure").waitFor();
    await login.close();
    const fresh = await signedIn(PEOPLE.changer.email, NEW_PASSWORD);
    expect(await replay(fresh.cookie)).toMatchObject({ api: 200, page: 200 });
    await Promise.all([first.context.close(), second.context.close(), fresh.context.close()]);
  });
});
