/**
 * The "structure" claim kind: connected, bipartite, tree, forest/acyclic, maximum degree, branch
 * vertices and the legs of a star-like tree, mapped onto the linear checks of structure.ts and
 * degree-structure.ts. Each evidence kind proves one polarity (a spanning forest proves "connected",
 * a component labelling disproves it), which is what the re-check compares with the stated outcome.
 */
import type { StructureClaim } from "./claim-schema";
import { CLAIM_LIMITS, graphOf, overLimit, withOutcome, type ClaimHandler } from "./claim-support";
import { branchVertices, maxDegree, recheckBranchVertices, recheckMaxDegree, recheckStarlikeLegs, starlikeLegs } from "../families/degree-structure";
import { isBipartite, isConnected, isForest, isTree, recheckBipartite, recheckConnected, recheckTree } from "../families/structure";
import type { Budget, Verdict } from "../verdict";
import type { Graph } from "../graph";

const DEGREE_SYMBOL = { "<=": "≤", "=": "=", ">=": "≥" } as const;

function statementOf(c: StructureClaim): string {
  switch (c.predicate) {
    case "connected":
      return "G is connected";
    case "bipartite":
      return "G is bipartite";
    case "tree":
      return "G is a tree";
    case "forest":
      return "G is a forest";
    case "acyclic":
      return "G is acyclic (no cycles, loops or multiple edges)";
    case "max-degree":
      return `Δ(G) ${DEGREE_SYMBOL[c.relation ?? "="]} ${String(c.parameter)}`;
    case "branch-vertices":
      return `G has exactly ${String(c.parameter)} vertices of degree ≥ 3`;
    case "leg-lengths":
      return `G is the star-like tree T(${(c.parameter as number[]).join(",")})`;
  }
}

function kindOf(evidence: unknown): unknown {
  return typeof evidence === "object" && evidence !== null ? (evidence as { kind?: unknown }).kind : undefined;
}

function field(evidence: unknown, name: string): unknown {
  return typeof evidence === "object" && evidence !== null ? (evidence as Record<string, unknown>)[name] : undefined;
}

function compareDegree(x: number, rel: "<=" | "=" | ">=", k: number): boolean {
  return rel === "<=" ? x <= k : rel === ">=" ? x >= k : x === k;
}

function sameMultiset(a: readonly number[], b: readonly number[]): boolean {
  const x = [...a].sort((p, q) => p - q),
    y = [...b].sort((p, q) => p - q);
  return x.length === y.length && x.every((v, i) => v === y[i]);
}

function verifyStructure(c: StructureClaim, g: Graph, budget: Budget): Verdict {
  switch (c.predicate) {
    case "connected":
      return isConnected(g, budget);
    case "bipartite":
      return isBipartite(g, budget);
    case "tree":
      return isTree(g, budget);
    case "forest":
    case "acyclic":
      return isForest(g, budget);
    case "max-degree":
      return maxDegree(g, c.relation ?? "=", c.parameter as number, budget);
    case "branch-vertices":
      return branchVertices(g, c.parameter as number, budget);
    case "leg-lengths":
      return starlikeLegs(g, c.parameter as number[], budget);
  }
}

function recheckStructure(c: StructureClaim, g: Graph, outcome: "verified" | "refuted", evidence: unknown, budget: Budget): Verdict {
  const kind = kindOf(evidence);
  switch (c.predicate) {
    case "connected":
      return withOutcome(recheckConnected(g, evidence, budget), kind === "forest", outcome, kind === "forest" ? "G is connected" : "G is not connected");
    case "bipartite":
      return withOutcome(recheckBipartite(g, evidence, budget), kind === "colouring", outcome, kind === "colouring" ? "a proper 2-colouring" : "an odd cycle");
    case "tree":
    case "forest":
    case "acyclic": {
      const tree = c.predicate === "tree";
      return withOutcome(
        recheckTree(g, evidence, tree, budget),
        kind === "forest",
        outcome,
        kind === "forest" ? `G is a ${tree ? "tree" : "forest"}` : `G is not a ${tree ? "tree" : "forest"}`,
      );
    }
    case "max-degree": {
      const shown = field(evidence, "maxDegree");
      const truth = typeof shown === "number" ? compareDegree(shown, c.relation ?? "=", c.parameter as number) : undefined;
      return withOutcome(recheckMaxDegree(g, evidence, budget), truth, outcome, `Δ(G) = ${String(shown)}`);
    }
    case "branch-vertices": {
      const list = field(evidence, "branchVertices");
      const truth = Array.isArray(list) ? list.length === c.parameter : undefined;
      return withOutcome(recheckBranchVertices(g, evidence, budget), truth, outcome, `${Array.isArray(list) ? list.length : "?"} vertices of degree ≥ 3`);
    }
    case "leg-lengths": {
      const legs = field(evidence, "legs");
      const lengths = kind === "legs" && Array.isArray(legs) ? legs.map((l) => (Array.isArray(l) ? l.length : 0)) : undefined;
      // Evidence other than legs (a cycle, components, a branch-vertex count ≠ 1) shows G is not star-like at all.
      const truth = lengths ? sameMultiset(lengths, c.parameter as number[]) : false;
      return withOutcome(recheckStarlikeLegs(g, evidence, budget), truth, outcome, lengths ? `G is T(${lengths.join(",")})` : "G is not star-like");
    }
  }
}

export const STRUCTURE_HANDLER: ClaimHandler<StructureClaim> = {
  statement: (c) => statementOf(c),
  limit: (_c, inputs) => overLimit(graphOf(inputs), "the graph", CLAIM_LIMITS.structureEdges),
  verify: (c, inputs, budget) => verifyStructure(c, graphOf(inputs), budget),
  recheck: (c, inputs, outcome, evidence, budget) => recheckStructure(c, graphOf(inputs), outcome, evidence, budget),
};
