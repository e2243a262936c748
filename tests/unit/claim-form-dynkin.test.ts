/**
 * The claim form's "Dynkin data" kind: its one-per-line text becomes the fields of a dynkin-data claim,
 * which the core accepts and verifies; unknown lines and bad integers are reported on the form field.
 */
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import type { UseFormRegister } from "react-hook-form";
import { DynkinFields } from "@/components/claims/dynkin-fields";
import { formFieldOf, type ClaimForm } from "@/lib/validations/claim";
import { namesMultilacedType, validateClaim } from "@/lib/core/claims/claim-schema";
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

  it("B5 picked by type: the stated data verify (Bourbaki, Plate II; Humphreys, Table 2.4: |W(B5)| = 2⁵·5! = 3840)", () => {
    // Text left in the graph box (hidden for B, C, F, G) is not sent: the claim names the diagram by type only.
    const B5_DATA = "h = 10\nrho = 2cos(pi/10)\nexponents = 1, 3, 5, 7, 9\nmarks = 1, 2, 2, 2, 2\nf = 2\n|W| = 3840";
    const claim = claimOf({ kind: "dynkin-data", family: "B_5", graphText: "path(5)", dynkinData: B5_DATA });
    expect(claim.graph).toBeUndefined();
    expect(namesMultilacedType("B_5") && namesMultilacedType("g2") && !namesMultilacedType("E8")).toBe(true);
    const v = verifyClaim(validateClaim(claim)).verdict;
    expect(v.status, v.reason).toBe("verified");
    const wrong = claimOf({ kind: "dynkin-data", family: "B5", dynkinData: "|W| = 1920" });
    expect(verifyClaim(validateClaim(wrong)).verdict.reason).toMatch(/\|W\(B5\)\| = 3840, not 1920/);
  });

  it("the type picker offers B, C, F and G beside A, D, E and says which ranks are accepted", () => {
    const register = ((name: string) => ({ name, onChange: async () => {}, onBlur: async () => {}, ref: () => {} })) as unknown as UseFormRegister<ClaimForm>;
    const html = renderToStaticMarkup(createElement(DynkinFields, { register, err: () => undefined }));
    const offered = [...html.matchAll(/<option value="([^"]+)"/g)].map((m) => m[1]);
    expect(offered).toEqual(expect.arrayContaining(["B5", "C4", "F4", "G2", "E8", "D4"]));
    // Every offered type is one the claim accepts.
    for (const t of offered) expect(validateClaim({ format: "cairn-claim/1", kind: "dynkin-data", type: t })).toMatchObject({ type: t });
    expect(html).toContain("B_n (n ≥ 2), C_n (n ≥ 3)");
    expect(html).toMatch(/list="dynkin-types"/);
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
