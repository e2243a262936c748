/**
 * Verification worker processes for the integration and browser tests (`npm run worker`'s script),
 * each in its own process group so that stopping one stops its worker threads too.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { createWriteStream } from "node:fs";

export interface TestWorker {
  child: ChildProcess;
  /** Lines the worker printed so far. */
  output: string[];
  /** Resolves when the worker said it is taking jobs. */
  ready: Promise<void>;
  stop(signal?: NodeJS.Signals): void;
}

/** Starts `scripts/worker.ts` with this environment (DATABASE_URL, REDIS_URL, CAIRN_QUEUE_PREFIX, …). */
export function startTestWorker(env: NodeJS.ProcessEnv, logFile?: string): TestWorker {
  if (!env.REDIS_URL) throw new Error("The tests need Redis; run them through `npm test`, which starts one and sets REDIS_URL.");
  const child = spawn("node_modules/.bin/tsx", ["--conditions=react-server", "scripts/worker.ts"], { env, detached: true, stdio: ["ignore", "pipe", "pipe"] });
  const output: string[] = [];
  const log = logFile ? createWriteStream(logFile, { flags: "a" }) : null;
  let onReady: () => void = () => undefined;
  const ready = new Promise<void>((resolve) => (onReady = resolve));
  const take = (d: Buffer) => {
    log?.write(d);
    for (const line of d.toString().split("\n").filter(Boolean)) {
      output.push(line);
      if (line.includes("is taking verification jobs")) onReady();
    }
  };
  child.stdout!.on("data", take);
  child.stderr!.on("data", take);
  return {
    child,
    output,
    ready,
    stop(signal: NodeJS.Signals = "SIGTERM") {
      try {
        process.kill(-child.pid!, signal);
      } catch {
        // already gone
      }
    },
  };
}

/** Polls `probe` every 200 ms until it gives a truthy value; throws after `ms` saying what it waited for. */
export async function until<T>(what: string, probe: () => Promise<T | null | undefined | false>, ms = 60_000): Promise<T> {
  const deadline = Date.now() + ms;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}
