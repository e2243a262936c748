import { route } from "@/lib/http";
import { getRevision } from "@/lib/data/steps";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireStepAccess } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; stepId: string; number: string }> };

/** One revision of a step, with its Markdown; any member. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, stepId, number } = await routeIds(params);
  await requireStepAccess(proofId, stepId); // a reviewer of chosen cases sees only those
  return Response.json({ revision: await getRevision(proofId, stepId, number) });
});
