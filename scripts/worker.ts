/**
 * `npm run worker`: one verification worker process (see lib/jobs/worker.ts). Needs DATABASE_URL
 * and REDIS_URL (the same as the web server's); run as many as you like, on any host that reaches both.
 * SIGTERM or SIGINT lets the job in hand finish, then exits.
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
