"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { MathEditor } from "./math-editor";
import type { Reference } from "./math-commands";
import { ApiError, apiFetch } from "@/components/proof/api-client";
import { MathMarkdown } from "@/components/markdown/math-markdown";

interface Latest {
  id: number;
  number: number;
  body: string;
  authorName: string;
}

/**
 * Edits a step. Every save is a new revision naming the one it was based on; if someone saved in
 * between, the server refuses (409) and this shows both texts, to merge or to overwrite knowingly.
 */
export function StepEditor({ proofId, stepId, latest, references }: { proofId: number; stepId: number; latest: Latest; references?: readonly Reference[] }) {
  const router = useRouter();
  const [text, setText] = useState(latest.body);
  const [baseId, setBaseId] = useState(latest.id);
  const [baseNumber, setBaseNumber] = useState(latest.number);
  const [theirs, setTheirs] = useState<Latest | null>(null);
  const [status, setStatus] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  const save = async (base: number) => {
    setSaving(true);
    setStatus(null);
    try {
      const { revision } = await apiFetch<{ revision: Latest }>(`/api/proofs/${proofId}/steps/${stepId}/revisions`, {
        method: "POST",
        body: { baseRevisionId: base, body: text },
      });
      setBaseId(revision.id);
      setBaseNumber(revision.number);
      setTheirs(null);
      setStatus(`Saved as revision ${revision.number}.`);
      router.refresh();
    } catch (e) {
      if (e instanceof ApiError && e.status === 409 && e.body.latest) setTheirs(e.body.latest as Latest);
      setStatus((e as Error).message);
    } finally {
      setSaving(false);
    }
  };

  const merge = () => {
    if (!theirs) return;
    setText(`${theirs.body}\n\n<!-- your text, from revision ${baseNumber}; merge it into the text above and delete this line -->\n\n${text}`);
    setBaseId(theirs.id);
    setBaseNumber(theirs.number);
    setTheirs(null);
    setStatus(`Both texts are in the editor: revision ${theirs.number} first, then yours. Edit, then save.`);
  };

  return (
    <section aria-label="edit this step" className="mt-4" data-testid="step-editor">
      <MathEditor value={text} onChange={setText} height={280} label="Step text" hint="Markdown with $…$ math" references={references} />
      <div className="mt-2 flex flex-wrap items-center gap-3">
        <button
          type="button"
          disabled={saving || text.trim() === ""}
          onClick={() => save(baseId)}
          className="rounded bg-lichen-700 px-3 py-1 text-white hover:bg-lichen-800 disabled:opacity-60"
        >
          {saving ? "Saving…" : "Save as new revision"}
        </button>
        <span className="font-mono text-xs text-stone-500">editing from revision {baseNumber}</span>
        {status && (
          <span className="text-sm" role="status">
            {status}
          </span>
        )}
      </div>
      {theirs && (
        <div className="mt-4 rounded border border-undecided/50 bg-amber-50 p-4" data-testid="save-conflict">
          <p className="font-semibold">
            ⚠ Revision {theirs.number} by {theirs.authorName} was saved while you were editing.
          </p>
          <div className="mt-3 grid gap-4 md:grid-cols-2">
            <div>
              <h4 className="text-sm font-semibold">Revision {theirs.number} (saved)</h4>
              <MathMarkdown source={theirs.body} className="rounded border border-stone-200 bg-white p-2 text-sm" />
            </div>
            <div>
              <h4 className="text-sm font-semibold">Your text (not saved)</h4>
              <MathMarkdown source={text} className="rounded border border-stone-200 bg-white p-2 text-sm" />
            </div>
          </div>
          <div className="mt-3 flex flex-wrap gap-3">
            <button type="button" onClick={merge} className="rounded border border-stone-400 bg-white px-3 py-1">
              Merge: put both texts in the editor
            </button>
            <button type="button" onClick={() => save(theirs.id)} className="rounded border border-refuted/60 bg-white px-3 py-1 text-refuted">
              Overwrite revision {theirs.number} knowingly
            </button>
          </div>
        </div>
      )}
    </section>
  );
}
