import { idParam, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { countCaseStates, getCaseTree } from "@/lib/data/cases";
import { createCase } from "@/lib/data/case-edits";
import { createCaseSchema } from "@/lib/validations/case";

type Context = { params: Promise<{ proofId: string }> };

/** The case tree, numbered, with each case's derived state and the counts per state; any member. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  await requireProofRole(proofId);
  const cases = await getCaseTree(proofId);
  return Response.json({ cases, counts: countCaseStates(cases) });
});

/** Adds a case (top level, or under `parentId`) at the end of its siblings; authors only. */
export const POST = route(async (request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user } = await requireProofRole(proofId, "author");
  const input = await readBody(request, createCaseSchema);
  const created = await createCase(proofId, user.id, input);
  return Response.json({ case: created }, { status: 201 });
});
