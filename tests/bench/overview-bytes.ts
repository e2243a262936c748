/**
 * How the overview (the proof page) grows with the number of cases: proofs of 10, 20, 40 and 60 cases
 * (a third of them sub-cases, one step with math in each) are made through the API, and the author's
 * proof page is fetched. Reported as bytes of HTML and bytes per case; it should grow linearly.
 * Used by `npm run bench` (its own stack, as the HTTP load section) and by tests/e2e/overview-size.test.ts.
 */
import type { BenchOptions, BenchSection } from "./run";
import { api, signIn, startStack } from "./api-load";

export const OVERVIEW_SIZES = [10, 20, 40, 60] as const;

export interface OverviewClient {
  post<T>(path: string, body: unknown): Promise<T>;
  /** The HTML of a page, as the signed-in author gets it. */
  page(path: string): Promise<string>;
}

export interface OverviewSize {
  cases: number;
  bytes: number;
  bytesPerCase: number;
}

/** Makes one proof per size and measures its page. */
export async function measureOverviewBytes(client: OverviewClient, sizes: readonly number[] = OVERVIEW_SIZES): Promise<OverviewSize[]> {
  const out: OverviewSize[] = [];
  for (const n of sizes) {
    const { proof } = await client.post<{ proof: { id: number } }>("/api/proofs", {
      title: `Overview of ${n} cases`,
      statement: "Every tree $T$ with $\\rho(T) \\le 2$ is a Dynkin or affine diagram.",
    });
    const tops: number[] = [];
    for (let i = 0; i < n; i++) {
      // Two top-level cases for every sub-case: cases 1, 2, 2.1, 3, 4, 4.1 …
      const parentId = i % 3 === 2 ? tops[tops.length - 1] : null;
      const { case: c } = await client.post<{ case: { id: number } }>(`/api/proofs/${proof.id}/cases`, {
        parentId,
        title: `Case with ${i} legs`,
        condition: `$T$ has ${i} legs of length at most $2$.`,
      });
      if (parentId === null) tops.push(c.id);
      await client.post(`/api/proofs/${proof.id}/cases/${c.id}/steps`, { body: `By the leg count, $\\rho(T) \\le \\sqrt{${i + 2}}$.` });
    }
    const bytes = Buffer.byteLength(await client.page(`/proofs/${proof.id}`));
    out.push({ cases: n, bytes, bytesPerCase: Math.round(bytes / n) });
  }
  return out;
}

async function run(options: BenchOptions): Promise<void> {
  if (options.only && !"overview-bytes".includes(options.only)) return;
  const stack = process.env.CAIRN_BENCH_URL ? { url: process.env.CAIRN_BENCH_URL, stop: () => undefined } : await startStack();
  try {
    const cookie = await signIn(stack.url);
    const client: OverviewClient = {
      post: (path, body) => api(stack.url, cookie, path, body),
      page: async (path) => (await fetch(`${stack.url}${path}`, { headers: { cookie } })).text(),
    };
    const sizes = await measureOverviewBytes(client, options.quick ? [10, 20] : OVERVIEW_SIZES);
    console.log("cases  HTML bytes  bytes per case");
    for (const s of sizes) console.log(`${String(s.cases).padStart(5)}  ${String(s.bytes).padStart(10)}  ${String(s.bytesPerCase).padStart(14)}`);
    const first = sizes[0];
    const last = sizes[sizes.length - 1];
    console.log(
      `growth: ${last.cases / first.cases}× the cases → ${(last.bytes / first.bytes).toFixed(2)}× the bytes (linear would be ${last.cases / first.cases}×)`,
    );
  } finally {
    stack.stop();
  }
}

export const overviewBytesSection: BenchSection = { name: "Overview page size", run };
