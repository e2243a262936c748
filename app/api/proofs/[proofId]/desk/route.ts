import { route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { assertMayInRound } from "@/lib/data/rounds";
import { getDesk } from "@/lib/data/desk";
import { routeIds } from "../route-ids";

type Context = { params: Promise<{ proofId: string }> };

/** The editor's desk as JSON: open disputes with their age, referees against due dates, reports, decisions. */
export const GET = route(async (_request: Request, { params }: Context) => {
  const { proofId } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  assertMayInRound(role, "read_desk");
  return Response.json({ desk: await getDesk(proofId, { id: user.id, role }) });
});
