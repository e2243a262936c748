/**
 * The claim form's "Dynkin data" kind: its one-per-line text becomes the fields of a dynkin-data claim,
 * which the core accepts and verifies; unknown lines and bad integers are reported on the form field.
 */
import { describe, expect, it } from "vitest";
import { formFieldOf } from "@/lib/validations/claim";
import { validateClaim } from "@/lib/core/claims/claim-schema";
import { verifyClaim } from "@/lib/core/claims/claims";
import { claimOf, fromForm } from "./claim-form-fixture";

// E8's data (Bourbaki, Plate VII; Humphreys, Table 2.4), one per line as the form takes them.
const E8_DATA = "h = 30\nrho = 2cos(pi/30)\nexponents = 1, 7, 11, 13, 17, 19, 23, 29\n|W| = 696729600\n[2]_q = 2cos(pi/30)\n[k]_q > 0";

describe("claim form: Dynkin data", () => {
  it("turns the stated lines into a claim that verifies (E8: Bourbaki, Plate VII; Humphreys, Table 2.4)", () => {
    const claim = claimOf({ kind: "dynkin-data", family: "E8", dynkinData: E8_DATA });
    expect(claim).toMatchObject({
      type: "E8",
      coxeterNumber: 30,
      spectralRadius: "2cos(pi/30)",
      exponents: [1, 7, 11, 13, 17, 19, 23, 29],
      weylGroupOrder: "696729600",
      quantumIntegers: [{ k: 2, value: "2cos(pi/30)" }],
      quantumPositivity: true,
    });
    expect(claim.graph).toBeUndefined();
    expect(verifyClaim(validateClaim(claim)).verdict.status).toBe("verified");
  });

  it("reports an unknown line and a missing diagram on the form's own fields", () => {
    const bad = fromForm({ kind: "dynkin-data", family: "E7", dynkinData: "height = 17" });
    expect(bad).toEqual({ issues: [expect.objectContaining({ field: "dynkinData", message: expect.stringMatching(/"height = 17" is not one of/) })] });
    const none = fromForm({ kind: "dynkin-data", dynkinData: "h = 18" });
    expect("issues" in none && none.issues[0].field).toBe("family");
    expect(formFieldOf("claims.0.weylGroupOrder")).toBe("dynkinData");
    expect(formFieldOf("claims.0.type")).toBe("family");
  });
});
