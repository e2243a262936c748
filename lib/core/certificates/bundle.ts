/**
 * The certificate bundle "cairn-bundle/1": the exported snapshot of a proof, and its offline re-check.
 *
 * A bundle is `{ format, export, items, manifestDigest }`. Every item is `{ id, type, data, sha256 }`
 * where `sha256` is the SHA-256 of the canonical JSON of `{ id, type, data }`, so a changed item is
 * named by its own id. The manifest digest is the SHA-256 of the canonical JSON of the format, the
 * export header and the list of `{ id, type, sha256 }`: it covers every byte of meaning in the bundle
 * (whitespace and key order aside, which canonical JSON ignores), and is the one number to cite.
 *
 * `checkBundle` recomputes every digest and re-verifies every claim from scratch (a fresh verification
 * plus an independent re-check of the stored certificate), and compares each with the recorded verdict;
 * each step's vouches are checked against the digest of the revision (text and claims) they cover.
 * A large enumeration or coverage claim may come with its parts computed elsewhere (`parts`,
 * parts-plan.ts): its verdict and the re-check of its certificate are then merged from them.
 * Framework-free: the server, the offline checker and a bundled single-file checker all use it.
 */
import { canonicalJson } from "../input/canonical";
import { ClaimError, validateClaim } from "../claims/claim-schema";
import { CHECKER_VERSION, claimDigest, verifyClaim } from "../claims/claims";
import { sha256Hex } from "../digest";
import { revisionDigest } from "./revision-digest";
import { Budget, DEFAULT_STEP_LIMIT } from "../verdict";
import { claimLineFields, type CheckLine } from "./check-report";
import { CERTIFICATE_SEPARATOR, certificateKindOf } from "./certificate-kind";
import { checkBatchItem } from "./batch-check";
import { claimPartsOptions, type PartsByClaim } from "./parts-plan";

export const BUNDLE_FORMAT = "cairn-bundle/1";

/** "round": one review round with its decision, as the authors may read it (referees as "Referee k" on a blind proof). */
export type BundleItemType = "proof" | "case" | "step" | "claim" | "round" | "batch";
export type ExportKind = "certified" | "draft";

export interface BundleItem {
  readonly id: string;
  readonly type: BundleItemType;
  readonly data: unknown;
  readonly sha256: string;
}

export interface BundleHeader {
  readonly kind: ExportKind;
  readonly exportedAt: string;
  readonly exportedBy: string;
  /** The proof's derived state at export time ("ready to certify" or "in progress"). */
  readonly proofState: string;
  readonly checkerVersion: string;
}

export interface Bundle {
  readonly format: typeof BUNDLE_FORMAT;
  readonly export: BundleHeader;
  readonly items: readonly BundleItem[];
  readonly manifestDigest: string;
}

/** What a claim item's `data` holds. `claim` is the cairn-claim/1 JSON without its certificate. */
export interface ClaimItemData {
  readonly step: string;
  readonly position: number;
  readonly claim: unknown;
  readonly digest: string | null;
  readonly verdict: { readonly status: string; readonly statement: string | null; readonly method: string | null; readonly reason: string | null };
  readonly certificate: unknown;
  readonly checkerVersion: string | null;
  readonly checkedAt: string | null;
}

export function itemDigest(item: { id: string; type: string; data: unknown }): string {
  return sha256Hex(canonicalJson({ id: item.id, type: item.type, data: item.data }));
}

export function manifestDigestOf(bundle: Pick<Bundle, "format" | "export" | "items">): string {
  return sha256Hex(
    canonicalJson({
      format: bundle.format,
      export: bundle.export,
      items: bundle.items.map((i) => ({ id: i.id, type: i.type, sha256: i.sha256 })),
    }),
  );
}

/** Seals items and a header into a bundle: per-item digests, then the manifest digest. */
export function sealBundle(header: BundleHeader, items: ReadonlyArray<{ id: string; type: BundleItemType; data: unknown }>): Bundle {
  const sealed = items.map((i) => ({ id: i.id, type: i.type, data: i.data, sha256: itemDigest(i) }));
  const body = { format: BUNDLE_FORMAT, export: header, items: sealed } as const;
  return { ...body, manifestDigest: manifestDigestOf(body) };
}

// ---- the re-check ---------------------------------------------------------------------------------

/** One printed line; the same shape as the checker's lines (check-report.ts). */
export type BundleCheckLine = CheckLine;

export interface BundleCheckReport {
  readonly source: string;
  readonly lines: BundleCheckLine[];
  readonly exitCode: number;
}

const TOP_KEYS = ["format", "export", "items", "manifestDigest"];
const ITEM_KEYS = ["id", "type", "data", "sha256"];
const short = (hex: unknown) => (typeof hex === "string" ? hex.slice(0, 16) + "…" : String(hex));
const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

function malformed(source: string, text: string): BundleCheckReport {
  return { source, lines: [{ label: "$", status: "malformed", text }], exitCode: 2 };
}

/** Re-verifies one claim item from scratch and compares the result with what the bundle records. */
function checkClaimItem(item: BundleItem, changed: boolean, steps: number, parts?: PartsByClaim): BundleCheckLine {
  const label = item.id;
  const data = item.data as Partial<ClaimItemData> | undefined;
  const prefix = changed ? "CHANGED since export (its SHA-256 no longer matches); " : "";
  if (!isRecord(data) || !isRecord(data.verdict)) return { label, status: "malformed", text: `${prefix}the item has no claim and verdict` };
  let claim;
  try {
    claim = validateClaim(data.claim, `${item.id}.data.claim`);
  } catch (e) {
    if (e instanceof ClaimError) return { label, status: "malformed", text: `${prefix}${e.message}` };
    throw e;
  }
  const recorded = String(data.verdict.status);
  const hasCertificate = data.certificate !== undefined && data.certificate !== null;
  let fresh;
  try {
    fresh = verifyClaim(hasCertificate ? { ...claim, certificate: data.certificate } : claim, {
      budget: new Budget(steps),
      path: `${item.id}.data.claim`,
      ...claimPartsOptions(parts, item.id, claim),
    });
  } catch (e) {
    if (e instanceof ClaimError) return { label, status: "malformed", text: `${prefix}${e.message}` };
    throw e;
  }
  const v = fresh.verdict;
  const problems: string[] = [];
  if (changed) problems.push("CHANGED since export: its content no longer matches its SHA-256");
  if (recorded === "pending") problems.push(`the claim had not been checked when it was exported (pending); the re-check gives "${v.status}"`);
  else if (recorded !== v.status) problems.push(`the bundle records "${recorded}" but the re-check gives "${v.status}"`);
  if (data.digest && data.digest !== claimDigest(claim))
    problems.push(`the recorded claim digest ${short(data.digest)} is not the claim's digest ${short(fresh.digest)}`);
  if (recorded === "verified" && !hasCertificate) problems.push("a verified claim without its certificate");
  const named =
    typeof data.verdict.method === "string" && data.verdict.method.includes(CERTIFICATE_SEPARATOR) ? data.verdict.method.split(CERTIFICATE_SEPARATOR)[1] : null;
  const carried = hasCertificate ? (certificateKindOf(claim.kind, data.certificate)?.words ?? null) : null;
  if (named !== null && named !== carried)
    problems.push(`the recorded method names a certificate of kind "${named}" but the certificate carried is ${carried ? `of kind "${carried}"` : "none"}`);
  const certificate = fresh.certificateCheck && {
    matches: fresh.certificateCheck.matches,
    text: fresh.certificateCheck.matches
      ? `certificate re-checked: matches (${fresh.certificateCheck.verdict.method}); claim digest ${short(fresh.digest)}`
      : `certificate does NOT match: ${fresh.certificateCheck.verdict.reason}`,
  };
  const reason = v.status === "verified" ? "" : `  — ${v.reason}`;
  const status = problems.length > 0 && v.status === "verified" ? "refuted" : v.status;
  const text = `${problems.length ? problems.join("; ") + ". " : ""}${v.statement}  (${v.method})${reason}`;
  return {
    label,
    status,
    text,
    ...(certificate ? { certificate } : {}),
    ...claimLineFields(fresh),
    ...(problems.length ? { reason: [...problems, v.reason].join("; ") } : {}),
  };
}

/**
 * What a step's vouches cover: the revision digest recomputed from the step's text and claim set, the
 * claim set compared with the claim items of the step, and every vouch's stored digest compared with
 * the revision it was given on. A vouch on an older revision must be marked superseded. Returns null
 * for a step with no recorded revision digest and no vouch (nothing to say).
 */
function checkStepCover(item: BundleItem, claimItems: readonly BundleItem[]): BundleCheckLine | null {
  const data = item.data as { revision?: unknown; reviews?: unknown } | undefined;
  if (!isRecord(data) || !isRecord(data.revision)) return null;
  const r = data.revision as { number?: unknown; body?: unknown; claims?: unknown; digest?: unknown };
  const vouches = (Array.isArray(data.reviews) ? data.reviews : []).filter(
    (v): v is Record<string, unknown> => isRecord(v) && (v.verdict === "vouch" || v.verdict === "vouch"),
  );
  if (typeof r.digest !== "string")
    return vouches.length ? { label: item.id, status: "refuted", text: "vouches are recorded but the revision carries no digest of what they cover" } : null;
  if (typeof r.number !== "number" || typeof r.body !== "string" || !Array.isArray(r.claims))
    return { label: item.id, status: "malformed", text: "the revision needs a number, a body and a list of claims" };
  const claims = (r.claims as unknown[]).map((c) => (isRecord(c) ? { digest: String(c.digest), status: String(c.status) } : { digest: "", status: "" }));
  const recomputed = revisionDigest({ number: r.number, body: r.body, claims });
  const problems: string[] = [];
  if (recomputed !== r.digest) problems.push(`the revision digest ${short(r.digest)} does not match its text and claims (${short(recomputed)})`);
  const inBundle = claimItems.map((c) => {
    const d = c.data as Partial<ClaimItemData> | undefined;
    return { digest: String(d?.digest ?? ""), status: String(isRecord(d?.verdict) ? d.verdict.status : "") };
  });
  if (inBundle.length !== claims.length || inBundle.some((c, i) => c.digest !== claims[i].digest || c.status !== claims[i].status))
    problems.push(
      `the bundle's ${inBundle.length} claim(s) of this step are not the ${claims.length} claim(s) (with their verdicts) that revision ${r.number} covers`,
    );
  let current = 0;
  for (const v of vouches) {
    const who = String(v.reviewer ?? "a referee");
    if (v.revision === r.number) {
      current++;
      if (v.digest !== recomputed)
        problems.push(`the vouch by ${who} records digest ${short(v.digest)}, but revision ${r.number} (text and claims) digests to ${short(recomputed)}`);
    } else if (v.superseded !== true)
      problems.push(`the vouch by ${who} on revision ${String(v.revision)} is counted, but it does not cover revision ${r.number}`);
  }
  if (problems.length) return { label: item.id, status: "refuted", text: `${problems.join("; ")}.` };
  if (vouches.length === 0) return null;
  const superseded = vouches.length - current;
  return {
    label: item.id,
    status: "verified",
    text: `revision ${r.number} (text and ${claims.length} claim(s)) digests to ${short(recomputed)}; ${current} vouch(es) cover exactly it${superseded ? `, ${superseded} superseded` : ""}`,
  };
}

/**
 * Checks a parsed bundle: every item digest, the manifest digest, every claim re-verified. Exit code
 * 0 when all hold, 1 when a claim fails or anything was changed (each changed item is named), 2 when
 * the document is not a bundle at all.
 */
export function checkBundle(json: unknown, source: string, options: { readonly steps?: number; readonly parts?: PartsByClaim } = {}): BundleCheckReport {
  if (!isRecord(json) || json.format !== BUNDLE_FORMAT) return malformed(source, `not a ${BUNDLE_FORMAT} document`);
  const extra = Object.keys(json).filter((k) => !TOP_KEYS.includes(k));
  if (!isRecord(json.export) || !Array.isArray(json.items) || typeof json.manifestDigest !== "string")
    return malformed(source, "a bundle needs an export header, a list of items and a manifest digest");
  const header = json.export as unknown as BundleHeader;
  const lines: BundleCheckLine[] = [];
  const seen = new Set<string>();
  const changedItems: string[] = [];
  let claims = 0;
  let batches = 0;
  const stepItems: BundleItem[] = [];
  const claimsOfStep = new Map<string, BundleItem[]>();
  for (const [index, raw] of (json.items as unknown[]).entries()) {
    if (!isRecord(raw) || typeof raw.id !== "string" || typeof raw.type !== "string" || typeof raw.sha256 !== "string") {
      lines.push({ label: `items[${index}]`, status: "malformed", text: "an item needs a string id, type and sha256" });
      continue;
    }
    const item = raw as unknown as BundleItem;
    const extraKeys = Object.keys(raw).filter((k) => !ITEM_KEYS.includes(k));
    if (seen.has(item.id)) lines.push({ label: item.id, status: "refuted", text: "CHANGED since export: this item id appears twice" });
    seen.add(item.id);
    let actual: string;
    try {
      actual = itemDigest(item);
    } catch (e) {
      lines.push({ label: item.id, status: "malformed", text: `its data cannot be digested: ${e instanceof Error ? e.message : String(e)}` });
      continue;
    }
    const changed = actual !== item.sha256 || extraKeys.length > 0;
    if (changed) changedItems.push(item.id);
    if (item.type === "step") stepItems.push(item);
    if (item.type === "claim") {
      claims++;
      const owner = isRecord(item.data) ? String(item.data.step) : "";
      claimsOfStep.set(owner, [...(claimsOfStep.get(owner) ?? []), item]);
      lines.push(checkClaimItem(item, changed, options.steps ?? DEFAULT_STEP_LIMIT, options.parts));
    } else if (item.type === "batch") {
      // A batch claim: every listed graph re-decided and its certificate re-checked (batch-check.ts).
      batches++;
      lines.push(checkBatchItem(item.id, item.data, changed, options.steps ?? DEFAULT_STEP_LIMIT));
    } else if (changed) {
      lines.push({
        label: item.id,
        status: "refuted",
        text: extraKeys.length
          ? `CHANGED since export: unexpected field(s) ${extraKeys.join(", ")}`
          : `CHANGED since export: its content no longer matches its SHA-256 (recorded ${short(item.sha256)}, now ${short(actual)})`,
      });
    }
  }
  for (const step of stepItems) {
    const line = checkStepCover(step, claimsOfStep.get(step.id) ?? []);
    if (line) lines.push(line);
  }
  let manifest: string;
  try {
    manifest = manifestDigestOf({ format: BUNDLE_FORMAT, export: header, items: json.items as BundleItem[] });
  } catch (e) {
    return {
      source,
      lines: [
        ...lines,
        { label: "manifest", status: "malformed", text: `the export header cannot be digested: ${e instanceof Error ? e.message : String(e)}` },
      ],
      exitCode: 2,
    };
  }
  const items = (json.items as unknown[]).length;
  if (manifest !== json.manifestDigest || extra.length > 0) {
    const why = extra.length ? `unexpected top-level field(s) ${extra.join(", ")}` : `recorded ${short(json.manifestDigest)}, recomputed ${short(manifest)}`;
    lines.push({
      label: "manifest",
      status: "refuted",
      text: `CHANGED since export: the manifest digest does not match (${why}); the export header or the list of items was altered`,
    });
  } else {
    lines.push({
      label: "manifest",
      status: changedItems.length ? "refuted" : "verified",
      text: changedItems.length
        ? `the manifest matches its own header, but ${changedItems.length} item(s) changed: ${changedItems.join(", ")}`
        : `all ${items} item digests and the manifest digest ${json.manifestDigest} recomputed and matching`,
    });
  }
  const checker = header.checkerVersion === CHECKER_VERSION ? "" : ` (exported with ${String(header.checkerVersion)}, re-checked with ${CHECKER_VERSION})`;
  const describeSource = `${source}: ${String(header.kind)} export, ${claims} claim(s)${batches ? `, ${batches} batch claim(s)` : ""}, ${items} item(s), exported ${String(header.exportedAt)} by ${String(header.exportedBy)}${checker}; manifest digest ${json.manifestDigest}`;
  const exitCode = lines.some((l) => l.status === "malformed")
    ? 2
    : lines.some((l) => l.status !== "verified" || (l.certificate && !l.certificate.matches))
      ? 1
      : 0;
  return { source: describeSource, lines, exitCode };
}
