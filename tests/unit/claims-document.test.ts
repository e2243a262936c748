import { describe, expect, it } from "vitest";
import { claimsFromDocument, describeClaimIssue, MAX_CLAIMS_PER_REQUEST } from "@/lib/validations/claim";
import { readClaimsDocument } from "@/lib/core/claims/claim-file";

const claim = (id: string) => ({ format: "cairn-claim/1", id, kind: "structure", graph: { format: "named", text: "path(3)" }, predicate: "tree" });

describe("claims documents in the attach-from-file form", () => {
  it("accept the three shapes the offline checker reads, with the same claims in the same order", () => {
    const a = claim("a"),
      b = claim("b");
    for (const doc of [[a, b], { format: "cairn-claims/1", claims: [a, b] }, a]) {
      const read = claimsFromDocument(JSON.stringify(doc));
      expect("claims" in read).toBe(true);
      if (!("claims" in read)) continue;
      // The checker's own reader sees the same list.
      expect(read.claims.map((c) => c.id)).toEqual(readClaimsDocument(doc).map((e) => ("claim" in e ? e.claim.id : null)));
    }
  });

  it("say what is wrong with a document that is not one", () => {
    const problem = (text: string) => {
      const r = claimsFromDocument(text);
      return "problem" in r ? r.problem : null;
    };
    expect(problem("")).toMatch(/Paste a claims document/);
    expect(problem("{ not json")).toMatch(/^This is not JSON/);
    expect(problem('{"format": "cairn-claim/2"}')).toMatch(/Expected one "cairn-claim\/1" claim/);
    expect(problem("[]")).toMatch(/no claims/);
    expect(problem("[1]")).toMatch(/Claim 1 is not a JSON object/);
    expect(problem(JSON.stringify(Array.from({ length: MAX_CLAIMS_PER_REQUEST + 1 }, (_, i) => claim(`c${i}`))))).toMatch(/at most 20/);
  });

  it("name the claim of a server issue by its place and its id", () => {
    const claims = [claim("first"), { format: "cairn-claim/1" }];
    expect(describeClaimIssue("claims.0.graph.text", "line 1, column 3: expected )", claims)).toBe("claim 1 (first), graph.text: line 1, column 3: expected )");
    expect(describeClaimIssue("claims.1", "kind is missing", claims)).toBe("claim 2: kind is missing");
    expect(describeClaimIssue("claims", "Attach at least one claim.", claims)).toBe("claims: Attach at least one claim.");
  });
});
