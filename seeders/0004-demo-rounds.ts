/**
 * Demo seed for review rounds: Dov opened round 1, Celia reported "minor revision" (with a note for the
 * editors), Dov decided "minor revision" with a letter to the authors, Ada revised, and round 2 is open
 * with Celia's report still a draft. Dates are set in the past so the desk and the rounds page read as a
 * review under way. Idempotent.
 */
import type { Sequelize } from "sequelize";
import { models } from "@/models";
import { demoPeople, demoProof } from "./demo-content";

const MARK = "demo.rounds";
const DAY = 86_400_000;
const ago = (days: number) => new Date(Date.now() - days * DAY);

export async function up({ context: sequelize }: { context: Sequelize }) {
  const { User, Proof, ReviewRound, RoundReferee, RefereeReport, RoundDecision, AuditEvent } = models();
  const idOf = async (key: string) => (await User.findOne({ where: { email: demoPeople.find((p) => p.key === key)!.email } }))!.id;
  const [author, reviewer, editor] = [await idOf("author"), await idOf("reviewer"), await idOf("editor")];
  const proof = await Proof.findOne({ where: { title: demoProof.title, createdBy: author } });
  if (!proof || (await AuditEvent.count({ where: { proofId: proof.id, action: MARK } })) > 0) return;

  await sequelize.transaction(async (transaction) => {
    const event = async (action: string, subjectType: string, subjectId: number, detail: string, actorId: number, at: Date) => {
      const e = await AuditEvent.create({ proofId: proof.id, actorId, action, subjectType, subjectId, detail }, { transaction });
      await AuditEvent.update({ createdAt: at }, { where: { id: e.id }, transaction, silent: true });
    };
    const backdate = async (model: typeof ReviewRound | typeof RefereeReport | typeof RoundDecision, id: number, at: Date) =>
      (model as typeof ReviewRound).update({ createdAt: at } as never, { where: { id }, transaction, silent: true });

    const round1 = await ReviewRound.create({ proofId: proof.id, number: 1, dueAt: ago(10), openedBy: editor, closedAt: ago(8) }, { transaction });
    await backdate(ReviewRound, round1.id, ago(24));
    await RoundReferee.create({ roundId: round1.id, userId: reviewer, dueAt: ago(10) }, { transaction });
    await event("round.opened", "round", round1.id, "round 1, due " + ago(10).toISOString().slice(0, 10), editor, ago(24));
    const report1 = await RefereeReport.create(
      {
        roundId: round1.id,
        refereeId: reviewer,
        version: 1,
        body: String.raw`The classification is convincing and the computations in cases 1 and 3.1 check out. Two points before I can recommend acceptance:

1. Case 2 needs the configuration of three branch vertices spelled out (see my dispute there).
2. In case 3, say explicitly that the trees with $\rho(T) < 2$ are exactly $A_n$, $D_n$, $E_6$, $E_7$, $E_8$, so that the reader sees why $\rho(T) > 2$ forces $T$ to contain an affine diagram.`,
        recommendation: "minor_revision",
        editorNote: "Nothing confidential; the argument is the group's usual standard. Happy to look at the revision quickly.",
        submittedAt: ago(12),
      },
      { transaction },
    );
    await backdate(RefereeReport, report1.id, ago(15));
    await event("report.submitted", "report", report1.id, "round 1, version 1: minor revision", reviewer, ago(12));
    const decision1 = await RoundDecision.create(
      {
        roundId: round1.id,
        editorId: editor,
        decision: "minor_revision",
        letter: String.raw`Dear Ada and Bram,

the referee finds the classification convincing and asks for two clarifications: the three-branch-vertex configuration in case 2, and the list of trees with $\rho(T) < 2$ in case 3. Please revise those steps; round 2 will look at the changes only.

Dov`,
        reportsAttached: true,
      },
      { transaction },
    );
    await backdate(RoundDecision, decision1.id, ago(8));
    await event("round.decided", "round", round1.id, "round 1: minor revision", editor, ago(8));

    const round2 = await ReviewRound.create({ proofId: proof.id, number: 2, dueAt: new Date(Date.now() + 12 * DAY), openedBy: editor }, { transaction });
    await backdate(ReviewRound, round2.id, ago(2));
    await RoundReferee.create({ roundId: round2.id, userId: reviewer, dueAt: new Date(Date.now() + 12 * DAY) }, { transaction });
    await event("round.opened", "round", round2.id, "round 2", editor, ago(2));
    await RefereeReport.create(
      {
        roundId: round2.id,
        refereeId: reviewer,
        version: 1,
        body: "Case 3 now states the list of trees with $\\rho(T) < 2$; thank you. Still reading case 2.",
        recommendation: null,
        editorNote: "",
        submittedAt: null,
      },
      { transaction },
    );
    await AuditEvent.create(
      { proofId: proof.id, actorId: null, action: MARK, subjectType: "proof", subjectId: proof.id, detail: "demo rounds seeded" },
      { transaction },
    );
  });
}

export async function down({ context: sequelize }: { context: Sequelize }) {
  const { Proof, ReviewRound, AuditEvent } = models();
  const proof = await Proof.findOne({ where: { title: demoProof.title } });
  if (!proof) return;
  await sequelize.transaction(async (transaction) => {
    await ReviewRound.destroy({ where: { proofId: proof.id }, transaction }); // cascades to referees, reports, decisions, reminders
    await AuditEvent.destroy({ where: { proofId: proof.id, action: [MARK, "round.opened", "round.decided", "report.submitted"] }, transaction });
  });
}
