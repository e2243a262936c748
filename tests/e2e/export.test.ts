import { execFile } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, inject, it } from "vitest";
import { strFromU8, unzipSync } from "fflate";
import type { Page } from "playwright-core";
import { browserForFile, signInAs, openDemoProofAs, openDemoProofAsAuthor } from "./browser";
import { demoProof } from "@/seeders/demo-content";

const baseUrl = inject("baseUrl");
const browser = browserForFile();
const dir = mkdtempSync(join(tmpdir(), "cairn-e2e-export-"));

afterAll(() => {
  rmSync(dir, { recursive: true, force: true });
});

/** Runs the downloaded self-contained checker with plain Node in a folder without node_modules. */
function nodeCheck(file: string): Promise<{ code: number; out: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [join(dir, "cairn-check.mjs"), file], { cwd: dir, timeout: 60_000 }, (error, stdout, stderr) =>
      resolve({ code: error ? Number(error.code ?? 1) : 0, out: stdout + stderr }),
    );
  });
}

async function saveDownload(page: Page, linkName: string | RegExp, to: string): Promise<string> {
  const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: linkName }).first().click()]);
  const path = join(dir, to);
  await download.saveAs(path);
  return path;
}

describe("exporting the seeded proof in the browser", () => {
  it("exports a draft, downloads the bundle and the checker, and the bundle re-checks offline with Node alone", async () => {
    const context = await browser().newContext({ acceptDownloads: true });
    const page = await context.newPage();
    const proofId = await openDemoProofAsAuthor(page, baseUrl);

    await page.goto(`${baseUrl}/proofs/${proofId}/export`);
    // The seeded proof is still under review: certified is not offered, the reasons are listed, the caution is shown.
    expect(await page.locator("[data-proof-state]").first().getAttribute("data-proof-state")).toBe("in progress");
    await page.getByTestId("blockers").waitFor();
    expect(await page.getByRole("button", { name: "▲ Export certified" }).isDisabled()).toBe(true);
    expect(await page.getByRole("note").first().textContent()).toContain("does not mean that the case split is exhaustive");

    await page.getByRole("button", { name: "△ Export draft" }).click();
    const made = page.getByTestId("export-made");
    await made.waitFor();
    const digest = (await made.textContent())!.match(/[0-9a-f]{64}/)![0];
    // The list shows the export just made (other browser tests may have exported this proof before): find it by its digest.
    const row = page.locator("[data-export-id]").filter({ has: page.getByTestId("manifest-digest").getByText(digest, { exact: true }) });
    await row.waitFor();
    expect(await row.count()).toBe(1);
    expect(await row.locator("[data-export-kind]").getAttribute("data-export-kind")).toBe("draft");
    expect(await row.getByTestId("manifest-digest").textContent()).toBe(digest);

    const bundlePath = await saveDownload(page, "Bundle (.json)", "bundle.json");
    await saveDownload(page, /self-contained checker/, "cairn-check.mjs");
    const texPath = await saveDownload(page, "LaTeX (.tex)", "proof.tex");
    // The one-archive download holds the same bundle, the checker and a README naming the digest.
    const zipPath = await saveDownload(page, "Everything for an offline re-check (.zip)", "export.zip");
    const zipped = unzipSync(new Uint8Array(readFileSync(zipPath)));
    const inZip = (name: string) => Object.entries(zipped).find(([k]) => k.endsWith(`/${name}`))![1];
    expect(JSON.parse(strFromU8(inZip("bundle.json"))).manifestDigest).toBe(digest);
    expect(strFromU8(inZip("README.txt"))).toContain(digest);
    expect(strFromU8(inZip("cairn-check.mjs")).startsWith("#!/usr/bin/env node")).toBe(true);
    expect(JSON.parse(readFileSync(bundlePath, "utf8")).manifestDigest).toBe(digest);
    expect(readFileSync(texPath, "utf8")).toContain("DRAFT --- not certified");

    const clean = await nodeCheck(bundlePath);
    expect(clean.out).toContain(`manifest digest ${digest}`);
    expect(clean.out).toMatch(/✓ verified\s+manifest/);
    expect(clean.code).toBe(0);

    // One character changed in a step: the same checker fails and names the step.
    const tampered = JSON.parse(readFileSync(bundlePath, "utf8"));
    const step = tampered.items.find((i: { type: string }) => i.type === "step");
    const body: string = step.data.revision.body;
    step.data.revision.body = (body[0] === "X" ? "Y" : "X") + body.slice(1);
    writeFileSync(join(dir, "tampered.json"), JSON.stringify(tampered));
    const bad = await nodeCheck(join(dir, "tampered.json"));
    expect(bad.code).toBe(1);
    expect(bad.out).toMatch(new RegExp(`✗ refuted\\s+${step.id.replace(/[()]/g, "\\$&")}\\s+CHANGED since export`));

    // The server-side PDF and the print view of the same export.
    const pdf = await page.request.get(`${baseUrl}/api/proofs/${proofId}/exports/${await row.getAttribute("data-export-id")}/pdf`);
    expect(pdf.status()).toBe(200);
    expect((await pdf.body()).subarray(0, 5).toString()).toBe("%PDF-");

    await row.getByRole("link", { name: "Print view" }).click();
    await page.getByTestId("print-document").waitFor();
    expect(await page.getByTestId("draft-banner").textContent()).toContain("DRAFT");
    expect(await page.getByTestId("print-caution").textContent()).toContain("remains the responsibility of the authors and the referees");
    expect(await page.locator(".print-document .katex").count()).toBeGreaterThan(5);
    // Every claim has its inputs in the appendix, the graph as entered among them; the .tex has the same appendix.
    const claimItems = JSON.parse(readFileSync(bundlePath, "utf8")).items.filter((i: { type: string }) => i.type === "claim");
    expect(claimItems.length).toBeGreaterThan(0);
    await page.getByTestId("print-claim-inputs").waitFor();
    expect(await page.locator("[data-claim-item]").count()).toBe(claimItems.length);
    for (const item of claimItems) {
      const section = page.locator(`[data-claim-item="${item.id}"]`);
      expect(await section.getByTestId("claim-inputs").count(), item.id).toBe(1);
      const claim = item.data.claim as { graph?: { text: string }; host?: { text: string }; bound?: string };
      const graph = claim.graph ?? claim.host;
      if (graph && graph.text.length <= 2000) expect(await section.textContent(), item.id).toContain(graph.text.split("\n")[0].trim());
      if (claim.bound) expect(await section.textContent(), item.id).toContain(claim.bound);
    }
    expect(readFileSync(texPath, "utf8")).toContain("\\section*{Appendix: claim inputs}");
    await context.close();
  });

  it("a reviewer sees the exports but no export buttons", async () => {
    const context = await browser().newContext();
    const page = await context.newPage();
    await openDemoProofAs(page, baseUrl, "reviewer");
    await page.goto(`${page.url()}/export`);
    await page.getByTestId("export-list").waitFor();
    expect(await page.getByRole("button", { name: "△ Export draft" }).count()).toBe(0);
    await context.close();
  });
});
