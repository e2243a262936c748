import { idParam, BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { getProofOverview } from "@/lib/data/cases";
import { createCase } from "@/lib/data/case-edits";
import { createCaseSchema } from "@/lib/validations/case";
import { visibleCaseIds } from "@/lib/access";

type Context = { params: Promise<{ proofId: string }> };

/** The case tree, numbered, with each case's derived state, the counts per state and the proof state, and under each step its claims and review (blind names as the caller may see them); any member. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user, role } = await requireProofRole(proofId);
  return Response.json(await getProofOverview(proofId, await visibleCaseIds(proofId, user.id), { id: user.id, role }));
});

/** Adds a case (top level, or under `parentId`) at the end of its siblings; authors only. */
export const POST = route(async (request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user } = await requireProofRole(proofId, "author");
  const input = await readBody(request, createCaseSchema, BODY_LIMITS.small);
  const created = await createCase(proofId, user.id, input);
  return Response.json({ case: created }, { status: 201 });
});
