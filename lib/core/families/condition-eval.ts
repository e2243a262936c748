/**
 * The exact evaluator of case conditions (the language and its validation: case-condition.ts): integer
 * degrees, graph search and subgraph containment, with what one graph needs computed once and shared by
 * every condition evaluated on it (ConditionContext). The conventions for loops and multiple edges are
 * case-condition.ts's module comment.
 */
import { isSimple, type Graph } from "../graph";
import { parseGraph } from "../input/parse";
import { Budget } from "../verdict";
import { sweep, findCycle } from "./structure";
import { decideContainment } from "../subgraph/subgraph";
import type { CaseCondition, ConditionRelation } from "./case-condition";

/** What is computed once per graph and shared by every condition evaluated on it. */
export class ConditionContext {
  private degrees?: number[];
  private sweepResult?: ReturnType<typeof sweep>;
  private patterns = new Map<string, Graph>();
  private answers = new Map<string, boolean>();
  constructor(
    readonly g: Graph,
    readonly budget: Budget,
  ) {}
  degreeList(): number[] {
    // Multiplicities counted and a loop counting 2 (the module comment); on a simple graph, the number of neighbours.
    if (!this.degrees) {
      const d = new Array<number>(this.g.n).fill(0);
      for (const e of this.g.edges) {
        d[e.u] += e.m;
        d[e.v] += e.m;
      }
      this.degrees = d;
    }
    return this.degrees;
  }
  swept() {
    return (this.sweepResult ??= sweep(this.g, this.budget));
  }
  connected(): boolean {
    return this.g.n > 0 && this.swept().componentCount === 1;
  }
  acyclic(): boolean {
    return this.memo("acyclic", () => findCycle(this.g, this.swept(), this.budget) === null);
  }
  memo(key: string, f: () => boolean): boolean {
    let r = this.answers.get(key);
    if (r === undefined) this.answers.set(key, (r = f()));
    return r;
  }
  pattern(text: string): Graph {
    let h = this.patterns.get(text);
    if (!h) this.patterns.set(text, (h = parseGraph(text, text.startsWith(":") ? "sparse6" : "graph6")));
    return h;
  }
}

function compare(x: number, r: ConditionRelation, k: number): boolean {
  switch (r) {
    case "<":
      return x < k;
    case "<=":
      return x <= k;
    case "=":
      return x === k;
    case ">=":
      return x >= k;
    case ">":
      return x > k;
  }
}

function bipartite(g: Graph, budget: Budget): boolean {
  const colour = new Int8Array(g.n).fill(-1);
  const nbrs: number[][] = Array.from({ length: g.n }, () => []);
  for (const e of g.edges) {
    if (e.u === e.v) return false;
    nbrs[e.u].push(e.v);
    nbrs[e.v].push(e.u);
  }
  for (let s = 0; s < g.n; s++) {
    if (colour[s] >= 0) continue;
    colour[s] = 0;
    const stack = [s];
    while (stack.length) {
      const u = stack.pop()!;
      budget.tick();
      for (const w of nbrs[u]) {
        if (colour[w] < 0) {
          colour[w] = 1 - colour[u];
          stack.push(w);
        } else if (colour[w] === colour[u]) return false;
      }
    }
  }
  return true;
}

/** Leg lengths of a tree with exactly one branch vertex (sorted), or null when G is not such a tree. */
function starLegs(ctx: ConditionContext): number[] | null {
  const g = ctx.g;
  if (!ctx.connected() || !ctx.acyclic()) return null;
  const deg = ctx.degreeList();
  const branch = deg.flatMap((d, v) => (d >= 3 ? [v] : []));
  if (branch.length !== 1) return null;
  const nbrs: number[][] = Array.from({ length: g.n }, () => []);
  for (const e of g.edges) {
    nbrs[e.u].push(e.v);
    nbrs[e.v].push(e.u);
  }
  const centre = branch[0];
  const legs = nbrs[centre].map((first) => {
    let [prev, cur, length] = [centre, first, 1];
    while (deg[cur] === 2) {
      const next = nbrs[cur][0] === prev ? nbrs[cur][1] : nbrs[cur][0];
      [prev, cur, length] = [cur, next, length + 1];
      ctx.budget.tick();
    }
    return length;
  });
  return legs.sort((a, b) => a - b);
}

/** Evaluates a condition on G exactly. */
export function evaluateCondition(c: CaseCondition, g: Graph | ConditionContext, budget = new Budget()): boolean {
  const ctx = g instanceof ConditionContext ? g : new ConditionContext(g, budget);
  if ("and" in c) return c.and.every((x) => evaluateCondition(x, ctx));
  if ("or" in c) return c.or.some((x) => evaluateCondition(x, ctx));
  if ("not" in c) return !evaluateCondition(c.not, ctx);
  const G = ctx.g;
  switch (c.predicate) {
    case "max-degree":
      return compare(Math.max(0, ...ctx.degreeList()), c.relation, c.value);
    case "min-degree":
      return compare(G.n === 0 ? 0 : Math.min(...ctx.degreeList()), c.relation, c.value);
    case "branch-vertices":
      return compare(ctx.degreeList().filter((d) => d >= 3).length, c.relation, c.value);
    case "vertices":
      return compare(G.n, c.relation, c.value);
    case "edges":
      return compare(
        G.edges.reduce((s, e) => s + e.m, 0),
        c.relation,
        c.value,
      );
    case "loops":
      return compare(
        G.edges.reduce((s, e) => s + (e.u === e.v ? e.m : 0), 0),
        c.relation,
        c.value,
      );
    case "multiple-edges":
      return compare(G.edges.filter((e) => e.u !== e.v && e.m >= 2).length, c.relation, c.value);
    case "max-multiplicity":
      return compare(Math.max(0, ...G.edges.map((e) => (e.u !== e.v ? e.m : 0))), c.relation, c.value);
    case "simple":
      return isSimple(G);
    case "connected":
      return ctx.connected();
    case "tree":
      return ctx.connected() && ctx.acyclic();
    case "has-cycle":
      return !ctx.acyclic();
    case "path":
      return ctx.connected() && ctx.acyclic() && ctx.degreeList().every((d) => d <= 2);
    case "bipartite":
      return ctx.memo("bipartite", () => bipartite(G, ctx.budget));
    case "leg-lengths": {
      const legs = starLegs(ctx);
      return legs !== null && legs.length === c.value.length && legs.every((l, i) => l === c.value[i]);
    }
    case "contains":
      return ctx.memo(
        `contains:${c.induced ? "i" : "s"}:${c.graph.text}`,
        () => "embedding" in decideContainment(ctx.pattern(c.graph.text), G, c.induced === true, ctx.budget),
      );
  }
}
