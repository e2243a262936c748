/**
 * `npm run worker`: one verification worker process (see lib/jobs/worker.ts). Needs DATABASE_URL
 * and REDIS_URL (the same as the web server's); run as many as you like, on any host that reaches both.
 * SIGTERM or SIGINT lets the job in hand finish, then exits. A verdict that changes a step's revision
 * notifies referees by mail, so give workers the web server's NEXTAUTH_URL, SMTP_URL and MAIL_FROM too.
 * Run with `--conditions=react-server` (as `npm run worker` does): the data modules it shares with the
 * web server import "server-only", which resolves to an empty module under that condition.
 */
import { startWorker } from "../lib/jobs/worker";
import { closeSequelize } from "../lib/db";
import { closePool } from "../lib/verification/pool";
import { closeQueue } from "../lib/jobs/queue";

const stop = await startWorker();
let stopping = false;
for (const signal of ["SIGTERM", "SIGINT"] as const)
  process.on(signal, () => {
    if (stopping) process.exit(1);
    stopping = true;
    console.log(`[cairn worker] ${signal}: finishing the job in hand, then stopping`);
    void (async () => {
      await stop();
      await Promise.allSettled([closePool(), closeQueue(), closeSequelize()]);
      process.exit(0);
    })();
  });
