import { readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { getStep, saveRevision } from "@/lib/data/steps";
import { saveRevisionSchema } from "@/lib/validations/step";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireStepAccess } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/** The step's revisions, newest first (numbers, authors, bases and times); any member. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  await requireStepAccess(proofId, stepId); // a reviewer of chosen cases sees only those
  return Response.json({ revisions: (await getStep(proofId, stepId)).revisions });
});

/**
 * Saves a new immutable revision based on `baseRevisionId`; authors only. 409 with the newer
 * revision (`error.latest`) when someone saved meanwhile.
 */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  const { user } = await requireProofRole(proofId, "author");
  const input = await readBody(request, saveRevisionSchema);
  const revision = await saveRevision(proofId, stepId, user.id, input.baseRevisionId, input.body);
  return Response.json({ revision }, { status: 201 });
});
