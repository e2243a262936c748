/**
 * Browser tests run against the built app (`next build` ran in npm test) served by `next start` on
 * loopback (tests/e2e/app-server.ts), with its own migrated and seeded database and one verification worker.
 */
import { execFileSync } from "node:child_process";
import type { TestProject } from "vitest/node";
import { startTestWorker } from "../support/workers";
import { E2E_PORT, e2eEnv, startAppServer } from "./app-server";

export default async function setup(project: TestProject) {
  const env = e2eEnv();
  for (const script of ["scripts/migrate.ts", "scripts/seed.ts"]) execFileSync("node_modules/.bin/tsx", [script], { env, stdio: "inherit" });
  const server = await startAppServer(env, E2E_PORT);
  project.provide("baseUrl", server.base);
  project.provide("partBytes", Number(env.CAIRN_UPLOAD_PART_BYTES));
  const worker = startTestWorker(env, ".data/e2e-worker.log");
  await worker.ready;
  return async () => {
    worker.stop();
    server.stop();
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    partBytes: number;
  }
}
