/**
 * The inputs of a claim read the way its check will read them, so that malformed input is refused
 * (with the field to fix) before a claim is stored. Shared by the server and the workers.
 */
import { readClaimGraph } from "./claims";
import { ClaimError, type Claim } from "./claim-schema";
import { NumberFormatError } from "../arithmetic/rational";
import { parseBound } from "../arithmetic/bound";

function boundOrFail(text: string, path: string): void {
  try {
    parseBound(text);
  } catch (e) {
    if (e instanceof NumberFormatError) throw new ClaimError(path, e.message);
    throw e;
  }
}

/**
 * Reads every input of a claim the way the check will, so that malformed input is refused before a
 * claim is stored: graph text, the bound, and the sizes of an embedding or a vector.
 */
export function checkInputs(claim: Claim): void {
  switch (claim.kind) {
    case "subgraph": {
      const h = readClaimGraph(claim.pattern, "$.pattern");
      const g = readClaimGraph(claim.host, "$.host");
      if (claim.embedding) {
        if (claim.embedding.length !== h.n)
          throw new ClaimError(
            "$.embedding",
            `the embedding lists ${claim.embedding.length} vertices but the pattern H has ${h.n}; give one host vertex per pattern vertex`,
          );
        const bad = claim.embedding.findIndex((v) => v >= g.n);
        if (bad >= 0) throw new ClaimError(`$.embedding[${bad}]`, `vertex ${claim.embedding[bad]} is not in the host G, which has vertices 0..${g.n - 1}`);
      }
      return;
    }
    case "enumeration":
      claim.graphs.forEach((g, i) => readClaimGraph(g, `$.graphs[${i}]`));
      boundOrFail(claim.bound, "$.bound");
      return;
    case "coverage":
      return; // the conditions were read (patterns included) by validateClaim
    case "exclusion":
      readClaimGraph(claim.host, "$.host");
      claim.patterns.forEach((p, i) => readClaimGraph(p, `$.patterns[${i}]`));
      return;
    case "spectral-radius-bound":
      readClaimGraph(claim.graph, "$.graph");
      boundOrFail(claim.bound, "$.bound");
      return;
    case "vector-certificate": {
      const g = readClaimGraph(claim.graph, "$.graph");
      boundOrFail(claim.bound, "$.bound");
      if (claim.vector.length !== g.n)
        throw new ClaimError("$.vector", `the vector has ${claim.vector.length} entries but G has ${g.n} vertices; give one entry per vertex`);
      return;
    }
    case "dynkin-data":
      if (claim.graph) readClaimGraph(claim.graph, "$.graph");
      claim.quantumIntegers?.forEach((q, i) => boundOrFail(q.value, `$.quantumIntegers[${i}].value`));
      if (claim.spectralRadius !== undefined) boundOrFail(claim.spectralRadius, "$.spectralRadius");
      return;
    default:
      readClaimGraph(claim.graph, "$.graph");
  }
}
