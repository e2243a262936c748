import "server-only";
import { models } from "@/models";
import { buildCaseTree, type CaseNode } from "@/lib/proof-tree";

export interface StepView {
  id: number;
  position: number;
  revision: { id: number; number: number; body: string; authorName: string; createdAt: string } | null;
}

export interface CaseView {
  id: number;
  parentId: number | null;
  position: number;
  title: string;
  condition: string;
  steps: StepView[];
}

/** The proof's case tree with each step's latest revision. Three queries, whatever the size of the tree. */
export async function getCaseTree(proofId: number): Promise<CaseNode<CaseView>[]> {
  const { Case, Step, StepRevision, User } = models();
  const cases = await Case.findAll({ where: { proofId }, order: [["position", "ASC"]] });
  const steps = cases.length ? await Step.findAll({ where: { caseId: cases.map((c) => c.id) }, order: [["position", "ASC"]] }) : [];
  const revisions = steps.length
    ? await StepRevision.findAll({
        where: { stepId: steps.map((s) => s.id) },
        include: [{ model: User, as: "author", attributes: ["name"] }],
        order: [["number", "DESC"]],
      })
    : [];
  const latest = new Map<number, (typeof revisions)[number]>();
  for (const r of revisions) if (!latest.has(r.stepId)) latest.set(r.stepId, r);
  const rows: CaseView[] = cases.map((c) => ({
    id: c.id,
    parentId: c.parentId,
    position: c.position,
    title: c.title,
    condition: c.condition,
    steps: steps
      .filter((s) => s.caseId === c.id)
      .map((s) => {
        const r = latest.get(s.id);
        return {
          id: s.id,
          position: s.position,
          revision: r
            ? {
                id: r.id,
                number: r.number,
                body: r.body,
                authorName: (r as unknown as { author?: { name: string } }).author?.name ?? "",
                createdAt: r.createdAt.toISOString(),
              }
            : null,
        };
      }),
  }));
  return buildCaseTree(rows);
}
