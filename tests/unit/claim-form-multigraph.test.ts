/**
 * The claim form's enumeration over graphs with loops and multiple edges: the setting and its two bounds
 * become the claim's fields, the core verifies it, and a bad bound comes back on its own form field.
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

  it("refuses loops and multiple edges on a coverage claim, on the setting field", () => {
    const built = claimFromForm({ ...emptyClaimForm, kind: "coverage", maxVertices: "3", enumerationSetting: "multigraph", cases: "[]" });
    expect("issues" in built && built.issues.map((i) => i.field)).toContain("enumerationSetting");
  });
});
