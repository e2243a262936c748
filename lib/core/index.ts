/**
 * The public surface of Cairn's verification core: what the server, the worker pool and the offline
 * checker import. Everything here is framework-free; `digest.ts` (SHA-256) is the one module that uses
 * a Node built-in (node:crypto), and the checker command (cli.ts, node:fs) is deliberately not
 * re-exported so that nothing here reads files.
 *
 * Every exact check returns a Verdict (verified / refuted / undecided, statement, method, reason,
 * certificate) and has a matching re-check that takes the input and a certificate.
 */

// Graphs, verdicts, budgets.
export * from "./graph";
export * from "./verdict";
export * from "./time-budget";

// Reading and writing graphs; canonical JSON and digests.
export { parseGraph, parseEdgeList, parseAdjacencyMatrix, detectFormat, MAX_PARSED_VERTICES, type GraphFormat } from "./input/parse";
export * from "./input/graph6";
export { parseNamed, looksNamed, NAMED_FAMILIES } from "./input/named";
export * from "./input/constructors";
export * from "./input/canonical";
export * from "./digest";

// Exact numbers and bounds.
export { NumberFormatError, parseRational, rat, ratToString, ratToNumber, type Rational } from "./arithmetic/rational";
export { parseBound, rationalBound, twoCosBound, compareToBound, boundApprox, type Bound } from "./arithmetic/bound";
export { polyToString, type Poly } from "./arithmetic/sturm";

// Structure.
export {
  isConnected,
  isBipartite,
  isForest,
  isTree,
  containsCycle,
  recheckConnected,
  recheckBipartite,
  recheckTree,
  recheckContainsCycle,
  type ForestCertificate,
  type ComponentsCertificate,
  type CycleCertificate,
  type ColouringCertificate,
  type ConnectivityCertificate,
  type TreeCertificate,
  type BipartiteCertificate,
} from "./families/structure";
export {
  maxDegree,
  recheckMaxDegree,
  branchVertices,
  branchVertexList,
  recheckBranchVertices,
  starlikeLegs,
  recheckStarlikeLegs,
  type DegreeRelation,
  type MaxDegreeCertificate,
  type BranchVerticesCertificate,
  type LegsCertificate,
  type StarlikeCertificate,
} from "./families/degree-structure";

// Containment and identification.
export {
  findSubgraph,
  recheckSubgraph,
  excludeSubgraphs,
  recheckExclusion,
  checkEmbedding,
  MONOTONICITY_NOTE,
  type SubgraphCertificate,
  type EmbeddingCertificate,
  type AbsenceCertificate,
  type AbsenceArgument,
  type ExclusionCertificate,
  type SubgraphOptions,
} from "./subgraph/subgraph";
export {
  identifySmith,
  recheckIdentification,
  type IdentificationCertificate,
  type IsomorphismCertificate,
  type ForbiddenSubgraphCertificate,
  type ExpectedFamily,
} from "./families/identify";
export { SMITH_FAMILIES, parseFamilyName, familyDisplay, isSmithFamily, type SmithFamily } from "./families/smith-families";

// Enumeration and coverage in independent parts (the job engine spreads them; the checker may re-run any).
export { type EnumerationSetting, type GenerationOptions } from "./families/augmentation";
export { enumeratePart, mergeParts, type PartResult } from "./families/augmentation-parts";
export {
  coveragePart,
  mergeCoverageParts,
  coverageVerdict,
  COVERAGE_UNCOVERED_CAP,
  type CoveragePartResult,
  type CoverageCertificate,
} from "./families/coverage";

// Spectra.
export { spectralRadiusBound, recheckSpectralRadiusBound, inertia, type Relation, type SpectralRadiusCertificate } from "./spectral/inertia";
export type { ZeroProof } from "./spectral/tree-zero-modular";
export { characteristicPolynomial, charpolyBerkowitz } from "./spectral/charpoly";
export { checkVectorCertificate, checkRayleighCertificate, recheckVectorCertificate, type VectorEvidence } from "./spectral/vector";
export * from "./spectral/spectral";
export * from "./spectral/perron";
export * from "./spectral/dynkin-data";

// Claims, the checker's reports, and exported bundles.
export {
  CLAIM_FORMAT,
  CLAIMS_FILE_FORMAT,
  CLAIM_KINDS,
  GRAPH_FORMATS,
  RELATIONS,
  STRUCTURE_PREDICATES,
  DEGREE_RELATIONS,
  MAX_GRAPH_TEXT,
  ClaimError,
  validateClaim,
  validateGraphInput,
  type Claim,
  type ClaimKind,
  type GraphInput,
  type GraphFormat as ClaimGraphFormat,
  type StructurePredicate,
  type SpectralRadiusBoundClaim,
  type VectorCertificateClaim,
  type SubgraphClaim,
  type ExclusionClaim,
  type IdentificationClaim,
  type CharacteristicPolynomialClaim,
  type EigenvaluesClaim,
  type DynkinDataClaim,
  type StructureClaim,
} from "./claims/claim-schema";
export { readClaimsDocument, type ClaimEntry } from "./claims/claim-file";
export {
  CHECKER_VERSION,
  verifyClaim,
  recheckClaim,
  checkedInParts,
  claimPart,
  claimCanonicalJson,
  claimDigest,
  readClaimGraph,
  type ClaimResult,
  type ClaimCertificate,
  type CertificateCheck,
  type VerifyOptions,
} from "./claims/claims";
export { CLAIM_LIMITS } from "./claims/claim-support";
export * from "./certificates/check-report";
export * from "./certificates/bundle";
