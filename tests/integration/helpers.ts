/**
 * Helpers for calling route handlers directly with `new Request(...)` as a chosen user.
 * `next-auth` is mocked in each test file (vi.mock) so that getServerSession returns `sessionFor(...)`.
 */
import { afterAll, expect, vi } from "vitest";
import { getServerSession } from "next-auth";
import { closeSequelize } from "@/lib/db";
import { closeQueue } from "@/lib/jobs/queue";
import { closePool } from "@/lib/verification/pool";
import { models } from "@/models";
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
