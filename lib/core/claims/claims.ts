/**
 * The claim layer: verifies a "cairn-claim/1" claim exactly and re-checks stored certificates.
 *
 * A claim names its inputs (graphs as text, a bound, a vector, …); `verifyClaim` parses them, applies
 * the size limits of its kind, runs the exact check under a step budget and wraps the result:
 * the verdict, the canonical JSON of the claim, its SHA-256 digest and the checker version.
 *
 * The certificate stored with a verdict is an envelope `{ kind, outcome, evidence }`: `outcome` is the
 * verdict it supports (verified or refuted) and `evidence` is the check's own certificate. Saying the
 * outcome explicitly lets `recheckClaim` confirm that a certificate proves *this* verdict, not merely
 * something true about the graph.
 */
import { canonicalJson } from "../input/canonical";
import { ClaimError, type Claim, type GraphInput } from "./claim-schema";
import { sha256Hex } from "../digest";
import { GraphError, describeGraphSummary, summarizeGraph, type Graph, type GraphSummary } from "../graph";
import { parseGraph } from "../input/parse";
import { NumberFormatError } from "../arithmetic/rational";
import { describeBound, parseBound, type BoundNormalForm } from "../arithmetic/bound";
import { Budget, BudgetExceeded, DEFAULT_STEP_LIMIT, budgetReason, type Verdict } from "../verdict";
import { HANDLERS } from "./claim-handlers";
import { TimedBudget } from "../time-budget";
import { ClaimInputError, type ClaimHandler, type ParsedInputs } from "./claim-support";
import { methodWithCertificate } from "../certificates/certificate-kind";
import { dynkinDiagram } from "../input/constructors";
import { isMultilacedType } from "../spectral/dynkin-multilaced";

/** Version of the checker that produced a verdict; stored with every result and bundle. */
export const CHECKER_VERSION = "cairn-check/0.1.0";

export interface ClaimCertificate {
  readonly kind: Claim["kind"];
  readonly outcome: "verified" | "refuted";
  readonly evidence: unknown;
}

/** The result of re-checking a stored certificate against a claim. */
export interface CertificateCheck {
  /** True when the certificate was accepted and supports the same verdict as a fresh verification. */
  readonly matches: boolean;
  /** The re-check itself: verified = the certificate is valid and establishes its stated outcome. */
  readonly verdict: Verdict;
}

export interface ClaimResult {
  /** The claim as checked (normalised, without its certificate). */
  readonly claim: Claim;
  /** Canonical JSON of the claim's content (format, kind and inputs; no id, no certificate). */
  readonly canonical: string;
  /** SHA-256 (hex) of `canonical`: the identity of the claim. */
  readonly digest: string;
  readonly checkerVersion: string;
  readonly verdict: Verdict<ClaimCertificate>;
  /** Present when the claim carried a certificate. */
  readonly certificateCheck?: CertificateCheck;
  /** The claim's bound (when it has one) in normal form: minimal polynomial, isolating interval, as written. */
  readonly bound?: BoundNormalForm;
  /** Wall-clock milliseconds: reading the inputs (graphs, bound), the check, the re-check of a carried certificate. */
  readonly timings: ClaimTimings;
}

export interface ClaimTimings {
  readonly parseMs: number;
  readonly checkMs: number;
  readonly recheckMs?: number;
}

const now = () => performance.now();
const elapsed = (since: number) => Math.round((now() - since) * 1000) / 1000;

export interface VerifyOptions {
  /** Step budget, used as given (a TimedBudget carries a time limit too); default DEFAULT_STEP_LIMIT steps. */
  readonly budget?: Budget;
  /** Without `budget`: a wall-clock limit per claim in milliseconds, past which the verdict is undecided (time-budget.ts). */
  readonly timeLimitMs?: number;
  /** JSON path of the claim inside its document, used in error messages (default "$"). */
  readonly path?: string;
  /**
   * For kinds whose check is an enumeration: the results of all its parts (claimPart), merged instead of
   * enumerating again, for the verdict and for the re-check of a certificate the claim carries.
   */
  readonly parts?: readonly unknown[];
  /** For kinds checked in parts: a part that gave no result (it failed for good), so the claim is undecided with this reason. */
  readonly partsFailed?: string;
}

/** Canonical JSON of what a claim states: the id and certificate are left out, so they never change its digest. */
export function claimCanonicalJson(claim: Claim): string {
  const { id: _id, certificate: _certificate, ...content } = claim;
  return canonicalJson(content);
}

export function claimDigest(claim: Claim): string {
  return sha256Hex(claimCanonicalJson(claim));
}

/** Parses one graph of a claim; a parse error becomes a ClaimError naming the field's JSON path. */
export function readClaimGraph(input: GraphInput, path: string): Graph {
  try {
    return parseGraph(input.text, input.format);
  } catch (e) {
    if (e instanceof GraphError || e instanceof NumberFormatError) throw new ClaimError(`${path}.text`, e.message);
    throw e;
  }
}

/** Reads the bound of a claim that has one, before any check, so its normal form is known and a bad bound names its field. */
function readClaimBound(claim: Claim, path: string): BoundNormalForm | undefined {
  const text = (claim as { bound?: unknown }).bound;
  if (typeof text !== "string") return undefined;
  try {
    return describeBound(parseBound(text));
  } catch (e) {
    if (e instanceof NumberFormatError) throw new ClaimError(`${path}.bound`, e.message);
    throw e;
  }
}

function parseInputs(claim: Claim, path: string): ParsedInputs {
  switch (claim.kind) {
    case "subgraph":
      return { pattern: readClaimGraph(claim.pattern, `${path}.pattern`), host: readClaimGraph(claim.host, `${path}.host`) };
    case "exclusion":
      return { host: readClaimGraph(claim.host, `${path}.host`), patterns: claim.patterns.map((p, i) => readClaimGraph(p, `${path}.patterns[${i}]`)) };
    case "enumeration":
      return { patterns: claim.graphs.map((g, i) => readClaimGraph(g, `${path}.graphs[${i}]`)) };
    case "coverage":
      return {};
    case "dynkin-data":
      // B_n, C_n, F4, G2 have no graph: a double or triple bond with an arrow is checked on the Cartan matrix.
      if (claim.graph) return { graph: readClaimGraph(claim.graph, `${path}.graph`) };
      return isMultilacedType(claim.type) ? {} : { graph: dynkinDiagram(claim.type!) };
    default:
      return { graph: readClaimGraph(claim.graph, `${path}.graph`) };
  }
}

/** The graphs a claim runs on, named as its statement names them. */
export function claimGraphSummaries(inputs: ParsedInputs): GraphSummary[] {
  const out: GraphSummary[] = [];
  if (inputs.graph) out.push(summarizeGraph(inputs.graph, "G"));
  if (inputs.pattern) out.push(summarizeGraph(inputs.pattern, "H"));
  if (inputs.host) out.push(summarizeGraph(inputs.host, "G"));
  (inputs.patterns ?? []).forEach((p, i) => out.push(summarizeGraph(p, inputs.host ? `H${i + 1}` : `G${i + 1}`)));
  return out;
}

/** One sentence for people: "Ran on G: order 4, size 3, no loops, no multiple edges." (long lists are cut short). */
export function describeRanOn(ranOn: readonly GraphSummary[]): string {
  if (ranOn.length === 0) return "";
  const shown = ranOn.slice(0, 4).map(describeGraphSummary).join("; ");
  return `Ran on ${shown}${ranOn.length > 4 ? `; and ${ranOn.length - 4} more graphs` : ""}.`;
}

function budgetOf(options: VerifyOptions): Budget {
  if (options.budget) return options.budget;
  return options.timeLimitMs !== undefined ? new TimedBudget(DEFAULT_STEP_LIMIT, options.timeLimitMs) : new Budget(DEFAULT_STEP_LIMIT);
}

/** Runs a check; an exhausted budget anywhere inside becomes an undecided verdict. */
function budgeted(statement: string, budget: Budget, run: () => Verdict): Verdict {
  try {
    return run();
  } catch (e) {
    if (e instanceof BudgetExceeded) return { status: "undecided", statement, method: "step budget", reason: budgetReason(e), steps: budget.used };
    throw e;
  }
}

function handlerOf(claim: Claim): ClaimHandler {
  return HANDLERS[claim.kind] as ClaimHandler;
}

/** Runs a handler step, turning input errors found late (a bound that does not parse, …) into ClaimErrors. */
function guarded<T>(path: string, run: () => T): T {
  try {
    return run();
  } catch (e) {
    if (e instanceof ClaimInputError) throw new ClaimError(`${path}.${e.field}`, e.message);
    if (e instanceof GraphError || e instanceof NumberFormatError) throw new ClaimError(path, e.message);
    throw e;
  }
}

/**
 * Verifies a validated claim. Throws ClaimError for input that cannot be read (the path names the
 * field); everything else, including input over the size limits and an exhausted budget, is a verdict.
 */
export function verifyClaim(claim: Claim, options: VerifyOptions = {}): ClaimResult {
  const path = options.path ?? "$";
  const budget = budgetOf(options);
  const { certificate: carried, ...content } = claim;
  const canonical = claimCanonicalJson(claim);
  const handler = handlerOf(claim);
  const parseStart = now();
  const inputs = parseInputs(claim, path);
  const bound = readClaimBound(claim, path);
  const statement = guarded(path, () => handler.statement(claim, inputs));
  const parseMs = elapsed(parseStart);
  const base = { claim: content as Claim, canonical, digest: sha256Hex(canonical), checkerVersion: CHECKER_VERSION, ...(bound ? { bound } : {}) };
  const ranOn = claimGraphSummaries(inputs);
  const tooLarge = handler.limit(claim, inputs);
  if (tooLarge)
    return {
      ...base,
      timings: { parseMs, checkMs: 0 },
      verdict: { status: "undecided", statement, method: "size limits", reason: `input over the size limit for "${claim.kind}" claims: ${tooLarge}`, ranOn },
    };
  if (options.partsFailed !== undefined)
    return { ...base, timings: { parseMs, checkMs: 0 }, verdict: { status: "undecided", statement, method: PARTS_METHOD, reason: options.partsFailed, ranOn } };
  const checkStart = now();
  const found = guarded(path, () =>
    budgeted(statement, budget, () => {
      if (!options.parts) return handler.verify(claim, inputs, budget);
      if (!handler.fromParts) throw new RangeError(`"${claim.kind}" claims are not checked in parts`);
      return handler.fromParts(claim, inputs, options.parts, budget);
    }),
  );
  const checkMs = elapsed(checkStart);
  const certificate: ClaimCertificate | undefined =
    found.status === "undecided" ? undefined : { kind: claim.kind, outcome: found.status, evidence: found.certificate };
  // The method named is the one that decided, with the kind of evidence it left beside it.
  const verdict: Verdict<ClaimCertificate> = { ...found, statement, ranOn, method: methodWithCertificate(claim.kind, found.method, certificate), certificate };
  if (verdict.certificate === undefined) delete (verdict as { certificate?: unknown }).certificate;
  if (carried === undefined) return { ...base, verdict, timings: { parseMs, checkMs } };
  const recheckStart = now();
  const again = budget instanceof TimedBudget ? budget.renewed() : new Budget(budget.limit);
  const check = guarded(path, () => recheckParsed(claim, inputs, carried, again, options.parts));
  const recheckMs = elapsed(recheckStart);
  const outcome = (carried as { outcome?: unknown } | null)?.outcome;
  return {
    ...base,
    verdict,
    timings: { parseMs, checkMs, recheckMs },
    certificateCheck: { matches: check.status === "verified" && outcome === verdict.status, verdict: check },
  };
}

/** The method named when a claim checked in parts is undecided because a part gave no result. */
export const PARTS_METHOD = "checked in parts";

/** Whether a claim's check is an enumeration the job engine may run in independent parts (claimPart). */
export const checkedInParts = (claim: Claim): boolean => !!handlerOf(claim).part;

/**
 * Part `part` of `parts` of a claim's enumeration (plain JSON, for verifyClaim's `parts` once every
 * part is in), or why this part cannot give one: input over the size limits, or the step budget
 * exhausted (the claim is then undecided, as when it is checked in one piece). Throws ClaimError for
 * input that cannot be read.
 */
export function claimPart(claim: Claim, part: number, parts: number, options: VerifyOptions = {}): { result: unknown } | { undecided: string } {
  const path = options.path ?? "$";
  const budget = budgetOf(options);
  const handler = handlerOf(claim);
  if (!handler.part) throw new RangeError(`"${claim.kind}" claims are not checked in parts`);
  const inputs = parseInputs(claim, path);
  const tooLarge = handler.limit(claim, inputs);
  if (tooLarge) return { undecided: `input over the size limit for "${claim.kind}" claims: ${tooLarge}` };
  try {
    return { result: guarded(path, () => handler.part!(claim, inputs, part, parts, budget)) };
  } catch (e) {
    if (e instanceof BudgetExceeded) return { undecided: `part ${part + 1} of ${parts}: ${budgetReason(e)}` };
    throw e;
  }
}

function rejected(statement: string, why: string): Verdict {
  return { status: "refuted", statement, method: "certificate re-check", reason: `certificate rejected: ${why}` };
}

function recheckParsed(claim: Claim, inputs: ParsedInputs, certificate: unknown, budget: Budget, parts?: readonly unknown[]): Verdict {
  const handler = handlerOf(claim);
  const statement = handler.statement(claim, inputs);
  const envelope = `certificate establishes the claim "${statement}" is`;
  if (typeof certificate !== "object" || certificate === null || Array.isArray(certificate))
    return rejected(`${envelope} decided`, "a claim certificate is an object { kind, outcome, evidence }");
  const c = certificate as Record<string, unknown>;
  if (c.outcome !== "verified" && c.outcome !== "refuted")
    return rejected(`${envelope} decided`, `certificate.outcome must be "verified" or "refuted", got ${JSON.stringify(c.outcome)}`);
  const full = `${envelope} ${c.outcome}`;
  if (c.kind !== claim.kind) return rejected(full, `certificate.kind is ${JSON.stringify(c.kind)}, the claim is "${claim.kind}"`);
  const tooLarge = handler.limit(claim, inputs);
  if (tooLarge) return { status: "undecided", statement: full, method: "size limits", reason: `input over the size limit: ${tooLarge}` };
  const outcome = c.outcome;
  const v = budgeted(full, budget, () => handler.recheck(claim, inputs, outcome, c.evidence, budget, parts));
  return { ...v, statement: full };
}

/**
 * Re-checks a stored certificate independently of any earlier run: `verified` when it is valid and
 * establishes its stated outcome for this claim, `refuted` when it is rejected (the reason names the
 * first failing entry), `undecided` when the budget ran out.
 */
export function recheckClaim(claim: Claim, certificate: unknown, options: VerifyOptions = {}): Verdict {
  const path = options.path ?? "$";
  const inputs = parseInputs(claim, path);
  return guarded(path, () => recheckParsed(claim, inputs, certificate, budgetOf(options), options.parts));
}
