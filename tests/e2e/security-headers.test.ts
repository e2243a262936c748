/**
 * Content-Security-Policy in the browser: every page, opened by the standing that can see it, carries the
 * policy (scripts by nonce only, no framing) and nosniff, and raises no CSP violation while the app, KaTeX
 * and the Markdown editor run. Violations are collected from `securitypolicyviolation` events and from
 * Chromium's console.
 */
import { describe, expect, inject, it } from "vitest";
import type { BrowserContext } from "playwright-core";
import { fixtureForFile, type Fixture } from "./access-fixture";

const baseUrl = inject("baseUrl");
const fx = fixtureForFile(baseUrl);

declare global {
  interface Window {
    __cspViolations?: string[];
  }
}

/** Opens a page and gathers every CSP complaint while it loads and settles, after `act` if given. */
export async function cspViolations(context: BrowserContext, url: string, act?: (page: import("playwright-core").Page) => Promise<void>): Promise<string[]> {
  const page = await context.newPage();
  await page.addInitScript(() => {
    window.__cspViolations = [];
    document.addEventListener("securitypolicyviolation", (e) =>
      window.__cspViolations!.push(`${e.violatedDirective} blocked ${e.blockedURI || "inline"} (${e.sourceFile}:${e.lineNumber})`),
    );
  });
  const consoleHits: string[] = [];
  page.on("console", (m) => {
    if (/Content Security Policy|Refused to/i.test(m.text())) consoleHits.push(m.text());
  });
  await page.goto(url, { waitUntil: "networkidle" });
  if (act) await act(page);
  await page.waitForTimeout(300);
  const found = [...((await page.evaluate(() => window.__cspViolations ?? [])) as string[]), ...consoleHits];
  await page.close();
  return found.map((v) => `${url}: ${v}`);
}

describe("security headers", () => {
  it("sends a nonce-based CSP with frame-ancestors 'none' and nosniff on pages, and a closed policy on the API", async () => {
    const page = await fx.contexts.owner.request.get(`${baseUrl}/proofs/${fx.proofId}`);
    const csp = page.headers()["content-security-policy"] ?? "";
    expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{16,}' 'strict-dynamic'/);
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
    expect(page.headers()["x-content-type-options"]).toBe("nosniff");
    const nonce = /'nonce-([^']+)'/.exec(csp)![1];
    expect(await page.text()).toContain(`nonce="${nonce}"`); // Next put this request's nonce on its scripts
    const again = await fx.contexts.owner.request.get(`${baseUrl}/proofs/${fx.proofId}`);
    expect(again.headers()["content-security-policy"]).not.toContain(nonce); // a fresh nonce per request
    const api = await fx.contexts.owner.request.get(`${baseUrl}/api/proofs`);
    expect(api.headers()["content-security-policy"]).toContain("frame-ancestors 'none'");
    expect(api.headers()["x-content-type-options"]).toBe("nosniff");
  });

  it("raises no CSP violation on any page, with KaTeX and the Markdown editor at work", async () => {
    const p = `/proofs/${fx.proofId}`;
    const visits: Array<[keyof Fixture["contexts"], string]> = [
      ["anonymous", "/"],
      ["anonymous", "/sign-in"],
      ["anonymous", "/invitations/no-such-invitation-token-0000000000"],
      ["admin", "/admin/mail"],
      ["owner", "/proofs"],
      ["owner", "/proofs/new"],
      ["owner", "/queue"],
      ["owner", "/notifications"],
      ["owner", p],
      ["owner", `${p}/members`],
      ["owner", `${p}/timeline`],
      ["owner", `${p}/export`],
      ["owner", `${p}/print/${fx.exportId}`],
      ["owner", `${p}/steps/${fx.stepIn}`],
      ["reviewer", `/queue/${fx.proofId}/${fx.stepIn}`],
      ["caseLimited", p],
    ];
    const found: string[] = [];
    for (const [role, path] of visits) found.push(...(await cspViolations(fx.contexts[role], `${baseUrl}${path}`)));
    // The step editor (loaded on demand) with its live preview of math.
    found.push(
      ...(await cspViolations(fx.contexts.owner, `${baseUrl}${p}/steps/${fx.stepIn}`, async (page) => {
        // The step editor by its label: the page also holds folded comment boxes (hidden textareas) that may come first.
        // The editor opens on request (the page reads first).
        const edit = page.getByTestId("step-edit");
        if ((await edit.getAttribute("open")) === null) await edit.locator("summary").click();
        const box = page.getByLabel("step text (Markdown with $…$ math)");
        await box.waitFor({ timeout: 20_000 });
        await box.fill("Preview: $\\sqrt{2+\\sqrt5}$ and $$\\rho(T) \\le 2$$");
        await page.locator(".katex").first().waitFor();
      })),
    );
    console.log(`[csp] ${visits.length + 1} page visits, ${found.length} violations`);
    expect(found).toEqual([]);
  }, 300_000);
});
