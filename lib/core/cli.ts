/**
 * The offline checker: `npm run check -- FILE...` or `bin/cairn-check.mjs FILE...`.
 *
 * Reads a claims document (one claim, an array of claims, or a "cairn-claims/1" list) or an exported
 * bundle ("cairn-bundle/1", bundle.ts), verifies every claim exactly, re-checks every certificate a
 * claim carries, and prints one line per claim and a summary. Exit codes (check-report.ts):
 *   0  every claim verified and every carried certificate re-checked;
 *   1  some claim refuted or undecided, or a carried certificate failed its re-check
 *      (undecided counts against: a reader cannot rely on a claim nobody decided);
 *   2  the file or some claim in it is malformed (the message names the JSON path), or usage error.
 */
import { readFileSync } from "node:fs";
import { availableParallelism } from "node:os";
import { isMainThread } from "node:worker_threads";
import { resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { BUNDLE_FORMAT, checkBundle } from "./certificates/bundle";
import { readClaimsDocument } from "./claims/claim-file";
import { ClaimError } from "./claims/claim-schema";
import { CHECKER_VERSION, describeRanOn, verifyClaim, type ClaimResult } from "./claims/claims";
import { TimedBudget } from "./time-budget";
import { claimPartsOptions } from "./certificates/parts-plan";
import { partsOnThreads, type ThreadOptions } from "./cli-parts";
import { Budget, DEFAULT_STEP_LIMIT } from "./verdict";
import { EXIT_MALFORMED, EXIT_OK, claimLineFields, exitCodeOf, type CheckLine, type CheckOptions, type CheckReport } from "./certificates/check-report";

export { EXIT_MALFORMED, EXIT_NOT_VERIFIED, EXIT_OK, exitCodeOf, type CheckLine, type CheckOptions, type CheckReport } from "./certificates/check-report";

const MARK: Record<CheckLine["status"], string> = { verified: "✓", refuted: "✗", undecided: "?", malformed: "!" };

function lineOf(label: string, r: ClaimResult): CheckLine {
  const v = r.verdict;
  // A refutation or an undecided verdict is only useful with its reason; a verification names its method.
  const reason = v.status === "verified" ? "" : `  — ${v.reason}`;
  const certificate = r.certificateCheck && {
    matches: r.certificateCheck.matches,
    text: r.certificateCheck.matches
      ? `certificate re-checked: matches (${r.certificateCheck.verdict.method})`
      : `certificate does NOT match: ${r.certificateCheck.verdict.reason}`,
  };
  const ranOn = describeRanOn(v.ranOn ?? []);
  const details = [
    ...(v.status === "verified" ? [v.reason] : []),
    ...(r.bound ? [`bound ${r.bound.sentence}`] : []),
    ...(ranOn ? [ranOn] : []),
    ...(v.notes ?? []),
  ];
  return {
    label,
    status: v.status,
    text: `${v.statement}  (${v.method})${reason}`,
    digest: r.digest,
    ...(certificate ? { certificate } : {}),
    ...(details.length ? { details } : {}),
    ...claimLineFields(r),
  };
}

/**
 * Checks a parsed document, dispatching on its "format" field. Claims documents are handled here;
 * other formats (an exported bundle) are added as further cases of the switch.
 */
export function checkDocument(json: unknown, source: string, options: CheckOptions = {}): CheckReport {
  const format = typeof json === "object" && json !== null && !Array.isArray(json) ? (json as { format?: unknown }).format : undefined;
  switch (format) {
    case BUNDLE_FORMAT:
      return checkBundle(json, source, options);
    default:
      return checkClaims(json, source, options);
  }
}

function checkClaims(json: unknown, source: string, options: CheckOptions): CheckReport {
  const lines: CheckLine[] = [];
  for (const entry of readClaimsDocument(json)) {
    const label = ("claim" in entry ? entry.claim.id : entry.id) || `#${entry.index + 1}`;
    if ("error" in entry) {
      lines.push({ label, status: "malformed", text: entry.error.message });
      continue;
    }
    try {
      const steps = options.steps ?? DEFAULT_STEP_LIMIT;
      const budget = options.timeLimitMs !== undefined ? new TimedBudget(steps, options.timeLimitMs) : new Budget(steps);
      lines.push(lineOf(label, verifyClaim(entry.claim, { budget, path: entry.path, ...claimPartsOptions(options.parts, entry.path, entry.claim) })));
    } catch (e) {
      // verifyClaim throws for malformed input (a graph text that does not parse, an embedding of the
      // wrong length). Anything else is a fault in the checker: a reader gets a line, not a stack trace,
      // and the claim counts as not verified.
      if (e instanceof ClaimError) lines.push({ label, status: "malformed", text: e.message });
      else
        lines.push({
          label,
          status: "undecided",
          text: `internal error in the checker (${e instanceof Error ? e.message : String(e)}); please report it with this claim`,
        });
    }
  }
  return { source, lines, exitCode: exitCodeOf(lines) };
}

/** Reads one file as JSON; a file that cannot be read or is not JSON is reported as malformed. */
function readDocument(path: string): { json: unknown } | { report: CheckReport } {
  try {
    return { json: JSON.parse(readFileSync(path, "utf8")) };
  } catch (e) {
    const why = e instanceof SyntaxError ? `not valid JSON: ${e.message}` : `cannot read: ${e instanceof Error ? e.message : String(e)}`;
    return { report: { source: path, lines: [{ label: "$", status: "malformed", text: why }], exitCode: EXIT_MALFORMED } };
  }
}

function checkRead(json: unknown, path: string, options: CheckOptions): CheckReport {
  try {
    return checkDocument(json, path, options);
  } catch (e) {
    if (e instanceof ClaimError) return { source: path, lines: [{ label: "$", status: "malformed", text: e.message }], exitCode: EXIT_MALFORMED };
    throw e;
  }
}

/** Reads and checks one file; a file that is not JSON or not a known document is reported as malformed. */
export function checkFile(path: string, options: CheckOptions = {}): CheckReport {
  const read = readDocument(path);
  return "report" in read ? read.report : checkRead(read.json, path, options);
}

/**
 * As checkFile, with the large enumeration and coverage claims checked in parts on worker threads
 * (cli-parts.ts): the same report, verdicts and digests as checkFile gives.
 */
export async function checkFileOnThreads(path: string, options: CheckOptions, threads: Omit<ThreadOptions, "steps" | "timeLimitMs">): Promise<CheckReport> {
  const read = readDocument(path);
  if ("report" in read) return read.report;
  const steps = options.steps ?? DEFAULT_STEP_LIMIT;
  const parts = await partsOnThreads(read.json, { ...threads, steps, ...(options.timeLimitMs !== undefined ? { timeLimitMs: options.timeLimitMs } : {}) });
  return checkRead(read.json, path, { ...options, parts });
}

export function formatReport(report: CheckReport, verbose = false): string {
  const out = [`${report.source}`];
  const width = Math.max(8, ...report.lines.map((l) => l.label.length));
  for (const l of report.lines) {
    out.push(`${MARK[l.status]} ${l.status.padEnd(10)} ${l.label.padEnd(width)}  ${l.text}`);
    if (l.certificate) out.push(`  ${l.certificate.matches ? "✓" : "✗"} ${l.certificate.text}`);
    if (verbose) for (const d of [...(l.details ?? []), ...(l.digest ? [`claim digest ${l.digest}`] : [])]) out.push(`    · ${d}`);
  }
  const count = (s: CheckLine["status"]) => report.lines.filter((l) => l.status === s).length;
  const mismatched = report.lines.filter((l) => l.certificate && !l.certificate.matches).length;
  out.push(
    `${report.lines.length} checked: ${count("verified")} verified, ${count("refuted")} refuted, ${count("undecided")} undecided` +
      (count("malformed") ? `, ${count("malformed")} malformed` : "") +
      (mismatched ? `, ${mismatched} certificate${mismatched > 1 ? "s" : ""} not matching` : ""),
  );
  return out.join("\n");
}

/** A reader's machine should never hang on a claim: past this, the claim is reported undecided. */
const DEFAULT_TIME_LIMIT_S = 120;

const USAGE = `usage: cairn-check [--steps N] [--time-limit SECONDS] [--parallel N] [--json] [--verbose] FILE...
Checks Cairn claims files (cairn-claim/1, cairn-claims/1) and exported bundles (cairn-bundle/1) exactly, offline.
--parallel N: check large enumeration and coverage claims in parts on N threads (default: the cores available; 1: in one piece).
Exit 0: all verified; 1: something refuted, undecided or a certificate not matching; 2: malformed input.`;

/** How the checker starts its threads: this module again (the single-file bundle is one module), or a script that loads it. */
export interface ThreadStart {
  readonly script?: string | URL;
}

/** Runs the checker on command-line arguments; resolves to the exit code. */
export async function main(argv: string[], print: (s: string) => void = (s) => process.stdout.write(s + "\n"), start: ThreadStart = {}): Promise<number> {
  const files: string[] = [];
  let steps: number | undefined;
  let seconds = DEFAULT_TIME_LIMIT_S;
  let threads = availableParallelism();
  let json = false,
    verbose = false;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === "--help" || a === "-h") {
      print(USAGE);
      return EXIT_OK;
    } else if (a === "--json") json = true;
    else if (a === "--verbose" || a === "-v") verbose = true;
    else if (a === "--steps") {
      steps = Number(argv[++i]);
      if (!Number.isSafeInteger(steps) || steps < 1) {
        print(`--steps needs a positive integer\n${USAGE}`);
        return EXIT_MALFORMED;
      }
    } else if (a === "--time-limit") {
      seconds = Number(argv[++i]);
      if (!Number.isFinite(seconds) || seconds <= 0) {
        print(`--time-limit needs a positive number of seconds\n${USAGE}`);
        return EXIT_MALFORMED;
      }
    } else if (a === "--parallel") {
      threads = Number(argv[++i]);
      if (!Number.isSafeInteger(threads) || threads < 1 || threads > 256) {
        print(`--parallel needs a number of threads from 1 to 256\n${USAGE}`);
        return EXIT_MALFORMED;
      }
    } else if (a === "--version") {
      print(CHECKER_VERSION);
      return EXIT_OK;
    } else if (a.startsWith("--")) {
      print(`unknown option ${a}\n${USAGE}`);
      return EXIT_MALFORMED;
    } else files.push(a);
  }
  if (files.length === 0) {
    print(USAGE);
    return EXIT_MALFORMED;
  }
  const options = { steps, timeLimitMs: seconds * 1000 };
  const reports: CheckReport[] = [];
  for (const f of files)
    reports.push(threads > 1 ? await checkFileOnThreads(f, options, { threads, script: start.script ?? new URL(import.meta.url) }) : checkFile(f, options));
  if (json) print(JSON.stringify({ checkerVersion: CHECKER_VERSION, reports }, null, 2));
  else {
    print(`cairn-check ${CHECKER_VERSION}`);
    for (const r of reports) print(formatReport(r, verbose));
  }
  return Math.max(...reports.map((r) => r.exitCode));
}

// Run when executed directly (`tsx lib/core/cli.ts`, or the single-file bundle); bin/cairn-check.mjs imports and calls `main`.
// Never in a thread the checker started for parts (it runs this same module with the same command line).
// Run from the TypeScript sources (`npm run check`), each thread loads the sources through bin/cairn-check-thread.mjs (tsx's loader).
if (isMainThread && process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const start = import.meta.url.endsWith(".ts") ? { script: new URL("../../bin/cairn-check-thread.mjs", import.meta.url) } : {};
  void main(process.argv.slice(2), undefined, start).then((code) => (process.exitCode = code));
}
