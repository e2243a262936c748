/**
 * Integration tests run against the real MariaDB and Redis that `npm test` started: migrate and seed
 * the database once, and start one verification worker process for the claims the tests attach.
 */
import { getSequelize, closeSequelize } from "@/lib/db";
import { createMigrator, createSeeder } from "@/lib/migrator";
import { startTestWorker } from "../support/workers";

export default async function setup() {
  if (!process.env.DATABASE_URL?.includes("cairn_it"))
    throw new Error("Integration tests need the test database; run them through `npm test`, which starts MariaDB and sets DATABASE_URL.");
  const sq = getSequelize();
  await createMigrator(sq).up();
  await createSeeder(sq).up();
  await closeSequelize();
  // Its sweep leaves young pending claims alone, so the worker-kill and Redis-outage tests (their own
  // queues and workers, same database) keep theirs to themselves.
  const worker = startTestWorker({ ...process.env, CAIRN_SWEEP_AFTER_MS: "300000" }, ".data/integration-worker.log");
  await worker.ready;
  return () => worker.stop();
}
