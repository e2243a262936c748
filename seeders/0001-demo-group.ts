/** Demo seed: the fictional Tarn Hollow group, their proof, its cases and steps. Idempotent. */
import bcrypt from "bcryptjs";
import type { Sequelize, Transaction } from "sequelize";
import { models } from "@/models";
import { DEMO_PASSWORD, demoPeople, demoProof, type DemoCase } from "./demo-content";

export async function up({ context: sequelize }: { context: Sequelize }) {
  const { User, Proof, ProofMember, Case, Step, StepRevision, AuditEvent } = models();
  await sequelize.transaction(async (transaction: Transaction) => {
    const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
    const users = new Map<string, number>();
    for (const p of demoPeople) {
      const [u] = await User.findOrCreate({
        where: { email: p.email },
        defaults: { email: p.email, name: p.name, role: p.role, passwordHash: hash },
        transaction,
      });
      users.set(p.key, u.id);
    }
    const authorId = users.get("author")!;
    const existing = await Proof.findOne({ where: { title: demoProof.title, createdBy: authorId }, transaction });
    if (existing) return; // already seeded

    const proof = await Proof.create({ title: demoProof.title, statement: demoProof.statement, createdBy: authorId }, { transaction });
    for (const p of demoPeople) if (p.proofRole) await ProofMember.create({ proofId: proof.id, userId: users.get(p.key)!, role: p.proofRole }, { transaction });

    const addCases = async (cases: DemoCase[], parentId: number | null) => {
      for (const [i, c] of cases.entries()) {
        const row = await Case.create({ proofId: proof.id, parentId, position: i + 1, title: c.title, condition: c.condition }, { transaction });
        for (const [j, body] of c.steps.entries()) {
          const step = await Step.create({ caseId: row.id, position: j + 1 }, { transaction });
          await StepRevision.create({ stepId: step.id, number: 1, body, authorId }, { transaction });
        }
        if (c.children) await addCases(c.children, row.id);
      }
    };
    await addCases(demoProof.cases, null);
    await AuditEvent.create(
      { proofId: proof.id, actorId: authorId, action: "proof.created", subjectType: "proof", subjectId: proof.id, detail: "demo seed" },
      { transaction },
    );
  });
}

export async function down({ context: sequelize }: { context: Sequelize }) {
  const { User, Proof } = models();
  await sequelize.transaction(async (transaction) => {
    await Proof.destroy({ where: { title: demoProof.title }, transaction });
    await User.destroy({ where: { email: demoPeople.map((p) => p.email) }, transaction });
  });
}
