/**
 * Drawing any other graph (layout.ts): a force layout (d3-force) from a fixed seed, so one graph is
 * always drawn the same way.
 */
import { forceCenter, forceLink, forceManyBody, forceSimulation, forceX, forceY, type SimulationNodeDatum } from "d3-force";
import { type Local, place } from "./layout-walks";

/** Seeded linear congruential generator so that one graph is always drawn the same way. */
function lcg(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32;
  };
}

interface ForceNode extends SimulationNodeDatum {
  v: number;
}

const LINK = 40;

/** Force-directed layout from a seeded start, for a fixed number of ticks (dense graphs get fewer). */
export function layoutForce(nb: number[][], comp: number[]): Local {
  const index = new Map(comp.map((v, i) => [v, i]));
  const nodes: ForceNode[] = comp.map((v) => ({ v }));
  const links: Array<{ source: number; target: number }> = [];
  for (const v of comp) for (const w of nb[v]) if (v < w) links.push({ source: index.get(v)!, target: index.get(w)! });
  const ticks = links.length > 300 ? 80 : 300;
  forceSimulation<ForceNode>(nodes)
    .randomSource(lcg(comp.length * 7919 + links.length))
    .force("link", forceLink<ForceNode, { source: number; target: number }>(links).distance(LINK).strength(0.9))
    .force("charge", forceManyBody<ForceNode>().strength(-60))
    .force("x", forceX<ForceNode>(0).strength(0.03))
    .force("y", forceY<ForceNode>(0).strength(0.03))
    .force("center", forceCenter(0, 0))
    .stop()
    .tick(ticks);
  const local: Local = { x: new Map(), y: new Map() };
  for (const d of nodes) place(local, d.v, (d.x ?? 0) / LINK, (d.y ?? 0) / LINK);
  return local;
}
