/**
 * A batch claim in the certificate bundle, and its offline re-check. The item carries the graph list
 * as it was read (with the SHA-256 of that text), the statement, and one result per listed graph: its
 * verdict and its certificate. The checker trusts none of it: it re-reads the list, re-decides every
 * graph with the same exact core the workers ran, re-checks every stored certificate on its own
 * (spectral: the claim handler's re-check; subgraphs: recheckExclusion; families: recheckIdentification)
 * and recounts. A changed verdict, a certificate that does not re-check, a graph left out or added,
 * or counts that do not add up are each named with the graph's line.
 */
import { checkListedGraphs, batchStatement, type BatchStatement, type ListedVerdict } from "../claims/batch";
import { readListedGraph, splitGraphList, type GraphListFormat } from "../input/graph-list";
import { sha256Hex } from "../digest";
import { parseBound } from "../arithmetic/bound";
import { recheckSpectralRadiusBound } from "../spectral/inertia";
import { recheckExclusion } from "../subgraph/subgraph";
import { recheckIdentification, type IsomorphismCertificate } from "../families/identify";
import { parseGraph } from "../input/parse";
import { Budget } from "../verdict";
import type { Graph } from "../graph";
import type { CheckLine } from "./check-report";
import { recheckMember, settleEnumeration } from "../claims/batch-enumeration";

/** What a batch item's `data` holds. */
export interface BatchItemData {
  readonly step: string;
  readonly statement: BatchStatement;
  readonly words: string;
  /** The batch's state when exported: "done", or "cancelled" / "running" (then not every graph is decided). */
  readonly status: string;
  readonly file: { readonly name: string; readonly format: GraphListFormat; readonly text: string; readonly textSha256: string; readonly sha256: string };
  readonly counts: {
    readonly total: number;
    readonly verified: number;
    readonly refuted: number;
    readonly undecided: number;
    readonly unreadable: number;
    /** Enumeration batches: classes not listed. */
    readonly missing?: number;
  };
  readonly results: ReadonlyArray<{ readonly entry: number; readonly line: number; readonly verdict: ListedVerdict; readonly certificate: unknown }>;
  readonly checkerVersion: string;
}

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

/** Re-checks a stored certificate of one listed graph on its own; null when it holds, else why not. */
function certificateProblem(s: BatchStatement, g: Graph, verdict: ListedVerdict, certificate: unknown, budget: Budget): string | null {
  if (verdict !== "verified" && verdict !== "refuted") return null;
  if (certificate === null || certificate === undefined) return verdict === "verified" ? "a verified graph without its certificate" : null;
  let check;
  switch (s.kind) {
    case "enumeration-exactly": {
      // A duplicate listing is refuted although its class is a member; settled over the whole list by the caller.
      const why = recheckMember(s, g, certificate);
      return why ? `the certificate does not re-check: ${why}` : null;
    }
    case "spectral-radius-bound":
      check = recheckSpectralRadiusBound(g, s.op, parseBound(s.bound), verdict, certificate, budget);
      break;
    case "contains-one-of":
    case "contains-none-of": {
      check = recheckExclusion(
        g,
        s.patterns.map((p) => parseGraph(p)),
        certificate,
        s.induced,
        budget,
      );
      // The exclusion certificate says "found" (one of them is contained) or "absent" (none is).
      const found = isRecord(certificate) && certificate.found !== undefined;
      const holds = s.kind === "contains-one-of" ? found : !found;
      if (check.status === "verified" && holds !== (verdict === "verified")) return `the certificate shows the opposite of the recorded "${verdict}"`;
      break;
    }
    case "identified-as": {
      check = recheckIdentification(g, certificate, budget);
      const member =
        isRecord(certificate) && certificate.kind === "isomorphism" && s.families.includes((certificate as unknown as IsomorphismCertificate).family);
      if (check.status === "verified" && member !== (verdict === "verified")) return `the certificate shows the opposite of the recorded "${verdict}"`;
      break;
    }
  }
  return check!.status === "verified" ? null : `the certificate does not re-check: ${check.reason}`;
}

/** Re-checks a batch item; `changed` when its SHA-256 no longer matches. */
export function checkBatchItem(id: string, raw: unknown, changed: boolean, steps: number): CheckLine {
  const prefix = changed ? "CHANGED since export: its content no longer matches its SHA-256; " : "";
  if (!isRecord(raw) || !isRecord(raw.file) || !isRecord(raw.counts) || !Array.isArray(raw.results) || !isRecord(raw.statement))
    return { label: id, status: "malformed", text: `${prefix}a batch item needs a statement, a file, counts and results` };
  const data = raw as unknown as BatchItemData;
  let words: string;
  try {
    words = batchStatement(data.statement);
  } catch (e) {
    return { label: id, status: "malformed", text: `${prefix}the statement does not read: ${(e as Error).message}` };
  }
  const problems: string[] = [];
  if (changed) problems.push("CHANGED since export: its content no longer matches its SHA-256");
  const { format, text } = data.file;
  if (typeof text !== "string" || !["graph6", "sparse6", "edges"].includes(format))
    return { label: id, status: "malformed", text: `${prefix}the item carries no graph list text in a known format` };
  if (sha256Hex(text) !== data.file.textSha256)
    problems.push(`the list's text does not match its recorded SHA-256 ${String(data.file.textSha256).slice(0, 16)}…`);
  const entries = splitGraphList(text, format);
  const fresh = checkListedGraphs(entries, format, data.statement, 0, entries.length, steps);
  let missing = 0;
  if (data.statement.kind === "enumeration-exactly") {
    // Over the whole list, as the worker settles it: a repeated class is refuted at its later listing; classes not listed are counted.
    const settled = settleEnumeration(
      data.statement,
      fresh.map((f) => ({ entry: f.entry, line: f.line, verdict: f.verdict, certificate: f.certificate ? JSON.parse(f.certificate) : null })),
    );
    for (const d of settled.duplicates) fresh[d.entry].verdict = "refuted";
    missing = settled.missing.length;
    if ((data.counts.missing ?? 0) !== missing)
      problems.push(`${missing} classes of the enumeration are not listed, the bundle records ${data.counts.missing ?? 0}`);
  }
  const byEntry = new Map(data.results.map((r) => [r.entry, r]));
  if (data.results.length !== entries.length || byEntry.size !== entries.length)
    problems.push(`the list has ${entries.length} graphs but ${data.results.length} results are recorded`);
  const tally = { verified: 0, refuted: 0, undecided: 0, unreadable: 0 };
  let certificates = 0;
  for (const f of fresh) {
    tally[f.verdict]++;
    const r = byEntry.get(f.entry);
    const at = `line ${f.line}`;
    if (!r) {
      if (data.status === "done") problems.push(`${at}: no result recorded`);
      continue;
    }
    if (r.verdict !== f.verdict) {
      problems.push(`${at}: the bundle records "${r.verdict}" but the re-check gives "${f.verdict}"`);
      continue;
    }
    if (f.verdict === "unreadable") continue;
    const why = certificateProblem(data.statement, readListedGraph(entries[f.entry], format), r.verdict, r.certificate, new Budget(steps));
    if (why) problems.push(`${at}: ${why}`);
    else if (r.certificate !== null && r.certificate !== undefined) certificates++;
  }
  const counts = data.counts;
  if (
    counts.total !== entries.length ||
    (data.status === "done" && (["verified", "refuted", "undecided", "unreadable"] as const).some((k) => counts[k] !== tally[k]))
  )
    problems.push(
      `the recorded counts (${counts.verified} verified, ${counts.refuted} refuted, ${counts.undecided} undecided, ${counts.unreadable} unreadable of ${counts.total}) are not the re-check's (${tally.verified}, ${tally.refuted}, ${tally.undecided}, ${tally.unreadable} of ${entries.length})`,
    );
  const summary = `${words}: ${tally.verified} of ${entries.length} graphs verified, ${tally.refuted} refuted, ${tally.undecided} undecided, ${tally.unreadable} unreadable${data.statement.kind === "enumeration-exactly" ? `, ${missing} of the enumeration not listed` : ""}; ${certificates} certificates re-checked`;
  if (problems.length)
    return {
      label: id,
      status: "refuted",
      text: `${problems.slice(0, 5).join("; ")}${problems.length > 5 ? `; and ${problems.length - 5} more` : ""}. ${summary}`,
      reason: problems.join("; "),
    };
  if (data.status !== "done") return { label: id, status: "undecided", text: `the batch was ${data.status} when exported. ${summary}` };
  return { label: id, status: tally.verified === entries.length && missing === 0 ? "verified" : "refuted", text: summary, statement: words };
}
