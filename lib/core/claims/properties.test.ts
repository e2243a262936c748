/**
 * Property tests (fast-check, fixed seeds, graphs with at most 12 vertices). The facts checked are
 * standard: the spectrum and every graph property are invariant under relabelling (common practice);
 * adding an edge never lowers ρ (Perron–Frobenius monotonicity, Brouwer & Haemers, Spectra of Graphs,
 * §3.1); and every certificate the core emits must re-check, and fail to re-check with one entry changed.
 */
import fc from "fast-check";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { readClaimsDocument } from "./claim-file";
import { oracleAccepts, type ClaimGraphs } from "../certificates/certificate-oracle";
import { numericLeafCount, tamper } from "../certificates/certificate-tamper";
import { validateClaim, type Claim } from "./claim-schema";
import { recheckClaim, verifyClaim, type ClaimCertificate } from "./claims";
import { makeGraph, type Graph } from "../graph";
import { identifySmith } from "../families/identify";
import { spectralRadiusBound, type Relation } from "../spectral/inertia";
import { parseGraph } from "../input/parse";
import { checkEmbedding, findSubgraph, recheckSubgraph } from "../subgraph/subgraph";

const SEED = 20261201;
const RUNS = 200;

type EdgeTriple = [number, number, number];

/** Multigraphs on 1..12 vertices; loops and double edges appear but are rarer. */
const graphArb: fc.Arbitrary<Graph> = fc.integer({ min: 1, max: 12 }).chain((n) =>
  fc
    .array(fc.tuple(fc.nat(n - 1), fc.nat(n - 1), fc.constantFrom(1, 1, 1, 1, 1, 2)), { maxLength: 2 * n })
    // A loop of weight 2 alone already has ρ = 2; keep loops light so the tests see varied spectra.
    .map((edges) =>
      makeGraph(
        n,
        edges.filter(([u, v, m]) => u !== v || m === 1 || n === 1).map(([u, v, m]) => ({ u, v, m })),
      ),
    ),
);

const simpleGraphArb: fc.Arbitrary<Graph> = graphArb.map((g) =>
  makeGraph(
    g.n,
    g.edges.filter((e) => e.u !== e.v).map((e) => ({ u: e.u, v: e.v })),
  ),
);

function relabel(g: Graph, perm: readonly number[]): Graph {
  return makeGraph(
    g.n,
    g.edges.map((e) => ({ u: perm[e.u], v: perm[e.v], m: e.m })),
  );
}

const withPermutation = (arb: fc.Arbitrary<Graph>) =>
  arb.chain((g) => fc.shuffledSubarray([...Array(g.n).keys()], { minLength: g.n, maxLength: g.n }).map((perm) => ({ g, perm })));

function edgeText(g: Graph): string {
  return [`n = ${g.n}`, "base = 0", ...g.edges.map((e) => `${e.u} ${e.v} ${e.m}`)].join("\n");
}

const BOUNDS = ["3/2", "2", "sqrt(5)", "5/2", "3"];
const PATTERNS = ["path(3)", "star(3)", "cycle(3)", "cycle(4)", "path(4)", "E~(6)"].map((t) => parseGraph(t, "named"));

describe("relabelling a graph never changes a verdict", () => {
  it("ρ bounds", () => {
    fc.assert(
      fc.property(withPermutation(graphArb), fc.constantFrom(...BOUNDS), fc.constantFrom<Relation>("<", "=", ">"), ({ g, perm }, b, op) => {
        expect(spectralRadiusBound(relabel(g, perm), op, b).status).toBe(spectralRadiusBound(g, op, b).status);
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });

  it("identification family", () => {
    fc.assert(
      fc.property(withPermutation(graphArb), ({ g, perm }) => {
        const a = identifySmith(g),
          b = identifySmith(relabel(g, perm));
        expect(b.status).toBe(a.status);
        // A verified identification names the family member; a refutation may exhibit a different
        // forbidden subgraph under another numbering (e.g. a double edge Ã1 or a heavy loop Ã0), which is fine.
        const family = (v: typeof a) =>
          v.certificate && "family" in v.certificate ? `${v.certificate.family}${v.certificate.parameter}` : v.certificate?.kind;
        if (a.status === "verified") expect(family(b)).toBe(family(a));
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });

  it("containment, plain and induced", () => {
    fc.assert(
      fc.property(withPermutation(simpleGraphArb), fc.constantFrom(...PATTERNS), fc.boolean(), ({ g, perm }, h, induced) => {
        expect(findSubgraph(h, relabel(g, perm), { induced }).status).toBe(findSubgraph(h, g, { induced }).status);
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });
});

describe("adding an edge never lowers ρ", () => {
  it("if ρ(G + e) < b is verified then so is ρ(G) < b, at several rational bounds", () => {
    const plusEdge = graphArb.chain((g) =>
      fc.tuple(fc.nat(g.n - 1), fc.nat(g.n - 1)).map(([u, v]) => ({ g, bigger: makeGraph(g.n, [...g.edges, { u, v, m: 1 }]) })),
    );
    fc.assert(
      fc.property(plusEdge, fc.constantFrom("1", "3/2", "2", "5/2", "3", "7/2"), ({ g, bigger }, b) => {
        const before = spectralRadiusBound(g, "<=", b).status,
          after = spectralRadiusBound(bigger, "<=", b).status;
        if (after === "verified") expect(before).toBe("verified");
        if (before === "refuted") expect(after).toBe("refuted");
      }),
      { seed: SEED, numRuns: 2 * RUNS },
    );
  });
});

describe("every embedding a search returns verifies", () => {
  it("plain and induced", () => {
    fc.assert(
      fc.property(simpleGraphArb, fc.constantFrom(...PATTERNS), fc.boolean(), (g, h, induced) => {
        const v = findSubgraph(h, g, { induced });
        if (v.certificate?.kind === "embedding") {
          expect(checkEmbedding(h, g, v.certificate.embedding, induced)).toBeNull();
          expect(recheckSubgraph(h, g, v.certificate, induced).status).toBe("verified");
        } else expect(v.status).toBe("refuted");
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });
});

describe("every certificate re-verifies, and one changed entry is rejected", () => {
  /**
   * Entries with slack, where a changed value may or may not still be valid and no independent judge
   * is cheap: the search's node count (a statistic, not part of the argument) and the ends of a Sturm
   * enclosure (a slightly different interval may still isolate b). Changes there may be accepted.
   */
  const SLACK = new Set(["nodesVisited", "lo", "hi"]);
  const withoutSlack = (x: unknown): unknown =>
    Array.isArray(x)
      ? x.map(withoutSlack)
      : x && typeof x === "object"
        ? Object.fromEntries(
            Object.entries(x)
              .filter(([k]) => !SLACK.has(k))
              .map(([k, v]) => [k, withoutSlack(v)]),
          )
        : x;

  const claims = (g: Graph, b: string, op: Relation, pattern: string): Claim[] => {
    const graph = { format: "edges", text: edgeText(g) };
    return [
      { kind: "spectral-radius-bound", graph, op, bound: b },
      { kind: "identification", graph },
      { kind: "structure", graph, predicate: "connected" },
      { kind: "structure", graph, predicate: "bipartite" },
      { kind: "structure", graph, predicate: "tree" },
      { kind: "structure", graph, predicate: "max-degree", relation: "<=", parameter: 3 },
      { kind: "subgraph", pattern: { format: "named", text: pattern }, host: graph },
      {
        kind: "exclusion",
        host: graph,
        patterns: [
          { format: "named", text: pattern },
          { format: "named", text: "star(4)" },
        ],
      },
    ].map((c) => validateClaim({ format: "cairn-claim/1", ...c }));
  };

  it("for spectral, structural, containment and identification claims", () => {
    const arb = fc.tuple(
      graphArb,
      fc.constantFrom(...BOUNDS),
      fc.constantFrom<Relation>("<", "<=", "=", ">=", ">"),
      fc.constantFrom("path(3)", "star(3)", "cycle(4)", "E~(6)"),
      fc.nat(),
    );
    fc.assert(
      fc.property(arb, ([g, b, op, pattern, pick]) => {
        const h = parseGraph(pattern, "named");
        const graphs: ClaimGraphs = { graph: g, host: g, pattern: h, patterns: [h, parseGraph("star(4)", "named")] };
        for (const claim of claims(g, b, op, pattern)) {
          const r = verifyClaim(claim);
          expect(r.verdict.status).not.toBe("undecided");
          const cert = r.verdict.certificate as ClaimCertificate;
          expect(recheckClaim(claim, cert).status, `${r.verdict.statement}: genuine certificate`).toBe("verified");
          const flipped = { ...cert, outcome: cert.outcome === "verified" ? "refuted" : "verified" };
          expect(recheckClaim(claim, flipped).status, `${r.verdict.statement}: flipped outcome`).toBe("refuted");
          const entries = numericLeafCount(cert.evidence);
          if (entries === 0) continue;
          const changed = { ...cert, evidence: tamper(cert.evidence, pick % entries) };
          const again = recheckClaim(claim, changed).status;
          if (JSON.stringify(withoutSlack(changed.evidence)) === JSON.stringify(withoutSlack(cert.evidence))) continue;
          // Accepting a changed certificate is right only when it is still a valid certificate, as judged
          // from the definitions (another embedding, another labelling of the components, …).
          const stillValid = oracleAccepts(claim, graphs, changed.evidence, cert.evidence);
          expect(again, `${r.verdict.statement}: ${JSON.stringify(cert.evidence)} → ${JSON.stringify(changed.evidence)}`).toBe(
            stillValid ? "verified" : "refuted",
          );
        }
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });
});

describe("arbitrary JSON as a certificate", () => {
  const fixtures = join(import.meta.dirname, "../../../tests/fixtures/claims");
  const fixtureClaims: Claim[] = readdirSync(fixtures)
    .filter((f) => f.endsWith(".json") && !f.startsWith("malformed"))
    .flatMap((f) => readClaimsDocument(JSON.parse(readFileSync(join(fixtures, f), "utf8"))))
    .flatMap((e) => ("claim" in e ? [e.claim] : []));

  it("never crashes a re-check and is never accepted", () => {
    const evidence = fc.oneof(
      fc.jsonValue({ maxDepth: 3 }),
      fc.record({
        kind: fc.constantFrom("inertia", "rayleigh", "embedding", "absence", "forest", "cycle", "components", "isomorphism", "legs"),
        value: fc.jsonValue({ maxDepth: 2 }),
      }),
    );
    fc.assert(
      fc.property(fc.constantFrom(...fixtureClaims), fc.constantFrom("verified", "refuted"), evidence, (claim, outcome, e) => {
        const v = recheckClaim(claim, { kind: claim.kind, outcome, evidence: e });
        expect(v.status).not.toBe("verified");
      }),
      { seed: SEED, numRuns: RUNS },
    );
  });
});
