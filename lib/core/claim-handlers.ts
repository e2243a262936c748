/**
 * The registry of claim kinds: one handler per kind (see claim-support.ts for what a handler does).
 */
import type { Claim } from "./claim-schema";
import type { ClaimHandler } from "./claim-support";
import { CHARPOLY_HANDLER, EIGENVALUES_HANDLER, SPECTRAL_RADIUS_HANDLER } from "./claim-spectral";
import { STRUCTURE_HANDLER } from "./claim-structure";

/** A kind whose exact check is not part of this build: always undecided, never a guess. */
function unavailable(kind: string): ClaimHandler {
  const reason = `this checker build has no exact check for "${kind}" claims yet`;
  return {
    statement: () => `${kind} claim`,
    limit: () => undefined,
    verify: () => ({ status: "undecided", statement: `${kind} claim`, method: "none", reason }),
    recheck: () => ({ status: "undecided", statement: `${kind} claim`, method: "none", reason }),
  };
}

export const HANDLERS: { [K in Claim["kind"]]: ClaimHandler<Extract<Claim, { kind: K }>> } = {
  "spectral-radius-bound": SPECTRAL_RADIUS_HANDLER,
  "vector-certificate": unavailable("vector-certificate"),
  subgraph: unavailable("subgraph"),
  exclusion: unavailable("exclusion"),
  identification: unavailable("identification"),
  "characteristic-polynomial": CHARPOLY_HANDLER,
  eigenvalues: EIGENVALUES_HANDLER,
  structure: STRUCTURE_HANDLER,
};
