/**
 * The main flow by keyboard alone: on the proof overview (as its author) and on a step page (as its referee) every
 * control of the flow is reached with Tab, each stop shows a focus ring (an outline or a ring shadow), and every form
 * control on the page has an accessible name. The step's math keeps KaTeX's MathML for screen readers. axe's label
 * rules run on every page in tests/e2e/screens.test.ts; this adds what axe does not do: pressing Tab.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, signInAs } from "./browser";
import { demoProof } from "@/seeders/demo-content";

const baseUrl = inject("baseUrl");
let browser: Browser;
let proofId: number;
/** The step of case 3: its referee's vouch was superseded by a revision (seeders/0003-demo-reviews.ts), so they may vouch again. */
let revisedStep: number;

beforeAll(async () => {
  browser = await launchBrowser();
  const page = await (await browser.newContext()).newPage();
  await signInAs(page, baseUrl, "author");
  await page.waitForURL(`${baseUrl}/proofs`);
  await page.getByRole("link", { name: demoProof.title }).click();
  await page.waitForURL(/\/proofs\/\d+$/);
  proofId = Number(new URL(page.url()).pathname.split("/")[2]);
  const href = (await page.getByRole("link", { name: "Step 3(a)", exact: true }).getAttribute("href"))!;
  revisedStep = Number(href.match(/steps\/(\d+)/)![1]);
  await page.context().close();
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

interface Stop {
  name: string;
  tag: string;
  ring: boolean;
}

/** Presses Tab until focus comes back round to the document (or `max` presses) and records every stop. */
async function tabStops(page: Page, max = 250): Promise<Stop[]> {
  await page.locator("body").click({ position: { x: 1, y: 1 } }); // start from the top, as after loading
  const stops: Stop[] = [];
  for (let i = 0; i < max; i++) {
    await page.keyboard.press("Tab");
    const stop = await page.evaluate(() => {
      const el = document.activeElement as HTMLElement | null;
      if (!el || el === document.body) return null;
      const style = getComputedStyle(el);
      const outline = style.outlineStyle !== "none" && parseFloat(style.outlineWidth) >= 1;
      const shadow = style.boxShadow !== "none" && style.boxShadow !== "";
      const labelled =
        el.getAttribute("aria-label") ??
        (el.getAttribute("aria-labelledby") ? document.getElementById(el.getAttribute("aria-labelledby")!)?.textContent : null);
      const label = (el as HTMLInputElement).labels?.[0]?.textContent;
      const name = (labelled ?? label ?? el.textContent ?? "").replace(/\s+/g, " ").trim().slice(0, 80);
      return { name, tag: el.tagName.toLowerCase(), ring: outline || shadow };
    });
    if (!stop) break;
    stops.push(stop);
  }
  return stops;
}

/** Visible form controls without an accessible name (label, aria-label, aria-labelledby, title; a button's text). */
async function unnamedControls(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll<HTMLElement>("input:not([type=hidden]), select, textarea, button")]
      .filter((el) => el.getClientRects().length > 0)
      .filter((el) => {
        const named = el.getAttribute("aria-label")?.trim() || el.getAttribute("aria-labelledby") || el.getAttribute("title")?.trim();
        const labelled = ((el as HTMLInputElement).labels?.length ?? 0) > 0;
        const text = el.tagName === "BUTTON" && el.textContent?.trim();
        return !(named || labelled || text);
      })
      .map((el) => el.outerHTML.slice(0, 120)),
  );
}

function expectReached(stops: Stop[], wanted: RegExp[]) {
  const names = stops.map((s) => `${s.tag}: ${s.name}`);
  for (const w of wanted)
    expect(
      names.some((n) => w.test(n)),
      `Tab never reaches ${w} (stops: ${names.join(" · ")})`,
    ).toBe(true);
  expect(
    stops.filter((s) => !s.ring).map((s) => `${s.tag}: ${s.name}`),
    "stops without a visible focus ring",
  ).toEqual([]);
}

describe("keyboard", () => {
  it("reaches the overview's steps, case form and claims table by Tab, with a visible focus ring", async () => {
    const page = await (await browser.newContext({ viewport: { width: 1280, height: 800 } })).newPage();
    await signInAs(page, baseUrl, "author");
    await page.waitForURL(`${baseUrl}/proofs`);
    await page.goto(`${baseUrl}/proofs/${proofId}`);
    await page.waitForLoadState("networkidle");
    const stops = await tabStops(page);
    expectReached(stops, [
      /^a: Proofs$/,
      /^a: Step 1\(a\)$/,
      /^a: Step 3\.2\(a\)$/,
      /^input: Case title/,
      /^a: Members and reviewers$/,
      /^div: All claims$/,
      /^button: .*Sign out/i,
    ]);
    expect(await unnamedControls(page)).toEqual([]);
    await page.context().close();
  }, 120_000);

  it("lets the referee vouch, dispute and comment on a step by Tab, with a visible focus ring; its math keeps MathML", async () => {
    const page = await (await browser.newContext({ viewport: { width: 390, height: 844 } })).newPage();
    await signInAs(page, baseUrl, "reviewer");
    await page.waitForURL(`${baseUrl}/proofs`);
    await page.goto(`${baseUrl}/proofs/${proofId}/steps/${revisedStep}`);
    await page.getByTestId("step-review").waitFor();
    await page.waitForLoadState("networkidle");
    const stops = await tabStops(page);
    expectReached(stops, [
      /^button: .*Menu$/,
      /^button: I vouch for revision \d+$/,
      /^button: I raise a dispute/,
      /^summary: Comments \(\d+\)$/,
      /^summary: Pictures \(\d+ graphs?/,
    ]);
    expect(await unnamedControls(page)).toEqual([]);
    // The comments fold open with Enter on their summary, and the next Tab is in the comment box.
    const comments = page.locator("summary", { hasText: /^Comments \(/ });
    await comments.focus();
    await page.keyboard.press("Enter");
    await page.keyboard.press("Tab");
    expect(await page.evaluate(() => (document.activeElement as HTMLTextAreaElement).labels?.[0]?.textContent?.trim())).toMatch(/^Comment on this step/);
    // The claim's pictures are folded; Enter on their summary opens them, with the graph described in words.
    const pictures = page.locator("summary", { hasText: /^Pictures \(/ }).first();
    await pictures.focus();
    await page.keyboard.press("Enter");
    await page
      .locator("summary", { hasText: /^The graph in words$/ })
      .first()
      .waitFor();
    // Enter on the focused dispute button opens the dispute form, and its text box has a name.
    await page.getByRole("button", { name: /I raise a dispute/ }).focus();
    await page.keyboard.press("Enter");
    await page.getByTestId("dispute-form").waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    // KaTeX's MathML output (katex.org, Options: output "htmlAndMathml") is kept for screen readers.
    expect(await page.locator("main .katex .katex-mathml math").count()).toBeGreaterThan(0);
    await page.context().close();
  }, 120_000);
});
