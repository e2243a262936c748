import { readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { createStep } from "@/lib/data/steps";
import { createStepSchema } from "@/lib/validations/step";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; caseId: string }> };

/** Adds a step at the end of the case with its first revision; authors only. */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, caseId } = await routeIds(params);
  const { user } = await requireProofRole(proofId, "author");
  const input = await readBody(request, createStepSchema);
  const step = await createStep(proofId, caseId, user.id, input.body);
  return Response.json({ step }, { status: 201 });
});
