/**
 * A certified export's bundle re-checked in parts on the job engine (lib/jobs/bundle-parts.ts): its large
 * enumeration claims go to part jobs spread across the workers, the last part in merges them, and the report is
 * the one of the re-check in one piece (verdicts, certificates, digests); a part that throws is tried again, and a
 * part that fails for good (faults injected with CAIRN_TEST_FAULTS, read by the workers only under NODE_ENV=test)
 * leaves its claim's line undecided saying which part failed, how often and why. Each test runs its own workers on
 * a queue prefix of its own, so the suite's shared worker never takes these jobs.
 */
import { describe, expect, it } from "vitest";
import { workersPerTest } from "./helpers";
import { A000055, A001349 } from "./claim-jobs-fixture";
import { models } from "@/models";
import { runBundleJob } from "@/lib/jobs/queue";
import { sweepBundleRechecks } from "@/lib/jobs/bundle-parts";
import { checkBundle, sealBundle } from "@/lib/core/certificates/bundle";
import { claimsToSplit } from "@/lib/core/certificates/parts-plan";
import { validateClaim } from "@/lib/core";
import { startTestWorker } from "../support/workers";
import { certifiedHeader, claimItem, sameRun } from "../support/bundle-items";

const { workers, saved } = workersPerTest(["REDIS_URL", "CAIRN_QUEUE_PREFIX"]);
const worker = (env: Record<string, string> = {}) => {
  const w = startTestWorker({ ...process.env, CAIRN_SWEEP_AFTER_MS: "600000", ...env }, `.data/bundle-parts-worker-${workers.length}.log`);
  workers.push(w);
  return w;
};

// Connected graphs on ≤ 7 vertices, none listed (refuted, every class in the certificate): 2 parts. Trees on ≤ 13 vertices: 4 parts.
const graphs7 = validateClaim({ format: "cairn-claim/1", kind: "enumeration", maxVertices: 7, op: "<", bound: "7", graphs: [] });
const trees13 = validateClaim({ format: "cairn-claim/1", kind: "enumeration", setting: "tree", maxVertices: 13, op: "<=", bound: "100", graphs: [] });
const path3 = validateClaim({ format: "cairn-claim/1", kind: "structure", graph: { format: "named", text: "path(3)" }, predicate: "tree" });

const bundle = JSON.parse(
  JSON.stringify(sealBundle(certifiedHeader, [claimItem("claim 1(a)#1", graphs7), claimItem("claim 1(a)#2", trees13), claimItem("claim 1(a)#3", path3)])),
) as unknown;
const single = checkBundle(bundle, "bundle", { steps: 1e12 });
const fault = (part: number, attempt: number) => `fault injected by CAIRN_TEST_FAULTS into part ${part}, attempt ${attempt}`;
const stored = (lines: string[]) => lines.filter((l) => /bundle re-check \d+: claim 1\(a\)#\d, part \d of \d stored/.test(l));

describe("a bundle re-checked in parts", () => {
  it("spreads the parts across the workers, and the last one in gives the report of the re-check in one piece", async () => {
    process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-bundleparts`;
    const ws = [worker(), worker()];
    await Promise.all(ws.map((w) => w.ready));
    expect(claimsToSplit(bundle).map((s) => [s.key, s.parts])).toEqual([
      ["claim 1(a)#1", 2],
      ["claim 1(a)#2", 4],
    ]);
    const report = await runBundleJob(bundle, 3, 240_000);
    expect(sameRun({ ...report, source: "bundle" })).toEqual(sameRun({ ...single, source: "bundle" }));
    expect(report.lines.map((l) => [l.label, l.status, l.certificate?.matches])).toEqual([
      ["claim 1(a)#1", "refuted", true],
      ["claim 1(a)#2", "refuted", true],
      ["claim 1(a)#3", "verified", true],
      ["manifest", "verified", undefined],
    ]);
    // The refutations name every graph found: counts per order against OEIS A001349 and A000055.
    expect(report.lines[0].reason).toContain(
      `(${A001349.slice(0, 7)
        .map((c, i) => `${c} on ${i + 1}`)
        .join(", ")})`,
    );
    expect(report.lines[1].reason).toContain(
      `(${A000055.slice(0, 13)
        .map((c, i) => `${c} on ${i + 1}`)
        .join(", ")})`,
    );
    // Six part jobs, each stored once, by whichever worker took it; one of them merged. The re-check's rows are gone once read.
    const lines = ws.flatMap((w) => w.output);
    expect(stored(lines)).toHaveLength(6);
    expect(lines.filter((l) => l.includes("all parts in, bundle re-checked"))).toHaveLength(1);
    expect(await models().BundleRecheck.count()).toBe(0);
    expect(await models().BundleRecheckPart.count()).toBe(0);
  }, 300_000);

  it("tries a part that throws again; the report is still the one in one piece", async () => {
    process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-bundleretry`;
    // Part 2 of each split claim throws on its first two attempts and computes on its third (the last BullMQ allows).
    const w = worker({ CAIRN_TEST_FAULTS: "part:2@1,part:2@2" });
    await w.ready;
    const report = await runBundleJob(bundle, 3, 240_000);
    expect(sameRun({ ...report, source: "bundle" })).toEqual(sameRun({ ...single, source: "bundle" }));
    for (const attempt of [1, 2])
      expect(w.output.some((l) => /bundle-r\d+-c0-p1 failed/.test(l) && l.includes(`(attempt ${attempt} of 3): ${fault(2, attempt)}`))).toBe(true);
    expect(stored(w.output)).toHaveLength(6);
  }, 300_000);

  it("leaves a claim undecided when its part fails on every attempt, saying which part, how often and why", async () => {
    process.env.CAIRN_QUEUE_PREFIX = `${saved.CAIRN_QUEUE_PREFIX}-bundlefail`;
    const w = worker({ CAIRN_TEST_FAULTS: "part:2@*" });
    await w.ready;
    const report = await runBundleJob(bundle, 3, 240_000);
    expect(report.exitCode).toBe(1);
    expect(report.lines.map((l) => [l.label, l.status])).toEqual([
      ["claim 1(a)#1", "undecided"],
      ["claim 1(a)#2", "undecided"],
      ["claim 1(a)#3", "verified"],
      ["manifest", "verified"],
    ]);
    const again = "so the claim could not be re-checked; make the certified export again to try again";
    expect(report.lines[0].text).toContain(`part 2 of 2 failed 3 times (${fault(2, 3)}), ${again}`);
    expect(report.lines[1].text).toContain(`part 2 of 4 failed 3 times (${fault(2, 3)}), ${again}`);
    expect(report.lines[0].text).toContain('the bundle records "refuted" but the re-check gives "undecided"');
  }, 300_000);

  it("the sweep removes re-checks nobody waits for any more, with their parts, and keeps recent ones", async () => {
    const { BundleRecheck, BundleRecheckPart } = models();
    const old = await BundleRecheck.create({ jobId: "sweep-old", bundle: "{}", claims: 1, parts: 1, createdAt: new Date(Date.now() - 3_600_000) });
    const recent = await BundleRecheck.create({ jobId: "sweep-recent", bundle: "{}", claims: 1, parts: 1 });
    await BundleRecheckPart.create({
      recheckId: old.id,
      item: "claim 1(a)#1",
      part: 0,
      parts: 1,
      digest: "0".repeat(64),
      result: "{}",
      undecided: null,
      worker: "w",
    });
    expect(await sweepBundleRechecks()).toBe(1);
    expect((await BundleRecheck.findAll()).map((r) => r.jobId)).toEqual(["sweep-recent"]);
    expect(await BundleRecheckPart.count({ where: { recheckId: old.id } })).toBe(0);
    await recent.destroy();
  });
});
