import "server-only";
/** Comment rows as threads (replies under their parent), the shape every comment thread is shown in. */
import type { NameLens } from "./blind";

export interface CommentNode {
  id: number;
  authorName: string;
  authorId: number;
  body: string;
  revisionNumber: number | null;
  at: string;
  replies: CommentNode[];
}

interface CommentRow {
  id: number;
  parentId: number | null;
  authorId: number;
  body: string;
  revisionId: number | null;
  createdAt: Date;
}

/** Threads of these rows (in their order), the authors named through the viewer's blind-review lens. */
export function commentTree(
  rows: readonly CommentRow[],
  names: ReadonlyMap<number, string>,
  lens: NameLens,
  revisionNumber?: ReadonlyMap<number, number>,
): CommentNode[] {
  const nodes = new Map<number, CommentNode>(
    rows.map((c) => [
      c.id,
      {
        id: c.id,
        authorId: lens.id(c.authorId),
        authorName: names.get(c.authorId) ?? "",
        body: c.body,
        revisionNumber: c.revisionId && revisionNumber ? (revisionNumber.get(c.revisionId) ?? null) : null,
        at: c.createdAt.toISOString(),
        replies: [],
      },
    ]),
  );
  const roots: CommentNode[] = [];
  for (const c of rows) (c.parentId && nodes.has(c.parentId) ? nodes.get(c.parentId)!.replies : roots).push(nodes.get(c.id)!);
  return roots;
}
