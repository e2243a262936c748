/**
 * Helpers for calling route handlers directly with `new Request(...)` as a chosen user.
 * `next-auth` is mocked in each test file (vi.mock) so that getServerSession returns `sessionFor(...)`.
 */
import { afterAll, afterEach, beforeAll, expect, vi } from "vitest";
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { getServerSession } from "next-auth";
import { closeSequelize } from "@/lib/db";
import { closeQueue } from "@/lib/jobs/queue";
import { closePool } from "@/lib/verification/pool";
import { models } from "@/models";
import type { TestWorker } from "../support/workers";
import type { S3Fake } from "../support/s3-fake";
import { demoPeople } from "@/seeders/demo-content";

export async function userIdOf(key: string): Promise<number> {
  const person = demoPeople.find((p) => p.key === key);
  if (!person) throw new Error(`no demo person ${key}`);
  const u = await models().User.findOne({ where: { email: person.email } });
  if (!u) throw new Error(`demo person ${key} is not seeded`);
  return u.id;
}

/** Makes the mocked getServerSession answer as this demo person, or as nobody. */
export async function actAs(key: string | null): Promise<number | null> {
  const mocked = vi.mocked(getServerSession);
  if (key === null) {
    mocked.mockResolvedValue(null);
    return null;
  }
  const id = await userIdOf(key);
  const person = demoPeople.find((p) => p.key === key)!;
  const { sessionVersion } = (await models().User.findByPk(id, { attributes: ["sessionVersion"] }))!;
  mocked.mockResolvedValue({ user: { id: String(id), name: person.name, email: person.email, role: person.role, sessionVersion }, expires: "2999-01-01" });
  return id;
}

export async function demoProofId(): Promise<number> {
  const p = await models().Proof.findOne({ order: [["id", "ASC"]] });
  if (!p) throw new Error("demo proof is not seeded");
  return p.id;
}

export function params<T extends Record<string, string>>(p: T) {
  return { params: Promise.resolve(p) };
}

export function jsonRequest(url: string, method: string, body?: unknown): Request {
  return new Request(`http://localhost${url}`, {
    method,
    headers: { "content-type": "application/json" },
    body: body === undefined ? undefined : typeof body === "string" ? body : JSON.stringify(body),
  });
}

/** Calls `call` as each person in turn (demo keys; "nobody": signed out) and expects that person's status; a failure names the person. */
export async function expectStatusAs(call: () => Promise<Response>, expected: Record<string, number>): Promise<void> {
  for (const [who, status] of Object.entries(expected)) {
    await actAs(who === "nobody" ? null : who);
    expect((await call()).status, `as ${who}`).toBe(status);
  }
}

export interface CloseOptions {
  /** The file used the in-process verification pool. */
  pool?: boolean;
  /** The file used the job queue. */
  queue?: boolean;
}

/**
 * A test file's last clean-up: removes what the file made (`drop`), then closes the verification pool and the job
 * queue if the file used them, then the database connection. Call it before the file's own afterAll hooks:
 * Vitest runs after-hooks last registered first, so this one runs after them.
 */
export function closeAfterAll(drop?: () => Promise<unknown>, { pool = false, queue = false }: CloseOptions = {}): void {
  afterAll(async () => {
    await drop?.();
    if (pool) await closePool();
    if (queue) await closeQueue();
    await closeSequelize();
  });
}

/**
 * This test file's verification workers: after each test they are killed (with the job queue closed) and the given
 * settings are put back as they were when the file started; `saved` holds those values.
 */
export function workersPerTest(keys: readonly string[]): { workers: TestWorker[]; saved: Record<string, string | undefined> } {
  const workers: TestWorker[] = [];
  const saved = Object.fromEntries(keys.map((k) => [k, process.env[k]]));
  afterEach(async () => {
    for (const w of workers.splice(0)) w.stop("SIGKILL");
    await closeQueue();
    for (const k of keys)
      if (saved[k] === undefined) delete process.env[k];
      else process.env[k] = saved[k];
  });
  return { workers, saved };
}

/**
 * A temporary folder and an S3 fake for this test file, set up before its tests; after them the fake stops, the folder
 * goes, `drop` runs and the storage settings (and `keys`) are put back as they were.
 */
export function storesForFile(prefix: string, portOffset: number, keys: readonly string[], drop: () => Promise<unknown>): { dir: string; fake: S3Fake } {
  const stores = {} as { dir: string; fake: S3Fake };
  let restore = () => {};
  closeAfterAll(async () => {
    restore();
    await drop();
    await stores.fake?.stop();
    if (stores.dir) await rm(stores.dir, { recursive: true, force: true });
  });
  beforeAll(async () => {
    // Loaded here, so that the other test files do not load the S3 fake.
    const s3 = await import("../support/s3-fake");
    restore = s3.rememberEnv([...s3.STORAGE_KEYS, ...keys]);
    stores.dir = await mkdtemp(path.join(tmpdir(), prefix));
    stores.fake = await s3.startS3Fake(s3.s3FakePort(portOffset));
  });
  return stores;
}
