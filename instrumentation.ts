/**
 * Runs once when the server starts (Next.js instrumentation hook). First the settings: a wrong or missing
 * one stops the server here, with a message naming the variable, instead of failing later inside a
 * request. Then the scheduled jobs that live in the web process; the reminder job keeps its state in the
 * database, so a restart simply resumes it.
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { checkServerEnv } = await import("@/lib/env");
  checkServerEnv();
  const { startReminderSchedule } = await import("@/lib/data/reminders");
  startReminderSchedule();
}
