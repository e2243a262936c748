import { readBody, route } from "@/lib/http";
import { saveReportDraft } from "@/lib/data/rounds";
import { reportDraftSchema } from "@/lib/validations/round";
import { refereeOfRound, type RoundContext } from "./referee";

/** A referee saves their report for the round as a draft; 409 once submitted (start a correction) or when the round is closed. */
export const PUT = route(async (request: Request, { params }: RoundContext) => {
  const { proofId, round, userId } = await refereeOfRound(params);
  const input = await readBody(request, reportDraftSchema);
  return Response.json({ report: await saveReportDraft(proofId, round, userId, input) });
});
