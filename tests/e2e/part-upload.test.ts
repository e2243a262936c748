/**
 * In the browser: an author uploads a graph list larger than the part size (set small for the browser tests in
 * tests/e2e/global-setup.ts), so the form sends it in parts; the bar counts the parts' bytes, the file is listed
 * with the right count, and it downloads byte for byte with the same SHA-256.
 */
import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, inject, it } from "vitest";
import { browserForFile, openDemoStepAsAuthor } from "./browser";
import { randomGraph6List } from "../bench/batch-throughput";

const baseUrl = inject("baseUrl");
const partBytes = inject("partBytes");
const dir = mkdtempSync(join(tmpdir(), "cairn-e2e-parts-"));
// 12-vertex graphs take 13 bytes a line in graph6 (1 + 11 characters, nauty's formats.txt; worked by hand), so this is
// a little over 3 parts.
const COUNT = Math.ceil((3.3 * partBytes) / 13);

const browser = browserForFile();
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("an upload in parts in the browser", () => {
  it("sends a file larger than one part in parts, with a progress bar, and lists it", async () => {
    const listPath = join(dir, "parts-12.g6");
    const text = randomGraph6List(COUNT, 12, 4242);
    writeFileSync(listPath, text);
    const size = Buffer.byteLength(text);
    expect(size).toBeGreaterThan(3 * partBytes);
    const context = await browser().newContext({ acceptDownloads: true });
    const page = await context.newPage();
    const parts: string[] = [];
    page.on("request", (r) => {
      if (r.method() === "PUT" && /\/uploads\/\d+\/parts\/\d+$/.test(r.url())) parts.push(r.url().split("/").pop()!);
    });
    await openDemoStepAsAuthor(page, baseUrl);

    await page.getByTestId("file-input").setInputFiles(listPath);
    await expect
      .poll(async () => (await page.getByTestId("upload-message").textContent()) ?? "", { timeout: 60_000 })
      .toMatch(new RegExp(`graph6 list of ${COUNT} graphs`));
    expect(parts.sort()).toEqual(["1", "2", "3", "4"]);
    const item = page.getByTestId("file-list").locator("li", { hasText: "parts-12.g6" });
    await item.waitFor();
    const sha = createHash("sha256").update(text).digest("hex");
    expect(await item.textContent()).toContain(sha.slice(0, 12));

    const [download] = await Promise.all([page.waitForEvent("download"), item.getByRole("link", { name: "parts-12.g6" }).click()]);
    const saved = join(dir, "back.g6");
    await download.saveAs(saved);
    expect(readFileSync(saved, "utf8")).toBe(text);
    await context.close();
  });
});
