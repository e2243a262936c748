/**
 * A two-round review in the browser (issue 15), one browser context per person, against MariaDB, the
 * worker and the local mail fake. Setup only through the API and the database (a new author with a
 * one-case proof, the demo editor made its editor); every step a person takes is taken on the pages:
 * the editor makes the proof blind and invites two referees by e-mail, they join through the mailed
 * links, round 1 opens, one referee reports at once, the other is late — the reminder job, run ten days
 * on (time travel, not a wait), mails her one "Overdue" reminder — then reports; the editor decides
 * "minor revision" and the authors are mailed with the referees as "Referee 1, 2"; the author revises
 * the step; round 2 opens, both referees vouch for the new revision and recommend accepting, the editor
 * accepts; the certified export lists both rounds and decisions, the referees numbered, never named.
 */
import { execFileSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, saveNewRevision, signInAs } from "./browser";
import { proofOfNewAuthor, signInPerson, type Person } from "./new-author";

const baseUrl = inject("baseUrl");
const stamp = Date.now();
const AUTHOR = { name: "Oriel Fanshawe", email: `oriel.fanshawe.${stamp}@tarnhollow.example`, password: "oriel-writes-2026" };
const WREN = { name: "Wren Halloway", email: `wren.halloway.rounds.${stamp}@moorfield.example`, password: "wren-reviews-2026" };
const YARROW = { name: "Yarrow Penhale", email: `yarrow.penhale.rounds.${stamp}@moorfield.example`, password: "yarrow-reviews-2026" };
const TITLE = `Two rounds on the star K(1,4) ${stamp}`;
let browser: Browser;
let proofId = 0;
let stepId = 0;

interface Mail {
  to: string[];
  subject: string;
  text: string;
}
const allMail = (): Mail[] => {
  const file = process.env.CAIRN_MAIL_STORE;
  if (!file) throw new Error("CAIRN_MAIL_STORE is not set: run through npm test, which starts the mail fake");
  return existsSync(file)
    ? readFileSync(file, "utf8")
        .split("\n")
        .filter(Boolean)
        .map((l) => JSON.parse(l) as Mail)
    : [];
};
async function mailTo(address: string, subject: RegExp, timeoutMs = 15_000): Promise<Mail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const hit = allMail().find((m) => m.to.includes(address) && subject.test(m.subject));
    if (hit) return hit;
    if (Date.now() > deadline) throw new Error(`no mail to ${address} matching ${subject} reached the mail fake`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function pageFor(signIn: (page: Page) => Promise<void>): Promise<Page> {
  const page = await (await browser.newContext({ acceptDownloads: true })).newPage();
  await signIn(page);
  await page.waitForURL(`${baseUrl}/proofs`);
  return page;
}
const signInWith = (who: Person) => (page: Page) => signInPerson(page, baseUrl, who);

/** The reminder job as of `daysOn` days from now, for this proof only (scripts/send-reminders.ts). */
function runReminders(daysOn: number): string {
  return execFileSync(
    "node_modules/.bin/tsx",
    ["--conditions=react-server", "scripts/send-reminders.ts", `--now=${new Date(Date.now() + daysOn * 86_400_000).toISOString()}`, `--proof=${proofId}`],
    { env: { ...process.env, DATABASE_URL: process.env.CAIRN_E2E_DATABASE_URL }, encoding: "utf8" },
  );
}

beforeAll(async () => {
  browser = await launchBrowser();
  // Setup: a new author (so that no demo person's mail changes), a proof with one case and one step, the demo editor as its editor.
  ({ proofId, stepId } = (await proofOfNewAuthor(browser, baseUrl, AUTHOR, {
    title: TITLE,
    statement: "The star $K_{1,4}$ has spectral radius $2$.",
    caseTitle: "The star",
    condition: "$G = K_{1,4}$",
    step: "Its adjacency matrix has rank 2 and trace of the square 8.",
  })) as { proofId: number; stepId: number });
}, 120_000);

afterAll(async () => {
  await browser?.close();
});

describe("a two-round review in the browser", () => {
  it("blind invitations → round 1 with a late referee reminded → minor revision → revised → round 2 → accept → certified export", async () => {
    const editor = await pageFor((p) => signInAs(p, baseUrl, "editor"));
    const rounds = `${baseUrl}/proofs/${proofId}/rounds`;

    // The editor makes the proof blind (reminders 2 days before and 1 day after a due date) and invites two referees.
    await editor.goto(rounds);
    const policy = editor.getByTestId("review-policy");
    await policy.getByLabel(/Blind review/).check();
    await policy.getByRole("spinbutton").nth(0).fill("2");
    await policy.getByRole("spinbutton").nth(1).fill("1");
    await policy.getByRole("button", { name: "Save" }).click();
    await policy.getByText("Saved.").waitFor();
    const referees: Record<string, Page> = {};
    for (const who of [WREN, YARROW]) {
      await editor.goto(`${baseUrl}/proofs/${proofId}/members`);
      const form = editor.getByTestId("invite-form");
      await form.getByLabel("Reviewer’s e-mail").fill(who.email);
      await form.getByRole("button", { name: "Send invitation" }).click();
      expect(await editor.getByTestId("invite-result").textContent()).toBe(`Invitation sent to ${who.email}.`);
      const link = /(http\S+\/invitations\/[A-Za-z0-9_-]+)/.exec((await mailTo(who.email, /invites you/)).text)![1];
      const page = await (await browser.newContext()).newPage();
      await page.goto(link);
      await page.getByLabel("Your name").fill(who.name);
      await page.getByLabel(/Choose a password/).fill(who.password);
      await page.getByRole("button", { name: "Create account and join as reviewer" }).click();
      await page.waitForURL(`${baseUrl}/queue`);
      referees[who.name] = page;
    }
    const wren = referees[WREN.name];
    const yarrow = referees[YARROW.name];

    // Round 1, due in a week.
    const due = new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);
    const openRound = async (n: number) => {
      await editor.goto(rounds);
      await editor
        .getByTestId("open-round")
        .getByLabel(/due on/)
        .fill(due);
      await editor.getByRole("button", { name: `Open round ${n}` }).click();
      // The form and its message leave the page once it refreshes with the round open: wait for the round itself.
      await editor.locator(`[data-testid="round"][data-round="${n}"][data-state="open"]`).waitFor();
    };
    await openRound(1);

    const report = async (page: Page, body: string, recommendation: string, note: string) => {
      await page.goto(rounds);
      const form = page.getByTestId("report-form");
      await form.getByLabel(/Your report/).fill(body);
      await form.getByLabel(/^Recommendation/).selectOption({ label: recommendation });
      await form.getByLabel(/Note for the editors only/).fill(note);
      await form.getByRole("button", { name: "Submit report" }).click();
      await page.getByTestId("report-submitted").waitFor();
    };
    // Wren reports at once; Yarrow does not.
    await report(wren, "Say why the rank is $2$: the matrix is $\\begin{pmatrix}0 & J\\\\ J^T & 0\\end{pmatrix}$.", "minor revision", "Wren's note");

    // Ten days on (time travel: the reminder job runs as of then), Yarrow is late: one "Overdue" mail to her, none to Wren; a second run sends nothing.
    expect(runReminders(10)).toMatch(/queued 1 reminder\b/);
    expect(runReminders(10)).toMatch(/queued 0 reminders/);
    const overdue = await mailTo(YARROW.email, /Overdue: your report for round 1/);
    expect(overdue.text).toMatch(/was due on \d{4}-\d{2}-\d{2}, \d+ days ago/);
    expect(overdue.text).toContain(`/proofs/${proofId}/rounds`);
    const reminders = allMail().filter((m) => /(Reminder|Overdue): your report/.test(m.subject) && m.subject.includes(TITLE));
    expect(reminders.map((m) => m.to)).toEqual([[YARROW.email]]);
    await report(yarrow, "The trace argument is fine; state the eigenvalues $\\pm 2$ explicitly.", "minor revision", "Yarrow's note");

    // The editor sees both recommendations and decides "minor revision" with the reports attached; the author is mailed.
    await editor.goto(rounds);
    await editor.getByTestId("referees").getByText(WREN.name).waitFor();
    const decision = editor.getByTestId("decision-form");
    await decision.getByLabel(/^Decision/).selectOption({ label: "minor revision" });
    await decision.getByLabel(/Letter to the authors/).fill("Please name the eigenvalues $\\pm 2$ and $0$.");
    await decision.getByRole("button", { name: "Record the decision and mail the authors" }).click();
    await editor.locator('[data-testid="round"][data-round="1"][data-state="decided"]').waitFor();
    const letter = await mailTo(AUTHOR.email, /Decision on round 1 of/);
    expect(letter.subject).toMatch(/minor revision/i);
    for (const secret of [WREN.name, WREN.email, YARROW.name, YARROW.email, "Wren's note", "Yarrow's note"]) expect(letter.text).not.toContain(secret);
    expect(letter.text).toContain("Referee 1");
    expect(letter.text).toContain("Referee 2");

    // The author reads the decision on the rounds page (referees numbered) and revises the step.
    const author = await pageFor(signInWith(AUTHOR));
    await author.goto(rounds);
    await author.getByTestId("decision").first().waitFor();
    const authorRounds = await author.content();
    for (const secret of [WREN.name, YARROW.name]) expect(authorRounds).not.toContain(secret);
    await author.goto(`${baseUrl}/proofs/${proofId}/steps/${stepId}`);
    await saveNewRevision(
      author,
      "Its adjacency matrix has rank 2, so two eigenvalues are nonzero; their squares sum to the trace of $A^2$, which is 8: they are $\\pm 2$.",
      2,
    );

    // Round 2: both referees vouch for revision 2 and recommend accepting; the editor accepts.
    await openRound(2);
    for (const page of [wren, yarrow]) {
      await page.goto(`${baseUrl}/proofs/${proofId}/steps/${stepId}`);
      await page.getByRole("button", { name: "I vouch for revision 2" }).click();
      await page.getByTestId("already-vouched").waitFor();
      await report(page, "Thank you; the eigenvalues are now explicit.", "accept", "none");
    }
    await editor.goto(rounds);
    const second = editor.getByTestId("decision-form");
    await second.getByLabel(/^Decision/).selectOption({ label: "accept" });
    await second.getByLabel(/Letter to the authors/).fill("Accepted.");
    await second.getByRole("button", { name: "Record the decision and mail the authors" }).click();
    await editor.locator('[data-testid="round"][data-round="2"][data-state="decided"]').waitFor();
    await mailTo(AUTHOR.email, /Decision on round 2 of/);

    // The author makes the certified export; its LaTeX lists both rounds and decisions, referees numbered.
    await author.goto(`${baseUrl}/proofs/${proofId}/export`);
    await author.getByRole("button", { name: "▲ Export certified" }).click();
    const made = author.getByTestId("export-made");
    await made.waitFor({ timeout: 120_000 });
    const exportId = /Export #(\d+)/.exec((await made.textContent())!)![1];
    const tex = await (await author.request.get(`${baseUrl}/api/proofs/${proofId}/exports/${exportId}/tex`)).text();
    expect(tex).not.toContain("DRAFT");
    expect(tex).toContain(String.raw`\section*{Review rounds and decisions}`);
    expect(tex).toContain(String.raw`\subsection*{Round 1}`);
    expect(tex).toContain(String.raw`\textbf{Decision: minor revision}`);
    expect(tex).toContain(String.raw`\subsection*{Round 2}`);
    expect(tex).toContain(String.raw`\textbf{Decision: accept}`);
    expect(tex).toContain("Referee 1 (report version 1");
    expect(tex).toContain("Referee 2 (report version 1");
    for (const secret of [WREN.name, WREN.email, YARROW.name, YARROW.email, "Wren's note", "Yarrow's note"]) expect(tex).not.toContain(secret);
  }, 600_000);
});
