/** What the server sends to a verification worker and what comes back (plain JSON both ways). */
import type { ClaimPicture } from "./picture";
import type { PartsByClaim } from "../core/certificates/parts-plan";

export interface VerificationTask {
  /** "check": validate and read every input (fast, for a 422 on the request); "verify": run the exact check. */
  mode: "check" | "verify";
  /** The claim as validated JSON ("cairn-claim/1"), including a carried certificate if any. */
  claim: unknown;
  /** Step budget of the exact check (see lib/core/verdict.ts). */
  stepLimit: number;
  /** Also compute the display picture (layout, float spectrum). */
  picture: boolean;
  /** A claim checked in independent parts: every part's result (PartTask), merged instead of checking again. */
  parts?: readonly unknown[];
}

/** One part of a claim checked in independent parts (run by the worker's `part` entry). */
export interface PartTask {
  claim: unknown;
  /** 0-based, of `parts`. */
  part: number;
  parts: number;
  stepLimit: number;
}

/** A part's result (plain JSON, stored until every part is in), or why it has none (the claim is then undecided). */
export type PartAnswer = { ok: true; result: unknown } | { ok: true; undecided: string } | { ok: false; problem: InputProblem };

/** Re-check a whole export bundle exactly as a reader will (run by the worker's `bundle` entry). */
export interface BundleTask {
  /** The bundle as JSON (a `cairn-bundle/1` document). */
  bundle: unknown;
  /** Step budget of each claim's check. */
  stepLimit: number;
  /** Its large claims' parts, computed by part jobs (lib/jobs/bundle-parts.ts), by claim item id. */
  parts?: PartsByClaim;
}

export interface VerificationOutcome {
  status: "verified" | "refuted" | "undecided";
  statement: string;
  method: string;
  reason: string;
  /** The verdict's certificate envelope as JSON text, or null for undecided. */
  certificate: string | null;
  digest: string;
  checkerVersion: string;
  /** Set when the claim carried a certificate: whether it re-checked and agrees with the verdict. */
  certificateMatches: boolean | null;
  notes: string[];
  /** "Ran on G: order 4, size 3, no loops, no multiple edges." — the graphs as read, so a misread input shows. */
  ranOn: string;
  steps: number | null;
  picture: ClaimPicture | null;
}

/** A claim whose input cannot be read: `path` is the JSON path of the field (e.g. "$.graph.text"). */
export interface InputProblem {
  path: string;
  detail: string;
}

export type WorkerAnswer = { ok: true; outcome: VerificationOutcome | null } | { ok: false; problem: InputProblem };
