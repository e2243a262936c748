/**
 * The case tree of a proof: building it from flat rows and numbering it 1, 1.2, 1.2.3.
 * Pure functions, shared by pages, handlers and exports.
 */

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
