import "server-only";
import type { Transaction } from "sequelize";
import { models } from "@/models";
import { getSequelize } from "@/lib/db";
import { conflict, invalid, notFound } from "@/lib/errors";
import { allCases, hiddenCaseIds, liveCases } from "@/lib/data/cases";
import { recordEvent } from "@/lib/data/audit";
import type { CreateCaseInput, UpdateCaseInput } from "@/lib/validations/case";

type CaseRow = InstanceType<ReturnType<typeof models>["Case"]>;

const loadLive = (proofId: number, transaction: Transaction): Promise<CaseRow[]> => liveCases(proofId, transaction, true);

function findCase(cases: CaseRow[], caseId: number): CaseRow {
  const c = cases.find((x) => x.id === caseId);
  if (!c) throw notFound("This case");
  return c;
}

/** Gives the siblings positions 1..k in their current order (positions stay dense after moves and deletes). */
async function renumber(siblings: CaseRow[], transaction: Transaction): Promise<void> {
  for (const [i, c] of siblings.entries()) if (c.position !== i + 1) await c.update({ position: i + 1 }, { transaction });
}

const siblingsOf = (cases: CaseRow[], parentId: number | null, except?: number) =>
  cases.filter((c) => c.parentId === parentId && c.id !== except).sort((a, b) => a.position - b.position || a.id - b.id);

function subtreeIds(cases: CaseRow[], rootId: number): number[] {
  const ids = [rootId];
  for (let i = 0; i < ids.length; i++) for (const c of cases) if (c.parentId === ids[i]) ids.push(c.id);
  return ids;
}

/** What a case and its sub-cases hold: moving or deleting them needs a confirmation when anything does. */
async function contents(caseIds: number[], transaction: Transaction): Promise<{ steps: number; reviews: number }> {
  const { Step, Review } = models();
  const steps = await Step.findAll({ where: { caseId: caseIds }, attributes: ["id"], transaction });
  const reviews = steps.length ? await Review.count({ where: { stepId: steps.map((s) => s.id) }, transaction }) : 0;
  return { steps: steps.length, reviews };
}

function needConfirmation(what: string, held: { steps: number; reviews: number }) {
  return conflict(
    `${what} holds ${held.steps} step${held.steps === 1 ? "" : "s"} and ${held.reviews} review${held.reviews === 1 ? "" : "s"}. Confirm to go ahead; their history is kept.`,
    { needsConfirmation: true, ...held },
  );
}

async function audit(proofId: number, actorId: number, action: string, caseId: number, detail: string | null, transaction: Transaction) {
  await recordEvent({ proofId, actorId, action, subjectType: "case", subjectId: caseId, detail }, transaction);
}

export async function createCase(proofId: number, userId: number, input: CreateCaseInput): Promise<{ id: number }> {
  const { Case } = models();
  return getSequelize().transaction(async (transaction) => {
    const cases = await loadLive(proofId, transaction);
    const parentId = input.parentId ?? null;
    if (parentId !== null && !cases.some((c) => c.id === parentId))
      throw invalid("The parent case is not in this proof.", [{ path: "parentId", message: "choose a case of this proof, or none for a top-level case" }]);
    const position = siblingsOf(cases, parentId).length + 1;
    const row = await Case.create({ proofId, parentId, position, title: input.title, condition: input.condition ?? "" }, { transaction });
    await audit(proofId, userId, "case.created", row.id, input.title, transaction);
    return { id: row.id };
  });
}

export async function updateCase(proofId: number, caseId: number, userId: number, input: UpdateCaseInput): Promise<void> {
  await getSequelize().transaction(async (transaction) => {
    const cases = await loadLive(proofId, transaction);
    const c = findCase(cases, caseId);
    if (input.title !== undefined || input.condition !== undefined) {
      await c.update(
        { ...(input.title !== undefined ? { title: input.title } : {}), ...(input.condition !== undefined ? { condition: input.condition } : {}) },
        { transaction },
      );
      await audit(proofId, userId, "case.edited", caseId, null, transaction);
    }
    if (input.move) {
      const siblings = siblingsOf(cases, c.parentId);
      const i = siblings.findIndex((s) => s.id === caseId);
      const j = input.move === "up" ? i - 1 : i + 1;
      if (j >= 0 && j < siblings.length) {
        [siblings[i], siblings[j]] = [siblings[j], siblings[i]];
        await renumber(siblings, transaction);
        await audit(proofId, userId, "case.moved", caseId, input.move, transaction);
      }
    }
    if (input.parentId !== undefined && input.parentId !== c.parentId) {
      const target = input.parentId;
      const subtree = subtreeIds(cases, caseId);
      if (target !== null && !cases.some((x) => x.id === target))
        throw invalid("The new parent case is not in this proof.", [{ path: "parentId", message: "choose a case of this proof, or none for top level" }]);
      if (target !== null && subtree.includes(target))
        throw invalid("A case cannot move under itself or one of its sub-cases.", [{ path: "parentId", message: "choose a case outside this one" }]);
      const held = await contents(subtree, transaction);
      if ((held.steps > 0 || held.reviews > 0) && !input.confirm) throw needConfirmation("This case", held);
      const from = c.parentId;
      await c.update({ parentId: target, position: siblingsOf(cases, target).length + 1 }, { transaction });
      await renumber(siblingsOf(cases, from, caseId), transaction);
      await audit(proofId, userId, "case.reparented", caseId, JSON.stringify({ from, to: target }), transaction);
    }
  });
}

/** Deletes a case softly: it and its sub-cases leave the tree; steps, revisions and reviews stay in the database. */
export async function deleteCase(proofId: number, caseId: number, userId: number, confirm: boolean): Promise<void> {
  await getSequelize().transaction(async (transaction) => {
    const cases = await loadLive(proofId, transaction);
    const c = findCase(cases, caseId);
    const held = await contents(subtreeIds(cases, caseId), transaction);
    if ((held.steps > 0 || held.reviews > 0) && !confirm) throw needConfirmation("This case", held);
    await c.update({ deletedAt: new Date() }, { transaction });
    await renumber(siblingsOf(cases, c.parentId, caseId), transaction);
    await audit(proofId, userId, "case.deleted", caseId, JSON.stringify(held), transaction);
  });
}

/**
 * Brings a deleted case back into the tree, with its sub-cases, steps, revisions and reviews as they
 * were; it goes last among its siblings. A case whose parent is itself deleted cannot come back on
 * its own (409 naming the parent to restore first); a case that is not deleted is a 409 too.
 */
export async function restoreCase(proofId: number, caseId: number, userId: number): Promise<void> {
  await getSequelize().transaction(async (transaction) => {
    const all = await allCases(proofId, transaction, true);
    const c = all.find((x) => x.id === caseId);
    if (!c) throw notFound("This case");
    const hidden = hiddenCaseIds(all);
    // The outermost deleted case above this one, if any: restoring it first makes the way back shortest.
    let top: CaseRow | undefined;
    for (let a = all.find((x) => x.id === c.parentId); a; a = all.find((x) => x.id === a!.parentId)) if (a.deletedAt) top = a;
    if (!c.deletedAt)
      throw top
        ? conflict(
            `This case was not deleted itself: it is hidden because “${top.title}” above it is deleted. Restore that one and this case comes back with it.`,
            { restoreFirst: top.id },
          )
        : conflict("This case is not deleted; there is nothing to restore.");
    if (top) throw conflict(`The case “${top.title}” above this one is deleted too; restore that one first, then this one.`, { restoreFirst: top.id });
    const live = all.filter((x) => !hidden.has(x.id));
    await c.update({ deletedAt: null, position: siblingsOf(live, c.parentId).length + 1 }, { transaction });
    await audit(proofId, userId, "case.restored", caseId, null, transaction);
  });
}
