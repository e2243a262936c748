/**
 * Browser tests run against the built app (`next build` ran in npm test) served by `next start` on
 * loopback, with its own migrated and seeded database and one verification worker. The server runs in its own process group so
 * that teardown stops next-server too.
 */
import { spawn, execFileSync, type ChildProcess } from "node:child_process";
import type { TestProject } from "vitest/node";
import { startTestWorker } from "../support/workers";

export const E2E_PORT = Number(process.env.CAIRN_E2E_PORT ?? 3101);

let server: ChildProcess | undefined;

export default async function setup(project: TestProject) {
  const dbUrl = process.env.CAIRN_E2E_DATABASE_URL;
  if (!dbUrl) throw new Error("Browser tests need CAIRN_E2E_DATABASE_URL; run them through `npm test`.");
  const env = {
    ...process.env,
    DATABASE_URL: dbUrl,
    NEXTAUTH_URL: `http://localhost:${E2E_PORT}`,
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? "e2e-secret-for-browser-tests",
    // Its own queue on the tests' Redis, apart from the integration tests' (another database).
    CAIRN_QUEUE_PREFIX: `${process.env.CAIRN_QUEUE_PREFIX ?? "cairn-test"}-e2e`,
    // Small parts, so that a browser test sends a file in parts without a large file (the batch test's 39 KB list stays one request).
    CAIRN_UPLOAD_PART_BYTES: process.env.CAIRN_UPLOAD_PART_BYTES ?? String(48 * 1024),
  };
  for (const script of ["scripts/migrate.ts", "scripts/seed.ts"]) execFileSync("node_modules/.bin/tsx", [script], { env, stdio: "inherit" });
  server = spawn("node_modules/.bin/next", ["start", "-H", "127.0.0.1", "-p", String(E2E_PORT)], {
    env,
    detached: true,
    stdio: ["ignore", "ignore", "inherit"],
  });
  const base = `http://localhost:${E2E_PORT}`;
  const deadline = Date.now() + 60_000;
  for (;;) {
    try {
      const res = await fetch(`${base}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`the app did not answer on ${base}/api/health within 60 s`);
    await new Promise((r) => setTimeout(r, 300));
  }
  project.provide("baseUrl", base);
  project.provide("partBytes", Number(env.CAIRN_UPLOAD_PART_BYTES));
  const worker = startTestWorker(env, ".data/e2e-worker.log");
  await worker.ready;
  return async () => {
    worker.stop();
    if (server?.pid) {
      try {
        process.kill(-server.pid, "SIGTERM");
      } catch {
        // already gone
      }
    }
  };
}

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    partBytes: number;
  }
}
