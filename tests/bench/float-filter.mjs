// A general float pipeline for the bench's side-by-side rows: reads graph6 lines (nauty geng output) on stdin and
// prints how many have ρ ≤ b (b = argv[2], a number) by order n, as "n:count" pairs. Floats only (a comparison
// workload, never a verdict): Collatz–Wielandt upper bound max (A x)_i / x_i after power iteration on A + I.
import { createInterface } from "node:readline";

const b = Number(process.argv[2]);
const counts = new Map();
function decode(line) {
  const n = line.charCodeAt(0) - 63;
  const adj = Array.from({ length: n }, () => []);
  let k = 0;
  for (let j = 1; j < n; j++)
    for (let i = 0; i < j; i++, k++) {
      const byte = line.charCodeAt(1 + Math.floor(k / 6)) - 63;
      if ((byte >> (5 - (k % 6))) & 1) (adj[i].push(j), adj[j].push(i));
    }
  return adj;
}
function upperRho(adj) {
  const n = adj.length;
  let x = new Float64Array(n).fill(1);
  let upper = Infinity;
  for (let it = 0; it < 4000 && upper > b + 1e-9; it++) {
    const y = new Float64Array(n);
    for (let v = 0; v < n; v++) {
      let s = x[v];
      for (const w of adj[v]) s += x[w];
      y[v] = s;
    }
    let hi = 0,
      lo = Infinity,
      max = 0;
    for (let v = 0; v < n; v++) ((hi = Math.max(hi, y[v] / x[v])), (lo = Math.min(lo, y[v] / x[v])), (max = Math.max(max, y[v])));
    upper = hi - 1;
    if (lo - 1 > b + 1e-9) return lo - 1;
    for (let v = 0; v < n; v++) y[v] /= max;
    x = y;
  }
  return upper;
}
for await (const line of createInterface({ input: process.stdin })) {
  if (!line || line.startsWith(">")) continue;
  const adj = decode(line);
  if (upperRho(adj) <= b + 1e-9) counts.set(adj.length, (counts.get(adj.length) ?? 0) + 1);
}
console.log(
  [...counts]
    .sort((p, q) => p[0] - q[0])
    .map(([n, c]) => c)
    .join(","),
);
