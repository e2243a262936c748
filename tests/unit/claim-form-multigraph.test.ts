/**
 * The claim form's enumeration and coverage over graphs with loops and multiple edges: the setting and its
 * two bounds become the claim's fields, the core verifies it, and a bad bound comes back on its own form field.
 */
import { describe, expect, it } from "vitest";
import { claimFromForm, emptyClaimForm, formFieldOf } from "@/lib/validations/claim";
import { ClaimError, validateClaim } from "@/lib/core/claims/claim-schema";
import { verifyClaim } from "@/lib/core/claims/claims";

describe("claim form: enumeration with loops and multiple edges", () => {
  it("builds a multigraph enumeration claim that verifies (ρ < 2 on ≤ 2 vertices: A1, T1, A2, T2 — J. H. Smith 1970, tadpole from memory)", () => {
    const built = claimFromForm({
      ...emptyClaimForm,
      kind: "enumeration",
      maxVertices: "2",
      op: "<",
      bound: "2",
      enumerationSetting: "multigraph",
      maxMultiplicity: "2",
      maxLoop: "1",
      patternFormat: "matrix",
      patternText: "0\n---\n1\n---\n0 1\n1 0\n---\n1 1\n1 0",
    });
    expect("claim" in built).toBe(true);
    if (!("claim" in built)) return;
    expect(built.claim).toMatchObject({ setting: "multigraph", maxMultiplicity: 2, maxLoop: 1 });
    const claim = validateClaim(built.claim);
    const v = verifyClaim(claim).verdict;
    expect(v.status, v.reason).toBe("verified");
  });

  it("sends a bad bound to the core, whose JSON path lands on the form field", () => {
    const built = claimFromForm({
      ...emptyClaimForm,
      kind: "enumeration",
      maxVertices: "3",
      enumerationSetting: "multigraph",
      maxLoop: "x",
      patternText: "A(1)",
    });
    if (!("claim" in built)) throw new Error("expected a claim");
    let path = "";
    try {
      validateClaim(built.claim);
    } catch (e) {
      if (e instanceof ClaimError) path = e.path;
    }
    expect(path).toBe("$.maxLoop");
    expect(formFieldOf("claims.0.maxLoop")).toBe("maxLoop");
    expect(formFieldOf("claims.0.maxMultiplicity")).toBe("maxMultiplicity");
  });

  it("builds a coverage claim over graphs with loops and multiple edges from the same two fields, and the core refutes a leaky split", () => {
    const built = claimFromForm({
      ...emptyClaimForm,
      kind: "coverage",
      maxVertices: "2",
      enumerationSetting: "multigraph",
      maxMultiplicity: "2",
      maxLoop: "1",
      cases:
        '[{ "label": "simple", "condition": { "predicate": "simple" } }, { "label": "looped", "condition": { "predicate": "loops", "relation": ">=", "value": 1 } }]',
    });
    if (!("claim" in built)) throw new Error("expected a claim");
    expect(built.claim).toMatchObject({ kind: "coverage", setting: "multigraph", maxMultiplicity: 2, maxLoop: 1 });
    const v = verifyClaim(validateClaim(built.claim)).verdict;
    // On at most 2 vertices, the double edge is neither simple nor looped (elementary).
    expect(v.status).toBe("refuted");
    expect(v.reason).toMatch(/1 of the \d+ graphs satisfy no sub-case's condition: :\S+ \(sparse6\)/);
  });
});
