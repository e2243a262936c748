/**
 * The parts of one generation (augmentation.ts) as plain data: running one part, and merging the
 * results of all parts into the result of the whole.
 */
import { Graph } from "../graph";
import { GenerationOptions, GenerationResult, GenerationStatistics, generateConnected } from "./augmentation";

/** One part's result, plain data (it crosses process boundaries as JSON). */
export interface PartResult {
  readonly part: number;
  readonly parts: number;
  /** counts[k - 1] = graphs on k vertices this part found. */
  readonly counts: number[];
  /** The graphs found, per order, when collected (each as vertex count and weighted edges). */
  readonly levels?: Graph[][];
  /** With `levels`: the origin of each graph (its ancestor's index at the split level, −1 at or above it). */
  readonly origins?: number[][];
  readonly stats: GenerationStatistics;
}

/**
 * Part `part` (0-based) of `parts` independent parts of the generation (see the module comment: a
 * partition of the isomorphism classes by the subtrees below the split level). Pure: the job engine
 * runs the parts on different workers and the offline checker may re-run any of them.
 */
export function enumeratePart(options: Omit<GenerationOptions, "part">, part: number, parts: number): PartResult {
  const r = generateConnected({ ...options, part: { index: part, of: parts } });
  return { part, parts, counts: r.counts, ...(options.collect !== false ? { levels: r.levels, origins: r.origins } : {}), stats: r.stats };
}

/**
 * Merges the results of parts 0..k−1 of one enumeration (each exactly once) into the result of the
 * whole: counts add up, the lists are joined (the classes are disjoint across parts) in the order one
 * run in a single part reports them — by origin, then in each part's own order — when every part
 * gives its origins. Throws when a part is missing, repeated, or from a different split.
 */
export function mergeParts(results: readonly PartResult[]): GenerationResult {
  if (results.length === 0) throw new RangeError("no parts to merge");
  const parts = results[0].parts;
  const seen = new Array<boolean>(parts).fill(false);
  for (const r of results) {
    if (r.parts !== parts) throw new RangeError(`part ${r.part} is one of ${r.parts} parts, not of ${parts}`);
    if (!(r.part >= 0 && r.part < parts)) throw new RangeError(`part ${r.part} does not exist: parts are numbered 0..${parts - 1}`);
    if (seen[r.part]) throw new RangeError(`part ${r.part} is given twice`);
    seen[r.part] = true;
  }
  const missing = seen.indexOf(false);
  if (missing >= 0) throw new RangeError(`part ${missing} of ${parts} is missing`);
  const N = Math.max(...results.map((r) => r.counts.length));
  const counts = new Array<number>(N).fill(0);
  const levels: Graph[][] = Array.from({ length: N }, () => []);
  const origins: number[][] = Array.from({ length: N }, () => []);
  const stats: GenerationStatistics = { candidates: 0, invariantRejected: 0, labellings: 0, rowSum: 0, vector: 0, elimination: 0, splitLevel: 0 };
  const ordered = results.every((r) => r.levels && r.origins);
  for (const r of [...results].sort((a, b) => a.part - b.part)) {
    r.counts.forEach((c, i) => (counts[i] += c));
    r.levels?.forEach((l, i) => levels[i].push(...l));
    if (ordered) r.origins!.forEach((o, i) => origins[i].push(...o));
    // Every part repeats the levels up to the split level: their work is counted once (part 0's).
    for (const k of ["candidates", "invariantRejected", "labellings", "rowSum", "vector", "elimination"] as const)
      stats[k] += r.stats[k] - (r.part > 0 ? (r.stats.shared?.[k] ?? 0) : 0);
    stats.splitLevel = Math.max(stats.splitLevel, r.stats.splitLevel);
  }
  if (ordered)
    levels.forEach((level, i) => {
      // A split-level node belongs to one part, which reports its subtree in the single run's order; a stable sort by origin restores the rest.
      const order = level.map((_, j) => j).sort((a, b) => origins[i][a] - origins[i][b]);
      levels[i] = order.map((j) => level[j]);
      origins[i] = order.map((j) => origins[i][j]);
    });
  return { counts, levels, origins, stats };
}
