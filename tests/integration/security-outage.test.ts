/**
 * A database outage (issue 10, defect 6): the API answers 503 with a temporary-error message, not
 * the generic 500, and works again when the database is back, without a restart.
 *
 * The test MariaDB serves every test file (and the browser tests), so it is not shut down here:
 * the app talks to it through a TCP relay that the test "stops" — every open connection is cut and
 * new ones are refused, as when the server goes away — and then starts again on the same port.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("next-auth", async (importOriginal) => ({ ...(await importOriginal<typeof import("next-auth")>()), getServerSession: vi.fn() }));

import { actAs, jsonRequest, params } from "./helpers";
import { TcpRelay } from "../support/tcp-relay";
import { closeSequelize } from "@/lib/db";
import { models } from "@/models";
import * as proofsRoute from "@/app/api/proofs/route";
import * as proofRoute from "@/app/api/proofs/[proofId]/route";
import * as casesRoute from "@/app/api/proofs/[proofId]/cases/route";

const realUrl = process.env.DATABASE_URL!;
const target = new URL(realUrl);
const relay = new TcpRelay(target.hostname, Number(target.port));

let proofId: string;

beforeAll(async () => {
  await closeSequelize();
  const relayPort = await relay.start(0);
  const viaRelay = new URL(realUrl);
  viaRelay.port = String(relayPort);
  process.env.DATABASE_URL = viaRelay.toString();
  await actAs("author");
  const res = await proofsRoute.POST(jsonRequest("/api/proofs", "POST", { title: "Outage test", statement: "A statement." }), params({}));
  proofId = String((await res.json()).proof.id);
});
afterAll(async () => {
  await models().Proof.destroy({ where: { id: Number(proofId) } });
  await closeSequelize();
  process.env.DATABASE_URL = realUrl;
  await relay.stop();
});

const read = () => proofRoute.GET(new Request("http://localhost/x"), params({ proofId }));
const write = (i: number) => casesRoute.POST(jsonRequest("/x", "POST", { title: `Case during outage ${i}`, condition: "" }), params({ proofId }));

describe("database outage", () => {
  it("answers 503 with a temporary-error message during the outage and recovers after it without a restart", async () => {
    expect((await read()).status).toBe(200);
    const casesBefore = await models().Case.count({ where: { proofId: Number(proofId) } });

    await relay.stop();
    const during = await Promise.all([...Array.from({ length: 10 }, () => read()), ...Array.from({ length: 10 }, (_, i) => write(i))]);
    const statuses = during.map((r) => r.status);
    console.log(`[outage] answers during the outage: ${JSON.stringify(countBy(statuses))}`);
    expect(statuses).toEqual(Array(20).fill(503));
    const err = (await during[0].json()).error;
    expect(err.code).toBe("unavailable");
    expect(err.message).toMatch(/database.*(not answering|unavailable)/i);
    expect(err.message).toMatch(/try again/i);
    expect(during[0].headers.get("retry-after")).toBe("5");

    await relay.start();
    const t0 = Date.now();
    const seen: number[] = [];
    for (;;) {
      const status = (await read()).status;
      seen.push(status);
      if (status === 200 || Date.now() - t0 > 20_000) break;
      await new Promise((r) => setTimeout(r, 250));
    }
    console.log(`[outage] after the restart: ${JSON.stringify(seen)} in ${Date.now() - t0} ms`);
    expect(seen.at(-1)).toBe(200);
    expect(seen.every((s) => s === 200 || s === 503)).toBe(true);
    expect((await write(99)).status).toBe(201);
    // No write from the outage landed; the one after it did.
    expect(await models().Case.count({ where: { proofId: Number(proofId) } })).toBe(casesBefore + 1);
  });
});

function countBy(xs: number[]): Record<number, number> {
  const out: Record<number, number> = {};
  for (const x of xs) out[x] = (out[x] ?? 0) + 1;
  return out;
}
