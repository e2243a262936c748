/**
 * A vouch covers the text and the claims of one revision, in the browser: the referee vouches; the author
 * attaches a claim (a new revision); the referee's vouch reads superseded, the notification names the proof
 * and the step and opens the comparison of the vouched revision with the latest (text and claim set); the
 * referee vouches again. Along the way the overview (as the referee), the step page and the comparison are
 * photographed at 1280 wide into test-results/vouch/ (git-ignored test artefacts).
 */
import { mkdirSync } from "node:fs";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, signInAs } from "./browser";
import { db } from "./access-fixture";
import { demoPeople } from "@/seeders/demo-content";
import { stepLabel } from "@/lib/proof-tree";

const baseUrl = inject("baseUrl");
const SHOTS = join(process.cwd(), "test-results", "vouch");
const SCREEN = { width: 1280, height: 800 };
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
  mkdirSync(SHOTS, { recursive: true });
});
afterAll(async () => {
  await browser?.close();
});

async function personPage(key: string): Promise<Page> {
  const page = await (await browser.newContext({ viewport: SCREEN })).newPage();
  await signInAs(page, baseUrl, key);
  await page.waitForURL(`${baseUrl}/proofs`);
  return page;
}

/** The top of an element, in page pixels from the top of the document. */
const topOf = async (page: Page, testId: string) => (await page.getByTestId(testId).first().boundingBox())!.y;

describe("a superseded vouch in the browser", () => {
  it("vouch → claim attached → superseded, notified → comparison (text and claims) → vouch again", async () => {
    // The author drafts a proof with one case and one step (through the API), and the demo referee joins it.
    const author = await personPage("author");
    const post = async (path: string, data: unknown) => {
      const res = await author.request.post(`${baseUrl}${path}`, { data, headers: { origin: baseUrl } });
      expect(res.ok(), `${path}: ${res.status()} ${await res.text()}`).toBe(true);
      return res.json();
    };
    const title = `Dynkin trees below two ${Date.now()}`;
    const { proof } = await post("/api/proofs", { title, statement: "Every tree $T$ with $\\rho(T) < 2$ is a Dynkin diagram." });
    const { case: c } = await post(`/api/proofs/${proof.id}/cases`, { title: "Exactly one branch vertex", condition: "$T$ has one vertex of degree $3$." });
    const body = "A tree with one branch vertex is $T(p,q,r)$; for $(1,2,3)$ it is $E_7$, and $\\rho(E_7) < 2$.";
    const { step } = await post(`/api/proofs/${proof.id}/cases/${c.id}/steps`, { body });
    const celia = demoPeople.find((p) => p.key === "reviewer")!;
    await db(async (conn) => {
      const [u] = await conn.query("SELECT id FROM users WHERE email = ?", [celia.email]);
      await conn.query("INSERT INTO proof_members (proof_id, user_id, role, created_at) VALUES (?, ?, 'reviewer', NOW(3))", [proof.id, u.id]);
    });
    const label = stepLabel("1", 1);
    const stepPath = `/queue/${proof.id}/${step.id}`;

    // The referee reads the step (argument, claims and review on the first screen) and vouches for revision 1.
    const referee = await personPage("reviewer");
    await referee.goto(`${baseUrl}${stepPath}`);
    await referee.getByRole("heading", { name: `Step ${label}` }).waitFor();
    await referee.getByRole("button", { name: "I vouch for revision 1" }).click();
    await referee.locator('[data-approval="current"]').waitFor();

    // The author attaches a claim: ρ(E7) < 2 (Smith 1970; Brouwer & Haemers, Spectra of Graphs, §3.1.1). That makes revision 2.
    const e7 = { format: "cairn-claim/1", kind: "spectral-radius-bound", graph: { format: "named", text: "E(7)" }, op: "<", bound: "2" };
    await post(`/api/proofs/${proof.id}/steps/${step.id}/claims`, { claims: [e7] });
    await expect
      .poll(async () => (await (await author.request.get(`${baseUrl}/api/proofs/${proof.id}/steps/${step.id}/claims`)).json()).claims[0]?.status, {
        timeout: 60_000,
        interval: 500,
      })
      .toBe("verified");

    // The referee is notified in a sentence naming the proof and the step, and the notice opens the comparison.
    await referee.goto(`${baseUrl}/notifications`);
    const notice = referee.locator('[data-testid="notification"][data-kind="vouch_superseded"]').first();
    await notice.waitFor();
    const sentence = (await notice.textContent())!;
    expect(sentence).toContain(`step ${label}`);
    expect(sentence).toContain(`“${title}”`);
    expect(sentence).toMatch(/at revision 1 is superseded by revision 2: claim #\d+ \(spectral-radius-bound\) attached/);
    await notice.getByRole("link", { name: "open" }).click();
    await referee.waitForURL((url) => url.pathname === stepPath && url.searchParams.get("compare") === "1..2");

    // The comparison of revision 1 with revision 2: both texts typeset, the claim set's change named.
    const compare = referee.getByTestId("revision-compare");
    await compare.waitFor();
    for (const side of ["compare-older", "compare-newer"]) {
      expect(await compare.getByTestId(side).textContent()).toContain("A tree with one branch vertex");
      expect(await compare.getByTestId(side).locator(".katex").count()).toBeGreaterThan(0);
    }
    expect(await compare.getByTestId("compare-older").locator("h3").textContent()).toBe("Revision 1");
    expect(await compare.getByTestId("compare-newer").locator("h3").textContent()).toBe("Revision 2");
    expect(await compare.textContent()).toContain("Text: unchanged");
    expect(await compare.getByTestId("compare-claims").textContent()).toMatch(/attached: claim #\d+ \(ρ\(G\) < 2\)/);
    await compare.scrollIntoViewIfNeeded();
    await compare.screenshot({ path: join(SHOTS, "comparison-1280.png") });

    // The review panel marks the vouch superseded and says so to the referee, with a link to the same comparison.
    await referee.locator('[data-testid="approval"] [data-approval="stale"]').waitFor();
    const superseded = referee.getByTestId("vouch-superseded-notice");
    expect(await superseded.textContent()).toContain("Your vouch for revision 1 is superseded");
    expect(await superseded.getByRole("link").getAttribute("href")).toBe(`${stepPath}?compare=1..2#compare`);

    // The step page as the referee sees it at 1280×800: argument, claims and review panel on the first screen.
    await referee.evaluate(() => window.scrollTo(0, 0));
    for (const id of ["step-body", "claim-list", "step-review"]) expect(await topOf(referee, id), `${id} starts on the first screen`).toBeLessThan(800);
    await referee.locator('[data-testid="claim"] [data-verdict="verified"]').first().waitFor();
    await referee.screenshot({ path: join(SHOTS, "step-as-referee-1280.png") });

    // The overview, read by the referee: the step's claim and its review (the superseded vouch at revision 1).
    await referee.goto(`${baseUrl}/proofs/${proof.id}`);
    const overviewStep = referee.locator(`[data-testid="step"][data-step-label="${label}"]`);
    await overviewStep.waitFor();
    expect(await overviewStep.getByTestId("step-claims").textContent()).toContain("ρ(G) < 2");
    expect(await overviewStep.locator('[data-testid="step-claims"] [data-verdict="verified"]').count()).toBe(1);
    const vouchLine = overviewStep.getByTestId("overview-vouch");
    expect(await vouchLine.locator("[data-approval]").getAttribute("data-approval")).toBe("stale");
    expect(await vouchLine.textContent()).toMatch(/Celia Marwood, revision 1 \(latest is 2\)/);
    expect(await topOf(referee, "step-review-summary")).toBeLessThan(800);
    await referee.screenshot({ path: join(SHOTS, "overview-1280.png"), fullPage: true });

    // The referee vouches again, for revision 2; the notice is gone and the overview shows the vouch current.
    await referee.goto(`${baseUrl}${stepPath}`);
    await referee.getByRole("button", { name: "I vouch for revision 2" }).click();
    await referee.getByTestId("already-vouched").waitFor();
    expect(await referee.getByTestId("vouch-superseded-notice").count()).toBe(0);
    expect(await referee.locator('[data-testid="approval"] [data-approval]').getAttribute("data-approval")).toBe("current");
    await referee.goto(`${baseUrl}/proofs/${proof.id}`);
    await overviewStep.waitFor();
    expect(await overviewStep.getByTestId("step-review-summary").getAttribute("data-vouches")).toBe("1");
    expect(await overviewStep.getByTestId("overview-vouch").textContent()).toMatch(/Celia Marwood, revision 2$/);

    // The proof list says where the proof stands: no round yet, no open dispute.
    await referee.goto(`${baseUrl}/proofs`);
    const row = referee.getByTestId("proof-list").locator("li", { hasText: title });
    expect(await row.getByTestId("proof-standing").getAttribute("data-stage")).toBe("drafting");
    expect(await row.getByTestId("proof-standing").textContent()).toContain("no open dispute");
    for (const p of [author, referee]) await p.context().close();
  }, 240_000);
});
