/**
 * The case tree of a proof: building it from flat rows and numbering it 1, 1.2, 1.2.3.
 * Pure functions, shared by pages, handlers and exports.
 */

/**
 * Step labels: a step is named by its case's number and a letter for its place in the case, in
 * parentheses: "3.2.1(a)" is the first step of case 3.2.1, "3.2.1(b)" the second. A dot or a bare
 * number would be ambiguous ("2.1.3" could as well be case 2.1.3); a letter in parentheses cannot be.
 *
 * Places past 26 go on as spreadsheet columns do (bijective base 26): (a)…(z), (aa), (ab)…(az),
 * (ba)…(zz), (aaa)… — so every place has exactly one letter string and every string of letters a-z
 * names exactly one place. This module owns the format: pages, API fields, exports, the timeline and
 * notifications all ask it, and nothing else builds or reads a label.
 */
const LETTERS = "abcdefghijklmnopqrstuvwxyz";

/** The letters of a place: 1 → "a", 26 → "z", 27 → "aa", 52 → "az", 53 → "ba", 703 → "aaa". */
export function placeLetters(place: number): string {
  if (!Number.isSafeInteger(place) || place < 1) throw new RangeError(`a step's place is a whole number from 1, not ${place}`);
  let out = "";
  for (let n = place; n > 0; n = Math.floor((n - 1) / 26)) out = LETTERS[(n - 1) % 26] + out;
  return out;
}

/** The place of a letter string ("a" → 1, "aa" → 27); null when it is not lower-case letters a-z. */
export function placeOfLetters(letters: string): number | null {
  if (!/^[a-z]{1,10}$/.test(letters)) return null;
  let n = 0;
  for (const ch of letters) n = n * 26 + (ch.charCodeAt(0) - 96);
  return n;
}

/** The label of a step: "2.1(c)" is the third step of case 2.1. */
export const stepLabel = (caseNumber: string, place: number): string => `${caseNumber}(${placeLetters(place)})`;

const LABEL = /^(\d+(?:\.\d+)*)\(([a-z]{1,10})\)$/;

/** Reads a label back into its case number and place; null for anything that is not a step label. */
export function parseStepLabel(label: string): { caseNumber: string; place: number } | null {
  const m = LABEL.exec(label.trim());
  return m ? { caseNumber: m[1], place: placeOfLetters(m[2])! } : null;
}

/**
 * The label of every step, its place being its rank among its case's steps by position (then id), as the
 * case tree, the step page and the claims table number them. Steps of unknown cases are left out.
 */
export function labelSteps(
  caseNumbers: ReadonlyMap<number, string>,
  steps: ReadonlyArray<{ id: number; caseId: number; position: number }>,
): Map<number, string> {
  const byCase = new Map<number, Array<{ id: number; position: number }>>();
  for (const s of steps) byCase.set(s.caseId, [...(byCase.get(s.caseId) ?? []), s]);
  const out = new Map<number, string>();
  for (const [caseId, list] of byCase) {
    const number = caseNumbers.get(caseId);
    if (number === undefined) continue;
    [...list].sort((a, b) => a.position - b.position || a.id - b.id).forEach((s, i) => out.set(s.id, stepLabel(number, i + 1)));
  }
  return out;
}

/**
 * Orders step labels as the proof reads: by case number part by part (a case's own steps before its
 * sub-cases), then by place ("1(b)" before "1(aa)"). Anything that is not a label sorts last, as text.
 */
export function compareStepLabels(a: string, b: string): number {
  const x = parseStepLabel(a),
    y = parseStepLabel(b);
  if (!x || !y) return x ? -1 : y ? 1 : a < b ? -1 : a > b ? 1 : 0;
  const xs = x.caseNumber.split(".").map(Number),
    ys = y.caseNumber.split(".").map(Number);
  for (let i = 0; i < Math.min(xs.length, ys.length); i++) if (xs[i] !== ys[i]) return xs[i] - ys[i];
  return xs.length - ys.length || x.place - y.place;
}

export interface CaseRow {
  id: number;
  parentId: number | null;
  position: number;
}

export type CaseNode<T extends CaseRow> = T & { number: string; depth: number; children: CaseNode<T>[] };

/** Nests rows by parent and numbers them by position among siblings. Orphans (a missing parent) are placed at the top level. */
export function buildCaseTree<T extends CaseRow>(rows: readonly T[]): CaseNode<T>[] {
  const ids = new Set(rows.map((r) => r.id));
  const byParent = new Map<number | null, T[]>();
  for (const r of rows) {
    const parent = r.parentId !== null && ids.has(r.parentId) ? r.parentId : null;
    const list = byParent.get(parent) ?? [];
    list.push(r);
    byParent.set(parent, list);
  }
  const build = (parent: number | null, prefix: string, depth: number, seen: Set<number>): CaseNode<T>[] =>
    (byParent.get(parent) ?? [])
      .slice()
      .sort((a, b) => a.position - b.position || a.id - b.id)
      .filter((r) => !seen.has(r.id))
      .map((r, i) => {
        const number = prefix ? `${prefix}.${i + 1}` : String(i + 1);
        seen.add(r.id);
        return { ...r, number, depth, children: build(r.id, number, depth + 1, seen) };
      });
  return build(null, "", 0, new Set());
}

/** Depth-first list of a tree, in reading order. */
export function flattenCaseTree<T extends CaseRow>(tree: CaseNode<T>[]): CaseNode<T>[] {
  return tree.flatMap((n) => [n, ...flattenCaseTree(n.children)]);
}

/**
 * Every case of flat rows in reading order, numbered 1, 1.2, 1.2.3, with its title. The rows may be model
 * instances: each is read field by field (spreading an instance would copy its internals, not its columns).
 */
export function numberedCases(rows: ReadonlyArray<CaseRow & { title: string }>): CaseNode<CaseRow & { title: string }>[] {
  return flattenCaseTree(buildCaseTree(rows.map((c) => ({ id: c.id, parentId: c.parentId, position: c.position, title: c.title }))));
}

/** Each case's number ("2.1") by its id, from flat rows (model instances are read field by field). */
export function caseNumbers(rows: ReadonlyArray<CaseRow>): Map<number, string> {
  return new Map(flattenCaseTree(buildCaseTree(rows.map((c) => ({ id: c.id, parentId: c.parentId, position: c.position })))).map((n) => [n.id, n.number]));
}

/**
 * The part of a numbered tree a reader may see: visible cases keep their numbers and their visible
 * descendants; an invisible case is replaced by its visible descendants. `null` means everything.
 */
export function pruneCaseTree<T extends CaseRow>(tree: CaseNode<T>[], visible: ReadonlySet<number> | null): CaseNode<T>[] {
  if (visible === null) return tree;
  return tree.flatMap((n) => {
    const children = pruneCaseTree(n.children, visible);
    return visible.has(n.id) ? [{ ...n, children }] : children;
  });
}

/**
 * The given cases and every case below them (the one definition of "everything below this case",
 * used for a referee's scope, for the cases hidden by a deletion and for what a deleted case holds).
 * Linear in the number of cases; a cycle in broken data cannot loop.
 */
export function casesBelow(roots: Iterable<number>, cases: ReadonlyArray<{ id: number; parentId: number | null }>): Set<number> {
  const children = new Map<number, number[]>();
  for (const c of cases) if (c.parentId !== null) children.set(c.parentId, [...(children.get(c.parentId) ?? []), c.id]);
  const out = new Set<number>();
  const stack = [...roots];
  while (stack.length > 0) {
    const id = stack.pop()!;
    if (out.has(id)) continue;
    out.add(id);
    stack.push(...(children.get(id) ?? []));
  }
  return out;
}

/** The overview's anchor of the thread on the statement (no case number) or on a case's condition. */
export const commentsAnchor = (caseNumber: string | null): string => (caseNumber === null ? "statement-comments" : `case-${caseNumber}-comments`);
