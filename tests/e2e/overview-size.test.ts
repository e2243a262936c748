/** The overview grows linearly with the cases (the measurement itself is tests/bench/overview-bytes.ts, also in `npm run bench`). */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, BrowserContext } from "playwright-core";
import { launchBrowser, signInAs } from "./browser";
import { measureOverviewBytes } from "../bench/overview-bytes";

const baseUrl = inject("baseUrl");
let browser: Browser;
let author: BrowserContext;

beforeAll(async () => {
  browser = await launchBrowser();
  author = await browser.newContext();
  const page = await author.newPage();
  await signInAs(page, baseUrl, "author");
  await page.waitForURL(`${baseUrl}/proofs`);
});
afterAll(async () => {
  await browser?.close();
});

describe("overview page size", () => {
  it("grows linearly with the number of cases, not with its square", async () => {
    const sizes = await measureOverviewBytes({
      post: async (path, body) => (await author.request.post(`${baseUrl}${path}`, { data: body, headers: { origin: baseUrl } })).json(),
      page: async (path) => (await author.request.get(`${baseUrl}${path}`)).text(),
    });
    console.log(`[overview] ${sizes.map((s) => `${s.cases} cases: ${s.bytes} B (${s.bytesPerCase} B/case)`).join("; ")}`);
    const [first, second, third, last] = sizes;
    // 6× the cases: linear growth gives at most 6× the bytes (the page's fixed part is shared), so the
    // bytes per case do not rise, and a case added to a large proof costs what it costs in a small one.
    expect(last.bytes / first.bytes).toBeLessThan(7);
    expect(last.bytesPerCase).toBeLessThanOrEqual(first.bytesPerCase);
    const marginal = (a: typeof first, b: typeof first) => (b.bytes - a.bytes) / (b.cases - a.cases);
    expect(marginal(third, last)).toBeLessThan(1.15 * marginal(first, second));
  }, 600_000);
});
