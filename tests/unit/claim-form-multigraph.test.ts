/**
 * The claim form's enumeration and coverage over graphs with loops and multiple edges: the setting and its
 * two bounds become the claim's fields, the core verifies it, and a bad bound comes back on its own form field.
 */
import { describe, expect, it } from "vitest";
import { formFieldOf } from "@/lib/validations/claim";
import { ClaimError, validateClaim } from "@/lib/core/claims/claim-schema";
import { verifyClaim } from "@/lib/core/claims/claims";
import { claimOf } from "./claim-form-fixture";

const MULTIGRAPHS = { kind: "enumeration", enumerationSetting: "multigraph" } as const;
// The connected multigraphs with ρ < 2 on at most 2 vertices as adjacency matrices, A1, T1, A2, T2 (sources in the test name).
const BELOW_2 = "0\n---\n1\n---\n0 1\n1 0\n---\n1 1\n1 0";

describe("claim form: enumeration with loops and multiple edges", () => {
  it("builds a multigraph enumeration claim that verifies (ρ < 2 on ≤ 2 vertices: A1, T1, A2, T2 — J. H. Smith 1970, tadpole from memory)", () => {
    const claim = claimOf({
      ...MULTIGRAPHS,
      maxVertices: "2",
      op: "<",
      bound: "2",
      maxMultiplicity: "2",
      maxLoop: "1",
      patternFormat: "matrix",
      patternText: BELOW_2,
    });
    expect(claim).toMatchObject({ setting: "multigraph", maxMultiplicity: 2, maxLoop: 1 });
    const v = verifyClaim(validateClaim(claim)).verdict;
    expect(v.status, v.reason).toBe("verified");
  });

  it("sends a bad bound to the core, whose JSON path lands on the form field", () => {
    const claim = claimOf({ ...MULTIGRAPHS, maxVertices: "3", maxLoop: "x", patternText: "A(1)" });
    let path = "";
    try {
      validateClaim(claim);
    } catch (e) {
      if (e instanceof ClaimError) path = e.path;
    }
    expect(path).toBe("$.maxLoop");
    expect(formFieldOf("claims.0.maxLoop")).toBe("maxLoop");
    expect(formFieldOf("claims.0.maxMultiplicity")).toBe("maxMultiplicity");
  });

  it("builds a coverage claim over graphs with loops and multiple edges from the same two fields, and the core refutes a leaky split", () => {
    const cases =
      '[{ "label": "simple", "condition": { "predicate": "simple" } }, { "label": "looped", "condition": { "predicate": "loops", "relation": ">=", "value": 1 } }]';
    const claim = claimOf({ ...MULTIGRAPHS, kind: "coverage", maxVertices: "2", maxMultiplicity: "2", maxLoop: "1", cases });
    expect(claim).toMatchObject({ kind: "coverage", setting: "multigraph", maxMultiplicity: 2, maxLoop: 1 });
    const v = verifyClaim(validateClaim(claim)).verdict;
    // On at most 2 vertices, the double edge is neither simple nor looped (elementary).
    expect(v.status).toBe("refuted");
    expect(v.reason).toMatch(/1 of the \d+ graphs satisfy no sub-case's condition: :\S+ \(sparse6\)/);
  });
});
