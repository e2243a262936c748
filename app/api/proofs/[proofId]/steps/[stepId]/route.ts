import { BODY_LIMITS, readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { moveStepSchema } from "@/lib/validations/step";
import { getStep, moveStep } from "@/lib/data/steps";
import { listStepClaims } from "@/lib/data/claim-lists";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireStepAccess } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/** A step: its latest revision, its history (without bodies) and its claims; any member. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  await requireStepAccess(proofId, stepId); // a reviewer of chosen cases sees only those
  const step = await getStep(proofId, stepId);
  return Response.json({ step, claims: await listStepClaims(stepId) });
});

/** Moves the step one place up or down in its case (`{ "move": "up" | "down" }`); authors only. */
export const PATCH = route(async (request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  const { user } = await requireProofRole(proofId, "author");
  const { move } = await readBody(request, moveStepSchema, BODY_LIMITS.small);
  await moveStep(proofId, stepId, user.id, move);
  return Response.json({ ok: true });
});
