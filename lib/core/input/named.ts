/**
 * The reader of the named graph syntax documented at the top of constructors.ts, e.g.
 * `E~(8) + path(3)` or `two_branch(1,2; 3; 1,1)`. Errors name line and column (1-based).
 */

import { GraphError, type Graph } from "../graph";
import { SMITH_FAMILIES, parseFamilyName } from "../families/smith-families";
import {
  MAX_NAMED_SIZE,
  path,
  cycle,
  star,
  complete,
  completeBipartite,
  starlike,
  twoBranch,
  dynkinA,
  dynkinD,
  dynkinE,
  affineA,
  affineD,
  affineE,
  loopPath,
  loopPath2,
  forkLoop,
  disjointUnion,
} from "./constructors";

/** The families the named syntax knows, with their argument shape. */
const FAMILIES: Record<string, { groups: number[] | "any"; build: (args: number[][]) => Graph }> = {
  path: { groups: [1], build: ([[n]]) => path(n) },
  cycle: { groups: [1], build: ([[n]]) => cycle(n) },
  star: { groups: [1], build: ([[k]]) => star(k) },
  complete: { groups: [1], build: ([[n]]) => complete(n) },
  complete_bipartite: { groups: [2], build: ([[a, b]]) => completeBipartite(a, b) },
  starlike: { groups: "any", build: ([legs]) => starlike(legs) },
  // T(a,b,c): the star-like tree by arm lengths (vertices of each arm besides the centre), as in identify.ts.
  T: { groups: "any", build: ([legs]) => starlike(legs) },
  two_branch: { groups: [2, 1, 2], build: ([[a, b], [k], [c, d]]) => twoBranch(a, b, k, c, d) },
  A: { groups: [1], build: ([[n]]) => dynkinA(n) },
  D: { groups: [1], build: ([[n]]) => dynkinD(n) },
  E: { groups: [1], build: ([[n]]) => dynkinE(n) },
  "A~": { groups: [1], build: ([[n]]) => affineA(n) },
  "D~": { groups: [1], build: ([[n]]) => affineD(n) },
  "E~": { groups: [1], build: ([[n]]) => affineE(n) },
  loop_path: { groups: [1], build: ([[n]]) => loopPath(n) },
  loop_path2: { groups: [1], build: ([[n]]) => loopPath2(n) },
  fork_loop: { groups: [1], build: ([[n]]) => forkLoop(n) },
};

export const NAMED_FAMILIES: readonly string[] = Object.keys(FAMILIES);

/** A recursive-descent reader of the named syntax; every error names line and column (1-based). */
class NamedReader {
  private pos = 0;
  constructor(private readonly text: string) {}

  private where(at = this.pos): { line: number; column: number } {
    let line = 1,
      lineStart = 0;
    for (let i = 0; i < at; i++)
      if (this.text[i] === "\n") {
        line++;
        lineStart = i + 1;
      }
    return { line, column: at - lineStart + 1 };
  }

  fail(message: string, at = this.pos): never {
    const { line, column } = this.where(at);
    throw new GraphError(message, line, column);
  }

  private skipSpace(): void {
    while (this.pos < this.text.length) {
      const c = this.text[this.pos];
      if (c === "#") {
        while (this.pos < this.text.length && this.text[this.pos] !== "\n") this.pos++;
      } else if (/\s/.test(c)) this.pos++;
      else break;
    }
  }

  private peek(): string | undefined {
    this.skipSpace();
    return this.text[this.pos];
  }

  private expect(ch: string): void {
    if (this.peek() !== ch)
      this.fail(this.pos < this.text.length ? `expected "${ch}" but found "${this.text[this.pos]}"` : `expected "${ch}" but the text ended`);
    this.pos++;
  }

  readAll(): Graph {
    const g = this.expression();
    if (this.peek() !== undefined) this.fail(`unexpected "${this.text[this.pos]}" after a complete graph expression (join graphs with "+")`);
    return g;
  }

  private expression(): Graph {
    let g = this.term();
    while (this.peek() === "+") {
      this.pos++;
      const h = this.term();
      if (g.n + h.n > MAX_NAMED_SIZE) this.fail(`the union is larger than the limit of ${MAX_NAMED_SIZE} vertices`);
      g = disjointUnion(g, h);
    }
    return g;
  }

  private term(): Graph {
    const c = this.peek();
    if (c === "(") {
      this.pos++;
      const g = this.expression();
      this.expect(")");
      return g;
    }
    const nameStart = this.pos;
    const m = /^[A-Za-z_][A-Za-z0-9_]*~?/.exec(this.text.slice(this.pos));
    if (!m) this.fail(c === undefined ? "expected a graph name such as path(5) but the text ended" : `expected a graph name such as path(5), found "${c}"`);
    const name = m[0];
    this.pos += name.length;
    const family = FAMILIES[name];
    if (!family) this.fail(`unknown graph family "${name}"; known: ${NAMED_FAMILIES.join(", ")}`, nameStart);
    this.expect("(");
    const argsStart = this.pos;
    const groups = this.argumentGroups();
    this.expect(")");
    const shape = family.groups;
    if (shape === "any" ? groups.length !== 1 || groups[0].length === 0 : groups.length !== shape.length || groups.some((gr, i) => gr.length !== shape[i]))
      this.fail(`${name} takes ${describeShape(shape)}, got "${this.text.slice(argsStart, this.pos - 1).trim()}"`, argsStart);
    try {
      return family.build(groups);
    } catch (e) {
      if (e instanceof GraphError && e.line === undefined) this.fail(e.message, nameStart);
      throw e;
    }
  }

  private argumentGroups(): number[][] {
    const groups: number[][] = [[]];
    if (this.peek() === ")") return groups;
    for (;;) {
      this.skipSpace();
      const numStart = this.pos;
      const m = /^\d+/.exec(this.text.slice(this.pos));
      if (!m)
        this.fail(
          this.pos < this.text.length
            ? `expected a non-negative integer, found "${this.text[this.pos]}"`
            : "expected a non-negative integer but the text ended",
        );
      const value = Number(m[0]);
      if (!Number.isSafeInteger(value) || value > MAX_NAMED_SIZE) this.fail(`${m[0]} is larger than the limit of ${MAX_NAMED_SIZE}`, numStart);
      groups[groups.length - 1].push(value);
      this.pos += m[0].length;
      const sep = this.peek();
      if (sep === ",") this.pos++;
      else if (sep === ";") {
        this.pos++;
        groups.push([]);
      } else return groups;
    }
  }
}

function describeShape(shape: number[] | "any"): string {
  if (shape === "any") return "one or more leg lengths separated by commas";
  if (shape.length === 1) return shape[0] === 1 ? "one integer" : `${shape[0]} integers separated by commas`;
  return `groups of ${shape.join(", ")} integers separated by ";" (for example two_branch(1,1; 3; 1,2))`;
}

/**
 * Parses the named syntax, e.g. `E~(8) + path(3)`. Throws GraphError with line and column. A whole text
 * that is a diagram name as the literature writes it ("affine E8", "Ẽ8", "E9", "T_{2,3,6}", see
 * parseFamilyName) is that diagram; "T_{p,q,r}" that is no family is the star-like tree with arms of
 * p − 1, q − 1, r − 1 vertices besides the centre (vertex counts include the centre).
 */
export function parseNamed(text: string): Graph {
  const diagram = diagramOf(text);
  if (diagram) return diagram;
  return new NamedReader(text).readAll();
}

const T_BY_VERTEX_COUNTS = /^\s*T\s*(?:_\s*\{|_|\[)\s*(\d+)\s*,\s*(\d+)\s*,\s*(\d+)\s*[}\]]?\s*$/;

function diagramOf(text: string): Graph | undefined {
  const t = T_BY_VERTEX_COUNTS.exec(text);
  if (t) {
    const counts = [t[1], t[2], t[3]].map(Number);
    if (counts.some((c) => c < 1 || c > MAX_NAMED_SIZE))
      throw new GraphError("T_{p,q,r} counts the vertices of each arm including the centre, so p, q, r >= 1");
    return starlike(counts.map((c) => c - 1).filter((c) => c > 0));
  }
  if (/^\s*[A-Za-z_][A-Za-z0-9_]*~?\s*\(/.test(text)) return undefined; // the named syntax proper
  const f = parseFamilyName(text);
  return f ? SMITH_FAMILIES[f.family].build(f.parameter) : undefined;
}

/** A diagram name as the literature writes it (whole text), read by parseNamed. */
export function looksLikeDiagramName(text: string): boolean {
  return T_BY_VERTEX_COUNTS.test(text) || (!/^\s*[A-Za-z_][A-Za-z0-9_]*~?\s*\(/.test(text) && parseFamilyName(text) !== null);
}

/** True when the text looks like the named syntax (a family name followed by "("). */
export function looksNamed(text: string): boolean {
  return /^\s*(?:#[^\n]*\n\s*)*\(*\s*[A-Za-z_][A-Za-z0-9_]*~?\s*\(/.test(text);
}
