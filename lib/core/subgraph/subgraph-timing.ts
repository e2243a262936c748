/**
 * Timing of the subgraph targets on the benchmark's graphs (random recursive tree with seed n, path,
 * D̃ tree; see BENCH-WORKLOADS.md). Run: npx tsx lib/core/subgraph/subgraph-timing.ts
 * Prints the median of 5 runs per case; not part of the test suite.
 */
import { makeGraph } from "../graph";
import { path, starlike, star, affineD, twoBranch } from "../input/constructors";
import { findSubgraph, searchEmbedding, checkEmbedding } from "./subgraph";
import { Budget } from "../verdict";

function randomTree(n: number) {
  let x = n >>> 0;
  const next = () => (x = (Math.imul(1664525, x) + 1013904223) >>> 0);
  const randint = (m: number) => Math.floor((next() * m) / 2 ** 32);
  const edges: Array<{ u: number; v: number }> = [];
  for (let i = 1; i < n; i++) edges.push({ u: randint(i), v: i });
  return makeGraph(n, edges);
}
type Outcome = { status: string; method: string; reason: string };
function time(label: string, run: () => Outcome) {
  const times: number[] = [];
  let last: Outcome | undefined;
  for (let r = 0; r < 5; r++) {
    const t0 = performance.now();
    last = run();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  console.log(
    `${label}: median ${times[2].toFixed(1)} ms (min ${times[0].toFixed(1)}, max ${times[4].toFixed(1)}) → ${last!.status} [${last!.method}] ${last!.reason.slice(0, 140)}`,
  );
}
const N = 100000;
const t0 = performance.now();
const tree = randomTree(N),
  p = path(N),
  dt = affineD(N - 1);
console.log(`built graphs in ${(performance.now() - t0).toFixed(0)} ms`);
const e8 = starlike([1, 2, 5]),
  k14 = star(4);
time("Ẽ8 in random tree 1e5", () => findSubgraph(e8, tree));
time("K_{1,4} absent from path 1e5", () => findSubgraph(k14, p));
time("Ẽ8 absent from D̃ tree 1e5", () => findSubgraph(e8, dt));
time("D̃40 in random tree 1e5 (tree table)", () => findSubgraph(affineD(40), tree));
time("two_branch(3,3; 30; 3,3) in random tree 1e5", () => findSubgraph(twoBranch(3, 3, 30, 3, 3), tree));
// Pure backtracking, without the forest shortcut, for comparison.
time("Ẽ8 in random tree 1e5 (backtracking only)", () => {
  const b = new Budget();
  const r = searchEmbedding(e8, tree, false, b);
  return {
    status: r.embedding && checkEmbedding(e8, tree, r.embedding) === null ? "verified" : "refuted",
    method: "searchEmbedding",
    reason: `${r.nodesVisited} nodes, ${b.used} steps`,
  };
});
time("Ẽ8 absent from D̃ tree 1e5 (backtracking only)", () => {
  const b = new Budget();
  const r = searchEmbedding(e8, dt, false, b);
  return { status: r.embedding ? "verified" : "refuted", method: "searchEmbedding", reason: `${r.nodesVisited} nodes, ${b.used} steps` };
});
console.log(`peak rss ${(process.memoryUsage().rss / 2 ** 20).toFixed(0)} MiB, node ${process.version}`);
