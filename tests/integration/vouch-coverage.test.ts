/**
 * A revision is text plus claims: attaching, withdrawing or re-deciding a claim makes a new revision,
 * a vouch covers exactly one revision (its digest is stored), earlier vouches are superseded and their
 * referees notified, and a vouch on anything but the latest revision is refused with what changed.
 */
import { describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params } from "./helpers";
import { reviewProofsForFile, latestRevision } from "./review-fixtures";
import { getSequelize } from "@/lib/db";
import { models } from "@/models";
import { verificationSettled } from "@/lib/data/claims";
import { storeClaims } from "@/lib/data/claim-attach";
import { giveVerdict, loadStep } from "@/lib/data/reviews";
import type { AppError } from "@/lib/errors";
import { storeVerdict } from "@/lib/data/revisions";
import { saveRevision } from "@/lib/data/steps";
import { digestOfRevision, parseClaimSet } from "@/lib/review/revisions";
import * as reviews from "@/app/api/proofs/[proofId]/steps/[stepId]/reviews/route";
import * as claimsRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/claims/route";
import * as claimRoute from "@/app/api/proofs/[proofId]/claims/[claimId]/route";
import * as diffRoute from "@/app/api/proofs/[proofId]/steps/[stepId]/diff/route";

const [fx] = reviewProofsForFile(["vouch coverage"], { pool: true });

const p = (stepId: number) => params({ proofId: String(fx.proofId), stepId: String(stepId) });
const vouch = (stepId: number, body: Record<string, unknown>) => reviews.POST(jsonRequest("/x", "POST", { verdict: "vouch", ...body }), p(stepId));
const panel = async (stepId: number) => (await (await reviews.GET(new Request("http://localhost/x"), p(stepId))).json()).review;
// E7 is a Dynkin diagram, so ρ(E7) < 2 (Smith 1970; Brouwer & Haemers, Spectra of Graphs, §3.1.1).
const e7 = { format: "cairn-claim/1", kind: "spectral-radius-bound", graph: { format: "named", text: "E(7)" }, op: "<", bound: "2" };
const attach = async (stepId: number, claims: unknown[]) => {
  const res = await claimsRoute.POST(jsonRequest("/x", "POST", { claims }), p(stepId));
  expect(res.status).toBe(202);
  const ids = ((await res.json()).claims as Array<{ id: number }>).map((c) => c.id);
  await Promise.all(ids.map(verificationSettled));
  return ids;
};
const inbox = (userId: number) => models().Notification.findAll({ where: { userId, kind: "vouch_superseded" }, order: [["id", "DESC"]] });

describe("a vouch covers the text and the claims of one revision", () => {
  it("attaching a claim supersedes the vouch, notifies the referee, and a vouch on the old revision is refused naming what changed", async () => {
    const stepId = fx.steps["1.1"];
    const r1 = await latestRevision(stepId);
    await actAs("reviewer");
    const first = await vouch(stepId, { revisionId: r1.id, digest: digestOfRevision(r1.number, r1.body, []) });
    expect(first.status).toBe(201);
    const stored = await models().Review.findByPk((await first.json()).reviewId);
    expect(stored!.digest).toBe(digestOfRevision(1, r1.body, []));

    await actAs("author");
    const [claimId] = await attach(stepId, [e7]);
    const r2 = await latestRevision(stepId);
    expect(r2).toMatchObject({ number: 2, body: r1.body, origin: "claims" });
    // The first verdict is written into the revision that recorded the claim as pending: no third revision.
    expect(parseClaimSet(r2.claimSet)).toEqual([expect.objectContaining({ id: claimId, status: "verified" })]);
    expect(r2.digest).toBe(digestOfRevision(2, r2.body, parseClaimSet(r2.claimSet)));

    await actAs("reviewer");
    const view = await panel(stepId);
    expect(view.status).toMatchObject({ vouches: 0, supersededVouches: 1, vouched: false });
    // Comparing the two revisions shows the claim set's change (and no change of text).
    const compared = (await (await diffRoute.GET(new Request("http://localhost/x?from=1&to=2"), p(stepId))).json()).diff;
    expect(compared.claims).toEqual({ added: [`claim #${claimId} (ρ(G) < 2)`], withdrawn: [], redecided: [], kept: 0 });
    expect(compared.words).toEqual({ removed: [], added: [], counts: { removed: 0, added: 0 } });
    expect(compared.to.body).toBe(r1.body);
    const [notice] = await inbox(fx.ids.reviewer);
    expect(notice.message).toMatch(
      /^Your vouch for step 1\(a\) \(case 1, “[^”]+”\) of “vouch coverage .*” at revision 1 is superseded by revision 2: claim #\d+ \(spectral-radius-bound\) attached\. Read revision 2/,
    );
    // The notice opens the referee's step page with the vouched revision compared to the latest.
    expect(notice.link).toBe(`/queue/${fx.proofId}/${stepId}?compare=1..2#compare`);

    const stale = await vouch(stepId, { revisionId: r1.id });
    expect(stale.status).toBe(409);
    const body = await stale.json();
    expect(body.error.message).toMatch(/Revision 1 is no longer the latest: revision 2 is, and since revision 1 claim #\d+ \(ρ\(G\) < 2\) attached/);
    expect(body.error).toMatchObject({
      latestRevisionNumber: 2,
      changed: { text: false, claimsAdded: [{ id: claimId }], claimsWithdrawn: [], claimsRedecided: [] },
    });

    const again = await vouch(stepId, { revisionId: r2.id, digest: r2.digest });
    expect(again.status).toBe(201);
    expect((await panel(stepId)).status).toMatchObject({ vouches: 1, supersededVouches: 0, vouched: true });
  });

  it("a vouch whose digest is not the revision's is refused, and so is a vouch while a claim of the revision is pending", async () => {
    const stepId = fx.steps["2.1"];
    await actAs("author");
    await attach(stepId, [e7]);
    const r = await latestRevision(stepId);
    await actAs("reviewer");
    const wrong = await vouch(stepId, { revisionId: r.id, digest: "0".repeat(64) });
    expect(wrong.status).toBe(409);
    expect((await wrong.json()).error.message).toMatch(/changed while you were reading it/);
    // A revision still recording a claim as pending (its check running) cannot be vouched for.
    const pending = parseClaimSet(r.claimSet).map((c) => ({ ...c, status: "pending" as const }));
    await r.update({ claimSet: JSON.stringify(pending), digest: digestOfRevision(r.number, r.body, pending) });
    const early = await vouch(stepId, { revisionId: r.id });
    expect(early.status).toBe(409);
    expect((await early.json()).error.message).toMatch(/is still being checked; a vouch covers the verdicts too/);
    expect(await models().Review.count({ where: { stepId } })).toBe(0);
  });

  it("withdrawing a claim and a verdict changing on re-check each make a new revision that supersedes the vouch", async () => {
    const stepId = fx.steps["1.1"];
    await actAs("author");
    const [second] = await attach(stepId, [{ ...e7, graph: { format: "named", text: "E(6)" } }]);
    let latest = await latestRevision(stepId);
    await actAs("reviewer");
    expect((await vouch(stepId, { revisionId: latest.id })).status).toBe(201);

    // Re-decided: the stored verdict of `second` changes (as a re-check with a new checker could).
    await getSequelize().transaction((t) => storeVerdict(second, { status: "undecided", reason: "test: budget" }, fx.ids.author, t));
    const redecided = await latestRevision(stepId);
    expect(redecided.number).toBe(latest.number + 1);
    expect(redecided.origin).toBe("claims");
    const refused = await vouch(stepId, { revisionId: latest.id });
    expect((await refused.json()).error.message).toMatch(new RegExp(`claim #${second} \\(ρ\\(G\\) < 2\\) re-decided: verified → undecided`));
    expect((await inbox(fx.ids.reviewer))[0].message).toMatch(/re-decided: verified → undecided/);

    // The same verdict again changes nothing.
    await getSequelize().transaction((t) => storeVerdict(second, { status: "undecided" }, fx.ids.author, t));
    expect((await latestRevision(stepId)).number).toBe(redecided.number);

    await actAs("author");
    expect(
      (await claimRoute.DELETE(new Request("http://localhost/x", { method: "DELETE" }), params({ proofId: String(fx.proofId), claimId: String(second) })))
        .status,
    ).toBe(200);
    latest = await latestRevision(stepId);
    expect(latest.number).toBe(redecided.number + 1);
    expect(parseClaimSet(latest.claimSet).map((c) => c.id)).not.toContain(second);
    await actAs("reviewer");
    const afterWithdrawal = await vouch(stepId, { revisionId: redecided.id });
    expect((await afterWithdrawal.json()).error.message).toMatch(new RegExp(`claim #${second} \\(ρ\\(G\\) < 2\\) withdrawn`));
  });

  it("saving text over revisions made by claim changes is no conflict, and the new text revision keeps the claims", async () => {
    const stepId = fx.steps["2.1"];
    const textRevision = await models().StepRevision.findOne({ where: { stepId, origin: "text" }, order: [["number", "DESC"]] });
    const before = await latestRevision(stepId);
    expect(before.id).not.toBe(textRevision!.id);
    const saved = await saveRevision(fx.proofId, stepId, fx.ids.author, textRevision!.id, "Step 2.1, reworded: $x^2 \\ge 0$.");
    expect(saved.number).toBe(before.number + 1);
    const row = await latestRevision(stepId);
    expect(parseClaimSet(row.claimSet)).toEqual(parseClaimSet(before.claimSet));
    expect(row.digest).toBe(digestOfRevision(row.number, row.body, parseClaimSet(row.claimSet)));
  });

  it("a vouch racing a claim change is either refused or superseded, never applied to a revision it did not cover", async () => {
    const stepId = fx.steps["2.2"];
    const r = await latestRevision(stepId);
    const step = await loadStep(fx.proofId, stepId);
    const vouching = giveVerdict(step, { id: fx.ids.reviewer, role: "reviewer" }, { revisionId: r.id, verdict: "vouch" }).then(
      () => ({ status: 201 }),
      (e: AppError) => ({ status: e.status }),
    );
    const attaching = storeClaims(fx.proofId, stepId, fx.ids.author, [e7]);
    const [v] = await Promise.all([vouching, attaching]);
    expect([201, 409]).toContain(v.status);
    for (const review of await models().Review.findAll({ where: { stepId } })) {
      const rev = await models().StepRevision.findByPk(review.revisionId);
      expect(review.digest).toBe(digestOfRevision(rev!.number, rev!.body, parseClaimSet(rev!.claimSet)));
    }
    const latest = await latestRevision(stepId);
    expect(latest.number).toBe(r.number + 1);
    expect(await models().Review.count({ where: { stepId, revisionId: latest.id } })).toBe(0);
  });
});
