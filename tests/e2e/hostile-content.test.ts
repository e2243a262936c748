/**
 * The hostile content corpus (tests/fixtures/hostile-content.ts) rendered in Chromium on every page that
 * shows user content — proof page, each step page, print view, timeline, the admin's mail view — with no
 * dialog, no request to another origin, no tab crash and no CSP violation; and the PDF of an export holding
 * all of it compiles.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, BrowserContext } from "playwright-core";
import { launchBrowser, signInAs } from "./browser";
import { HOSTILE_PAYLOADS, HOSTILE_TITLE } from "../fixtures/hostile-content";

const baseUrl = inject("baseUrl");
let browser: Browser;
let author: BrowserContext;
let admin: BrowserContext;
let proofUrl = "";
let printUrl = "";
let pdfUrl = "";
const stepUrls: string[] = [];

async function signedIn(key: string) {
  const context = await browser.newContext();
  const page = await context.newPage();
  await signInAs(page, baseUrl, key);
  await page.waitForURL(`${baseUrl}/proofs`);
  await page.close();
  return context;
}

beforeAll(async () => {
  browser = await launchBrowser();
  author = await signedIn("author");
  admin = await signedIn("admin");
  const api = async (method: string, path: string, data?: unknown) => {
    const res = await author.request.fetch(`${baseUrl}${path}`, { method, data, headers: { origin: baseUrl } });
    if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
    return res.json();
  };
  const { proof } = await api("POST", "/api/proofs", { title: HOSTILE_TITLE, statement: HOSTILE_PAYLOADS.slice(0, 8).join("\n\n") });
  const { case: c } = await api("POST", `/api/proofs/${proof.id}/cases`, { title: HOSTILE_TITLE, condition: HOSTILE_PAYLOADS[1] });
  for (const body of HOSTILE_PAYLOADS) {
    const { step } = await api("POST", `/api/proofs/${proof.id}/cases/${c.id}/steps`, { body });
    stepUrls.push(`${baseUrl}/proofs/${proof.id}/steps/${step.id}`);
  }
  // An invitation puts the hostile title into a mail, shown in the admin's mail view.
  await api("POST", `/api/proofs/${proof.id}/invitations`, { email: "ivo.hostile@tarnhollow.example", scope: "proof" });
  const { export: made } = await api("POST", `/api/proofs/${proof.id}/exports`, { kind: "draft" });
  proofUrl = `${baseUrl}/proofs/${proof.id}`;
  printUrl = `${proofUrl}/print/${made.id}`;
  pdfUrl = `${baseUrl}/api/proofs/${proof.id}/exports/${made.id}/pdf`;
}, 240_000);
afterAll(async () => {
  await browser?.close();
});

/** Everything that would show the content is not inert, on one page. */
async function incidents(context: BrowserContext, url: string): Promise<string[]> {
  const found: string[] = [];
  const page = await context.newPage();
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) =>
      ((window as unknown as { __csp: string[] }).__csp ??= []).push(`${e.violatedDirective} ${e.blockedURI}`),
    );
  });
  page.on("dialog", (d) => {
    found.push(`dialog: ${d.message()}`);
    void d.dismiss();
  });
  page.on("crash", () => found.push("tab crashed"));
  page.on("request", (r) => {
    const u = r.url();
    if (!u.startsWith(baseUrl) && !u.startsWith("data:") && !u.startsWith("blob:") && !u.startsWith("about:")) found.push(`request to ${u}`);
  });
  page.on("console", (m) => {
    if (/Content Security Policy|Refused to/i.test(m.text())) found.push(`console: ${m.text()}`);
  });
  const res = await page.goto(url, { waitUntil: "networkidle", timeout: 60_000 }).catch((e) => (found.push(`load failed: ${e}`), null));
  if (res && res.status() !== 200) found.push(`status ${res.status()}`);
  await page.waitForTimeout(200);
  const csp = await page.evaluate(() => (window as unknown as { __csp?: string[] }).__csp ?? []).catch(() => ["page gone"]);
  found.push(...csp.map((v) => `csp: ${v}`));
  const title = await page.title().catch(() => "");
  if (title.includes("49")) found.push("template injection evaluated {{7*7}}");
  await page.close();
  return found.map((f) => `${url}: ${f}`);
}

describe("hostile content in the browser", () => {
  it("stays inert on the proof page, every step page, the print view, the timeline and the mail view", async () => {
    const pages: Array<[BrowserContext, string]> = [
      [author, proofUrl],
      ...stepUrls.map((u): [BrowserContext, string] => [author, u]),
      [author, printUrl],
      [author, `${proofUrl}/timeline`],
      [admin, `${baseUrl}/admin/mail`],
    ];
    const found: string[] = [];
    for (const [context, url] of pages) found.push(...(await incidents(context, url)));
    // Proof page and print view show every step; each step page shows one; timeline and mail view show the titles.
    console.log(
      `[hostile] ${HOSTILE_PAYLOADS.length} payloads (+ a hostile title) on ${pages.length} page visits: ${HOSTILE_PAYLOADS.length * 3 + 2} payload renderings, ${found.length} incidents`,
    );
    expect(found).toEqual([]);
  }, 600_000);

  it("keeps the over-budget formula small on the page", async () => {
    const res = await author.request.get(stepUrls[HOSTILE_PAYLOADS.findIndex((p) => p.includes("\\sqrt{\\sqrt{"))]);
    const html = await res.text();
    expect(html).toContain("math-over-budget");
    expect(html.length).toBeLessThan(300_000);
  });

  it("compiles the PDF of an export holding every payload", async () => {
    const res = await author.request.get(pdfUrl, { timeout: 240_000 });
    expect(res.status()).toBe(200);
    expect((await res.body()).subarray(0, 5).toString()).toBe("%PDF-");
  }, 300_000);
});
