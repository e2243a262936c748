import "server-only";
import { nameOf, pick } from "./rows";
import { exportedBatches } from "./batches";
import { textAuthors } from "@/lib/review/revisions";
import { claimsOf, digestOf } from "./revisions";
/**
 * Exports of a proof: reading the proof into a snapshot, deciding certified vs draft with the review
 * rules, sealing the bundle and the LaTeX source and recording them. An export is immutable once made.
 */
import { getSequelize } from "@/lib/db";
import { models } from "@/models";
import { refereeLens } from "./blind";
import { AppError, conflict, forbidden, notFound } from "@/lib/errors";
import type { Bundle, ExportKind } from "@/lib/core/certificates/bundle";
import { QueueUnavailable, runBundleJob } from "@/lib/jobs/queue";
import { TIME_LIMIT_MS } from "@/lib/verification/limits";
import { buildBundle } from "@/lib/export/bundle";
import { documentOf } from "@/lib/export/document";
import { renderLatex } from "@/lib/export/latex";
import { certificationOf, type Certification, type ProofSnapshot, type SnapshotCase, type SnapshotRound, type SnapshotStep } from "@/lib/export/snapshot";
import { buildCaseTree, type CaseNode } from "@/lib/proof-tree";
import type { ClaimStatus, DisputeState } from "@/lib/review/states";
import { liveCases, stepRecords, stepsOfCases } from "./cases";
import { listRoundViews } from "./rounds";
import { recordEvent } from "./audit";

/** The proof as it stands: live cases in order, each step's latest revision, all reviews and claims. */
export async function loadSnapshot(proofId: number): Promise<ProofSnapshot | null> {
  const { Proof, ProofMember, User } = models();
  const proof = await Proof.findByPk(proofId);
  if (!proof) return null;
  const [members, cases] = await Promise.all([
    ProofMember.findAll({
      where: { proofId },
      include: [{ model: User, as: "user", attributes: ["name"] }],
      order: [
        ["role", "ASC"],
        ["userId", "ASC"],
      ],
    }),
    liveCases(proofId),
  ]);
  const steps = await stepsOfCases(cases.map((c) => c.id));
  const stepIds = steps.map((s) => s.id);
  const { revisions, reviews, claims } = await stepRecords(stepIds, { reviewerNames: true });
  const revisionNumber = new Map(revisions.map((r) => [r.id, r.number]));
  const batches = await exportedBatches(stepIds);
  // A blind proof's export goes to readers: referees appear as "Referee k" and the bundle keeps no mapping
  // to names (the editors have the names in Cairn itself).
  const lens = proof.blindReview ? await refereeLens(proofId, { id: 0, role: "author" }) : null;
  const shown = (userId: number, name: string) => (lens ? lens.name(userId, name) : name);

  const stepView = (s: (typeof steps)[number], ordinal: number): SnapshotStep => {
    const own = revisions.filter((r) => r.stepId === s.id);
    const latest = own[0];
    return {
      id: s.id,
      position: ordinal,
      revision: latest
        ? {
            number: latest.number,
            body: latest.body,
            authorName: nameOf(latest, "author"),
            savedAt: latest.createdAt.toISOString(),
            claims: claimsOf(latest).map((c) => ({ digest: c.digest, status: c.status })),
            digest: digestOf(latest),
          }
        : null,
      authorIds: textAuthors(own),
      reviews: reviews
        .filter((r) => r.stepId === s.id)
        .map((r) => ({
          reviewerId: r.reviewerId,
          reviewerName: shown(r.reviewerId, nameOf(r, "reviewer")),
          verdict: r.verdict,
          revisionNumber: revisionNumber.get(r.revisionId) ?? 0,
          disputeState: r.disputeState as DisputeState | null,
          digest: r.digest ?? null,
          at: (r.verdict === "vouch" ? r.updatedAt : r.createdAt).toISOString(),
        })),
      claims: claims
        .filter((c) => c.stepId === s.id)
        .map((c) => ({
          position: c.position,
          kind: c.kind,
          input: c.input,
          digest: c.digest,
          status: c.status as ClaimStatus,
          statement: c.statement,
          method: c.method,
          reason: c.reason,
          certificate: c.certificate,
          checkerVersion: c.checkerVersion,
          checkedAt: c.checkedAt ? c.checkedAt.toISOString() : null,
        })),
      ...(batches.has(s.id) ? { batches: batches.get(s.id) } : {}),
    };
  };
  const tree = buildCaseTree(cases.map((c) => ({ id: c.id, parentId: c.parentId, position: c.position, title: c.title, condition: c.condition })));
  const toSnapshot = (n: CaseNode<{ id: number; parentId: number | null; position: number; title: string; condition: string }>): SnapshotCase => ({
    id: n.id,
    number: n.number,
    depth: n.depth,
    title: n.title,
    condition: n.condition,
    steps: steps.filter((s) => s.caseId === n.id).map((s, i) => stepView(s, i + 1)),
    children: n.children.map(toSnapshot),
  });
  return {
    id: proof.id,
    title: proof.title,
    statement: proof.statement,
    requiredApprovals: proof.requiredApprovals,
    members: members.map((m) => ({ name: shown(m.userId, nameOf(m, "user")), role: m.role })),
    cases: tree.map(toSnapshot),
    rounds: await exportedRounds(proofId),
  };
}

/**
 * The rounds as an export carries them: exactly what the proof's authors may read (lib/review/rounds.ts
 * reportAccess through listRoundViews, with the blind lens), with no ids, no addresses and no editor note.
 */
async function exportedRounds(proofId: number): Promise<SnapshotRound[]> {
  const views = await listRoundViews(proofId, { id: 0, role: "author" });
  return views.map((v) => ({
    number: v.number,
    state: v.state,
    openedAt: v.openedAt,
    dueAt: v.dueAt,
    closedAt: v.closedAt,
    decision: v.decision && {
      decision: v.decision.decision,
      editor: v.decision.editor,
      decidedAt: v.decision.decidedAt,
      letter: v.decision.letter,
      reportsAttached: v.decision.reportsAttached,
    },
    reports: v.reports
      .filter((r) => r.state === "submitted")
      .map((r) => ({ referee: r.referee, version: r.version, recommendation: r.recommendation, submittedAt: r.submittedAt, body: r.body })),
  }));
}

export async function getCertification(proofId: number): Promise<Certification> {
  const snapshot = await loadSnapshot(proofId);
  if (!snapshot) throw notFound("This proof");
  return certificationOf(snapshot);
}

export interface ExportSummary {
  id: number;
  proofId: number;
  kind: ExportKind;
  manifestDigest: string;
  itemCount: number;
  claimCount: number;
  createdByName: string | null;
  createdAt: string;
}

type ExportRow = InstanceType<ReturnType<typeof models>["ProofExport"]>;

function summaryOf(e: ExportRow): ExportSummary {
  return {
    ...pick(e, ["id", "proofId", "kind", "manifestDigest", "itemCount", "claimCount"]),
    createdByName: nameOf(e, "creator") || null,
    createdAt: e.createdAt.toISOString(),
  };
}

/**
 * Makes an export. A certified export is refused (409, with every reason) unless the proof is ready to
 * certify, and also unless the sealed bundle re-checks cleanly here, exactly as a reader will re-check it.
 */
export async function createExport(proofId: number, user: { id: number; name: string }, kind: ExportKind): Promise<ExportSummary> {
  const snapshot = await loadSnapshot(proofId);
  if (!snapshot) throw notFound("This proof");
  const certification = certificationOf(snapshot);
  if (kind === "certified" && certification.state !== "ready to certify")
    throw conflict(`This proof is not ready to certify: ${certification.blockers.join(" ")} You can export a draft instead.`, {
      blockers: certification.blockers,
    });
  const bundle = buildBundle(snapshot, { kind, exportedAt: new Date().toISOString(), exportedBy: user.name });
  if (kind === "certified") {
    // As a job in a worker process, not here: re-checking every claim of a large proof must not hold up other requests.
    // The wait covers the re-check's own limit (that of each claim, up to ten minutes) and a minute in the queue.
    // A batch claim weighs one claim per thousand listed graphs (each graph re-decided and its certificate re-checked).
    const claims =
      bundle.items.filter((i) => i.type === "claim").length +
      bundle.items.filter((i) => i.type === "batch").reduce((n, i) => n + Math.ceil((i.data as { counts: { total: number } }).counts.total / 1000), 0);
    const report = await runBundleJob(JSON.parse(JSON.stringify(bundle)), claims, Math.min(TIME_LIMIT_MS * Math.max(1, claims), 600_000) + 60_000).catch(
      (e) => {
        if (e instanceof QueueUnavailable)
          throw new AppError(
            "unavailable",
            "Verification is paused (the job queue cannot be reached), so the bundle cannot be re-checked and certified now. Try again in a few minutes; a draft export works meanwhile.",
          );
        throw conflict(`The bundle could not be re-checked, so it cannot be certified: ${(e as Error).message}.`);
      },
    );
    const failing = report.lines.filter((l) => l.status !== "verified" || (l.certificate && !l.certificate.matches));
    if (report.exitCode !== 0)
      throw conflict(
        `The bundle does not re-check, so it cannot be certified: ${failing.map((l) => `${l.label}: ${l.certificate && !l.certificate.matches ? l.certificate.text : l.text}`).join("; ")}`,
      );
  }
  const tex = renderLatex(documentOf(bundle));
  const { ProofExport } = models();
  const row = await getSequelize().transaction(async (transaction) => {
    const created = await ProofExport.create(
      {
        proofId,
        kind,
        manifestDigest: bundle.manifestDigest,
        createdBy: user.id,
        itemCount: bundle.items.length,
        claimCount: bundle.items.filter((i) => i.type === "claim").length,
        bundle: JSON.stringify(bundle, null, 1),
        tex,
        createdAt: new Date(bundle.export.exportedAt),
      },
      { transaction },
    );
    await recordEvent(
      {
        proofId,
        actorId: user.id,
        action: `export.${kind}`,
        subjectType: "proof",
        subjectId: proofId,
        detail: `${kind} export #${created.id}, manifest digest ${bundle.manifestDigest}`,
      },
      transaction,
    );
    return created;
  });
  return { ...summaryOf(row), createdByName: user.name };
}

export async function listExports(proofId: number): Promise<ExportSummary[]> {
  const { ProofExport, User } = models();
  const rows = await ProofExport.findAll({
    where: { proofId },
    attributes: { exclude: ["bundle", "tex"] },
    include: [{ model: User, as: "creator", attributes: ["name"] }],
    order: [
      ["createdAt", "DESC"],
      ["id", "DESC"],
    ],
  });
  return rows.map(summaryOf);
}

export interface ExportFull extends ExportSummary {
  bundle: Bundle;
  bundleText: string;
  tex: string;
}

/** One export of this proof with its bundle and LaTeX source; 404 for an export of another proof. */
export async function getExport(proofId: number, exportId: number): Promise<ExportFull> {
  const { ProofExport, User } = models();
  const row = await ProofExport.findOne({ where: { id: exportId, proofId }, include: [{ model: User, as: "creator", attributes: ["name"] }] });
  if (!row) throw notFound("This export");
  return { ...summaryOf(row), bundle: JSON.parse(row.bundle) as Bundle, bundleText: row.bundle, tex: row.tex };
}
