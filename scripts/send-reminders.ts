/**
 * `npm run reminders -- [--now=ISO] [--proof=ID]`: one run of the reminder job on DATABASE_URL, as the
 * server's hourly schedule does (lib/data/reminders.ts), e.g. from cron when no server is up. `--now`
 * runs it as of another moment: the browser test of two rounds uses it to be ten days later without
 * waiting. Reminders already sent are never sent again, whatever `--now` says.
 */
import { closeSequelize } from "../lib/db";
import { sendDueReminders } from "../lib/data/reminders";

const arg = (name: string) => process.argv.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3);
const now = arg("now") ? new Date(arg("now")!) : new Date();
const proofId = arg("proof") ? Number(arg("proof")) : undefined;

try {
  if (Number.isNaN(now.getTime())) throw new Error(`--now must be an ISO date and time, not “${arg("now")}”`);
  if (proofId !== undefined && !(Number.isInteger(proofId) && proofId > 0)) throw new Error(`--proof must be a proof id, not “${arg("proof")}”`);
  const { queued } = await sendDueReminders(now, { proofId });
  console.log(`queued ${queued} reminder${queued === 1 ? "" : "s"} as of ${now.toISOString()}`);
} catch (e) {
  console.error(`reminder run failed: ${(e as Error).message}`);
  process.exitCode = 1;
} finally {
  await closeSequelize();
}
