/**
 * The offline checker with --parallel 1 and 2: the single-file checker (lib/core/cli.ts bundled by esbuild, as
 * offered beside every export) on an enumeration claim over all connected graphs on ≤ 8 vertices and one over all
 * trees on ≤ 16 vertices, each timed as a fresh process, the two thread counts alternating; median wall time, the
 * machine's load average before and after, and whether both gave the same verdicts and digests.
 *
 * Alone: `npx tsx tests/bench/offline-parts.ts [--runs N]`; in `npm run bench` as the section "offline checker"
 * (`--only offline`).
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { availableParallelism, loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import type { BenchOptions, BenchSection } from "./run";

const WORKLOADS = [
  // Every connected graph on n ≤ 8 vertices has ρ ≤ n − 1 < 8: the claim lists none, so it is refuted with all 11,117 + … in its certificate.
  { name: "enumerate-connected-8", claim: { format: "cairn-claim/1", kind: "enumeration", maxVertices: 8, op: "<", bound: "8", graphs: [] } },
  { name: "trees-16", claim: { format: "cairn-claim/1", kind: "enumeration", setting: "tree", maxVertices: 16, op: "<=", bound: "100", graphs: [] } },
];

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const load = () =>
  loadavg()
    .map((x) => x.toFixed(2))
    .join(" ");
/** A report without what measures the run itself, to compare the two thread counts' answers. */
const answer = (stdout: string) => JSON.stringify(JSON.parse(stdout), (k, x: unknown) => (k === "steps" || k === "timings" ? undefined : x));

export async function runOfflineParts(runs = 3): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), "cairn-bench-offline-"));
  try {
    const checker = join(dir, "cairn-check.mjs");
    const built = spawnSync(
      join(process.cwd(), "node_modules", ".bin", "esbuild"),
      ["lib/core/cli.ts", "--bundle", "--platform=node", "--format=esm", "--target=node20", "--log-level=error", `--outfile=${checker}`],
      { encoding: "utf8" },
    );
    if (built.status !== 0) throw new Error(`esbuild failed: ${built.stderr}`);
    console.log(`single-file checker, ${availableParallelism()} cores available; load average (1, 5, 15 min) before: ${load()}`);
    console.log(`workload                threads  median s  runs (s)                 same answer as 1 thread`);
    for (const w of WORKLOADS) {
      const file = join(dir, `${w.name}.json`);
      writeFileSync(file, JSON.stringify(w.claim));
      const times: Record<number, number[]> = { 1: [], 2: [] };
      const answers: Record<number, string> = {};
      for (let r = 0; r < runs; r++)
        for (const threads of r % 2 ? [2, 1] : [1, 2]) {
          const start = performance.now();
          const out = spawnSync(process.execPath, [checker, "--parallel", String(threads), "--json", "--time-limit", "600", file], {
            encoding: "utf8",
            maxBuffer: 256 * 1024 * 1024,
          });
          times[threads].push((performance.now() - start) / 1000);
          answers[threads] = answer(out.stdout);
        }
      for (const threads of [1, 2])
        console.log(
          `${w.name.padEnd(23)} ${String(threads).padEnd(8)} ${median(times[threads]).toFixed(2).padEnd(9)} ${times[threads]
            .map((t) => t.toFixed(2))
            .join(", ")
            .padEnd(24)} ${threads === 1 ? "" : answers[2] === answers[1] ? "yes" : "NO"}`,
        );
    }
    console.log(`load average after: ${load()}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export const offlinePartsSection: BenchSection = {
  name: "offline checker: an enumeration claim in parts on 1 and 2 threads (--parallel)",
  async run(options: BenchOptions) {
    if (options.quick || (options.only && !"offline".includes(options.only))) return console.log("(skipped: --quick or --only)");
    await runOfflineParts(options.runs);
  },
};

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const i = process.argv.indexOf("--runs");
  await runOfflineParts(i > 0 ? Number(process.argv[i + 1]) : 3);
}
