import { idParam, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { listProofClaims } from "@/lib/data/claim-lists";
import { visibleCaseIds } from "@/lib/access";

type Context = { params: Promise<{ proofId: string }> };

/** Every claim of the proof with its verdict and the number of its step; any member. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user } = await requireProofRole(proofId);
  return Response.json({ claims: await listProofClaims(proofId, await visibleCaseIds(proofId, user.id)) });
});
