/**
 * The families of connected graphs with spectral radius ρ ≤ 2 that identify.ts recognises.
 *
 * Without loops this is Smith's classification (J. H. Smith, "Some properties of the spectrum of a
 * graph", 1970; Brouwer & Haemers, Spectra of Graphs, §3.1.1, section number from memory): ρ < 2 exactly for A_n, D_n, E6,
 * E7, E8, and ρ = 2 exactly for Ã_n, D̃_n, Ẽ6, Ẽ7, Ẽ8. With loops of weight 1 (A[v][v] = 1, the
 * convention of constructors.ts) the norm ≤ 2 classification adds, from memory of F. M. Goodman,
 * P. de la Harpe, V. F. R. Jones, Coxeter Graphs and Towers of Algebras, 1989, §1.4: the path with a
 * loop at one end (ρ < 2, the "tadpole" T_n), and with ρ = 2 the path with a loop at each end and the
 * path with a loop at one end and a fork at the other. A positive eigenvector checks ρ = 2 for the
 * last two directly (all ones; resp. 1 on the two fork leaves and 2 elsewhere). Ã_0 is one vertex
 * with a loop of weight 2 (ρ = 2).
 */

import type { Graph } from "../graph";
import { affineA, affineD, affineE, dynkinA, dynkinD, dynkinE, forkLoop, loopPath, loopPath2 } from "../input/constructors";

export type SmithFamily = "A" | "D" | "E" | "A~" | "D~" | "E~" | "loop_path" | "loop_path2" | "fork_loop";

interface FamilyInfo {
  /** Smallest parameter, and the largest (E families) */
  min: number;
  max?: number;
  /** ρ < 2 ("finite") or ρ = 2 ("affine"). */
  radius: "< 2" | "= 2";
  build: (p: number) => Graph;
  display: (p: number) => string;
}

export const SMITH_FAMILIES: Record<SmithFamily, FamilyInfo> = {
  A: { min: 1, radius: "< 2", build: dynkinA, display: (p) => `A${p}` },
  D: { min: 4, radius: "< 2", build: dynkinD, display: (p) => `D${p}` },
  E: { min: 6, max: 8, radius: "< 2", build: dynkinE, display: (p) => `E${p}` },
  loop_path: { min: 1, radius: "< 2", build: loopPath, display: (p) => `loop_path(${p}) (tadpole T${p})` },
  "A~": { min: 0, radius: "= 2", build: affineA, display: (p) => `Ã${p}` },
  "D~": { min: 4, radius: "= 2", build: affineD, display: (p) => `D̃${p}` },
  "E~": { min: 6, max: 8, radius: "= 2", build: affineE, display: (p) => `Ẽ${p}` },
  loop_path2: { min: 2, radius: "= 2", build: loopPath2, display: (p) => `loop_path2(${p})` },
  fork_loop: { min: 3, radius: "= 2", build: forkLoop, display: (p) => `fork_loop(${p})` },
};

/** A family name that cannot be read (e.g. "E9", "F4"); the message says what to write instead. */
export class FamilyNameError extends Error {
  constructor(readonly text: string) {
    super(
      `"${text}" is not a family name; write e.g. E7, D5, affine E8 (also Ẽ8, E~8, E9), T(1,2,4) (arm lengths) or T_{2,3,5} (vertex counts with the centre), A~0, loop_path(3), loop_path2(4) or fork_loop(5)`,
    );
    this.name = "FamilyNameError";
  }
}

export function isSmithFamily(name: unknown): name is SmithFamily {
  return typeof name === "string" && Object.prototype.hasOwnProperty.call(SMITH_FAMILIES, name);
}

export function validParameter(family: SmithFamily, p: number): boolean {
  const info = SMITH_FAMILIES[family];
  return Number.isSafeInteger(p) && p >= info.min && (info.max === undefined || p <= info.max) && p <= 10_000_000;
}

/** Vertex count of a family member: the affine Ã, D̃, Ẽ have p + 1 vertices, the others p. */
export function familyOrder(family: SmithFamily, p: number): number {
  return family === "A~" || family === "D~" || family === "E~" ? p + 1 : p;
}

export const familyDisplay = (family: SmithFamily, p: number): string => SMITH_FAMILIES[family].display(p);

/**
 * Reads a family name as a person writes it. Spellings and what they mean:
 *   "E7", "E_7", "E(7)", "E_{7}"                      the Dynkin diagram E7;
 *   "E~7", "E~(7)", "E7~", "Ẽ7", "Ẽ_7", "\tilde{E}_7", "\tilde E_7", "affine E7", "E_7^{(1)}", "E7^(1)"
 *                                                    the affine (extended) diagram Ẽ7 (7 + 1 vertices);
 *   "E9", "E_9"                                      Ẽ8, as texts that continue the series E6, E7, E8 = T(1,2,k) write it;
 *   "T(a,b,c)"                                       the star-like tree with arms of a, b, c vertices besides the
 *                                                    centre (arm lengths, the convention of identify.ts: E8 = T(1,2,4));
 *   "T_{p,q,r}", "T_p,q,r", "T[p,q,r]"               the same tree by vertex counts of the arms *including* the
 *                                                    centre (the Coxeter-group convention: E8 = T_{2,3,5}, Ẽ8 = T_{2,3,6});
 *   "D̃5", "A~0", "loop_path(3)", "tadpole 3"        as before.
 * A T-spelling is accepted when the tree is one of the families (D_n, E6–E8, Ẽ6–Ẽ8; an empty arm gives A_n).
 * Returns null when the text is not a family name.
 */
export function parseFamilyName(text: string): { family: SmithFamily; parameter: number } | null {
  let t = text
    .normalize("NFD")
    .trim()
    .replace(/\u0303/g, "~");
  // LaTeX: \tilde{E}_8, \tilde E_8, \widetilde{E}_8; braces around subscripts.
  t = t.replace(/^\\(?:wide)?tilde\s*\{?\s*([ADE])\s*\}?/, "$1~").replace(/_\{\s*([^{}]*?)\s*\}/g, "_$1");
  const tree = readT(t);
  if (tree !== undefined) return tree;
  let affine = false;
  const prefix = /^affine\s+/i.exec(t);
  if (prefix) {
    affine = true;
    t = t.slice(prefix[0].length);
  }
  const kac = /\s*\^\s*\{?\s*\(\s*1\s*\)\s*\}?$/.exec(t); // untwisted affine, Kac's notation X_n^(1)
  if (kac) {
    affine = true;
    t = t.slice(0, kac.index);
  }
  const loop = /^(loop_path2|loop_path|fork_loop|tadpole)\s*[_(]?\s*(\d+)\s*\)?$/.exec(t);
  if (loop && !affine) {
    const family = (loop[1] === "tadpole" ? "loop_path" : loop[1]) as SmithFamily;
    const parameter = Number(loop[2]);
    return validParameter(family, parameter) ? { family, parameter } : null;
  }
  const m = /^([ADE])\s*(~?)\s*[_(]?\s*(\d+)\s*\)?\s*(~?)$/.exec(t);
  if (!m) return null;
  let parameter = Number(m[3]);
  let tilde = affine || m[2] === "~" || m[4] === "~";
  if (m[1] === "E" && parameter === 9 && !tilde) {
    tilde = true;
    parameter = 8;
  }
  const family = (m[1] + (tilde ? "~" : "")) as SmithFamily;
  return validParameter(family, parameter) ? { family, parameter } : null;
}

/** The family of the star-like tree with three arms of a <= b <= c vertices besides the centre, if it is one. */
export function starlikeFamily(arms: number[]): { family: SmithFamily; parameter: number } | null {
  if (arms.length !== 3 || arms.some((x) => !Number.isSafeInteger(x) || x < 0)) return null;
  const [a, b, c] = [...arms].sort((x, y) => x - y);
  const n = a + b + c + 1;
  if (a === 0) return validParameter("A", n) ? { family: "A", parameter: n } : null;
  if (a === 1 && b === 1) return validParameter("D", n) ? { family: "D", parameter: n } : null;
  if (a === 1 && b === 2 && c <= 4) return { family: "E", parameter: c + 4 };
  if (a === 2 && b === 2 && c === 2) return { family: "E~", parameter: 6 };
  if (a === 1 && b === 3 && c === 3) return { family: "E~", parameter: 7 };
  if (a === 1 && b === 2 && c === 5) return { family: "E~", parameter: 8 };
  return null;
}

/** "T(a,b,c)" (arm lengths) or "T_p,q,r" / "T[p,q,r]" (vertex counts with the centre); undefined when not a T-spelling. */
function readT(t: string): { family: SmithFamily; parameter: number } | null | undefined {
  const m = /^T\s*(?:(\()|(_|\[))\s*(\d+)\s*,\s*(\d+)\s*,\s*(\d+)\s*[)\]]?$/.exec(t);
  if (!m) return undefined;
  const arms = [m[3], m[4], m[5]].map(Number).map((x) => (m[1] ? x : x - 1));
  return starlikeFamily(arms);
}
