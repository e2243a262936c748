import { route } from "@/lib/http";
import { startCorrection } from "@/lib/data/rounds";
import { refereeOfRound, type RoundContext } from "../referee";

/** Starts a correction of a submitted report: a new draft version; the submitted one is kept unchanged. */
export const POST = route(async (_request: Request, { params }: RoundContext) => {
  const { proofId, round, userId } = await refereeOfRound(params);
  return Response.json({ report: await startCorrection(proofId, round, userId) }, { status: 201 });
});
