import { describe, expect, it } from "vitest";
import { ClaimError, validateClaim } from "./claim-schema";
import { readClaimsDocument } from "./claim-file";

// These tests exercise the claim format only (common practice for a hand-written validator: every
// rejection names the JSON path a person has to fix). The mathematics is tested in claims.test.ts.

const p5 = { format: "named", text: "path(5)" };

function errorOf(json: unknown): ClaimError {
  try {
    validateClaim(json);
  } catch (e) {
    if (e instanceof ClaimError) return e;
    throw e;
  }
  throw new Error("expected a ClaimError");
}

describe("validateClaim", () => {
  it("accepts a spectral-radius-bound claim and trims the bound", () => {
    const c = validateClaim({ format: "cairn-claim/1", kind: "spectral-radius-bound", graph: p5, op: "<", bound: " 2 " });
    expect(c).toEqual({ format: "cairn-claim/1", kind: "spectral-radius-bound", graph: p5, op: "<", bound: "2" });
  });

  it("fills in induced = false for subgraph and exclusion claims", () => {
    const c = validateClaim({ format: "cairn-claim/1", kind: "subgraph", pattern: p5, host: p5 });
    expect(c.kind === "subgraph" && c.induced).toBe(false);
  });

  it("names the path of a bad operator", () => {
    const e = errorOf({ format: "cairn-claim/1", kind: "spectral-radius-bound", graph: p5, op: "≤", bound: "2" });
    expect(e.path).toBe("$.op");
    expect(e.message).toContain('"<="');
  });

  it.each([
    [{ kind: "subgraph", pattern: p5, host: p5, embedding: [0, -1] }, "$.embedding[1]"],
    [{ kind: "eigenvalues", graph: p5, h: 6, multiset: [1, 1.5] }, "$.multiset[1]"],
    [{ kind: "characteristic-polynomial", graph: p5, coefficients: ["1", "x"] }, "$.coefficients[1]"],
    [{ kind: "characteristic-polynomial", graph: p5, coefficients: [] }, "$.coefficients"],
    [{ kind: "exclusion", host: p5, patterns: [] }, "$.patterns"],
    [{ kind: "exclusion", host: p5, patterns: [p5], induced: "yes" }, "$.induced"],
  ])("names the path of a bad list entry or field: %j → %s", (claim, path) => {
    expect(errorOf({ format: "cairn-claim/1", ...claim }).path).toBe(path);
  });

  it("keeps the fields in the order of the format (the stored JSON and its digest depend on it)", () => {
    const keys = (c: Record<string, unknown>) => Object.keys(validateClaim({ format: "cairn-claim/1", ...c }));
    expect(keys({ kind: "exclusion", patterns: [p5], host: p5 })).toEqual(["format", "kind", "host", "patterns", "induced"]);
    expect(keys({ kind: "vector-certificate", bound: "2", relation: "<", vector: ["1"], graph: p5 })).toEqual([
      "format",
      "kind",
      "graph",
      "vector",
      "relation",
      "bound",
    ]);
    expect(keys({ kind: "spectral-radius-bound", bound: "2", op: "<", graph: p5 })).toEqual(["format", "kind", "graph", "op", "bound"]);
  });

  it("names the path of a bad graph format inside an exclusion list", () => {
    const e = errorOf({ format: "cairn-claim/1", kind: "exclusion", host: p5, patterns: [p5, { format: "dot", text: "x" }] });
    expect(e.path).toBe("$.patterns[1].format");
  });

  it("bounds an enumeration claim: N at most 20, op only < or <= (families closed under removing a vertex), setting simple, tree, or multigraph with its bounds", () => {
    const base = { format: "cairn-claim/1", kind: "enumeration", maxVertices: 6, op: "<", bound: "2", graphs: [p5] };
    expect(validateClaim(base)).toMatchObject({ kind: "enumeration", maxVertices: 6, graphs: [p5] });
    expect(validateClaim({ ...base, maxVertices: 20 })).toMatchObject({ maxVertices: 20 });
    expect(errorOf({ ...base, maxVertices: 21 }).path).toBe("$.maxVertices");
    expect(validateClaim({ ...base, setting: "tree" })).toMatchObject({ setting: "tree" });
    expect(errorOf({ ...base, setting: "multigraphs" }).path).toBe("$.setting");
    expect(errorOf({ ...base, setting: "multigraph" }).path).toBe("$.maxMultiplicity");
    expect(validateClaim({ ...base, setting: "multigraph", maxMultiplicity: 2, maxLoop: 1 })).toMatchObject({
      setting: "multigraph",
      maxMultiplicity: 2,
      maxLoop: 1,
    });
    expect(errorOf({ ...base, op: ">" }).path).toBe("$.op");
    expect(errorOf({ ...base, graphs: [p5, { format: "named" }] }).path).toBe("$.graphs[1].text");
  });

  it("rejects a misspelt field instead of ignoring it", () => {
    const e = errorOf({ format: "cairn-claim/1", kind: "subgraph", pattern: p5, host: p5, indcued: true });
    expect(e.path).toBe("$.indcued");
  });

  it("rejects a wrong format version", () => {
    expect(errorOf({ format: "cairn-claim/2", kind: "structure", graph: p5, predicate: "tree" }).path).toBe("$.format");
  });

  it("checks vector entries are rationals with non-zero denominators", () => {
    expect(errorOf({ format: "cairn-claim/1", kind: "vector-certificate", graph: p5, vector: ["1", "x"], relation: "<", bound: "2" }).path).toBe("$.vector[1]");
    expect(errorOf({ format: "cairn-claim/1", kind: "vector-certificate", graph: p5, vector: ["1/0"], relation: "<", bound: "2" }).path).toBe("$.vector[0]");
  });

  it("accepts vector entries as fractions or decimals", () => {
    const c = validateClaim({ format: "cairn-claim/1", kind: "vector-certificate", graph: p5, vector: ["1", "3/2", "0.25", "-2"], relation: "<=", bound: "2" });
    expect(c.kind === "vector-certificate" && c.vector).toEqual(["1", "3/2", "0.25", "-2"]);
  });

  it("accepts characteristic polynomial coefficients as numbers or strings and normalises them", () => {
    const c = validateClaim({ format: "cairn-claim/1", kind: "characteristic-polynomial", graph: p5, coefficients: [1, "0", "-04"] });
    expect(c.kind === "characteristic-polynomial" && c.coefficients).toEqual(["1", "0", "-4"]);
  });

  it("requires the right parameter for each structure predicate", () => {
    expect(errorOf({ format: "cairn-claim/1", kind: "structure", graph: p5, predicate: "max-degree" }).path).toBe("$.parameter");
    expect(errorOf({ format: "cairn-claim/1", kind: "structure", graph: p5, predicate: "tree", parameter: 3 }).path).toBe("$.parameter");
    expect(errorOf({ format: "cairn-claim/1", kind: "structure", graph: p5, predicate: "leg-lengths", parameter: [1, 0] }).path).toBe("$.parameter[1]");
  });

  it("rejects an empty graph text", () => {
    expect(errorOf({ format: "cairn-claim/1", kind: "identification", graph: { format: "edges", text: "  " } }).path).toBe("$.graph.text");
  });
});

describe("readClaimsDocument", () => {
  const good = { format: "cairn-claim/1", kind: "structure", graph: p5, predicate: "tree" };

  it("reads one claim, an array, and a claims list", () => {
    expect(readClaimsDocument(good)).toHaveLength(1);
    expect(readClaimsDocument([good, good])).toHaveLength(2);
    expect(readClaimsDocument({ format: "cairn-claims/1", claims: [good, good, good] }).map((e) => e.path)).toEqual([
      "$.claims[0]",
      "$.claims[1]",
      "$.claims[2]",
    ]);
  });

  it("keeps a malformed claim as an entry with its error so the others are still checked", () => {
    const entries = readClaimsDocument([good, { ...good, predicate: "planar" }]);
    expect("claim" in entries[0]).toBe(true);
    expect("error" in entries[1] && entries[1].error.path).toBe("$[1].predicate");
  });

  it("throws on an unknown document format", () => {
    expect(() => readClaimsDocument({ format: "something-else" })).toThrow(ClaimError);
  });
});

describe("numbers that JSON cannot carry exactly", () => {
  const problem = (json: Record<string, unknown>) => {
    try {
      validateClaim({ format: "cairn-claim/1", ...json });
    } catch (e) {
      return (e as Error).message;
    }
    throw new Error("accepted");
  };
  it("a JSON number beyond 2^53 is refused with a message that says precision was lost and to use a string", () => {
    const m = problem({
      kind: "vector-certificate",
      graph: { format: "named", text: "path(2)" },
      vector: [12345678901234567891, "1"],
      relation: "<=",
      bound: "1",
    });
    expect(m).toMatch(/\$\.vector\[0\]/);
    expect(m).toMatch(/is beyond 2\^53, where JSON numbers lose precision: it was already rounded when the file was read/);
    expect(m).toMatch(/Write it as a string in quotes/);
  });
  it("a small JSON number where a string is expected says to quote it", () => {
    expect(problem({ kind: "spectral-radius-bound", graph: { format: "named", text: "path(2)" }, op: "<", bound: 2 })).toMatch(
      /expected a string, got the number 2: write numbers here in quotes \("2"\)/,
    );
  });
  it("an integer field beyond 2^53 says precision was lost", () => {
    expect(problem({ kind: "structure", graph: { format: "named", text: "path(3)" }, predicate: "max-degree", relation: "<=", parameter: 2 ** 60 })).toMatch(
      /beyond 2\^53, where JSON numbers lose precision.*at most 2\^53 − 1/,
    );
  });
});
