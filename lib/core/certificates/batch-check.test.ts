/**
 * Batch claims in the certificate bundle, re-checked offline (checkBundle, and the checker command's
 * `main`): an honest batch passes; a changed verdict, a tampered certificate or a dropped graph is
 * rejected even when the tamperer re-seals every digest, and an unsealed change is named as changed.
 */
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { checkBundle, sealBundle, type Bundle } from "./bundle";
import type { BatchItemData } from "./batch-check";
import type { BatchStatement } from "../claims/batch";
import { batchItemData, BUNDLE_HEADER } from "../../../tests/support/batch-item";
import { generateConnected } from "../families/augmentation";
import { writeGraph6 } from "../input/graph6";
import { Budget } from "../verdict";
import { main } from "../cli";

// All 106 trees on 10 vertices (OEIS A000055), from Cairn's own enumeration by canonical augmentation.
const trees = generateConnected({ maxVertices: 10, setting: { kind: "tree" }, collect: true, budget: new Budget(1e9) }).levels[9].map((g) => writeGraph6(g));
const text = trees.join("\n") + "\n";

const batchData = (statement: BatchStatement): BatchItemData => batchItemData(statement, text, "graph6", "trees-10.g6");
const header = BUNDLE_HEADER;
const seal = (data: unknown): Bundle => sealBundle(header, [{ id: "batch 1(a)#1", type: "batch", data }]);
const batchLine = (b: unknown) => checkBundle(b, "bundle.json").lines.find((l) => l.label === "batch 1(a)#1")!;
const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

// A tree on n vertices has ρ ≤ √(n−1), with equality only for the star (from memory; common knowledge):
// every tree on 10 vertices has ρ ≤ 3.
const allHold = batchData({ kind: "spectral-radius-bound", op: "<=", bound: "3" });
// Smith 1970 (Brouwer & Haemers, Spectra of Graphs, Thm 3.1.3): of these only A₁₀ and D₁₀ are Dynkin.
const dynkin = batchData({ kind: "identified-as", families: ["A", "D"] });

describe("a batch claim in the bundle", () => {
  it("re-checks every graph and its certificate: all 106 trees have ρ ≤ 3 (exit 0)", () => {
    const report = checkBundle(seal(allHold), "bundle.json");
    expect(report.exitCode).toBe(0);
    expect(batchLine(seal(allHold))).toMatchObject({
      status: "verified",
      text: expect.stringMatching(/106 of 106 graphs verified.*106 certificates re-checked/),
    });
    expect(report.source).toMatch(/1 batch claim\(s\)/);
  });

  it("an honest batch with failures is refuted, with the re-check agreeing: 2 of 106 identified as A or D", () => {
    expect(batchLine(seal(dynkin))).toMatchObject({ status: "refuted", text: expect.stringMatching(/^every graph .*: 2 of 106 graphs verified, 104 refuted/) });
  });

  it("rejects a verdict changed from refuted to verified, even with every digest re-sealed", () => {
    const forged = clone(dynkin);
    const i = forged.results.findIndex((r) => r.verdict === "refuted");
    (forged.results[i] as { verdict: string }).verdict = "verified";
    const line = batchLine(seal(forged));
    expect(line.status).toBe("refuted");
    expect(line.text).toContain(`line ${forged.results[i].line}: the bundle records "verified" but the re-check gives "refuted"`);
  });

  it("rejects a tampered certificate: an inertia count changed, or an isomorphism's bijection swapped", () => {
    const forged = clone(allHold);
    const cert = forged.results[5].certificate as { positive: number; negative: number };
    cert.positive -= 1;
    cert.negative += 1;
    const line = batchLine(seal(forged));
    expect(line.status).toBe("refuted");
    expect(line.text).toMatch(/line 6: the certificate does not re-check/);

    const bad = clone(dynkin);
    const k = bad.results.findIndex((r) => r.verdict === "verified");
    const iso = bad.results[k].certificate as { bijection: number[] };
    [iso.bijection[0], iso.bijection[1]] = [iso.bijection[1], iso.bijection[0]];
    const l2 = batchLine(seal(bad));
    expect(l2.status).toBe("refuted");
    expect(l2.text).toMatch(new RegExp(`line ${bad.results[k].line}: the certificate does not re-check`));
  });

  it("rejects a graph dropped from the results, and counts that do not add up", () => {
    const dropped = clone(dynkin);
    (dropped as unknown as { results: unknown[] }).results = dropped.results.slice(1);
    expect(batchLine(seal(dropped)).text).toMatch(/the list has 106 graphs but 105 results are recorded/);
    const counted = clone(dynkin);
    (counted.counts as { verified: number }).verified = 3;
    expect(batchLine(seal(counted)).text).toMatch(/the recorded counts \(3 verified/);
  });

  it("names an unsealed change as changed, and the checker command exits 1 on a tampered bundle, 0 on the honest one", async () => {
    const honest = seal(allHold);
    const changed = clone(honest) as unknown as { items: Array<{ data: BatchItemData }> };
    (changed.items[0].data.results[0] as { verdict: string }).verdict = "refuted";
    expect(batchLine(changed).text).toMatch(/^CHANGED since export/);

    const dir = mkdtempSync(join(tmpdir(), "cairn-batch-bundle-"));
    writeFileSync(join(dir, "honest.json"), JSON.stringify(honest));
    writeFileSync(join(dir, "tampered.json"), JSON.stringify(changed));
    const out: string[] = [];
    expect(await main([join(dir, "honest.json")], (l) => out.push(l))).toBe(0);
    expect(await main([join(dir, "tampered.json")], (l) => out.push(l))).toBe(1);
    expect(out.join("\n")).toMatch(/batch 1\(a\)#1/);
  });
});
