import { idParam, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { listProofDisputes } from "@/lib/data/review-queues";
import { visibleCaseIds } from "@/lib/access";

type Context = { params: Promise<{ proofId: string }> };

/** The proof's disputes with their state (a reviewer limited to some cases sees only those cases' disputes). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const proofId = idParam((await params).proofId, "This proof");
  const { user } = await requireProofRole(proofId);
  return Response.json({ disputes: await listProofDisputes(proofId, await visibleCaseIds(proofId, user.id), user.id) });
});
