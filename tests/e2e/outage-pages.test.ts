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
import net from "node:net";
import { spawn, type ChildProcess } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPeople } from "@/seeders/demo-content";
import { TcpRelay } from "../support/tcp-relay";
import { signInByFetch } from "../support/sign-in";

const target = new URL(process.env.CAIRN_E2E_DATABASE_URL!);
const relay = new TcpRelay(target.hostname, Number(target.port));
let server: ChildProcess | undefined;
let base = "";
let cookie = "";
let proofId = 0;

const freePort = () =>
  new Promise<number>((resolve) => {
    const probe = net.createServer().listen(0, "127.0.0.1", () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });

const PAGES = () => ["/proofs", `/proofs/${proofId}`, `/proofs/${proofId}/timeline`, "/queue", "/notifications"];
const get = (path: string) => fetch(`${base}${path}`, { headers: { cookie }, redirect: "manual" });

beforeAll(async () => {
  const relayPort = await relay.start(0);
  const viaRelay = new URL(target);
  viaRelay.port = String(relayPort);
  const port = await freePort();
  base = `http://localhost:${port}`;
  const env = {
    ...process.env,
    DATABASE_URL: viaRelay.toString(),
    NEXTAUTH_URL: base,
    NEXTAUTH_SECRET: process.env.NEXTAUTH_SECRET ?? "e2e-secret-for-browser-tests",
    CAIRN_QUEUE_PREFIX: `${process.env.CAIRN_QUEUE_PREFIX ?? "cairn-test"}-e2e`,
  };
  server = spawn("node_modules/.bin/next", ["start", "-H", "127.0.0.1", "-p", String(port)], { env, detached: true, stdio: ["ignore", "ignore", "inherit"] });
  const deadline = Date.now() + 60_000;
  for (;;) {
    const ok = await fetch(`${base}/api/health`).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) break;
    if (Date.now() > deadline) throw new Error(`the second server did not answer on ${base} within 60 s`);
    await new Promise((r) => setTimeout(r, 300));
  }
  cookie = await signInByFetch(base, demoPeople.find((p) => p.key === "author")!.email);
  const { proofs } = (await (await get("/api/proofs")).json()) as { proofs: Array<{ id: number }> };
  proofId = proofs[0].id;
});

afterAll(async () => {
  if (server?.pid) {
    try {
      process.kill(-server.pid, "SIGTERM");
    } catch {
      // already gone
    }
  }
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
    const t0 = Date.now();
    const seen: number[] = [];
    for (;;) {
      const status = (await get("/proofs")).status;
      seen.push(status);
      if (status === 200 || Date.now() - t0 > 20_000) break;
      await new Promise((r) => setTimeout(r, 250));
    }
    console.log(`[outage pages] after the database came back: ${JSON.stringify(seen)} in ${Date.now() - t0} ms`);
    expect(seen.every((s) => s === 200 || s === 503)).toBe(true);
    for (const path of PAGES()) expect((await get(path)).status, path).toBe(200);
  });
});
