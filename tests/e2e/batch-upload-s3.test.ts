/**
 * The batch flow of batch-upload.test.ts with the S3 file store: a second app server and worker whose
 * CAIRN_STORAGE=s3 points at an S3 fake (s3rver) on loopback. An author uploads all 3159 trees on 14 vertices,
 * starts "every graph has ρ(G) < 2", watches the progress, opens the table and downloads the failures as graph6 and CSV.
 * Then, with that server's own Redis stopped, a batch made in the browser waits and the page says verification is paused;
 * once Redis is back it finishes with every line decided.
 *
 * Expected verdicts, from outside Cairn:
 * - the list is Debian nauty's `nauty-gentreeg -q 14` (sparse6), 3159 trees: OEIS A000055 (n = 14);
 * - Smith's classification (Brouwer & Haemers, "Spectra of Graphs", Thm 3.1.3): the connected graphs with ρ < 2 are the
 *   Dynkin graphs A_n, D_n, E_6, E_7, E_8; on 14 vertices only the path A_14 and D_14 (a path with two leaves on one end vertex's neighbour).
 *   So exactly 3157 trees fail; they are told apart here by degrees alone.
 */
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Browser } from "playwright-core";
import { launchBrowser, openDemoStepAsAuthor } from "./browser";
import { db } from "./access-fixture";
import { E2E_PORT, e2eEnv, startAppServer, type AppServer } from "./app-server";
import { s3FakePort, startS3Fake, type S3Fake } from "../support/s3-fake";
import { startTestWorker, type TestWorker } from "../support/workers";
import { ownRedis, type TestRedis } from "../support/redis";
import { parseGraph6 } from "@/lib/core/input/graph6";
import { readListedGraph } from "@/lib/core/input/graph-list";
import type { Graph } from "@/lib/core/graph";

const N = 14;
const TOTAL = 3159; // OEIS A000055, n = 14
let browser: Browser;
let fake: S3Fake;
let app: AppServer;
let worker: TestWorker;
let redis: TestRedis;
const dir = mkdtempSync(join(tmpdir(), "cairn-e2e-s3-"));

/** Debian nauty's trees on n vertices (sparse6), or null when nauty is not installed. */
function gentreeg(n: number): string[] | null {
  for (const cmd of ["nauty-gentreeg", "gentreeg"]) {
    const r = spawnSync(cmd, ["-q", String(n)], { encoding: "utf8" });
    if (r.status === 0 && r.stdout) return r.stdout.trim().split("\n");
  }
  return null;
}
const trees = gentreeg(N);

/** The edge set of a graph as sorted pairs (both files keep gentreeg's labelling). */
const edgesOf = (g: Graph): [number, number][] =>
  g.edges.map((e): [number, number] => [Math.min(e.u, e.v), Math.max(e.u, e.v)]).sort((a, b) => a[0] - b[0] || a[1] - b[1]);
const edgeKey = (g: Graph): string => JSON.stringify(edgesOf(g));

/** A_n (a path) or D_n (one vertex of degree 3 with two leaf neighbours, the rest a path), told by degrees. */
function isDynkinAorD(edges: [number, number][], n: number): boolean {
  const deg = new Array<number>(n).fill(0);
  for (const [a, b] of edges) (deg[a]++, deg[b]++);
  const big = deg.map((d, v) => [d, v]).filter(([d]) => d >= 3);
  if (big.length === 0) return Math.max(...deg) <= 2;
  if (big.length > 1 || big[0][0] !== 3) return false;
  const centre = big[0][1];
  const leaves = edges.map(([a, b]) => (a === centre ? b : b === centre ? a : -1)).filter((v) => v >= 0 && deg[v] === 1);
  return leaves.length >= 2;
}

/** A new browser context on the demo step of the S3 server, with `lines` uploaded as the file `name`. */
async function openStepAndUpload(name: string, lines: string[]) {
  const text = lines.join("\n") + "\n";
  writeFileSync(join(dir, name), text);
  const context = await browser.newContext({ acceptDownloads: true });
  const page = await context.newPage();
  await openDemoStepAsAuthor(page, app.base);
  await page.getByTestId("file-input").setInputFiles(join(dir, name));
  await expect
    .poll(async () => (await page.getByTestId("upload-message").textContent()) ?? "", { timeout: 60_000 })
    .toMatch(new RegExp(`sparse6 list of ${lines.length} graphs`));
  return { page, context, text };
}

beforeAll(async () => {
  if (!trees) return;
  fake = await startS3Fake(s3FakePort(7), "cairn-e2e-files");
  // Its own Redis (the second test stops it), so that only the worker with the S3 settings takes this server's jobs.
  redis = await ownRedis();
  await redis.up();
  const env: NodeJS.ProcessEnv = {
    ...e2eEnv("e2e-s3"),
    ...fake.env,
    REDIS_URL: redis.url,
    CAIRN_BATCH_CHUNK: "500",
    // Batches stored while Redis was away are queued soon after it returns.
    CAIRN_SWEEP_AFTER_MS: "500",
    CAIRN_SWEEP_INTERVAL_MS: "500",
  };
  delete env.CAIRN_STORAGE_DIR;
  worker = startTestWorker(env, ".data/e2e-s3-worker.log");
  [app] = await Promise.all([startAppServer(env, E2E_PORT + 1), worker.ready]);
  browser = await launchBrowser();
}, 120_000);
afterAll(async () => {
  await browser?.close();
  // This file's batches have their lists in the S3 fake, which stops with the file. The main test server (local file
  // store, same database) would meet them on the demo step and fail to read them (an export re-reads every batch's
  // list), so they and their files' rows go (batch results follow by ON DELETE CASCADE).
  await db(async (c) => {
    await c.query("DELETE b FROM batch_claims b JOIN step_files f ON f.id = b.file_id WHERE f.name IN (?, ?)", ["trees-14.s6", "trees-10.s6"]);
    await c.query("DELETE FROM step_files WHERE name IN (?, ?)", ["trees-14.s6", "trees-10.s6"]);
  });
  worker?.stop();
  app?.stop();
  await fake?.stop();
  redis?.remove();
  rmSync(dir, { recursive: true, force: true });
});

describe.skipIf(!trees)("a batch claim in the browser with the S3 file store", () => {
  it("stores the upload in the bucket under its SHA-256, checks 3159 trees and downloads exactly the 3157 failures", { timeout: 170_000 }, async () => {
    expect(trees).toHaveLength(TOTAL);
    const { page, context, text } = await openStepAndUpload("trees-14.s6", trees!);

    // The object is in the fake's bucket under the SHA-256 of the bytes sent.
    const s3 = new S3Client({
      endpoint: fake.endpoint,
      region: "us-east-1",
      forcePathStyle: true,
      credentials: { accessKeyId: fake.env.CAIRN_S3_ACCESS_KEY_ID, secretAccessKey: fake.env.CAIRN_S3_SECRET_ACCESS_KEY },
    });
    const listed = await s3.send(new ListObjectsV2Command({ Bucket: fake.bucket }));
    const digest = createHash("sha256").update(text).digest("hex");
    expect((listed.Contents ?? []).map((o) => o.Key)).toContain(digest);
    s3.destroy();

    const form = page.getByTestId("batch-form");
    await form.getByLabel("graph list").selectOption({ label: `trees-14.s6 (${TOTAL} graphs)` });
    await form.getByLabel("relation").selectOption("<");
    await form.getByLabel("bound").fill("2");
    await form.getByRole("button", { name: "Check every graph" }).click();

    // Other tests add batches to this step: this batch's card is the one over trees-14.s6.
    const card = page.getByTestId("batch-card").filter({ hasText: "trees-14.s6" }).first();
    const progress = card.getByTestId("batch-progress");
    await progress.waitFor();
    const seen = new Set<string>();
    const outcome = card.getByTestId("batch-outcome");
    while (!(await outcome.isVisible())) {
      const t = (await progress.textContent().catch(() => null)) ?? "";
      if (t) seen.add(t);
      await page.waitForTimeout(100);
    }
    expect([...seen].some((t) => new RegExp(`of ${TOTAL} checked`).test(t))).toBe(true);
    expect(await outcome.textContent()).toMatch(new RegExp(`\\b${TOTAL - 2} of ${TOTAL} graphs fail`));

    await card.getByRole("button", { name: "show each graph" }).click();
    await card.getByTestId("batch-result-row").first().waitFor();
    const verdicts = await card.getByTestId("batch-result-row").locator("td:nth-child(2)").allTextContents();
    expect(verdicts).toHaveLength(TOTAL - 2);
    expect(verdicts.every((v) => !v.includes("verified"))).toBe(true);

    // The expected failures: every tree of the list but A_14 and D_14 (Smith), by edge set.
    const listedGraphs = trees!.map((line, i) => edgesOf(readListedGraph({ line: i + 1, text: line }, "sparse6")));
    const passing = listedGraphs.filter((e) => isDynkinAorD(e, N));
    expect(passing).toHaveLength(2);
    const expected = listedGraphs.filter((e) => !isDynkinAorD(e, N)).map((e) => JSON.stringify(e));

    const [g6] = await Promise.all([page.waitForEvent("download"), card.getByTestId("download-failures").click()]);
    await g6.saveAs(join(dir, "failures.g6"));
    const g6Lines = readFileSync(join(dir, "failures.g6"), "utf8").trimEnd().split("\n");
    expect(g6Lines.map((l) => edgeKey(parseGraph6(l))).sort()).toEqual([...expected].sort());

    const [csv] = await Promise.all([page.waitForEvent("download"), card.getByTestId("download-csv").click()]);
    await csv.saveAs(join(dir, "results.csv"));
    const rows = readFileSync(join(dir, "results.csv"), "utf8").trimEnd().split("\r\n");
    expect(rows[0]).toBe("line,verdict,graph6,sparse6,vertices,edges,method,reason");
    const body = rows.slice(1).map((r) => r.split(","));
    // The CSV holds every line: a tree on 14 vertices each, verified exactly for A_14 and D_14.
    expect(body.map((r) => Number(r[0]))).toEqual(trees!.map((_, i) => i + 1));
    for (const [line, verdict, graph6, sparse6, vertices, edges] of body) {
      expect(sparse6).toBe(""); // trees are simple: named in graph6 only
      const listedEdges = listedGraphs[Number(line) - 1];
      expect(verdict === "verified").toBe(isDynkinAorD(listedEdges, N));
      expect([vertices, edges]).toEqual([String(N), String(N - 1)]);
      expect(edgeKey(parseGraph6(graph6))).toBe(JSON.stringify(listedEdges));
    }
    await context.close();
  });

  it(
    "with Redis stopped, a batch made in the browser waits and the page says verification is paused; once Redis is back it finishes",
    { timeout: 120_000 },
    async () => {
      // OEIS A000055: 106 trees on 10 vertices (nauty's gentreeg); with ρ < 2 only A_10 and D_10 (Brouwer & Haemers Thm 3.1.3).
      const small = gentreeg(10)!;
      expect(small).toHaveLength(106);
      const { page, context } = await openStepAndUpload("trees-10.s6", small);

      redis.down();
      const form = page.getByTestId("batch-form");
      await form.getByLabel("graph list").selectOption({ label: "trees-10.s6 (106 graphs)" });
      await form.getByLabel("relation").selectOption("<");
      await form.getByLabel("bound").fill("2");
      await form.getByRole("button", { name: "Check every graph" }).click();

      const card = page.getByTestId("batch-card").filter({ hasText: "trees-10.s6" }).first();
      await card.waitFor();
      const paused = page.getByTestId("batch-verification-paused");
      await paused.waitFor({ timeout: 30_000 });
      expect(await paused.textContent()).toMatch(/Verification is paused/);
      expect(await card.textContent()).toMatch(/waiting for a worker/);
      expect(await card.getByTestId("batch-progress").textContent()).toMatch(/^0 of 106 checked/);
      // Still waiting a few seconds later: nothing is decided without the queue.
      await page.waitForTimeout(3_000);
      expect(await card.getByTestId("batch-progress").textContent()).toMatch(/^0 of 106 checked/);

      await redis.up();
      const outcome = card.getByTestId("batch-outcome");
      await outcome.waitFor({ timeout: 90_000 });
      expect(await outcome.textContent()).toMatch(/\b104 of 106 graphs fail/);
      await paused.waitFor({ state: "detached", timeout: 30_000 });

      // Nothing lost: every line decided once, verified exactly for A_10 and D_10.
      const [csv] = await Promise.all([page.waitForEvent("download"), card.getByTestId("download-csv").click()]);
      await csv.saveAs(join(dir, "trees-10.csv"));
      const body = readFileSync(join(dir, "trees-10.csv"), "utf8")
        .trimEnd()
        .split("\r\n")
        .slice(1)
        .map((r) => r.split(","));
      expect(body.map((r) => Number(r[0]))).toEqual(small.map((_, i) => i + 1));
      const smallEdges = small.map((line, i) => edgesOf(readListedGraph({ line: i + 1, text: line }, "sparse6")));
      for (const [line, verdict] of body) expect(verdict === "verified").toBe(isDynkinAorD(smallEdges[Number(line) - 1], 10));
      await context.close();
    },
  );
});
