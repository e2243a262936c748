/**
 * Runs once when the server starts (Next.js instrumentation hook): a wrong or missing setting stops the
 * server here, with a message naming the variable, instead of failing later inside a request.
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { checkServerEnv } = await import("@/lib/env");
  checkServerEnv();
}
