/**
 * The registry of claim kinds: one handler per kind (see claim-support.ts for what a handler does).
 */
import type { Claim } from "./claim-schema";
import type { ClaimHandler } from "./claim-support";
import { EXCLUSION_HANDLER, IDENTIFICATION_HANDLER, SUBGRAPH_HANDLER } from "./claim-combinatorial";
import { CHARPOLY_HANDLER, EIGENVALUES_HANDLER, ENUMERATION_HANDLER, SPECTRAL_RADIUS_HANDLER, VECTOR_HANDLER } from "./claim-spectral";
import { STRUCTURE_HANDLER } from "./claim-structure";
import { DYNKIN_DATA_HANDLER } from "./claim-dynkin";
import { COVERAGE_HANDLER } from "./claim-coverage";

export const HANDLERS: { [K in Claim["kind"]]: ClaimHandler<Extract<Claim, { kind: K }>> } = {
  "spectral-radius-bound": SPECTRAL_RADIUS_HANDLER,
  "vector-certificate": VECTOR_HANDLER,
  subgraph: SUBGRAPH_HANDLER,
  exclusion: EXCLUSION_HANDLER,
  identification: IDENTIFICATION_HANDLER,
  "characteristic-polynomial": CHARPOLY_HANDLER,
  eigenvalues: EIGENVALUES_HANDLER,
  structure: STRUCTURE_HANDLER,
  enumeration: ENUMERATION_HANDLER,
  "dynkin-data": DYNKIN_DATA_HANDLER,
  coverage: COVERAGE_HANDLER,
};
