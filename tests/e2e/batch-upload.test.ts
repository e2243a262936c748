/**
 * In the browser: an author uploads a graph6 file of 3000 random 12-vertex graphs to a step, starts
 * "every graph has ρ(G) < 4", watches the progress, opens the table and downloads the failing graphs.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, inject, it } from "vitest";
import { browserForFile, openDemoStepAsAuthor, startBatch } from "./browser";
import { randomGraph6List } from "../bench/batch-throughput";
import { parseGraph6 } from "@/lib/core/input/graph6";

const baseUrl = inject("baseUrl");
const dir = mkdtempSync(join(tmpdir(), "cairn-e2e-batch-"));
const COUNT = 3000;

const browser = browserForFile();
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("a batch claim in the browser", () => {
  it("uploads a graph list with a progress bar, checks every graph, shows the table and downloads the failures", async () => {
    const listPath = join(dir, "random-12.g6");
    writeFileSync(listPath, randomGraph6List(COUNT, 12, 77));
    const context = await browser().newContext({ acceptDownloads: true });
    const page = await context.newPage();
    await openDemoStepAsAuthor(page, baseUrl);

    await page.getByTestId("file-input").setInputFiles(listPath);
    await expect
      .poll(async () => (await page.getByTestId("upload-message").textContent()) ?? "", { timeout: 60_000 })
      .toMatch(new RegExp(`graph6 list of ${COUNT} graphs`));
    // The list of files is fetched again after the upload; wait for it rather than read it at once.
    await expect.poll(async () => (await page.getByTestId("file-list").textContent()) ?? "", { timeout: 30_000 }).toContain("random-12.g6");

    const card = await startBatch(page, "random-12.g6", COUNT, "<", "4");
    const progress = card.getByTestId("batch-progress");
    await progress.waitFor();
    expect(await progress.textContent()).toMatch(new RegExp(`of ${COUNT} checked`));
    const outcome = card.getByTestId("batch-outcome");
    await outcome.waitFor({ timeout: 100_000 });
    const failing = Number(/(\d+) of 3000 graphs fail/.exec((await outcome.textContent()) ?? "")?.[1]);
    expect(failing).toBeGreaterThan(0);

    await card.getByRole("button", { name: "show each graph" }).click();
    await card.getByTestId("batch-result-row").first().waitFor();
    // "failures only" starts ticked when some graphs fail: every row shown is a failure.
    const verdicts = await card.getByTestId("batch-result-row").locator("td:nth-child(2)").allTextContents();
    expect(verdicts.length).toBe(failing);
    expect(verdicts.every((v) => !v.includes("verified"))).toBe(true);

    const [download] = await Promise.all([page.waitForEvent("download"), card.getByTestId("download-failures").click()]);
    const saved = join(dir, "failures.g6");
    await download.saveAs(saved);
    const lines = readFileSync(saved, "utf8").trimEnd().split("\n");
    expect(lines).toHaveLength(failing);
    for (const l of lines.slice(0, 50)) expect(parseGraph6(l).n).toBe(12);
    await context.close();
  });
});
