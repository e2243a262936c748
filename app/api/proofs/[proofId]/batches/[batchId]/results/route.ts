import { route } from "@/lib/http";
import { invalid } from "@/lib/errors";
import { batchResults, failuresFile, resultsCsv } from "@/lib/data/batches";
import { routeIds } from "@/app/api/proofs/[proofId]/route-ids";
import { requireBatchAccess } from "../batch-access";

type Context = { params: Promise<{ proofId: string; batchId: string }> };

const FORMATS = ["json", "csv", "graph6", "sparse6"] as const;
const EXTENSION = { csv: "csv", graph6: "g6", sparse6: "s6" } as const;

/**
 * A batch claim's per-graph results in list order: `?format=json` (default; with certificates,
 * `offset`/`limit` pages of at most 5000), `csv`, `graph6` (the failing simple graphs, one per line) or
 * `sparse6` (every failing graph, loops and multiple edges included);
 * `?only=failing` keeps the graphs whose verdict is not "verified". Any member who sees the step.
 */
export const GET = route(async (request: Request, { params }: Context) => {
  const { proofId, batchId } = await routeIds(params);
  const { batch } = await requireBatchAccess(proofId, batchId);
  const q = new URL(request.url).searchParams;
  const format = (q.get("format") ?? "json") as (typeof FORMATS)[number];
  if (!FORMATS.includes(format)) throw invalid("Unknown format.", [{ path: "format", message: `one of ${FORMATS.join(", ")}` }]);
  const failing = q.get("only") === "failing" || format === "graph6" || format === "sparse6";
  const base = `batch-${batch.id}${failing ? "-failures" : ""}`;
  if (format === "json") {
    const offset = Math.max(0, Number(q.get("offset")) || 0);
    const limit = Math.min(5_000, Math.max(1, Number(q.get("limit")) || 5_000));
    return Response.json({ batch, results: await batchResults(batch.id, { failing, offset, limit }) });
  }
  const rows = await batchResults(batch.id, { failing, certificates: false });
  const body = format === "csv" ? resultsCsv(rows) : failuresFile(rows, format);
  return new Response(body, {
    headers: {
      "content-type": format === "csv" ? "text/csv; charset=utf-8" : "text/plain; charset=utf-8",
      "content-disposition": `attachment; filename="${base}.${EXTENSION[format]}"`,
      "x-content-type-options": "nosniff",
    },
  });
});
