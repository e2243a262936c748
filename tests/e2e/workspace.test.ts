/** The author's day in the browser: draft a proof with two cases, write a step with math, attach a claim, see its verdict and picture. */
import { describe, expect, inject, it } from "vitest";
import type { Page } from "playwright-core";
import { browserForFile, saveNewRevision, signInAs } from "./browser";

const baseUrl = inject("baseUrl");
const browser = browserForFile();

/** Signs the demo author in and makes (through the API) a proof with one case and one step; returns the step's page. */
async function authorWithOneStep(page: Page, title: string, body: string): Promise<{ stepUrl: string; proofUrl: string; caseId: number }> {
  await signInAs(page, baseUrl, "author");
  await page.waitForURL(`${baseUrl}/proofs`);
  const post = async (path: string, data: unknown) => (await page.request.post(`${baseUrl}${path}`, { data })).json();
  const { proof } = await post("/api/proofs", { title, statement: "$\\rho < 2$" });
  const { case: c } = await post(`/api/proofs/${proof.id}/cases`, { title: "Only case", condition: "" });
  const { step } = await post(`/api/proofs/${proof.id}/cases/${c.id}/steps`, { body });
  return { stepUrl: `${baseUrl}/proofs/${proof.id}/steps/${step.id}`, proofUrl: `${baseUrl}/proofs/${proof.id}`, caseId: c.id };
}

/** A fresh context whose author has a new proof with one step, that step's page open; close the context when done. */
async function claimFormOnNewStep(title: string, body: string) {
  const context = await browser().newContext();
  const page = await context.newPage();
  const { stepUrl } = await authorWithOneStep(page, title, body);
  await page.goto(stepUrl);
  return { context, page, form: page.getByTestId("claim-form") };
}

/** Sends the claim form and waits for its refusal beside a field (an alert saying `problem`); no claim is attached. */
async function attachRefused(page: Page, problem: string): Promise<void> {
  const form = page.getByTestId("claim-form");
  await form.getByRole("button", { name: "Attach claim" }).click();
  await form.getByRole("alert").filter({ hasText: problem }).waitFor();
  expect(await page.getByTestId("claim").count()).toBe(0);
}

/** Sends the claim form and waits for the claim's verdict: verified. */
async function attachVerified(page: Page): Promise<void> {
  await page.getByTestId("claim-form").getByRole("button", { name: "Attach claim" }).click();
  await page.locator('[data-testid="claim"] [data-verdict="verified"]').waitFor();
}

describe("proof workspace in the browser", () => {
  it("drafts a proof with two cases, a step with math and a verified claim with its picture", async () => {
    const context = await browser().newContext();
    const page = await context.newPage();
    await signInAs(page, baseUrl, "author");
    await page.waitForURL(`${baseUrl}/proofs`);

    await page.goto(`${baseUrl}/proofs/new`);
    await page.getByLabel("Title").fill("Stars and the golden bound");
    await page.getByLabel(/^Statement/).fill("Every graph $G$ with $\\rho(G) < \\sqrt{5}$ has maximum degree at most $4$.");
    await page.getByRole("button", { name: "Create proof" }).click();
    await page.waitForURL(/\/proofs\/\d+$/);
    await page.getByRole("heading", { name: "Stars and the golden bound" }).waitFor();
    await page.getByRole("button", { name: "✎ Edit title and statement" }).click();
    await page
      .getByTestId("edit-proof")
      .getByLabel(/^Statement/)
      .fill("Every connected graph $G$ with $\\rho(G) < \\sqrt{5}$ has maximum degree at most $4$.");
    await page.getByTestId("edit-proof").getByRole("button", { name: "Save" }).click();
    await page.getByTestId("edit-proof").waitFor({ state: "detached" }); // the editor shows the text too while it is open
    await page.getByText("Every connected graph").waitFor();

    const addCase = page.getByTestId("add-case");
    await addCase.getByLabel("Case title").fill("A vertex of degree at least 5");
    await addCase.getByLabel(/^Condition/).fill("$\\Delta(G) \\ge 5$");
    await addCase.getByRole("button", { name: "Add case" }).click();
    await page.locator('[data-case-number="1"]').waitFor();
    await addCase.getByLabel("Case title").fill("All degrees at most 4");
    await addCase.getByLabel(/^Condition/).fill("$\\Delta(G) \\le 4$");
    await addCase.getByRole("button", { name: "Add case" }).click();
    await page.locator('[data-case-number="2"]').waitFor();
    expect(await page.getByTestId("case").count()).toBe(2);
    expect(await page.locator('[data-case-number="1"] [data-case-state]').first().getAttribute("data-case-state")).toBe("drafting");

    // A step in case 1, written with math; it opens on its own page.
    // The case's controls are one menu: open it, then choose.
    await page.getByTestId("case-actions-1").locator("summary").click();
    await page.getByTestId("case-actions-1").getByRole("button", { name: "Add a step" }).click();
    await page.getByTestId("add-step").getByRole("textbox").fill("$K_{1,5} \\subseteq G$, hence\n\n$$\n\\rho(G) \\ge \\rho(K_{1,5}) = \\sqrt{5}.\n$$");
    await page.getByRole("button", { name: "Add step and open it" }).click();
    await page.waitForURL(/\/steps\/\d+$/);
    await page.getByText("Step 1(a)").first().waitFor();
    expect(await page.locator("main .katex").count()).toBeGreaterThanOrEqual(2);
    expect(await page.locator("main .katex-display").count()).toBeGreaterThanOrEqual(1);

    // A new revision through the editor, which opens on request (the page reads first).
    await saveNewRevision(page, "Since $K_{1,5} \\subseteq G$ and $\\rho$ is monotone under subgraphs,\n\n$$\n\\rho(G) \\ge \\sqrt{5}.\n$$", 2);

    // A claim with malformed input shows the problem next to the field and saves nothing.
    const form = page.getByTestId("claim-form");
    await form.getByLabel("graph G", { exact: true }).fill("star(5)");
    await form.getByLabel("relation", { exact: true }).selectOption(">=");
    await form.getByLabel("bound", { exact: true }).fill("sqrt(5");
    await form.getByRole("button", { name: "Attach claim" }).click();
    // The problem beside the field (the live preview may show the same problem too; that one is not the form's answer).
    await form.locator('[role="alert"]:not([data-testid="preview-bound-error"])').filter({ hasText: "sqrt(5" }).waitFor();
    expect(await page.getByTestId("claim").count()).toBe(0);

    // The corrected claim goes pending, then verified, with its drawing and spectrum.
    await form.getByLabel("bound", { exact: true }).fill("sqrt(5)");
    await form.getByRole("button", { name: "Attach claim" }).click();
    const claim = page.getByTestId("claim").first();
    await claim.locator('[data-verdict="verified"]').waitFor({ timeout: 60_000 });
    expect(await claim.textContent()).toContain("ρ(G) ≥ sqrt(5)");
    expect(await claim.textContent()).toContain("cairn-check/");
    // Pictures are folded: the claim's inputs and verdict come first.
    await claim.getByTestId("claim-pictures").locator(":scope > summary").click();
    const picture = claim.getByTestId("graph-picture");
    expect(await picture.locator("svg circle").count()).toBe(6);
    expect(await picture.locator("svg line").count()).toBe(5);
    await claim.getByTestId("spectrum-plot").waitFor();
    await picture.getByLabel("Perron vector values (display only)").check();
    expect(await picture.getByTestId("perron-value").count()).toBe(6);
    expect(await page.getByRole("note").first().textContent()).toContain("What a verdict means");

    // The overview lists the claim in the table, filterable by verdict, with a link back to the step.
    await page.getByRole("link", { name: "Stars and the golden bound" }).click();
    const table = page.getByTestId("claims-table");
    await table.waitFor();
    expect(await table.locator('tbody [data-verdict="verified"]').count()).toBe(1);
    await table.getByLabel("Verdict").selectOption("verified");
    expect(await table.getByRole("link", { name: "1(a)" }).count()).toBe(1);

    // Reordering renumbers: case 1 moves down and its step becomes 2(a); a case is edited in place.
    await page.getByTestId("case-actions-1").locator("summary").click();
    await page.getByRole("button", { name: "move case 1 down" }).click();
    await page.locator('[data-case-number="1"]', { hasText: "All degrees at most 4" }).waitFor();
    await page.getByTestId("claims-table").getByRole("link", { name: "2(a)" }).waitFor();
    await page.getByTestId("case-actions-1").locator("summary").click();
    await page.getByTestId("case-actions-1").getByRole("button", { name: "Edit title and condition" }).click();
    await page.getByTestId("edit-case").getByLabel("Title").fill("Maximum degree at most 4");
    await page.getByTestId("edit-case").getByRole("button", { name: "Save case" }).click();
    await page.locator('[data-case-number="1"] h3', { hasText: "Maximum degree at most 4" }).waitFor();
    await context.close();
  });

  it("attaches every claim of a claims file at once (none when one cannot be read) and withdraws one", async () => {
    const context = await browser().newContext();
    const page = await context.newPage();
    const { stepUrl } = await authorWithOneStep(page, "A claims file", "The Dynkin diagrams.");
    await page.goto(stepUrl);
    await page.getByText("Attach several claims at once from a claims file").click();
    const form = page.getByTestId("claim-file-form");
    const claim = (id: string, text: string, op: string) => ({
      format: "cairn-claim/1",
      id,
      kind: "spectral-radius-bound",
      graph: { format: "named", text },
      op,
      bound: "2",
    });

    // The second claim's graph does not parse: a 422 names it, and neither claim is stored.
    const bad = { format: "cairn-claims/1", claims: [claim("E7-below-2", "E(7)", "<"), claim("broken", "E(", "<")] };
    await form.getByLabel("claims document").fill(JSON.stringify(bad));
    await form.getByRole("button", { name: "Attach all" }).click();
    await form
      .getByTestId("claim-file-problems")
      .getByText(/claim 2 \(broken\), graph/)
      .waitFor();
    expect(await page.getByTestId("claim").count()).toBe(0);

    // Fixed, both are attached and verified: E7 below 2, affine E8 exactly 2 (Smith 1970).
    const good = { format: "cairn-claims/1", claims: [claim("E7-below-2", "E(7)", "<"), claim("E8-affine-is-2", "E~(8)", "=")] };
    await form.getByLabel("claims document").fill(JSON.stringify(good));
    await form.getByRole("button", { name: "Attach all" }).click();
    await form.getByText("Attached 2 claims.", { exact: false }).waitFor();
    await page.locator('[data-testid="claim"] [data-verdict="verified"]').nth(1).waitFor();
    expect(await page.getByTestId("claim").count()).toBe(2);

    // Withdrawing one (after confirming) leaves one live claim and one line of history.
    page.once("dialog", (dialog) => void dialog.accept());
    await page.getByTestId("claim").first().getByRole("button", { name: "⨯ Withdraw" }).click();
    await page.getByTestId("withdrawn-claims").waitFor();
    expect(await page.getByTestId("claim").count()).toBe(1);
    await page.getByTestId("withdrawn-claims").locator("summary").click();
    expect(await page.getByTestId("withdrawn-claim").first().textContent()).toMatch(/withdrawn by Ada Quenby/);
    await context.close();
  });

  it("reorders the steps of a case, deletes the case (after confirming) and restores it with its steps", async () => {
    const context = await browser().newContext();
    const page = await context.newPage();
    const { proofUrl, caseId } = await authorWithOneStep(page, "Delete and restore", "A step worth keeping.");
    await page.request.post(`${proofUrl.replace(baseUrl, `${baseUrl}/api`)}/cases/${caseId}/steps`, { data: { body: "A second step, $E_6$." } });
    await page.goto(proofUrl);

    // The second step moves up: it becomes 1(a) and the first one 1(b).
    await page.getByRole("button", { name: "move step 1(b) up" }).click();
    await page.getByTestId("step").first().getByText("A second step").waitFor();
    expect(await page.getByTestId("step").nth(1).textContent()).toContain("A step worth keeping.");

    const actions = page.getByTestId("case-actions-1");
    await actions.locator("summary").click();
    await actions.getByRole("button", { name: "Delete case…" }).click();
    await actions.getByRole("button", { name: "Yes, delete it" }).click();
    await page.getByTestId("deleted-cases").waitFor();
    expect(await page.locator('[data-case-number="1"]').count()).toBe(0);
    await page.getByTestId("deleted-cases").locator("summary").click();
    await page.getByTestId("deleted-case").getByRole("button", { name: "↺ Restore" }).click();
    await page.locator('[data-case-number="1"]', { hasText: "Only case" }).waitFor();
    await page.getByText("Step 1(b)").waitFor();
    expect(await page.getByTestId("step").count()).toBe(2);
    expect(await page.getByTestId("deleted-cases").count()).toBe(0);
    await context.close();
  });

  it("attaches an enumeration claim through the form: N over the limit is refused beside N, the right list is verified", async () => {
    const { context, page, form } = await claimFormOnNewStep("All small Dynkin diagrams", "Smith's list up to five vertices.");
    await form.getByLabel("Kind").selectOption("enumeration");
    await form.getByLabel("largest number of vertices").fill("21");
    await form.getByLabel("relation", { exact: true }).selectOption("<");
    await form.getByLabel("bound", { exact: true }).fill("2");
    // Smith 1970: the connected graphs with ρ < 2 on at most 5 vertices are A1–A5, D4 and D5.
    await form.getByLabel("listed graphs").fill(["A(1)", "A(2)", "A(3)", "A(4)", "D(4)", "A(5)", "D(5)"].join("\n---\n"));
    await attachRefused(page, "at most 20");
    await form.getByLabel("largest number of vertices").fill("5");
    await attachVerified(page);
    expect(await page.getByTestId("claim").first().textContent()).toContain("exactly the 7 listed");
    await context.close();
  });

  it("attaches Dynkin data through the form: an unknown line is refused beside the field, E8's data are verified", async () => {
    const { context, page, form } = await claimFormOnNewStep("The Weyl group of E8", "Its order and Coxeter number.");
    await form.getByLabel("Kind").selectOption("dynkin-data");
    await form.getByLabel("Dynkin type").fill("E8");
    await form.getByLabel("stated Dynkin data").fill("height = 29");
    await attachRefused(page, "is not one of");
    // h(E8) = 30 and |W(E8)| = 696729600 (Humphreys, Reflection Groups and Coxeter Groups, Tables 2.4 and 3.1).
    await form.getByLabel("stated Dynkin data").fill("h = 30\n|W| = 696729600\n[k]_q > 0");
    await attachVerified(page);
    const card = (await page.getByTestId("claim").first().textContent()) ?? "";
    expect(card).toContain("|W| = 696729600");
    expect(card).toContain("h = 30");
    // F4 is given by type only: the form hides the graph box. |W(F4)| = 1152, h = 12 (Humphreys Table 2.4; Bourbaki Plate VIII):
    // a doubled order is refuted naming the value, the published one verified.
    await form.getByLabel("Dynkin type").fill("F4");
    await form.getByLabel("graph G").waitFor({ state: "detached" });
    await form.getByLabel("stated Dynkin data").fill("h = 12\n|W| = 2304");
    await form.getByRole("button", { name: "Attach claim" }).click();
    await page.getByTestId("claim").filter({ hasText: "1152" }).locator('[data-verdict="refuted"]').first().waitFor();
    await form.getByLabel("stated Dynkin data").fill("h = 12\n|W| = 1152\nexponents = 1, 5, 7, 11");
    await form.getByRole("button", { name: "Attach claim" }).click();
    await page.getByTestId("claim").filter({ hasText: "exponents" }).locator('[data-verdict="verified"]').first().waitFor();
    await context.close();
  });

  it("keeps both edits when two tabs save the same step: 409, both texts shown, overwrite knowingly", async () => {
    const context = await browser().newContext();
    const first = await context.newPage();
    const { stepUrl } = await authorWithOneStep(first, "Two tabs", "First draft.");
    const second = await context.newPage();
    await first.goto(stepUrl);
    await second.goto(stepUrl);
    const label = "step text (Markdown with $…$ math)";
    for (const tab of [first, second]) await tab.getByTestId("step-edit").locator("summary").click();
    await second.getByLabel(label).fill("Second tab: $\\lambda_1 = 2$.");
    await second.getByRole("button", { name: "Save as new revision" }).click();
    await second.getByText("Saved as revision 2.").waitFor();

    await first.getByLabel(label).fill("First tab: $\\lambda_1 < 2$.");
    await first.getByRole("button", { name: "Save as new revision" }).click();
    const conflict = first.getByTestId("save-conflict");
    await conflict.waitFor();
    expect(await conflict.textContent()).toContain("Revision 2");
    expect(await conflict.locator(".katex").count()).toBe(2);
    await conflict.getByRole("button", { name: "Overwrite revision 2 knowingly" }).click();
    await first.getByText("Saved as revision 3.").waitFor();
    // History keeps all three; 2 and 3 are compared typeset side by side, the changed words marked.
    await first.reload();
    const history = first.getByTestId("revision-history");
    const compare = history.getByTestId("revision-compare");
    await compare.waitFor();
    expect(await compare.getByTestId("compare-older").locator("mark.word-removed").first().textContent()).toBe("Second");
    expect(await compare.getByTestId("compare-newer").locator("mark.word-added").first().textContent()).toBe("First");
    expect(await compare.getByTestId("compare-older").locator(".katex").count()).toBe(1);
    expect(await compare.getByTestId("compare-newer").locator(".katex").count()).toBe(1);
    expect(await compare.getByTestId("compare-claims").textContent()).toContain("The claim set is the same");
    // The source, line by line, stays available (folded).
    const diff = await history.getByTestId("revision-diff").textContent();
    expect(diff).toContain("− Second tab");
    expect(diff).toContain("+ First tab");
    await context.close();
  });
});
