import "server-only";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { recordEvent } from "@/lib/data/audit";
import type { CreateProofInput, UpdateProofInput } from "@/lib/validations/proof";

/** Creates a proof with its creator as its first author, in one transaction. */
export async function createProof(userId: number, input: CreateProofInput): Promise<{ id: number }> {
  const { Proof, ProofMember } = models();
  return getSequelize().transaction(async (transaction) => {
    const proof = await Proof.create({ title: input.title, statement: input.statement, createdBy: userId }, { transaction });
    await ProofMember.create({ proofId: proof.id, userId, role: "author" }, { transaction });
    await recordEvent({ proofId: proof.id, actorId: userId, action: "proof.created", subjectType: "proof", subjectId: proof.id, detail: null }, transaction);
    return { id: proof.id };
  });
}

export async function updateProof(proofId: number, userId: number, input: UpdateProofInput): Promise<void> {
  const { Proof } = models();
  await getSequelize().transaction(async (transaction) => {
    await Proof.update(
      { ...(input.title !== undefined ? { title: input.title } : {}), ...(input.statement !== undefined ? { statement: input.statement } : {}) },
      { where: { id: proofId }, transaction },
    );
    await recordEvent(
      { proofId, actorId: userId, action: "proof.edited", subjectType: "proof", subjectId: proofId, detail: Object.keys(input).join(",") },
      transaction,
    );
  });
}
