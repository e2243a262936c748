/**
 * In the browser: one batch claim of each statement the form offers besides ρ(G) op b, over the 106 trees on 10 vertices
 * (Debian nauty's `nauty-gentreeg -q 10`, sparse6; OEIS A000055 n = 10), and the verdicts the page shows.
 *
 * Expected verdicts, from outside Cairn:
 * - contains one of K_{1,3}: a tree avoids K_{1,3} exactly when its degrees are at most 2, i.e. when it is the path
 *   (common practice); in a tree the three neighbours of a vertex are never adjacent, so "induced" changes nothing here;
 * - identified as A or D: by Smith's classification (Brouwer & Haemers, "Spectra of Graphs", Thm 3.1.3) the only
 *   trees on 10 vertices of type A or D are A_10 and D_10, so 104 fail;
 * - the list is exactly the trees on 10 vertices: nauty's list is the enumeration (A000055: 106);
 *   with one tree dropped and one repeated, the repeated line is refuted naming its first line, and one class is missing;
 * - with ρ(G) < 2: exactly A_10 and D_10 (Smith, as above), so the 106 trees are not that enumeration (104 too many).
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import type { Browser, Page } from "playwright-core";
import { launchBrowser, openDemoStepAsAuthor } from "./browser";

const baseUrl = inject("baseUrl");
let browser: Browser;
let page: Page;
const dir = mkdtempSync(join(tmpdir(), "cairn-e2e-statements-"));

const trees = (() => {
  for (const cmd of ["nauty-gentreeg", "gentreeg"]) {
    const r = spawnSync(cmd, ["-q", "10"], { encoding: "utf8" });
    if (r.status === 0 && r.stdout) return r.stdout.trim().split("\n");
  }
  return null;
})();

beforeAll(async () => {
  if (!trees) return;
  browser = await launchBrowser();
  page = await (await browser.newContext()).newPage();
  await openDemoStepAsAuthor(page, baseUrl);
  // Line 6 dropped, line 1 repeated at the end (line 106).
  const edited = [...trees.slice(0, 5), ...trees.slice(6), trees[0]];
  for (const [name, lines] of [
    ["trees10-all.s6", trees],
    ["trees10-edited.s6", edited],
  ] as const) {
    writeFileSync(join(dir, name), lines.join("\n") + "\n");
    await page.getByTestId("file-input").setInputFiles(join(dir, name));
    await page.getByTestId("file-list").getByText(name).first().waitFor({ timeout: 60_000 });
  }
});
afterAll(async () => {
  await browser?.close();
  rmSync(dir, { recursive: true, force: true });
});

/** Starts a batch over `file` with the statement set up by `fill`, and gives its card once it is finished. */
async function run(file: string, statement: string, fill: () => Promise<void>) {
  const form = page.getByTestId("batch-form");
  await form.getByLabel("graph list").selectOption({ label: `${file} (106 graphs)` });
  await form.getByLabel("statement").selectOption({ label: statement });
  await fill();
  const before = await page.getByTestId("batch-card").count();
  await form.getByRole("button", { name: "Check every graph" }).click();
  await expect.poll(() => page.getByTestId("batch-card").count(), { timeout: 30_000 }).toBe(before + 1);
  const card = page.getByTestId("batch-card").first();
  await card.getByTestId("batch-outcome").waitFor({ timeout: 60_000 });
  return card;
}

describe.skipIf(!trees)("batch statements in the browser", () => {
  it("contains one of K_{1,3} (induced): only the path fails", async () => {
    const form = page.getByTestId("batch-form");
    const card = await run("trees10-all.s6", "contains one of", async () => {
      await form.getByLabel("patterns, one per line").fill("star(3)");
      await form.getByLabel("as induced subgraphs").check();
    });
    expect(await card.textContent()).toMatch(/induced/);
    expect(await card.getByTestId("batch-outcome").textContent()).toMatch(/\b1 of 106 graphs fail/);
  });

  it("identified as a member of A or D: 104 of 106 fail", async () => {
    const form = page.getByTestId("batch-form");
    const card = await run("trees10-all.s6", "is identified as a member of", async () => {
      for (const f of ["E", "Ã", "D̃", "Ẽ"]) await form.getByLabel(f, { exact: true }).setChecked(false);
      await form.getByLabel("A", { exact: true }).check();
      await form.getByLabel("D", { exact: true }).check();
    });
    expect(await card.getByTestId("batch-outcome").textContent()).toMatch(/\b104 of 106 graphs fail/);
  });

  it("exactly the trees on 10 vertices: verified for nauty's list; the edited list names the repeated line and the missing class", async () => {
    const form = page.getByTestId("batch-form");
    const enumeration = "— the list is exactly, up to isomorphism, the enumeration of";
    const fill = async () => {
      await form.getByLabel("which graphs").selectOption("tree");
      await form.getByLabel("vertices").fill("10");
      await form.getByLabel("only those with ρ(G)").selectOption("");
    };
    const all = await run("trees10-all.s6", enumeration, fill);
    expect(await all.getByTestId("batch-outcome").textContent()).toMatch(/verified for every graph of the list/);

    const edited = await run("trees10-edited.s6", enumeration, fill);
    expect(await edited.getByTestId("batch-outcome").textContent()).toMatch(/\b1 of 106 graphs fail; 1 graphs of the enumeration are not listed/);
    expect(await edited.getByTestId("batch-note").textContent()).toMatch(/^1 of the .* is not listed, e\.g\. \(graph6\) \S+/);
    await edited.getByRole("button", { name: "show each graph" }).click();
    const row = edited.getByTestId("batch-result-row").first();
    await row.waitFor();
    expect(await row.textContent()).toMatch(/^106.*isomorphic to the graph listed at line 1\b/);

    // With ρ(G) < 2 the enumeration is {A_10, D_10}: the 104 other trees are refuted.
    const limited = await run("trees10-all.s6", enumeration, async () => {
      await fill();
      await form.getByLabel("only those with ρ(G)").selectOption("<");
      await form.getByLabel("bound").fill("2");
    });
    expect(await limited.getByTestId("batch-outcome").textContent()).toMatch(/\b104 of 106 graphs fail/);
  });
});
