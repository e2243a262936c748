/**
 * Claims that carry their own certificate, re-checked in parts: the verdict, the certificate, the
 * digest and the re-check of the carried certificate are those of the single run, and the re-check
 * does not enumerate again in one piece; an exported bundle re-checked with its claims' parts gives
 * the same report, and a bundle whose enumeration list was tampered (one graph removed, one added)
 * is refused naming the graph in graph6, with parts or without.
 */
import { describe, expect, it } from "vitest";
import { validateClaim, type Claim } from "../claims/claim-schema";
import { claimPart, verifyClaim } from "../claims/claims";
import { partsOf } from "../claims/part-count";
import { Budget } from "../verdict";
import { checkBundle, sealBundle, type ClaimItemData } from "./bundle";
import { certifiedHeader, claimItem, sameRun } from "../../../tests/support/bundle-items";
import { claimsToSplit, type PartsByClaim } from "./parts-plan";

// Connected graphs on n = 1..7 vertices: OEIS A001349. Trees on n = 1..13 vertices: OEIS A000055.
const A001349 = [1, 1, 2, 6, 21, 112, 853];
const A000055 = [1, 1, 1, 2, 3, 6, 11, 23, 47, 106, 235, 551, 1301];

const claim = (c: object): Claim => validateClaim({ format: "cairn-claim/1", ...c });
/** Every connected graph on ≤ 7 vertices has ρ < 7 (ρ ≤ n − 1), so none listed is refuted with all of them in the certificate. */
const graphs7 = claim({ kind: "enumeration", maxVertices: 7, op: "<", bound: "7", graphs: [] });
/** Every tree on ≤ 13 vertices has ρ ≤ √12 < 100. */
const trees13 = claim({ kind: "enumeration", setting: "tree", maxVertices: 13, op: "<=", bound: "100", graphs: [] });
const below = claim({ kind: "enumeration", maxVertices: 8, op: "<", bound: "5/2", graphs: [] });
/** Listed exactly: the graphs the enumeration finds (228 of them), so the claim is verified. */
const listed = claim({
  ...below,
  graphs: (verifyClaim(below).verdict.certificate!.evidence as { graph6: string[] }).graph6.map((text) => ({ format: "graph6", text })),
});
const coverage = claim({
  kind: "coverage",
  maxVertices: 7,
  cases: [
    { label: "trees", condition: { predicate: "tree" } },
    { label: "with a cycle", condition: { predicate: "has-cycle" } },
  ],
});

const big = () => new Budget(1e12);
/** Every part of the claim, computed on its own as a part job or a checker thread does. */
const partsOfClaim = (c: Claim, k = partsOf(c)) =>
  Array.from({ length: k }, (_, p) => {
    const r = claimPart(c, p, k, { budget: big() });
    if (!("result" in r)) throw new Error(r.undecided);
    return r.result;
  });
/** The claim with the certificate a single run gives it, as it is stored and exported. */
const carrying = (c: Claim) => ({ ...c, certificate: verifyClaim(c, { budget: big() }).verdict.certificate });

describe("a claim carrying its own certificate, checked in parts", () => {
  it.each([
    ["connected graphs on ≤ 7 vertices (OEIS A001349)", graphs7, A001349],
    ["trees on ≤ 13 vertices (OEIS A000055)", trees13, A000055],
    ["the 228 connected graphs on ≤ 8 vertices with ρ < 5/2, listed", listed, undefined],
    ["a case split into trees and graphs with a cycle, ≤ 7 vertices (OEIS A001349)", coverage, A001349],
  ])("%s: same verdict, certificate, digest and certificate re-check as the single run", (_name, c, counts) => {
    const k = partsOf(c);
    expect(k).toBeGreaterThan(1);
    const withCertificate = carrying(c);
    const single = verifyClaim(withCertificate, { budget: big() });
    for (const parts of [partsOfClaim(c), partsOfClaim(c, k + 1)]) {
      const split = verifyClaim(withCertificate, { budget: big(), parts });
      expect(sameRun(split.verdict)).toEqual(sameRun(single.verdict));
      expect(split.digest).toBe(single.digest);
      expect(sameRun(split.certificateCheck)).toEqual(sameRun(single.certificateCheck));
      expect(split.certificateCheck!.matches).toBe(true);
    }
    const evidence = single.verdict.certificate!.evidence as { counts?: number[]; orders?: number[] };
    if (counts) expect(evidence.counts ?? evidence.orders).toEqual(counts);
  });

  it("re-checks the certificate against the merged parts, not by enumerating again in one piece", () => {
    // A coverage claim's merge only adds counts, so a step budget of a tenth of one run suffices for the verdict
    // and for the certificate's re-check from the parts; the single run cannot decide within it, nor could a
    // re-check that enumerated again (its budget is the same limit).
    const one = new Budget(1e12);
    verifyClaim(coverage, { budget: one });
    const small = Math.floor(one.used / 10);
    const withCertificate = carrying(coverage);
    expect(verifyClaim(withCertificate, { budget: new Budget(small) }).verdict.status).toBe("undecided");
    const split = verifyClaim(withCertificate, { budget: new Budget(small), parts: partsOfClaim(coverage) });
    expect(split.verdict.status).toBe("verified");
    expect(split.certificateCheck).toMatchObject({ matches: true, verdict: { status: "verified" } });
  });

  it("a part that failed for good leaves the claim undecided with its reason", () => {
    const r = verifyClaim(carrying(graphs7), { budget: big(), partsFailed: "part 2 of 2 failed 3 times (out of memory), so the claim could not be decided" });
    expect(r.verdict).toMatchObject({ status: "undecided", method: "checked in parts", reason: expect.stringContaining("part 2 of 2 failed 3 times") });
    expect(r.verdict.certificate).toBeUndefined();
  });
});

// ---- bundles

/** The parts of every split claim of a document, computed apart (as part jobs or checker threads do). */
function partsOfDocument(json: unknown): PartsByClaim {
  return Object.fromEntries(claimsToSplit(json).map((s) => [s.key, { digest: s.digest, results: partsOfClaim(s.claim, s.parts) }]));
}

const copy = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

describe("a bundle re-checked in parts", () => {
  const items = [claimItem("claim 1(a)#1", graphs7), claimItem("claim 1(a)#2", listed), claimItem("claim 1(a)#3", coverage)];
  const bundle = sealBundle(certifiedHeader, items);

  it("gives the report of the single re-check, line for line", () => {
    expect(claimsToSplit(copy(bundle)).map((s) => [s.key, s.parts])).toEqual([
      ["claim 1(a)#1", 2],
      ["claim 1(a)#2", 4],
      ["claim 1(a)#3", 2],
    ]);
    const single = checkBundle(copy(bundle), "b.json");
    // Each claim re-decided as recorded (claim 1 is refuted: none of the 996 graphs is listed), each certificate matching.
    expect(single.lines.map((l) => [l.label, l.status, l.certificate?.matches])).toEqual([
      ["claim 1(a)#1", "refuted", true],
      ["claim 1(a)#2", "verified", true],
      ["claim 1(a)#3", "verified", true],
      ["manifest", "verified", undefined],
    ]);
    expect(sameRun(checkBundle(copy(bundle), "b.json", { parts: partsOfDocument(copy(bundle)) }))).toEqual(sameRun(single));
  });

  it("uses no parts computed for another claim", () => {
    const parts = partsOfDocument(copy(bundle));
    // The parts of claim 1 handed in as claim 2's: refused by digest, so claim 2 is enumerated afresh and still verified.
    const swapped = { ...parts, "claim 1(a)#2": parts["claim 1(a)#1"] };
    expect(sameRun(checkBundle(copy(bundle), "b.json", { parts: swapped }))).toEqual(sameRun(checkBundle(copy(bundle), "b.json")));
  });

  const graph6 = (items[1].data.certificate as { evidence: { graph6: string[] } }).evidence.graph6;
  const removed = graph6[100];
  // K4 (graph6 "C~") has ρ = 3, so it is not among the graphs with ρ < 5/2.
  const added = "C~";
  const resealed = (edit: (d: ClaimItemData & { claim: Claim; certificate: { evidence: { counts: number[]; graph6: string[] } } }) => void) => {
    const edited = copy(items);
    edit(edited[1].data as never);
    return copy(sealBundle(certifiedHeader, edited));
  };

  it.each([
    [
      "the claim's list with one graph removed",
      (d: { claim: Claim & { graphs: { text: string }[] } }) => (d.claim.graphs = d.claim.graphs.filter((g) => g.text !== removed)),
      new RegExp(`graph6 ${escape(removed)}\\) with ρ < 5/2 is not listed`),
    ],
    [
      "the claim's list with one graph added",
      (d: { claim: Claim & { graphs: { format: string; text: string }[] } }) => d.claim.graphs.push({ format: "graph6", text: added }),
      /listed graph 229 \(C~\) does not have ρ < 5\/2/,
    ],
    [
      "the certificate's list with one graph removed (its counts mended)",
      (d: { certificate: { evidence: { counts: number[]; graph6: string[] } } }) => {
        d.certificate.evidence.graph6 = d.certificate.evidence.graph6.filter((t) => t !== removed);
        d.certificate.evidence.counts[4]--;
      },
      new RegExp(`certificate\\.graph6 lacks graph6 ${escape(removed)}, one of the graphs the enumeration finds`),
    ],
    [
      "the certificate's list with one graph added (its counts mended)",
      (d: { certificate: { evidence: { counts: number[]; graph6: string[] } } }) => {
        d.certificate.evidence.graph6.push(added);
        d.certificate.evidence.counts[3]++;
      },
      /certificate\.graph6\[228\] is not one of the graphs the enumeration finds \(graph6 C~\)/,
    ],
  ])("refuses %s, naming the graph in graph6, with parts and without", (_name, edit, named) => {
    const tampered = resealed(edit as never);
    const single = checkBundle(copy(tampered), "b.json");
    const split = checkBundle(copy(tampered), "b.json", { parts: partsOfDocument(copy(tampered)) });
    expect(sameRun(split)).toEqual(sameRun(single));
    expect(single.exitCode).toBe(1);
    const line = single.lines.find((l) => l.label === "claim 1(a)#2")!;
    expect(`${line.text} ${line.certificate?.text ?? ""}`).toMatch(named);
    expect(line.status !== "verified" || line.certificate?.matches === false).toBe(true);
  });
});

function escape(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}
