"use client";
/** A thread of comments with replies, in sanitised Markdown with math, and a box to add to it. */
import { useState } from "react";
import { MathMarkdown } from "@/components/markdown/math-markdown";
import type { CommentNode } from "@/lib/data/review-panel";
import { send } from "@/components/proof/api-client";

export function CommentBox({ label, onSubmit, testId }: { label: string; onSubmit: (body: string) => Promise<string | null>; testId?: string }) {
  const [body, setBody] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <form
      className="mt-2 space-y-1"
      data-testid={testId}
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        const failure = await onSubmit(body);
        setBusy(false);
        setError(failure);
        if (!failure) setBody("");
      }}
    >
      <label className="block text-xs font-semibold text-stone-600">
        {label}
        <textarea
          value={body}
          onChange={(e) => setBody(e.target.value)}
          rows={3}
          className="mt-1 block w-full rounded border border-stone-300 bg-white px-2 py-1 font-mono text-sm"
          placeholder="Markdown with $math$"
        />
      </label>
      {error && (
        <p role="alert" className="text-sm text-refuted">
          {error}
        </p>
      )}
      <button
        type="submit"
        disabled={busy || !body.trim()}
        className="rounded border border-stone-300 bg-white px-3 py-1 text-sm hover:bg-stone-50 disabled:opacity-50"
      >
        {busy ? "Posting…" : "Post"}
      </button>
    </form>
  );
}

interface ThreadProps {
  nodes: CommentNode[];
  commentsUrl: string;
  reviewId?: number;
  onChange: () => void;
}

export function CommentThread({ nodes, commentsUrl, reviewId, onChange }: ThreadProps) {
  return (
    <ol className="space-y-2">
      {nodes.map((n) => (
        <CommentItem key={n.id} node={n} commentsUrl={commentsUrl} reviewId={reviewId} onChange={onChange} />
      ))}
    </ol>
  );
}

function CommentItem({ node, commentsUrl, reviewId, onChange }: { node: CommentNode } & Omit<ThreadProps, "nodes">) {
  const [replying, setReplying] = useState(false);
  return (
    <li className="rounded border border-stone-200 bg-white px-3 py-2" data-testid="comment">
      <p className="font-mono text-xs text-stone-500">
        {node.authorName} · {new Date(node.at).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}
        {node.revisionNumber !== null && ` · on revision ${node.revisionNumber}`}
      </p>
      <MathMarkdown source={node.body} className="text-sm" />
      <button type="button" className="mt-1 text-xs text-lichen-700 underline" onClick={() => setReplying((r) => !r)}>
        {replying ? "Cancel reply" : "Reply"}
      </button>
      {replying && (
        <CommentBox
          label="Your reply"
          onSubmit={async (body) => {
            const res = await send(commentsUrl, "POST", { body, parentId: node.id, reviewId: reviewId ?? null });
            if (!res.ok) return res.error ?? "Not posted.";
            setReplying(false);
            onChange();
            return null;
          }}
        />
      )}
      {node.replies.length > 0 && (
        <div className="mt-2 border-l-2 border-stone-200 pl-3">
          <CommentThread nodes={node.replies} commentsUrl={commentsUrl} reviewId={reviewId} onChange={onChange} />
        </div>
      )}
    </li>
  );
}
