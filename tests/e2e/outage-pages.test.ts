/**
 * A database outage on pages (issue 10, defect 6): while the database does not answer, pages answer 503
 * with the temporary-error message (they answered the generic 500), the API keeps its 503, and both
 * work again when the database is back, without a restart of the app.
 *
 * The browser tests' MariaDB serves every test file, so it is not stopped here: this file starts its
 * own `next start` whose DATABASE_URL points at a TCP relay, and "stops" the database by closing the
 * relay and cutting every open connection through it (as tests/integration/security-outage.test.ts does
 * for the route handlers), then starts the relay again on the same port.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPeople } from "@/seeders/demo-content";
import { TcpRelay } from "../support/tcp-relay";
import { signInByFetch } from "../support/sign-in";
import { freePort } from "../support/free-port";
import { e2eEnv, startAppServer, statusesUntilOk, type AppServer } from "./app-server";

const target = new URL(process.env.CAIRN_E2E_DATABASE_URL!);
const relay = new TcpRelay(target.hostname, Number(target.port));
let server: AppServer | undefined;
let base = "";
let cookie = "";
let proofId = 0;

const PAGES = () => ["/proofs", `/proofs/${proofId}`, `/proofs/${proofId}/timeline`, "/queue", "/notifications"];
const get = (path: string) => fetch(`${base}${path}`, { headers: { cookie }, redirect: "manual" });

beforeAll(async () => {
  const relayPort = await relay.start(0);
  const viaRelay = new URL(target);
  viaRelay.port = String(relayPort);
  const port = await freePort();
  server = await startAppServer({ ...e2eEnv(), DATABASE_URL: viaRelay.toString() }, port);
  base = server.base;
  cookie = await signInByFetch(base, demoPeople.find((p) => p.key === "author")!.email);
  const { proofs } = (await (await get("/api/proofs")).json()) as { proofs: Array<{ id: number }> };
  proofId = proofs[0].id;
});

afterAll(async () => {
  server?.stop();
  await relay.stop();
});

describe("pages during a database outage", () => {
  it("answer 503 with the temporary-error message during the outage and 200 again after it, without a restart", async () => {
    for (const path of PAGES()) expect((await get(path)).status, path).toBe(200);

    await relay.stop();
    const during = await Promise.all([...PAGES(), ...PAGES(), "/sign-in"].map(get));
    const statuses = during.map((r) => r.status);
    console.log(`[outage pages] answers during the outage: ${JSON.stringify(statuses)}`);
    expect(statuses).toEqual(Array(statuses.length).fill(503));
    const html = await during[0].text();
    expect(html).toMatch(/not answering at the moment/);
    expect(html).toMatch(/try again/i);
    expect(during[0].headers.get("retry-after")).toBe("5");
    expect(during[0].headers.get("content-security-policy")).toBeTruthy();
    // The API keeps its own 503 with the same message in the one error shape.
    const api = await get("/api/proofs");
    expect(api.status).toBe(503);
    expect((await api.json()).error.code).toBe("unavailable");
    // The landing page reads nothing from the database and still renders.
    expect((await get("/")).status).toBe(200);

    await relay.start();
    const { seen, ms } = await statusesUntilOk(() => get("/proofs"), 20_000);
    console.log(`[outage pages] after the database came back: ${JSON.stringify(seen)} in ${ms} ms`);
    expect(seen.every((s) => s === 200 || s === 503)).toBe(true);
    for (const path of PAGES()) expect((await get(path)).status, path).toBe(200);
  });
});
