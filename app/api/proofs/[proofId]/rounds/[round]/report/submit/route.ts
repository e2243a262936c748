import { route } from "@/lib/http";
import { submitReport } from "@/lib/data/rounds";
import { refereeOfRound, type RoundContext } from "../referee";

/** Submits the referee's draft (once): 422 without a report or recommendation, 409 when the round is closed (with its state). */
export const POST = route(async (_request: Request, { params }: RoundContext) => {
  const { proofId, round, userId } = await refereeOfRound(params);
  return Response.json({ report: await submitReport(proofId, round, userId) });
});
