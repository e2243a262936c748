import { readBody, route } from "@/lib/http";
import { requireProofRole } from "@/lib/session";
import { assertMayInRound, loadRound, saveReportDraft } from "@/lib/data/rounds";
import { reportDraftSchema } from "@/lib/validations/round";
import { routeIds } from "../../../route-ids";

type Context = { params: Promise<{ proofId: string; round: string }> };

/** A referee saves their report for the round as a draft; 409 once submitted (start a correction) or when the round is closed. */
export const PUT = route(async (request: Request, { params }: Context) => {
  const { proofId, round } = await routeIds(params);
  const { user, role } = await requireProofRole(proofId);
  await loadRound(proofId, round);
  assertMayInRound(role, "write_report");
  const input = await readBody(request, reportDraftSchema);
  return Response.json({ report: await saveReportDraft(proofId, round, user.id, input) });
});
