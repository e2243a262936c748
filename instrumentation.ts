/**
 * Runs once when the server starts: the scheduled jobs that live in the web process. The reminder job
 * keeps its state in the database, so a restart simply resumes it.
 */
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { startReminderSchedule } = await import("@/lib/data/reminders");
  startReminderSchedule();
}
