/**
 * The review workflow end to end, one browser context per person, against MariaDB and the local mail fake:
 * the editor invites a reviewer to case 3.2 → the mail arrives at the fake → the reviewer follows the link,
 * creates an account and disputes the step → the author is notified, revises the step in the step editor and
 * marks the dispute answered → the referee withdraws it and vouches for the new revision → case 3.2 is settled.
 */
import { readFileSync, existsSync, mkdirSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { browserForFile, saveNewRevision, signInAs } from "./browser";
import { demoProof } from "@/seeders/demo-content";

const baseUrl = inject("baseUrl");
/** Screenshots kept as test artefacts (git-ignored). */
const SHOTS = join(process.cwd(), "test-results", "review");
const browser = browserForFile();
let usedLink = "";

async function mailTo(address: string, timeoutMs = 15_000): Promise<{ subject: string; text: string }> {
  const file = process.env.CAIRN_MAIL_STORE;
  if (!file) throw new Error("CAIRN_MAIL_STORE is not set: run through npm test, which starts the mail fake");
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const lines = existsSync(file) ? readFileSync(file, "utf8").split("\n").filter(Boolean) : [];
    const hit = lines.map((l) => JSON.parse(l)).find((m: { to: string[] }) => m.to.includes(address));
    if (hit) return hit;
    if (Date.now() > deadline) throw new Error(`no mail to ${address} reached the mail fake`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function personPage(key: string): Promise<Page> {
  const page = await (await browser().newContext()).newPage();
  await signInAs(page, baseUrl, key);
  await page.waitForURL(`${baseUrl}/proofs`);
  return page;
}

describe("review workflow in the browser", () => {
  it("invite → mail → join → dispute → notify → revise → answer → withdraw → vouch → case settled", async () => {
    // The editor opens the demo proof's members page and invites a new reviewer to case 3.2 only.
    const editor = await personPage("editor");
    await editor.getByTestId("proof-list").getByRole("link", { name: demoProof.title }).click();
    await editor.waitForURL(/\/proofs\/\d+$/);
    const proofId = Number(new URL(editor.url()).pathname.split("/")[2]);
    await editor.goto(`${baseUrl}/proofs/${proofId}/members`);
    const email = `wren.halloway.${Date.now()}@moorfield.example`;
    const form = editor.getByTestId("invite-form");
    await form.getByLabel("Reviewer’s e-mail").fill(email);
    await form.getByLabel("chosen cases").check();
    await form.getByText("Case 3.2").click();
    await form.getByRole("button", { name: "Send invitation" }).click();
    expect(await editor.getByTestId("invite-result").textContent()).toBe(`Invitation sent to ${email}.`);
    await editor.locator('[data-testid="invitation"][data-mail-status="sent"]', { hasText: email }).waitFor();

    // The mail reached the SMTP fake; its link lets the reviewer create an account and join.
    const mail = await mailTo(email);
    expect(mail.subject).toContain("Dov Ashgrove invites you to review");
    const link = /(http\S+\/invitations\/[A-Za-z0-9_-]+)/.exec(mail.text)![1];
    expect(link.startsWith(baseUrl)).toBe(true);
    usedLink = link;
    const reviewer = await (await browser().newContext()).newPage();
    await reviewer.goto(link);
    await reviewer.getByText("cases 3.2").waitFor();
    await reviewer.getByLabel("Your name").fill("Wren Halloway");
    await reviewer.getByLabel(/Choose a password/).fill("wren-reviews-2026");
    await reviewer.getByRole("button", { name: "Create account and join as reviewer" }).click();
    await reviewer.waitForURL(`${baseUrl}/queue`);

    // Only the step of case 3.2 waits for Wren's verdict (the scope of the invitation).
    const queue = reviewer.getByTestId("queue-verdicts");
    await queue.waitFor();
    expect(await queue.getByTestId("queue-row").count()).toBe(1);
    await queue.getByRole("link", { name: "Step 3.2(a)" }).click();
    await reviewer.waitForURL(/\/queue\/\d+\/\d+$/);
    const stepPath = new URL(reviewer.url()).pathname;
    const stepId = Number(stepPath.split("/")[3]);
    // Reader first: at 1280×800 the argument, its claims and the review panel are all on the first screen.
    await reviewer.setViewportSize({ width: 1280, height: 800 });
    for (const id of ["step-body", "claim-list", "step-review"]) {
      await reviewer.getByTestId(id).waitFor();
      const box = await reviewer.getByTestId(id).boundingBox();
      expect(box, id).not.toBeNull();
      expect(box!.y, `${id} starts on the first screen`).toBeLessThan(800);
    }
    mkdirSync(SHOTS, { recursive: true });
    await reviewer.screenshot({ path: join(SHOTS, "step-as-referee-1280.png") });
    await reviewer.getByRole("button", { name: "I raise a dispute…" }).click();
    const disputeForm = reviewer.getByTestId("dispute-form");
    await disputeForm.getByLabel(/What is wrong/).fill("Monotonicity in $c$ needs an argument: why is $\\rho(T(2,2,c))$ increasing?");
    await disputeForm.getByRole("button", { name: "Post" }).click();
    const dispute = reviewer.getByTestId("dispute");
    await dispute.locator('[data-dispute-state="raised"]').waitFor();
    expect(await dispute.locator(".katex").count()).toBeGreaterThan(0);
    await reviewer.locator('[data-testid="case-state"] [data-case-state="disputed"]').waitFor();

    // The author is notified, revises the step in the step editor and marks the dispute answered.
    const author = await personPage("author");
    await author.goto(`${baseUrl}/notifications`);
    const notice = author.locator('[data-testid="notification"][data-kind="dispute_raised"]', { hasText: "disputed revision 1" });
    await notice.first().waitFor();
    expect(await notice.first().getAttribute("data-read")).toBe("false");
    expect((await mailTo("ada.quenby@tarnhollow.example")).subject).toContain("dispute");
    await author.goto(`${baseUrl}/proofs/${proofId}/steps/${stepId}`);
    await saveNewRevision(
      author,
      "Since $T(2,2,c) \\subsetneq T(2,2,c+1)$, Perron–Frobenius makes $\\rho\\big(T(2,2,c)\\big)$ strictly increasing in $c$; it converges to $\\sqrt{2+\\sqrt5}$.",
      2,
    );
    await author.reload();
    const authorDispute = author.getByTestId("dispute");
    await authorDispute.getByLabel("Note with the change (optional)").fill("Revision 2 argues monotonicity by strict inclusion.");
    await authorDispute.getByRole("button", { name: "Mark answered" }).click();
    await authorDispute.locator('[data-dispute-state="answered"]').waitFor();

    // The reviewer sees the answer, closes the dispute and approves revision 2: case 3.2 is settled.
    await reviewer.goto(`${baseUrl}/queue`);
    await reviewer.getByTestId("queue-answered").getByRole("link", { name: "Step 3.2(a)" }).click();
    await reviewer.waitForURL(`${baseUrl}${stepPath}`);
    await reviewer.getByText("revision 2 by Ada Quenby").waitFor();
    // The referee compares revisions 1 and 2, typeset side by side with the changed words marked.
    const compare = reviewer.getByTestId("revision-compare");
    await compare.waitFor();
    expect(await compare.getByTestId("compare-newer").locator("mark.word-added").count()).toBeGreaterThan(0);
    expect(await compare.getByTestId("compare-newer").locator(".katex").count()).toBeGreaterThan(0);
    await compare.scrollIntoViewIfNeeded();
    await compare.screenshot({ path: join(SHOTS, "comparison-1280.png") });
    await reviewer.getByTestId("dispute").getByRole("button", { name: "Withdraw: I am satisfied" }).click();
    await reviewer.getByTestId("dispute").locator('[data-dispute-state="withdrawn"]').waitFor();
    await reviewer.getByRole("button", { name: "I vouch for revision 2" }).click();
    await reviewer.locator('[data-approval="current"]').waitFor();
    await reviewer.locator('[data-testid="case-state"] [data-case-state="settled"]').waitFor();
    const transitions = await reviewer.getByRole("list", { name: "Transitions" }).textContent();
    expect(transitions).toMatch(/· → raised by Wren Halloway.*raised → answered by Ada Quenby.*answered → withdrawn by Wren Halloway/s);

    // The editor's roll-up agrees, and the timeline recorded each step of the way.
    await editor.goto(`${baseUrl}/proofs/${proofId}/members`);
    expect(await editor.locator('[data-testid="readiness-case"][data-case-number="3.2"] [data-case-state]').getAttribute("data-case-state")).toBe("settled");
    await editor.goto(`${baseUrl}/proofs/${proofId}/timeline`);
    for (const action of ["invitation.sent", "invitation.accepted", "review.disputed", "dispute.answered", "dispute.withdrawn", "review.vouched"])
      expect(await editor.locator(`[data-testid="timeline-event"][data-action="${action}"]`).count(), action).toBeGreaterThan(0);

    // The admin page lists the captured invitation.
    const admin = await personPage("admin");
    await admin.goto(`${baseUrl}/admin/mail`);
    await admin.getByTestId("captured-message").filter({ hasText: email }).first().waitFor();
    for (const p of [editor, reviewer, author, admin]) await p.context().close();
  }, 240_000); // a long flow across four people; a loaded 2-core machine needs the room

  it("refuses a used invitation link in the browser", async () => {
    expect(usedLink, "the flow above ran").not.toBe("");
    const page = await (await browser().newContext()).newPage();
    await page.goto(usedLink);
    expect(await page.getByTestId("invitation-closed").textContent()).toContain("already used");
    await page.context().close();
  });

  it("revokes an invitation sent to the wrong address; its link then says so", async () => {
    const editor = await personPage("editor");
    await editor.getByTestId("proof-list").getByRole("link", { name: demoProof.title }).click();
    await editor.waitForURL(/\/proofs\/\d+$/);
    await editor.goto(`${editor.url()}/members`);
    const email = `wrong.address.${Date.now()}@moorfield.example`;
    const form = editor.getByTestId("invite-form");
    await form.getByLabel("Reviewer’s e-mail").fill(email);
    await form.getByRole("button", { name: "Send invitation" }).click();
    const row = editor.locator('[data-testid="invitation"]', { hasText: email });
    await row.getByRole("button", { name: "Revoke" }).click();
    await row.getByText("⊘ revoked").waitFor();
    const link = /(http\S+\/invitations\/[A-Za-z0-9_-]+)/.exec((await mailTo(email)).text)![1];
    const stranger = await (await browser().newContext()).newPage();
    await stranger.goto(link);
    expect(await stranger.getByTestId("invitation-closed").textContent()).toContain("withdrawn by the proof's editor");
    for (const p of [editor, stranger]) await p.context().close();
  });
});
