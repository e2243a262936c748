/**
 * The verification worker (bundled to plain JS by lib/verification/pool.ts and run in a piscina
 * worker thread): validates and verifies one claim with the exact core under a step budget, and
 * computes its display picture. Nothing here touches the database; the server stores the outcome.
 */
import { CHECKER_VERSION, claimPart, describeRanOn, readClaimGraph, verifyClaim } from "../core/claims/claims";
import { checkInputs } from "../core/claims/claim-inputs";
import { ClaimError, validateClaim, type Claim, type GraphInput } from "../core/claims/claim-schema";
import { NumberFormatError } from "../core/arithmetic/rational";
import { parseGraph } from "../core/input/parse";
import { dynkinDiagram } from "../core/input/constructors";
import { isMultilacedType, multilacedBondGraph } from "../core/spectral/dynkin-multilaced";
import { boundApprox, parseBound } from "../core/arithmetic/bound";
import { Budget } from "../core/verdict";
import type { Graph } from "../core/graph";
import { pictureOf, type ClaimPicture, type GraphPicture } from "./picture";
import type { BundleTask, PartAnswer, PartTask, VerificationOutcome, VerificationTask, WorkerAnswer } from "./types";
import { checkBundle, type BundleCheckReport } from "../core/certificates/bundle";
import { setPriority } from "node:os";
import { isMainThread } from "node:worker_threads";

// Inside a pool thread, lower this thread's scheduling priority (on Linux, nice is per thread), so
// the thread answering requests wins the CPU whenever both want it.
if (!isMainThread) {
  try {
    setPriority(10);
  } catch {
    // not permitted here: run at normal priority
  }
}

function embeddingIn(evidence: unknown): number[] | undefined {
  if (typeof evidence !== "object" || evidence === null) return undefined;
  const e = (evidence as { embedding?: unknown }).embedding;
  return Array.isArray(e) && e.every((v) => Number.isInteger(v)) ? (e as number[]) : undefined;
}

function read(input: GraphInput): Graph | null {
  try {
    return parseGraph(input.text, input.format);
  } catch {
    return null;
  }
}

function boundOf(claim: Claim): ClaimPicture["bound"] {
  if (claim.kind !== "spectral-radius-bound" && claim.kind !== "vector-certificate") return null;
  try {
    return { text: claim.bound, approx: boundApprox(parseBound(claim.bound)) };
  } catch {
    return null;
  }
}

/** The pictures of a claim: its graph, or the host with the embedding's image highlighted. */
export function claimPicture(claim: Claim, evidence: unknown): ClaimPicture {
  const pictures: GraphPicture[] = [];
  const add = (g: Graph | null, title: string, map?: readonly number[], pattern?: Graph) => {
    const p = g ? pictureOf(g, title, map, pattern) : null;
    if (p) pictures.push(p);
  };
  if (claim.kind === "subgraph") {
    const pattern = read(claim.pattern);
    add(read(claim.host), "G (host), the embedding's image highlighted", claim.embedding ?? embeddingIn(evidence), pattern ?? undefined);
    add(pattern, "H (pattern)");
  } else if (claim.kind === "enumeration") {
    claim.graphs.slice(0, 4).forEach((g, i) => add(read(g), `listed graph ${i + 1}`));
  } else if (claim.kind === "exclusion") {
    add(read(claim.host), "G (host)");
    claim.patterns.slice(0, 4).forEach((p, i) => add(read(p), `H${i + 1} (excluded pattern)`));
  } else if (claim.kind === "coverage") {
    const uncovered = (evidence as { uncovered?: unknown } | null)?.uncovered;
    // Named on the card in the certificate's own text: sparse6 (leading ':') with loops and multiple edges, else graph6.
    if (Array.isArray(uncovered))
      uncovered.slice(0, 4).forEach((t, i) => {
        const format = String(t).startsWith(":") ? "sparse6" : "graph6";
        add(read({ format, text: String(t) }), format === "sparse6" ? `uncovered graph ${i + 1} (sparse6 ${String(t)})` : `uncovered graph ${i + 1}`);
      });
  } else if (claim.kind === "dynkin-data") {
    if (isMultilacedType(claim.type))
      add(multilacedBondGraph(claim.type!), `${claim.type}: its bonds as 1, 2 or 3 edges, roots numbered as in Bourbaki (the arrow is not drawn)`);
    else add(claim.graph ? read(claim.graph) : dynkinDiagram(claim.type!), claim.type ? `G (${claim.type})` : "G");
  } else {
    add(read(claim.graph), "G", embeddingIn(evidence));
  }
  return { pictures, bound: boundOf(claim), ...(pictures.length === 0 ? { note: "the graph is too large to draw" } : {}) };
}

function run(task: VerificationTask): VerificationOutcome | null {
  const claim = validateClaim(task.claim);
  if (task.mode === "check") {
    checkInputs(claim);
    return null;
  }
  return verifyOne(claim, task);
}

/** Entry point of the worker: never throws for bad input, answers with the field to fix instead. */
export default function answer(task: VerificationTask): WorkerAnswer {
  try {
    return { ok: true, outcome: run(task) };
  } catch (e) {
    if (e instanceof ClaimError) return { ok: false, problem: { path: e.path, detail: e.detail } };
    throw e;
  }
}

/** The worker's `part` entry: one part of a claim checked in independent parts. */
export function part(task: PartTask): PartAnswer {
  try {
    const r = claimPart(validateClaim(task.claim), task.part, task.parts, { budget: new Budget(task.stepLimit) });
    return "result" in r ? { ok: true, result: r.result } : { ok: true, undecided: r.undecided };
  } catch (e) {
    if (e instanceof ClaimError) return { ok: false, problem: { path: e.path, detail: e.detail } };
    throw e;
  }
}

/** The worker's `bundle` entry: the offline checker's bundle re-check, off the thread that answers requests. */
export function bundle(task: BundleTask): BundleCheckReport {
  return checkBundle(task.bundle, "bundle", { steps: task.stepLimit, ...(task.parts ? { parts: task.parts } : {}) });
}

function verifyOne(claim: Claim, task: VerificationTask): VerificationOutcome {
  const result = verifyClaim(claim, { budget: new Budget(task.stepLimit), ...(task.parts ? { parts: task.parts } : {}) });
  const v = result.verdict;
  const evidence = (v.certificate as { evidence?: unknown } | undefined)?.evidence;
  return {
    status: v.status,
    statement: v.statement,
    method: v.method,
    reason: v.reason,
    certificate: v.certificate === undefined ? null : JSON.stringify(v.certificate),
    digest: result.digest,
    checkerVersion: result.checkerVersion ?? CHECKER_VERSION,
    certificateMatches: result.certificateCheck ? result.certificateCheck.matches : null,
    notes: v.notes ?? [],
    ranOn: describeRanOn(v.ranOn ?? []),
    steps: v.steps ?? null,
    picture: task.picture ? claimPicture(claim, evidence) : null,
  };
}
