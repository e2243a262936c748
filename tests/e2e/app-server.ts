/**
 * Starts the built app (`next start`) on loopback for the browser tests, in its own process group so that
 * stopping it stops next-server too. The global setup starts the main one; a test may start a second one
 * with other settings (e.g. the S3 file store) on another port.
 */
import { spawn } from "node:child_process";

export const E2E_PORT = Number(process.env.CAIRN_E2E_PORT ?? 3101);

/** The browser tests' settings: their own database, and their own queue on the tests' Redis (`suffix` sets a queue apart). */
export function e2eEnv(suffix = "e2e"): NodeJS.ProcessEnv {
  const dbUrl = process.env.CAIRN_E2E_DATABASE_URL;
  if (!dbUrl) throw new Error("Browser tests need CAIRN_E2E_DATABASE_URL; run them through `npm test`.");
  return {
    ...process.env,
    DATABASE_URL: dbUrl,
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? "e2e-secret-for-browser-tests",
    // Apart from the integration tests' queue (which use another database).
    CAIRN_QUEUE_PREFIX: `${process.env.CAIRN_QUEUE_PREFIX ?? "cairn-test"}-${suffix}`,
    // Small parts, so that a browser test sends a file in parts without a large file (the batch test's 39 KB list stays one request).
    CAIRN_UPLOAD_PART_BYTES: process.env.CAIRN_UPLOAD_PART_BYTES ?? String(48 * 1024),
  };
}

export interface AppServer {
  base: string;
  /** The process group's leader (next start). */
  pid: number | undefined;
  /** Sends `signal` (SIGTERM unless told) to the whole process group. */
  stop(signal?: NodeJS.Signals): void;
}

export async function startAppServer(env: NodeJS.ProcessEnv, port: number, timeoutMs = 60_000): Promise<AppServer> {
  const server = spawn("node_modules/.bin/next", ["start", "-H", "127.0.0.1", "-p", String(port)], {
    env: { ...env, NEXTAUTH_URL: `http://localhost:${port}` },
    detached: true,
    stdio: ["ignore", "ignore", "inherit"],
  });
  const stop = (signal: NodeJS.Signals = "SIGTERM") => {
    try {
      if (server.pid) process.kill(-server.pid, signal);
    } catch {
      // already gone
    }
  };
  const base = `http://localhost:${port}`;
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    try {
      const res = await fetch(`${base}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      stop();
      throw new Error(`the app did not answer on ${base}/api/health within ${timeoutMs / 1000} s`);
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  return { base, pid: server.pid, stop };
}

/** Asks `read` every 250 ms until it answers 200 or `timeoutMs` has passed; gives every status seen and the time taken. */
export async function statusesUntilOk(read: () => Promise<Response>, timeoutMs: number): Promise<{ seen: number[]; ms: number }> {
  const t0 = Date.now();
  const seen: number[] = [];
  for (;;) {
    const { status } = await read();
    seen.push(status);
    if (status === 200 || Date.now() - t0 > timeoutMs) return { seen, ms: Date.now() - t0 };
    await new Promise((r) => setTimeout(r, 250));
  }
}
