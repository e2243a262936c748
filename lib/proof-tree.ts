/**
 * The case tree of a proof: building it from flat rows and numbering it 1, 1.2, 1.2.3.
 * Pure functions, shared by pages, handlers and exports.
 */

/**
 * The label of a step: its case's number, a colon, and its place in the case ("2.1:3" is the third
 * step of case 2.1). A dot would be ambiguous: "2.1.3" could as well be case 2.1.3.
 */
export const stepLabel = (caseNumber: string, place: number): string => `${caseNumber}:${place}`;

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

/** Orders step labels as the proof reads: by case number part by part (a case before its sub-cases), then by place. */
export function compareStepLabels(a: string, b: string): number {
  const parts = (label: string) => {
    const [caseNumber, place] = label.split(":");
    return { caseParts: caseNumber.split(".").map(Number), place: Number(place) };
  };
  const x = parts(a),
    y = parts(b);
  for (let i = 0; i < Math.min(x.caseParts.length, y.caseParts.length); i++) if (x.caseParts[i] !== y.caseParts[i]) return x.caseParts[i] - y.caseParts[i];
  return x.caseParts.length - y.caseParts.length || x.place - y.place;
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
