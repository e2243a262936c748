import { readBody, route } from "@/lib/http";
import { forbidden } from "@/lib/errors";
import { proofAccess, seesCase } from "@/lib/access";
import { addPlaceComment, conditionCase, getPlaceThread } from "@/lib/data/proof-comments";
import { placeCommentSchema } from "@/lib/validations/comment";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string; caseId: string }> };

/** 401 → 404 (proof, live case) → 403 (not a member; a case-limited referee outside their cases). */
async function conditionAccess(params: Context["params"]) {
  const { proofId, caseId } = await routeIds(params);
  const access = await proofAccess(proofId);
  await conditionCase(proofId, caseId);
  if (!seesCase(access, caseId)) throw forbidden("This case is not one you were asked to review.");
  return { proofId, place: { kind: "condition", caseId } as const, actor: { id: access.user.id, role: access.role } };
}

/** The comments on this case's condition as threads, with the condition and its digest. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, place, actor } = await conditionAccess(params);
  return Response.json(await getPlaceThread(proofId, place, actor));
});

/** Any member who sees the case comments on its condition or replies, in Markdown with math. */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId, place, actor } = await conditionAccess(params);
  const input = await readBody(request, placeCommentSchema);
  return Response.json(await addPlaceComment(proofId, place, actor, input), { status: 201 });
});
