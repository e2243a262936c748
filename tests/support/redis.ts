/**
 * A Redis of a test's own on a free loopback port (Debian's redis-server), that the test can stop and
 * start again to play an outage; its append-only file keeps the queue across the restart, as a real
 * Redis with persistence does.
 */
import { execFileSync, spawn } from "node:child_process";
import { mkdtempSync, rmSync } from "node:fs";
import { onTestFinished } from "vitest";
import { freePort } from "./free-port";
import { tmpdir } from "node:os";
import path from "node:path";

export interface TestRedis {
  port: number;
  url: string;
  up(): Promise<void>;
  down(): void;
  /** Stops it (if running) and removes its folder. */
  remove(): void;
}

/** Whether `redis-cli ping` on this port answers PONG. */
export function redisAnswers(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const c = spawn("redis-cli", ["-p", String(port), "ping"], { stdio: ["ignore", "pipe", "ignore"] });
    let out = "";
    c.stdout.on("data", (d: Buffer) => (out += d));
    c.on("close", () => resolve(out.includes("PONG")));
    c.on("error", () => resolve(false));
  });
}

export async function ownRedis(): Promise<TestRedis> {
  const dir = mkdtempSync(path.join(tmpdir(), "cairn-redis-"));
  const port = await freePort();
  const down = () => execFileSync("redis-cli", ["-p", String(port), "shutdown"]);
  return {
    port,
    url: `redis://127.0.0.1:${port}`,
    async up() {
      execFileSync("redis-server", [
        "--port",
        String(port),
        "--bind",
        "127.0.0.1",
        "--dir",
        dir,
        "--pidfile",
        path.join(dir, "redis.pid"),
        "--appendonly",
        "yes",
        "--save",
        "",
        "--daemonize",
        "yes",
        "--logfile",
        path.join(dir, "redis.log"),
      ]);
      const deadline = Date.now() + 30_000;
      while (!(await redisAnswers(port))) {
        if (Date.now() > deadline) throw new Error(`Redis on port ${port} did not start`);
        await new Promise((r) => setTimeout(r, 100));
      }
    },
    down,
    remove() {
      try {
        down();
      } catch {
        // already down
      }
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** For one test: a Redis of its own, started and named in REDIS_URL, with the job queue under `queuePrefix`; removed once the test has finished. */
export async function ownRedisForTest(queuePrefix: string): Promise<TestRedis> {
  const redis = await ownRedis();
  onTestFinished(() => redis.remove());
  await redis.up();
  process.env.REDIS_URL = redis.url;
  process.env.CAIRN_QUEUE_PREFIX = queuePrefix;
  return redis;
}
