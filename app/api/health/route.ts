import { pingDatabase } from "@/lib/health";

export const dynamic = "force-dynamic";

const startedAt = Date.now();

/** App and database state as JSON: 200 when the database answers, 503 when it does not. */
export async function GET() {
  let database: { status: "up" | "down"; latencyMs?: number; message?: string };
  try {
    // Its own connection, not the application's pool: a full pool is not a database that is down.
    database = { status: "up", latencyMs: Math.round((await pingDatabase(3_000)) * 10) / 10 };
  } catch (e) {
    database = { status: "down", message: `the database did not answer: ${(e as Error).message}` };
  }
  const ok = database.status === "up";
  return Response.json(
    { status: ok ? "ok" : "degraded", app: { name: "cairn", uptimeSeconds: Math.round((Date.now() - startedAt) / 1000) }, database },
    { status: ok ? 200 : 503, headers: { "cache-control": "no-store" } },
  );
}
