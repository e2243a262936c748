/**
 * Every page of the file tree (tests/e2e/page-routes.ts), as author, referee, editor and admin, and signed out, on a phone
 * (390 × 844) and a desktop (1280 × 800): the document never scrolls sideways (scrollWidth ≤ clientWidth), axe-core finds
 * no serious or critical violation, and a full-page screenshot of each is kept under test-results/screens/<size>/
 * (git-ignored; the README's two screenshots are copied from there), with every measurement in findings.jsonl.
 * axe-core is injected with page.evaluate, which the pages' Content-Security-Policy does not block.
 *
 * One browser for the file and one context per person; the viewport changes inside the context, so each person signs in once.
 * A page a person may not open (403/404) is measured too: the refusal page must be as clean as any other.
 */
import { appendFileSync, existsSync, mkdirSync, readFileSync, rmSync } from "node:fs";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import axe from "axe-core";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { launchBrowser, signInAs, openDemoProofAsAuthor } from "./browser";
import { pageRoutes } from "./page-routes";

const baseUrl = inject("baseUrl");
const SHOTS = join(process.cwd(), "test-results", "screens");
const VIEWPORTS = [
  { name: "phone", width: 390, height: 844 },
  { name: "desktop", width: 1280, height: 800 },
] as const;
type Viewport = (typeof VIEWPORTS)[number];
/** The demo people by seed key; "reviewer" is the proof's referee. */
const PEOPLE = ["author", "reviewer", "editor", "admin"] as const;
type Who = (typeof PEOPLE)[number] | "signed-out";

let browser: Browser;
let fx: { proofId: number; stepIds: number[]; exportId: number; invitationToken: string };
const started = Date.now();
/** Route → the statuses it answered with, over everyone; each page must have shown its content (200) to someone. */
const answered = new Map<string, Set<number>>();
let visits = 0;
let scans = 0;

/**
 * Each page of the file tree with its parameters filled: the step page twice (the first step, whose claim draws a
 * pattern's embedding, and the step of case 2 with an eight-vertex tree), the invitation page with a waiting invitation.
 * A new page.tsx fails the coverage test below until it has a row here.
 */
function urlsOf(route: string): Array<[label: string, path: string]> {
  const { proofId, stepIds, exportId, invitationToken } = fx;
  const fill = (step: number) =>
    route.replace("[proofId]", String(proofId)).replace("[stepId]", String(step)).replace("[exportId]", String(exportId)).replace("[token]", invitationToken);
  const label =
    route === "/"
      ? "landing"
      : route
          .slice(1)
          .replace(/\[(\w+)\]/g, "$1")
          .replace(/\//g, "-");
  if (route.includes("[stepId]"))
    return [
      [`${label}-first`, fill(stepIds[0])],
      [`${label}-tree`, fill(stepIds[Math.min(2, stepIds.length - 1)])],
    ];
  return [[label, fill(stepIds[0])]];
}

/** Pages that only make sense signed out: signed in, /sign-in redirects to /proofs, which is measured anyway. */
const SIGNED_OUT_ONLY = new Set(["/sign-in"]);
/** Pages open signed out (the rest redirect to the sign-in page). */
const PUBLIC = new Set(["/", "/sign-in", "/invitations/[token]"]);

async function mailTo(address: string, timeoutMs = 15_000): Promise<string> {
  const file = process.env.CAIRN_MAIL_STORE;
  if (!file) throw new Error("CAIRN_MAIL_STORE is not set: run through npm test, which starts the mail fake");
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const lines = existsSync(file) ? readFileSync(file, "utf8").split("\n").filter(Boolean) : [];
    const hit = lines.map((l) => JSON.parse(l) as { to: string[]; text: string }).find((m) => m.to.includes(address));
    if (hit) return hit.text;
    if (Date.now() > deadline) throw new Error(`no mail to ${address} reached the mail fake`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

beforeAll(async () => {
  rmSync(SHOTS, { recursive: true, force: true });
  browser = await launchBrowser();
  // The demo proof, its steps, a draft export for the print view (as its author) and a waiting invitation (as its editor).
  const context = await browser.newContext();
  const page = await context.newPage();
  const proofId = await openDemoProofAsAuthor(page, baseUrl);
  await page.locator(`a[href*="/proofs/${proofId}/steps/"]`).first().waitFor(); // the case tree streams in after the heading
  const hrefs = await page.locator(`a[href*="/proofs/${proofId}/steps/"]`).evaluateAll((as) => as.map((a) => a.getAttribute("href")!));
  const stepIds = [...new Set(hrefs.map((h) => Number(h.match(/steps\/(\d+)/)![1])))];
  const made = await page.request.post(`${baseUrl}/api/proofs/${proofId}/exports`, { data: { kind: "draft" }, headers: { origin: baseUrl } });
  expect(made.ok()).toBe(true);
  await page.goto(`${baseUrl}/proofs/${proofId}/export`);
  const printPath = (await page.locator(`a[href*="/proofs/${proofId}/print/"]`).first().getAttribute("href"))!;
  const exportId = Number(printPath.match(/print\/(\d+)/)![1]);
  await context.close();

  const editor = await browser.newContext();
  const ed = await editor.newPage();
  await signInAs(ed, baseUrl, "editor");
  await ed.waitForURL(`${baseUrl}/proofs`);
  const email = `lark.fenwick.${Date.now()}@moorfield.example`;
  const invited = await ed.request.post(`${baseUrl}/api/proofs/${proofId}/invitations`, { data: { email, scope: "proof" }, headers: { origin: baseUrl } });
  expect(invited.status()).toBe(201);
  await editor.close();
  const invitationToken = /\/invitations\/([A-Za-z0-9_-]+)/.exec(await mailTo(email))![1];
  fx = { proofId, stepIds, exportId, invitationToken };
}, 120_000);

afterAll(async () => {
  await browser?.close();
  console.log(
    `[screens] ${answered.size} pages of the file tree, ${visits} visits (people × sizes × filled routes), ${scans} scanned with axe and photographed, ${((Date.now() - started) / 1000).toFixed(0)} s in all`,
  );
});

interface Finding {
  who: Who;
  viewport: string;
  page: string;
  status: number;
  scrollWidth: number;
  clientWidth: number;
  wideElements: string[];
  serious: string[];
  scanned: boolean;
  ms: { load: number; axe: number; shot: number };
}

const AXE_TAGS = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa", "best-practice"];

/** The Markdown editor is loaded in the browser after the page (components/editor/math-editor.tsx): measure it loaded. */
async function editorsLoaded(page: Page): Promise<void> {
  await page.waitForFunction(() => [...document.querySelectorAll(".math-editor")].every((el) => el.querySelector(".w-md-editor-toolbar")), null, {
    timeout: 30_000,
  });
}

/** Refusals (403, 404) already fully measured for a person at a size: the same page again is only checked for width. */
const refusalsSeen = new Set<string>();

/**
 * Opens one page and measures it: status, sideways overflow of the document, serious/critical axe findings; saves a
 * screenshot (JPEG: a full-page PNG of a long page costs seconds to encode). A refusal page that this person has
 * already been shown at this size (the admin's 404 on every page of a proof they are not on) is not re-scanned.
 */
async function inspect(page: Page, who: Who, viewport: Viewport, route: string, label: string, path: string): Promise<Finding> {
  const t0 = Date.now();
  const response = await page.goto(`${baseUrl}${path}`);
  const status = response?.status() ?? 0;
  await page.waitForLoadState("networkidle");
  await editorsLoaded(page);
  const refusal = status === 403 || status === 404 ? `${who} ${viewport.name} ${status}` : null;
  const repeat = refusal !== null && refusalsSeen.has(refusal);
  if (refusal) refusalsSeen.add(refusal);
  const { scrollWidth, clientWidth, wideElements } = await page.evaluate(() => {
    const clientWidth = document.documentElement.clientWidth;
    const scrollWidth = Math.max(document.documentElement.scrollWidth, document.body.scrollWidth);
    // When the page is too wide, name the innermost elements that stick out (and are not inside a scrolling frame).
    const clipped = (el: Element) => {
      for (let a = el.parentElement; a && a !== document.body; a = a.parentElement) if (getComputedStyle(a).overflowX !== "visible") return true;
      return false;
    };
    const out =
      scrollWidth > clientWidth
        ? [...document.body.querySelectorAll("*")].filter((el) => el.getBoundingClientRect().right > clientWidth + 0.5 && !clipped(el))
        : [];
    const innermost = out.filter((el) => !out.some((o) => o !== el && el.contains(o)));
    const describe = (el: Element) =>
      `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ""}.${[...el.classList].slice(0, 4).join(".")} right=${Math.round(el.getBoundingClientRect().right)} in ${el.parentElement?.tagName.toLowerCase()}.${[...(el.parentElement?.classList ?? [])].slice(0, 4).join(".")}`;
    return { scrollWidth, clientWidth, wideElements: innermost.slice(0, 4).map(describe) };
  });
  const tLoaded = Date.now();
  if (!repeat) await page.evaluate(axe.source);
  const violations = repeat
    ? []
    : await page.evaluate(async (tags) => {
        const w = window as unknown as { axe: typeof axe };
        // KaTeX's visual HTML is skipped: it is aria-hidden (screen readers get the MathML beside it), takes its colour from
        // the text around it (which is checked), and is most of the nodes on a page of math, so scanning it would double the time.
        const result = await w.axe.run({ exclude: [".katex-html"] }, { runOnly: { type: "tag", values: tags }, resultTypes: ["violations"] });
        return result.violations.map((v) => ({ id: v.id, impact: v.impact, targets: v.nodes.map((n) => n.target.map(String).join(" ")) }));
      }, AXE_TAGS);
  const serious = violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id} (${v.impact}, ${v.targets.length}×): ${v.targets.slice(0, 3).join(" | ")}`);
  const tAxe = Date.now();
  const dir = join(SHOTS, viewport.name);
  mkdirSync(dir, { recursive: true });
  if (!repeat)
    await page.screenshot({ path: join(dir, `${who}-${label}.jpg`), type: "jpeg", quality: 70, fullPage: true, animations: "disabled", caret: "hide" });
  if (!answered.has(route)) answered.set(route, new Set());
  answered.get(route)!.add(status);
  visits++;
  if (!repeat) scans++;
  const finding = {
    who,
    viewport: viewport.name,
    page: `${label} ${path}`,
    status,
    scrollWidth,
    clientWidth,
    wideElements,
    serious,
    scanned: !repeat,
    ms: { load: tLoaded - t0, axe: tAxe - tLoaded, shot: Date.now() - tAxe },
  };
  mkdirSync(SHOTS, { recursive: true });
  appendFileSync(join(SHOTS, "findings.jsonl"), `${JSON.stringify(finding)}\n`);
  return finding;
}

function expectClean(findings: Finding[]) {
  expect(
    findings.filter((f) => f.status === 0 || f.status >= 500).map((f) => `${f.page}: ${f.status}`),
    "pages that failed",
  ).toEqual([]);
  expect(
    findings.filter((f) => f.scrollWidth > f.clientWidth).map((f) => `${f.page}: ${f.scrollWidth} > ${f.clientWidth} px (${f.wideElements.join("; ")})`),
    "pages wider than the window",
  ).toEqual([]);
  expect(
    findings.filter((f) => f.serious.length > 0).map((f) => `${f.page}: ${f.serious.join("; ")}`),
    "serious or critical axe violations",
  ).toEqual([]);
}

describe("every page at every size", () => {
  it("has a row for every page of the file tree", () => {
    const routes = pageRoutes().sort();
    expect(routes.length).toBeGreaterThan(10);
    for (const route of routes) expect(urlsOf(route).every(([, path]) => !path.includes("["))).toBe(true);
    expect([...PUBLIC, ...SIGNED_OUT_ONLY].every((r) => routes.includes(r))).toBe(true);
  });

  for (const who of ["signed-out", ...PEOPLE] as const)
    describe(who, () => {
      let context: BrowserContext;
      beforeAll(async () => {
        context = await browser.newContext({ viewport: VIEWPORTS[0] });
        if (who === "signed-out") return;
        const page = await context.newPage();
        await signInAs(page, baseUrl, who);
        await page.waitForURL(`${baseUrl}/proofs`);
        await page.close();
      });
      afterAll(() => context?.close());
      // The two sizes run side by side in two tabs of the context: each waits for the server and for quiet on the
      // network (networkidle) at different moments, so the two cores are kept busy.
      it("phone and desktop", async () => {
        const findings = await Promise.all(
          VIEWPORTS.map(async (viewport) => {
            const page = await context.newPage();
            await page.setViewportSize(viewport);
            const out: Finding[] = [];
            const routes = pageRoutes().filter((r) => (who === "signed-out" ? PUBLIC.has(r) : !SIGNED_OUT_ONLY.has(r)));
            for (const route of routes) for (const [label, path] of urlsOf(route)) out.push(await inspect(page, who, viewport, route, label, path));
            if (who === "author") {
              // The README's pictures: the step page with its claims and drawings, as much as one screen shows.
              await page.goto(`${baseUrl}${urlsOf("/proofs/[proofId]/steps/[stepId]")[1][1]}`);
              await page.waitForLoadState("networkidle");
              await editorsLoaded(page);
              await page.screenshot({ path: join(SHOTS, viewport.name, "readme-step.png"), animations: "disabled", caret: "hide" });
            }
            await page.close();
            return out;
          }),
        );
        expectClean(findings.flat());
      }, 900_000);
    });

  it("showed every page's content to someone (no page was measured only as a refusal)", () => {
    const never = pageRoutes().filter((r) => !answered.get(r)?.has(200));
    expect(never).toEqual([]);
  });

  it("keeps the site menu reachable on a phone: the user's name and Sign out are one tap away", async () => {
    const context = await browser.newContext({ viewport: VIEWPORTS[0] });
    const page = await context.newPage();
    await signInAs(page, baseUrl, "author");
    await page.waitForURL(`${baseUrl}/proofs`);
    const menu = page.getByRole("button", { name: "Menu" });
    expect(await menu.getAttribute("aria-expanded")).toBe("false");
    expect(await page.getByRole("button", { name: "Sign out" }).isVisible()).toBe(false);
    await menu.click();
    expect(await menu.getAttribute("aria-expanded")).toBe("true");
    const signOut = page.getByRole("button", { name: "Sign out" });
    expect(await signOut.isVisible()).toBe(true);
    const box = (await signOut.boundingBox())!;
    expect(box.x + box.width).toBeLessThanOrEqual(390);
    const name = page.getByTestId("current-user");
    expect(await name.evaluate((el) => el.scrollWidth <= el.clientWidth)).toBe(true); // not clipped
    await page.getByRole("link", { name: "Review queue" }).click();
    await page.waitForURL(`${baseUrl}/queue`);
    expect(await page.getByRole("button", { name: "Menu" }).getAttribute("aria-expanded")).toBe("false");
    await context.close();
  });
});
