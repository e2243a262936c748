import { route, zodIssues } from "@/lib/http";
import { diffRevisions } from "@/lib/data/steps";
import { invalid } from "@/lib/errors";
import { diffQuerySchema } from "@/lib/validations/step";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireStepAccess } from "@/lib/access";

type Context = { params: Promise<{ proofId: string; stepId: string }> };

/** Line diff between two revisions: `?from=1&to=3` (revision numbers); any member. */
export const GET = route(async (request: Request, { params }: Context) => {
  const { proofId, stepId } = await routeIds(params);
  await requireStepAccess(proofId, stepId); // a reviewer of chosen cases sees only those
  const query = Object.fromEntries(new URL(request.url).searchParams);
  const parsed = diffQuerySchema.safeParse(query);
  if (!parsed.success) throw invalid("Name two revisions to compare, e.g. ?from=1&to=2.", zodIssues(parsed.error));
  return Response.json({ diff: await diffRevisions(proofId, stepId, parsed.data.from, parsed.data.to) });
});
