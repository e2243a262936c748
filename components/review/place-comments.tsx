"use client";
/** The thread under the statement or under a case's condition on the overview: folded when empty, open once someone wrote. */
import { useRouter } from "next/navigation";
import type { CommentNode } from "@/lib/data/comment-tree";
import { send } from "@/components/proof/api-client";
import { CommentBox, CommentThread } from "./comment-thread";

interface Props {
  /** The place's comments route: /api/proofs/ID/statement/comments or /api/proofs/ID/cases/ID/comments. */
  url: string;
  anchor: string;
  /** "the statement" or "the condition of case 2.1". */
  what: string;
  digest: string;
  comments: CommentNode[];
}

const count = (nodes: CommentNode[]): number => nodes.reduce((n, c) => n + 1 + count(c.replies), 0);

export function PlaceComments({ url, anchor, what, digest, comments }: Props) {
  const router = useRouter();
  const total = count(comments);
  return (
    <details id={anchor} open={total > 0} className="mt-2 text-sm" data-testid="place-comments">
      <summary className="cursor-pointer text-xs text-lichen-700">{total === 0 ? `Comment on ${what}` : `Comments on ${what} (${total})`}</summary>
      <div className="mt-2 space-y-2">
        <CommentThread nodes={comments} commentsUrl={url} onChange={() => router.refresh()} />
        <CommentBox
          label={`Your comment on ${what}`}
          testId="place-comment-form"
          onSubmit={async (body) => {
            const res = await send(url, "POST", { body, digest });
            // A 409 means the text changed while the comment was written: show the new text, keep the draft.
            if (!res.ok) {
              if (res.status === 409) router.refresh();
              return res.error ?? "Not posted.";
            }
            router.refresh();
            return null;
          }}
        />
      </div>
    </details>
  );
}
