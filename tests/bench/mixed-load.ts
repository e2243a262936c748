/**
 * Mixed reads and writes under load (issue 10): 50 clients for 60 s on a proof of 60 cases, each client in a
 * loop of its own (no think time): the overview page (the proof page, HTML), a step through the API, a claim
 * attached to a step (POST …/claims, answered 202 when stored; the verification runs in the worker processes),
 * a comment, and a saved revision of the client's own step. Reported: p50/p95 per kind (the overview and the
 * claim attach are the two the issue names), errors (any answer other than the expected 2xx, or no answer),
 * and the row counts read back through the API after the load against the acknowledged writes. Also the
 * overview's bytes per case before the load.
 *
 *   npm run bench -- --only mixed-load            the full run (50 clients, 60 s)
 *   npm run bench -- --only mixed-load --quick    10 clients, 10 s
 *
 * The stack is the one of the HTTP load section (tests/bench/api-load.ts startStack: its own MariaDB, Redis, a
 * production build served by `next start`, the verification workers); CAIRN_BENCH_URL uses a running app
 * instead, and CAIRN_BENCH_SKIP_BUILD=1 CAIRN_BENCH_DIST_DIR=.next reuses the build of the last `npm test`.
 * Clients run in this one Node process (undici's fetch, one connection per client at a time).
 */
import { loadavg } from "node:os";
import type { BenchOptions, BenchSection } from "./run";
import { api, signIn, startStack } from "./api-load";

const CASES = 60;

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

type Kind = "overview" | "step read" | "claim attach" | "comment" | "revision save";
/** Each client's cycle: three reads to two writes on average, a claim attach in every cycle. */
const CYCLE: Kind[] = ["overview", "step read", "claim attach", "comment", "overview", "revision save", "step read", "claim attach"];

interface ClientSteps {
  /** The client's own step: only this client saves revisions of it, so every save is on the latest revision. */
  own: number;
  latest: number;
  /** A step of another case that the client attaches claims to and comments on (shared with other clients). */
  shared: number;
}

async function run(options: BenchOptions): Promise<void> {
  if (options.only && !"mixed-load".includes(options.only)) return;
  const clients = options.quick ? 10 : 50;
  const seconds = options.quick ? 10 : 60;
  const stack = process.env.CAIRN_BENCH_URL ? { url: process.env.CAIRN_BENCH_URL, stop: () => undefined } : await startStack();
  try {
    const url = stack.url;
    const cookie = await signIn(url);
    const post = <T>(path: string, body: unknown) => api<T>(url, cookie, path, body);
    const { proof } = await post<{ proof: { id: number } }>("/api/proofs", {
      title: `Mixed load ${new Date().toISOString()}`,
      statement: "Every tree $T$ with $\\rho(T) \\le 2$ is a Dynkin or affine diagram.",
    });
    console.log(`making a proof of ${CASES} cases (a third of them sub-cases, one step each) and ${clients} steps of the clients' own …`);
    const tops: number[] = [];
    const caseIds: number[] = [];
    const sharedSteps: number[] = [];
    for (let i = 0; i < CASES; i++) {
      const parentId = i % 3 === 2 ? tops[tops.length - 1] : null;
      const { case: c } = await post<{ case: { id: number } }>(`/api/proofs/${proof.id}/cases`, {
        parentId,
        title: `Case with ${i} legs`,
        condition: `$T$ has ${i} legs of length at most $2$.`,
      });
      if (parentId === null) tops.push(c.id);
      caseIds.push(c.id);
      const { step } = await post<{ step: { id: number } }>(`/api/proofs/${proof.id}/cases/${c.id}/steps`, {
        body: `By the leg count, $\\rho(T) \\le \\sqrt{${i + 2}}$.`,
      });
      sharedSteps.push(step.id);
    }
    const steps: ClientSteps[] = [];
    for (let k = 0; k < clients; k++) {
      const { step } = await post<{ step: { id: number; revisionId: number } }>(`/api/proofs/${proof.id}/cases/${caseIds[k % CASES]}/steps`, {
        body: `Client ${k} revises this step.`,
      });
      steps.push({ own: step.id, latest: step.revisionId, shared: sharedSteps[(k * 7) % CASES] });
    }
    const allSteps = [...sharedSteps, ...steps.map((s) => s.own)];
    const overviewBytes = Buffer.byteLength(await (await fetch(`${url}/proofs/${proof.id}`, { headers: { cookie } })).text());
    console.log(
      `overview page of ${CASES} cases and ${allSteps.length} steps: ${overviewBytes} bytes of HTML, ${Math.round(overviewBytes / CASES)} bytes per case`,
    );

    const claim = { format: "cairn-claim/1", kind: "spectral-radius-bound", graph: { format: "named", text: "path(5)" }, op: "<", bound: "2" };
    const times = new Map<Kind, number[]>(CYCLE.map((k) => [k, []]));
    const errors: string[] = [];
    const acked = { claims: 0, comments: 0, saves: 0 };
    const deadline = Date.now() + seconds * 1000;
    const headers = { "content-type": "application/json", cookie, origin: url };

    async function one(kind: Kind, s: ClientSteps, k: number, i: number): Promise<void> {
      const t0 = performance.now();
      let res: Response;
      if (kind === "overview") res = await fetch(`${url}/proofs/${proof.id}`, { headers: { cookie } });
      else if (kind === "step read")
        res = await fetch(`${url}/api/proofs/${proof.id}/steps/${allSteps[(k * 13 + i) % allSteps.length]}`, { headers: { cookie } });
      else if (kind === "claim attach")
        res = await fetch(`${url}/api/proofs/${proof.id}/steps/${s.shared}/claims`, { method: "POST", headers, body: JSON.stringify({ claims: [claim] }) });
      else if (kind === "comment")
        res = await fetch(`${url}/api/proofs/${proof.id}/steps/${s.shared}/comments`, {
          method: "POST",
          headers,
          body: JSON.stringify({ body: `Client ${k}, comment ${i}.` }),
        });
      else
        res = await fetch(`${url}/api/proofs/${proof.id}/steps/${s.own}/revisions`, {
          method: "POST",
          headers,
          body: JSON.stringify({ baseRevisionId: s.latest, body: `Client ${k}, revision ${i}: $\\rho(T) < 2$.` }),
        });
      const text = await res.text();
      times.get(kind)!.push(performance.now() - t0);
      const expected = kind === "claim attach" ? 202 : kind === "comment" || kind === "revision save" ? 201 : 200;
      if (res.status !== expected) {
        errors.push(`${kind}: ${res.status} ${text.slice(0, 160)}`);
        return;
      }
      if (kind === "claim attach") acked.claims++;
      else if (kind === "comment") acked.comments++;
      else if (kind === "revision save") {
        acked.saves++;
        s.latest = (JSON.parse(text) as { revision: { id: number } }).revision.id;
      }
    }

    // The machine may be shared: its load average says how much of the two figures below is the app's own.
    const load = () =>
      loadavg()
        .map((l) => l.toFixed(1))
        .join(" / ");
    console.log(`${clients} clients for ${seconds} s … (load average before: ${load()})`);
    const started = performance.now();
    await Promise.all(
      steps.map(async (s, k) => {
        for (let i = 0; Date.now() < deadline; i++) {
          const kind = CYCLE[(k + i) % CYCLE.length];
          try {
            await one(kind, s, k, i);
          } catch (e) {
            const cause = e instanceof Error && e.cause instanceof Error ? ` (${(e.cause as NodeJS.ErrnoException).code ?? e.cause.message})` : "";
            errors.push(`${kind}: ${e instanceof Error ? e.message : String(e)}${cause}`);
          }
        }
      }),
    );
    const elapsed = (performance.now() - started) / 1000;
    console.log(`  load average after: ${load()}`);

    // Row counts read back through the API: every acknowledged write, nothing else.
    const claims = ((await (await fetch(`${url}/api/proofs/${proof.id}/claims`, { headers: { cookie } })).json()) as { claims: unknown[] }).claims.length;
    let comments = 0;
    for (const id of new Set(steps.map((s) => s.shared)))
      comments += ((await (await fetch(`${url}/api/proofs/${proof.id}/steps/${id}/comments`, { headers: { cookie } })).json()) as { comments: unknown[] })
        .comments.length;
    let saves = 0;
    for (const s of steps)
      saves +=
        ((await (await fetch(`${url}/api/proofs/${proof.id}/steps/${s.own}/revisions`, { headers: { cookie } })).json()) as { revisions: unknown[] }).revisions
          .length - 1;

    const total = [...times.values()].reduce((n, t) => n + t.length, 0);
    console.log(
      `  requests: ${total} in ${elapsed.toFixed(1)} s (${(total / elapsed).toFixed(0)}/s), errors ${errors.length}${errors.length ? ` — first: ${errors[0]}` : ""}`,
    );
    console.log(`  ${"kind".padEnd(14)} ${"count".padStart(6)} ${"p50 ms".padStart(8)} ${"p95 ms".padStart(8)} ${"max ms".padStart(8)}`);
    for (const [kind, t] of times) {
      t.sort((a, b) => a - b);
      console.log(
        `  ${kind.padEnd(14)} ${String(t.length).padStart(6)} ${percentile(t, 50).toFixed(0).padStart(8)} ${percentile(t, 95).toFixed(0).padStart(8)} ${percentile(t, 100).toFixed(0).padStart(8)}`,
      );
    }
    const match = (n: number, a: number) => (n === a ? "match" : "MISMATCH");
    console.log(
      `  rows after the load: claims ${claims} / acknowledged ${acked.claims} (${match(claims, acked.claims)}), comments ${comments} / ${acked.comments} (${match(comments, acked.comments)}), saved revisions ${saves} / ${acked.saves} (${match(saves, acked.saves)})`,
    );
    if (errors.length || claims !== acked.claims || comments !== acked.comments || saves !== acked.saves) process.exitCode = 1;
  } finally {
    stack.stop();
  }
}

export const mixedLoadSection: BenchSection = { name: "Mixed load (reads and writes on a 60-case proof)", run };
