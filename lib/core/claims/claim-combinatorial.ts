/**
 * Combinatorial claim kinds: subgraph containment (with or without a stated embedding), exclusion of
 * a list of patterns (subgraph.ts), and identification within Smith's families (identify.ts).
 */
import type { ExclusionClaim, IdentificationClaim, SubgraphClaim } from "./claim-schema";
import { CLAIM_LIMITS, ClaimInputError, graphOf, overLimit, withOutcome, type ClaimHandler, type ParsedInputs } from "./claim-support";
import type { Graph } from "../graph";
import { identifySmith, recheckIdentification } from "../families/identify";
import { familyDisplay, parseFamilyName, type SmithFamily } from "../families/smith-families";
import { checkEmbedding, excludeSubgraphs, findSubgraph, MONOTONICITY_NOTE, recheckExclusion, recheckSubgraph } from "../subgraph/subgraph";
import type { Budget, Verdict } from "../verdict";

function kindOf(evidence: unknown): unknown {
  return typeof evidence === "object" && evidence !== null ? (evidence as { kind?: unknown }).kind : undefined;
}

function pair(inputs: ParsedInputs): { h: Graph; g: Graph } {
  if (!inputs.pattern || !inputs.host) throw new Error("internal: subgraph claim graphs not parsed");
  return { h: inputs.pattern, g: inputs.host };
}

function hostLimit(g: Graph): string | undefined {
  return overLimit(g, "the host graph", CLAIM_LIMITS.hostEdges);
}

// ---------------------------------------------------------------- subgraph

function subgraphStatement(c: SubgraphClaim): string {
  return `H ⊆ G${c.induced ? " (induced)" : ""}${c.embedding ? " via the stated embedding" : ""}`;
}

/** With a stated embedding the claim is about that embedding: it holds or it does not, no search. */
function verifyStatedEmbedding(c: SubgraphClaim, h: Graph, g: Graph, budget: Budget): Verdict {
  const phi = c.embedding!;
  if (phi.length !== h.n) throw new ClaimInputError("embedding", `the embedding lists ${phi.length} vertices but H has ${h.n}`);
  const statement = subgraphStatement(c),
    method = "embedding check";
  const problem = checkEmbedding(h, g, phi, c.induced, budget);
  if (problem) return { status: "refuted", statement, method, reason: `the stated embedding fails: ${problem}` };
  return {
    status: "verified",
    statement,
    method,
    certificate: { kind: "embedding", embedding: [...phi] },
    notes: [MONOTONICITY_NOTE],
    reason: `the stated embedding is injective and maps every ${c.induced ? "pair of vertices of H to a pair of G with equal multiplicity" : "edge (and loop) of H to one of G of at least the same multiplicity"}`,
  };
}

export const SUBGRAPH_HANDLER: ClaimHandler<SubgraphClaim> = {
  statement: (c) => subgraphStatement(c),
  limit: (_c, inputs) => {
    const { h, g } = pair(inputs);
    return overLimit(h, "the pattern", CLAIM_LIMITS.patternVertices, CLAIM_LIMITS.patternVertices ** 2) ?? hostLimit(g);
  },
  verify: (c, inputs, budget) => {
    const { h, g } = pair(inputs);
    if (c.embedding) return verifyStatedEmbedding(c, h, g, budget);
    return findSubgraph(h, g, { induced: c.induced, budget });
  },
  recheck: (c, inputs, outcome, evidence, budget) => {
    const { h, g } = pair(inputs);
    const present = kindOf(evidence) === "embedding";
    // A refutation of a stated embedding carries no evidence; re-running the embedding check is the re-check.
    if (c.embedding && outcome === "refuted" && evidence === undefined) {
      const v = verifyStatedEmbedding(c, h, g, budget);
      return {
        ...v,
        status: v.status === "refuted" ? "verified" : "refuted",
        reason: v.status === "refuted" ? v.reason : "certificate rejected: the stated embedding is valid",
      };
    }
    if (c.embedding && present && JSON.stringify((evidence as { embedding?: unknown }).embedding) !== JSON.stringify(c.embedding))
      return {
        status: "refuted",
        statement: subgraphStatement(c),
        method: "certificate re-check",
        reason: "certificate rejected: its embedding is not the one stated in the claim",
      };
    return withOutcome(recheckSubgraph(h, g, evidence, c.induced, budget), present, outcome, present ? "an embedding of H in G" : "H is absent from G");
  },
};

// ---------------------------------------------------------------- exclusion

function hostAndPatterns(inputs: ParsedInputs): { g: Graph; patterns: readonly Graph[] } {
  if (!inputs.host || !inputs.patterns) throw new Error("internal: exclusion claim graphs not parsed");
  return { g: inputs.host, patterns: inputs.patterns };
}

export const EXCLUSION_HANDLER: ClaimHandler<ExclusionClaim> = {
  statement: (c) => `G contains none of ${c.patterns.map((_, i) => `H${i + 1}`).join(", ")}${c.induced ? " as induced subgraphs" : ""}`,
  limit: (c, inputs) => {
    const { g, patterns } = hostAndPatterns(inputs);
    if (c.patterns.length > CLAIM_LIMITS.exclusionPatterns) return `${c.patterns.length} patterns; the limit is ${CLAIM_LIMITS.exclusionPatterns}`;
    for (let i = 0; i < patterns.length; i++) {
      const over = overLimit(patterns[i], `pattern H${i + 1}`, CLAIM_LIMITS.patternVertices, CLAIM_LIMITS.patternVertices ** 2);
      if (over) return over;
    }
    return hostLimit(g);
  },
  verify: (c, inputs, budget) => {
    const { g, patterns } = hostAndPatterns(inputs);
    return excludeSubgraphs(g, patterns, { induced: c.induced, budget });
  },
  recheck: (c, inputs, outcome, evidence, budget) => {
    const { g, patterns } = hostAndPatterns(inputs);
    const found = typeof evidence === "object" && evidence !== null && (evidence as { found?: unknown }).found !== undefined;
    return withOutcome(
      recheckExclusion(g, patterns, evidence, c.induced, budget),
      !found,
      outcome,
      found ? "one pattern embeds in G" : "every pattern is absent",
    );
  },
};

// ---------------------------------------------------------------- identification

function expectedFamily(c: IdentificationClaim): { family: SmithFamily; parameter: number } | undefined {
  if (c.family === undefined) return undefined;
  const want = parseFamilyName(c.family);
  if (!want) throw new ClaimInputError("family", `"${c.family}" is not a family name; write e.g. E7, D5, affine E8, A~0, loop_path(3)`);
  return want;
}

export const IDENTIFICATION_HANDLER: ClaimHandler<IdentificationClaim> = {
  statement: (c) => {
    const want = expectedFamily(c);
    return want ? `G ≅ ${familyDisplay(want.family, want.parameter)}` : "G belongs to a family with ρ ≤ 2 (Dynkin A/D/E, affine Ã/D̃/Ẽ, or a loop family)";
  },
  limit: (_c, inputs) => overLimit(graphOf(inputs), "the graph", CLAIM_LIMITS.identificationEdges),
  verify: (c, inputs, budget) => identifySmith(graphOf(inputs), expectedFamily(c), budget),
  recheck: (c, inputs, outcome, evidence, budget) => {
    const want = expectedFamily(c);
    const e = typeof evidence === "object" && evidence !== null ? (evidence as Record<string, unknown>) : {};
    // An isomorphism shows G is that family member; a forbidden subgraph or a disconnection shows G is in none.
    const truth = e.kind === "isomorphism" ? !want || (e.family === want.family && e.parameter === want.parameter) : false;
    const shows = e.kind === "isomorphism" ? `G ≅ ${String(e.family)}(${String(e.parameter)})` : "G is in no family with ρ ≤ 2";
    return withOutcome(recheckIdentification(graphOf(inputs), evidence, budget), truth, outcome, shows);
  },
};
