import { readBody, route } from "@/lib/http";
import { proofAccess } from "@/lib/access";
import { addPlaceComment, getPlaceThread } from "@/lib/data/proof-comments";
import { placeCommentSchema } from "@/lib/validations/comment";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";

type Context = { params: Promise<{ proofId: string }> };
const STATEMENT = { kind: "statement" } as const;

/** The statement's comments as threads, with the statement and its digest. Whole-proof members only. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId } = await routeIds(params);
  const access = await proofAccess(proofId, "statement.discuss");
  return Response.json(await getPlaceThread(proofId, STATEMENT, { id: access.user.id, role: access.role }));
});

/** Any whole-proof member comments on the statement or replies, in Markdown with math. */
export const POST = route(async (request: Request, { params }: Context) => {
  const { proofId } = await routeIds(params);
  const access = await proofAccess(proofId, "statement.discuss");
  const input = await readBody(request, placeCommentSchema);
  return Response.json(await addPlaceComment(proofId, STATEMENT, { id: access.user.id, role: access.role }, input), { status: 201 });
});
