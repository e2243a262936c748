/**
 * Demo seed for the review workflow, so the demo shows every state: Celia's vouches (case 1 and case 3.1
 * settled), a superseded vouch after Ada revised the step of case 3, and one open dispute
 * on the step of case 2 with a thread. Case 3.2 stays untouched (drafting). Idempotent.
 */
import type { Sequelize } from "sequelize";
import { models } from "@/models";
import { claimSetText, digestOfRevision, parseClaimSet } from "@/lib/review/revisions";
import { demoPeople, demoProof } from "./demo-content";

const MARK = "demo.reviews";

export async function up({ context: sequelize }: { context: Sequelize }) {
  const { User, Proof, Case, Step, StepRevision, Review, Comment, DisputeTransition, AuditEvent, Notification } = models();
  const idOf = async (key: string) => (await User.findOne({ where: { email: demoPeople.find((p) => p.key === key)!.email } }))!.id;
  const author = await idOf("author");
  const reviewer = await idOf("reviewer");
  const proof = await Proof.findOne({ where: { title: demoProof.title, createdBy: author } });
  if (!proof || (await AuditEvent.count({ where: { proofId: proof.id, action: MARK } })) > 0) return;

  await sequelize.transaction(async (transaction) => {
    const cases = await Case.findAll({ where: { proofId: proof.id }, order: [["position", "ASC"]], transaction });
    const top = cases.filter((c) => c.parentId === null);
    const [case1, case2, case3] = top;
    const case31 = cases.find((c) => c.parentId === case3.id && c.position === 1)!;
    const stepsOf = (caseId: number) => Step.findAll({ where: { caseId }, order: [["position", "ASC"]], transaction });
    const latest = async (stepId: number) => (await StepRevision.findOne({ where: { stepId }, order: [["number", "DESC"]], transaction }))!;
    const event = (action: string, subjectType: string, subjectId: number, detail: string, actorId = reviewer) =>
      AuditEvent.create({ proofId: proof.id, actorId, action, subjectType, subjectId, detail }, { transaction });

    const approve = async (stepId: number) => {
      const rev = await latest(stepId);
      await Review.create(
        {
          stepId,
          revisionId: rev.id,
          reviewerId: reviewer,
          verdict: "vouch",
          disputeState: null,
          digest: rev.digest ?? digestOfRevision(rev.number, rev.body, parseClaimSet(rev.claimSet)),
        },
        { transaction },
      );
      await event("review.vouched", "step", stepId, `revision ${rev.number}`);
    };
    for (const s of [...(await stepsOf(case1.id)), ...(await stepsOf(case31.id))]) await approve(s.id);

    // Vouched for, then revised by the author: the vouch is superseded until Celia reads it again.
    const [step3] = await stepsOf(case3.id);
    await approve(step3.id);
    const first = await latest(step3.id);
    const body2 = `${first.body}\n\nEquivalently, $T$ is not one of $A_n, D_n, E_6, E_7, E_8$ (the connected graphs with $\\rho < 2$).`;
    const claims2 = parseClaimSet(first.claimSet);
    const rev2 = await StepRevision.create(
      {
        stepId: step3.id,
        number: first.number + 1,
        body: body2,
        authorId: author,
        baseRevisionId: first.id,
        claimSet: claimSetText(claims2),
        digest: digestOfRevision(first.number + 1, body2, claims2),
        origin: "text",
      },
      { transaction },
    );
    await event("revision.created", "revision", rev2.id, `step ${step3.id} revision ${rev2.number}`, author);

    // One open dispute with a thread.
    const [step2] = await stepsOf(case2.id);
    const rev = await latest(step2.id);
    const dispute = await Review.create(
      { stepId: step2.id, revisionId: rev.id, reviewerId: reviewer, verdict: "dispute", disputeState: "raised" },
      { transaction },
    );
    await DisputeTransition.create({ reviewId: dispute.id, actorId: reviewer, fromState: null, toState: "raised" }, { transaction });
    const opening = await Comment.create(
      {
        proofId: proof.id,
        caseId: case2.id,
        stepId: step2.id,
        reviewId: dispute.id,
        parentId: null,
        revisionId: rev.id,
        authorId: reviewer,
        body: String.raw`"On a common path or forming a fork" does not cover three branch vertices where one lies off the path between the other two. Which $\tilde D_n$ is meant in that configuration?`,
      },
      { transaction },
    );
    await Comment.create(
      {
        proofId: proof.id,
        caseId: case2.id,
        stepId: step2.id,
        reviewId: dispute.id,
        parentId: opening.id,
        revisionId: rev.id,
        authorId: author,
        body: String.raw`Fair point: in that case take the two nearest branch vertices; the path between them with its four pendant neighbours is $\tilde D_n$. I will spell this out.`,
      },
      { transaction },
    );
    await event("review.disputed", "step", step2.id, `revision ${rev.number}; dispute #${dispute.id} opened`);
    for (const key of ["author", "coauthor"])
      await Notification.create(
        {
          userId: await idOf(key),
          proofId: proof.id,
          stepId: step2.id,
          kind: "dispute_raised",
          message: `A reviewer disputed revision ${rev.number} of a step you are an author of.`,
          link: `/queue/${proof.id}/${step2.id}`,
        },
        { transaction },
      );
    await AuditEvent.create(
      { proofId: proof.id, actorId: null, action: MARK, subjectType: "proof", subjectId: proof.id, detail: "demo reviews seeded" },
      { transaction },
    );
  });
}

export async function down({ context: sequelize }: { context: Sequelize }) {
  const { Proof, Case, Step, Review, AuditEvent, Notification } = models();
  const proof = await Proof.findOne({ where: { title: demoProof.title } });
  if (!proof) return;
  await sequelize.transaction(async (transaction) => {
    const cases = (await Case.findAll({ where: { proofId: proof.id }, transaction })).map((c) => c.id);
    const steps = (await Step.findAll({ where: { caseId: cases }, transaction })).map((s) => s.id);
    await Review.destroy({ where: { stepId: steps }, transaction });
    await Notification.destroy({ where: { proofId: proof.id }, transaction });
    await AuditEvent.destroy({ where: { proofId: proof.id, action: MARK }, transaction });
  });
}
