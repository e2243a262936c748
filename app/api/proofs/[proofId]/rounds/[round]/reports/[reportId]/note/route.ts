import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { readEditorNote } from "@/lib/data/rounds";
import { routeIds } from "../../../../../route-ids";

type Context = { params: Promise<{ proofId: string; round: string; reportId: string }> };

/** A report's note for the editors: editors and its own referee only (403 for anyone else). */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId, round, reportId } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  return Response.json(await readEditorNote(proofId, round, reportId, { id: user.id, role }));
});
