/**
 * The shape of a checker report, shared by the claims checker (cli.ts) and any other document
 * checker (an exported bundle), so that every document prints and exits the same way.
 *
 * Exit codes:
 *   0  every claim verified and every carried certificate re-checked;
 *   1  some claim refuted or undecided, or a carried certificate failed its re-check
 *      (undecided counts against: a reader cannot rely on a claim nobody decided);
 *   2  the file or some claim in it is malformed (the message names the JSON path), or usage error.
 */

import { canonicalJson } from "../input/canonical";
import { sha256Hex } from "../digest";
import type { ClaimResult, ClaimTimings } from "../claims/claims";
import type { GraphSummary } from "../graph";
import type { BoundNormalForm } from "../arithmetic/bound";
import type { PartsByClaim } from "./parts-plan";

export const EXIT_OK = 0;
export const EXIT_NOT_VERIFIED = 1;
export const EXIT_MALFORMED = 2;

/** One printed line of a check. */
export interface CheckLine {
  readonly label: string;
  readonly status: "verified" | "refuted" | "undecided" | "malformed";
  readonly text: string;
  /** Set when the claim carried a certificate: whether it re-checked. */
  readonly certificate?: { readonly matches: boolean; readonly text: string };
  /** The reason of a verification and the verdict's notes, printed with --verbose. */
  readonly details?: readonly string[];
  /** SHA-256 of the claim's canonical JSON, to match the claim with the one shown in the web app. */
  readonly digest?: string;
  // The verdict as separate fields for tools (`--json`; documented by report.schema.json beside this file).
  readonly statement?: string;
  readonly method?: string;
  /** Why the verdict holds, or why no decision: said once, never prefixed by the text above. */
  readonly reason?: string;
  /** The kind of the evidence stored with a decided verdict (e.g. "inertia", "embedding"), null when undecided. */
  readonly certificateKind?: string | null;
  readonly digests?: { readonly claim: string; readonly certificate: string | null };
  readonly timings?: ClaimTimings;
  /** Budget steps used. */
  readonly steps?: number | null;
  /** The graphs the check ran on. */
  readonly ranOn?: readonly GraphSummary[];
  /** The bound in normal form, for claims with a bound. */
  readonly bound?: BoundNormalForm;
}

/** The structured fields of a checked claim's line. */
export function claimLineFields(
  r: ClaimResult,
): Pick<CheckLine, "statement" | "method" | "reason" | "certificateKind" | "digests" | "timings" | "steps" | "ranOn" | "bound"> {
  const v = r.verdict;
  const evidence = (v.certificate as { evidence?: unknown } | undefined)?.evidence;
  const evidenceKind = typeof evidence === "object" && evidence !== null ? (evidence as { kind?: unknown }).kind : undefined;
  return {
    statement: v.statement,
    method: v.method,
    reason: v.reason,
    certificateKind: v.certificate === undefined ? null : typeof evidenceKind === "string" ? evidenceKind : v.certificate.kind,
    digests: { claim: r.digest, certificate: v.certificate === undefined ? null : sha256Hex(canonicalJson(v.certificate)) },
    timings: r.timings,
    steps: v.steps ?? null,
    ranOn: v.ranOn ?? [],
    ...(r.bound ? { bound: r.bound } : {}),
  };
}

export interface CheckReport {
  readonly source: string;
  readonly lines: CheckLine[];
  readonly exitCode: number;
}

export interface CheckOptions {
  /** Step limit per claim. */
  readonly steps?: number;
  /** Wall-clock limit per claim in milliseconds (the checker command's default is 120 s). */
  readonly timeLimitMs?: number;
  /** Claims checked in parts (parts-plan.ts): their parts, computed elsewhere, by claim key. */
  readonly parts?: PartsByClaim;
}

/** The exit code of a list of lines: 2 if any is malformed, else 1 if any is not verified or its certificate does not match, else 0. */
export function exitCodeOf(lines: CheckLine[]): number {
  if (lines.some((l) => l.status === "malformed")) return EXIT_MALFORMED;
  if (lines.some((l) => l.status !== "verified" || (l.certificate && !l.certificate.matches))) return EXIT_NOT_VERIFIED;
  return EXIT_OK;
}
