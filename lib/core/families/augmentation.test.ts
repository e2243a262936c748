import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { generateConnected, type EnumerationSetting } from "./augmentation";
import { canonicalKeyOf, canonicalLabelling } from "./canonical-label";
import { parseBound } from "../arithmetic/bound";
import { Budget } from "../verdict";
import { Graph, makeGraph } from "../graph";
import { parseGraph6 } from "../input/graph6";
import { spectralRadiusBound } from "../spectral/inertia";
import { identifySmith } from "./identify";

const budget = () => new Budget(1e12);
const memo = new Map<string, number[]>();
/** Counts per order (memoised: the geng cross-checks reuse the runs checked against OEIS). */
const count = (maxVertices: number, setting?: EnumerationSetting) => {
  const k = JSON.stringify([maxVertices, setting]);
  if (!memo.has(k)) memo.set(k, generateConnected({ maxVertices, setting, budget: budget(), collect: false }).counts);
  return memo.get(k)!;
};

/** The nauty tools as Debian names them (nauty-geng) or as upstream does (geng); undefined when absent. */
function nautyTool(name: string): string | undefined {
  for (const cmd of [`nauty-${name}`, name]) if (spawnSync("sh", ["-c", `command -v ${cmd}`]).status === 0) return cmd;
  return undefined;
}
const geng = nautyTool("geng");
const NO_NAUTY = "Debian's nauty is not installed (apt-get install nauty): the cross-checks against geng are skipped";
if (!geng) console.warn(NO_NAUTY);
const sh = (cmd: string) => spawnSync("sh", ["-c", cmd], { encoding: "utf8", maxBuffer: 1 << 28 }).stdout;

/** Graphs of nauty's simple text format "nv ne c_1..c_nv {v1 v2 mult}": the colour is the loop weight. */
function parseNautyText(text: string): Graph[] {
  return text
    .trim()
    .split("\n")
    .filter(Boolean)
    .map((line) => {
      const t = line.trim().split(/\s+/).map(Number);
      const [nv, ne] = t;
      const edges = Array.from({ length: nv }, (_, v) => ({ u: v, v, m: t[2 + v] })).filter((e) => e.m > 0);
      for (let i = 0; i < ne; i++) edges.push({ u: t[2 + nv + 3 * i], v: t[3 + nv + 3 * i], m: t[4 + nv + 3 * i] });
      return makeGraph(nv, edges);
    });
}

const keys = (gs: Graph[]) => gs.map((g) => canonicalKeyOf(g)).sort();

describe("canonical labelling", () => {
  it("gives isomorphic graphs the same key and the automorphism group's orbits", () => {
    // The Petersen graph is vertex-transitive with |Aut| = 120 (Brouwer & Haemers §1.4.6, common knowledge).
    const outer = [0, 1, 2, 3, 4].map((i) => ({ u: i, v: (i + 1) % 5 }));
    const spokes = [0, 1, 2, 3, 4].map((i) => ({ u: i, v: i + 5 }));
    const inner = [0, 1, 2, 3, 4].map((i) => ({ u: 5 + i, v: 5 + ((i + 2) % 5) }));
    const petersen = makeGraph(10, [...outer, ...spokes, ...inner]);
    const perm = [3, 7, 1, 9, 0, 5, 2, 8, 4, 6];
    const relabelled = makeGraph(
      10,
      petersen.edges.map((e) => ({ u: perm[e.u], v: perm[e.v] })),
    );
    expect(canonicalKeyOf(relabelled)).toBe(canonicalKeyOf(petersen));
    const W = new Int32Array(100);
    for (const e of petersen.edges) W[e.u * 10 + e.v] = W[e.v * 10 + e.u] = 1;
    const lab = canonicalLabelling(10, W);
    expect(new Set(lab.orbit).size).toBe(1);
    // Every generator found is an automorphism.
    for (const g of lab.generators) for (const e of petersen.edges) expect(W[g[e.u] * 10 + g[e.v]]).toBe(1);
    // C_10 is not isomorphic to it (it is not even cubic), nor is the 5-prism (cubic, 10 vertices).
    const prism = makeGraph(10, [...outer, ...spokes, ...[0, 1, 2, 3, 4].map((i) => ({ u: 5 + i, v: 5 + ((i + 1) % 5) }))]);
    expect(canonicalKeyOf(prism)).not.toBe(canonicalKeyOf(petersen));
  });

  it("tells loops and multiplicities apart", () => {
    const a = makeGraph(3, [
      { u: 0, v: 1, m: 2 },
      { u: 1, v: 2 },
      { u: 0, v: 0 },
    ]);
    const b = makeGraph(3, [
      { u: 0, v: 1 },
      { u: 1, v: 2, m: 2 },
      { u: 0, v: 0 },
    ]);
    const c = makeGraph(3, [
      { u: 2, v: 1, m: 2 },
      { u: 1, v: 0 },
      { u: 2, v: 2 },
    ]);
    expect(canonicalKeyOf(a)).not.toBe(canonicalKeyOf(b));
    expect(canonicalKeyOf(a)).toBe(canonicalKeyOf(c));
  });
});

describe("enumeration by canonical augmentation", () => {
  it("counts the connected graphs on n ≤ 8 vertices", () => {
    // OEIS A001349 (connected graphs on n nodes): 1, 1, 2, 6, 21, 112, 853, 11117.
    expect(count(8)).toEqual([1, 1, 2, 6, 21, 112, 853, 11117]);
  });

  it("counts the trees on n ≤ 16 vertices", () => {
    // OEIS A000055 (trees on n unlabelled nodes), n = 1..16.
    expect(count(16, { kind: "tree" })).toEqual([1, 1, 1, 2, 3, 6, 11, 23, 47, 106, 235, 551, 1301, 3159, 7741, 19320]);
  });

  it("finds exactly Smith's graphs with ρ < 2 and ρ = 2 on up to 20 vertices", () => {
    // J. H. Smith 1970; Brouwer & Haemers, Spectra of Graphs, Thm 3.1.3: ρ < 2 exactly for A_n (n ≥ 1),
    // D_n (n ≥ 4), E6, E7, E8; ρ = 2 exactly for C_n (n ≥ 3), D̃_{n−1} on n ≥ 5 vertices, Ẽ6, Ẽ7, Ẽ8 on 7, 8, 9.
    const below = Array.from({ length: 20 }, (_, i) => {
      const n = i + 1;
      return 1 + (n >= 4 ? 1 : 0) + (n >= 6 && n <= 8 ? 1 : 0);
    });
    const equal = Array.from({ length: 20 }, (_, i) => {
      const n = i + 1;
      return (n >= 3 ? 1 : 0) + (n >= 5 ? 1 : 0) + (n >= 7 && n <= 9 ? 1 : 0);
    });
    const lt = generateConnected({ maxVertices: 20, spectral: { op: "<", bound: parseBound("2") }, budget: budget() });
    const le = generateConnected({ maxVertices: 20, spectral: { op: "<=", bound: parseBound("2") }, budget: budget() });
    expect(lt.counts).toEqual(below);
    expect(le.counts).toEqual(below.map((x, i) => x + equal[i]));
    // Each graph with ρ < 2 is identified as a Dynkin diagram by the independent identification check.
    for (const g of lt.levels.flat()) expect(identifySmith(g, undefined, budget()).status).toBe("verified");
    // The trees among them: every graph with ρ ≤ 2 but the cycles.
    const trees = generateConnected({
      maxVertices: 20,
      setting: { kind: "tree" },
      spectral: { op: "<=", bound: parseBound("2") },
      budget: budget(),
      collect: false,
    });
    expect(trees.counts).toEqual(le.counts.map((x, i) => x - (i >= 2 ? 1 : 0)));
  });

  it("splits into independent parts whose union is the whole", () => {
    const whole = generateConnected({ maxVertices: 7, budget: budget() });
    for (const of of [2, 3, 5]) {
      const parts = Array.from({ length: of }, (_, index) => generateConnected({ maxVertices: 7, part: { index, of }, budget: budget() }));
      const union = parts.flatMap((p) => p.levels.flat());
      expect(union.length).toBe(whole.levels.flat().length);
      expect(keys(union)).toEqual(keys(whole.levels.flat()));
      // Every part below the split level does some of the work.
      expect(parts.every((p) => p.counts.some((c) => c > 0))).toBe(true);
    }
    const rho = (index: number, of: number) =>
      generateConnected({ maxVertices: 14, spectral: { op: "<=", bound: parseBound("sqrt(2+sqrt(5))") }, part: { index, of }, budget: budget() });
    const all = rho(0, 1).levels.flat();
    expect(keys([0, 1, 2, 3].flatMap((i) => rho(i, 4).levels.flat()))).toEqual(keys(all));
    expect(() => rho(4, 4)).toThrow(/parts are numbered 0\.\.3/);
  });

  it.skipIf(!geng)("agrees with nauty's geng on all connected graphs with n ≤ 8 and on the trees with n ≤ 16", () => {
    for (let n = 1; n <= 8; n++) {
      const out = sh(`${geng} -cu ${n} 2>&1`);
      const m = /(\d+) graphs generated/.exec(out);
      expect(m, out).not.toBeNull();
      expect(count(8)[n - 1]).toBe(Number(m![1]));
    }
    const gentree = nautyTool("gentreeg")!;
    const trees = count(16, { kind: "tree" });
    for (let n = 2; n <= 16; n++) expect(trees[n - 1]).toBe(Number(/(\d+) trees generated/.exec(sh(`${gentree} -u ${n} 2>&1`))![1]));
  });

  it.skipIf(!geng)("finds the same graphs with ρ ≤ √(2+√5) on n ≤ 7 vertices as geng filtered by the exact verdict", () => {
    const b = parseBound("sqrt(2+sqrt(5))");
    const ours = generateConnected({ maxVertices: 7, spectral: { op: "<=", bound: b }, budget: budget() }).levels.flat();
    const theirs: Graph[] = [];
    for (let n = 1; n <= 7; n++)
      for (const line of sh(`${geng} -cq ${n}`).split("\n").filter(Boolean)) {
        const g = parseGraph6(line);
        if (spectralRadiusBound(g, "<=", b, budget()).status === "verified") theirs.push(g);
      }
    expect(keys(ours)).toEqual(keys(theirs));
  });

  it.skipIf(!geng)("agrees with nauty (geng | vcolg | multig) on connected graphs with loops and multiple edges", () => {
    const vcolg = nautyTool("vcolg")!,
      multig = nautyTool("multig")!;
    const counted = (cmd: string) => Number(/(\d+) (?:coloured graphs|multigraphs) generated/.exec(sh(`${cmd} 2>&1`))![1]);
    // Loop weight ≤ 1 is a vertex colour out of 2; multiplicity ≤ 2 is nauty's multig -m2.
    const loops = count(6, { kind: "multigraph", maxMultiplicity: 1, maxLoop: 1 });
    const multi = count(5, { kind: "multigraph", maxMultiplicity: 2, maxLoop: 0 });
    const both = count(4, { kind: "multigraph", maxMultiplicity: 2, maxLoop: 1 });
    for (let n = 1; n <= 6; n++) expect(loops[n - 1]).toBe(counted(`${geng} -cq ${n} | ${vcolg} -u -m2`));
    for (let n = 2; n <= 5; n++) expect(multi[n - 1]).toBe(counted(`${geng} -cq ${n} | ${multig} -u -m2`));
    for (let n = 2; n <= 4; n++) expect(both[n - 1]).toBe(counted(`${geng} -cq ${n} | ${vcolg} -T -m2 | ${multig} -V -u -m2`));
    // Bounded: the same graphs with ρ ≤ 2 as nauty's list filtered by the exact verdict, n ≤ 4.
    const b = parseBound("2");
    const ours = generateConnected({
      maxVertices: 4,
      setting: { kind: "multigraph", maxMultiplicity: 2, maxLoop: 1 },
      spectral: { op: "<=", bound: b },
      budget: budget(),
    }).levels.flat();
    const theirs = [1, 2, 3, 4]
      .flatMap((n) => parseNautyText(sh(n === 1 ? `printf '1 0 0\\n1 0 1\\n'` : `${geng} -cq ${n} | ${vcolg} -T -m2 | ${multig} -V -T -m2`)))
      .filter((g) => spectralRadiusBound(g, "<=", b, budget()).status === "verified");
    expect(ours.length).toBeGreaterThan(0);
    expect(keys(ours)).toEqual(keys(theirs));
  });

  it.skipIf(geng)("is skipped without nauty", () => {
    console.warn(NO_NAUTY);
  });
});
