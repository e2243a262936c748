"use client";
/** A referee's report for the open round: save as draft, submit once, then start a correction (a new version). */
import { useState } from "react";
import { useRouter } from "next/navigation";
import { send } from "@/components/proof/api-client";
import type { Recommendation } from "@/lib/review/rounds";
import { RecommendationSelect, TextField } from "./round-fields";

export interface ReportDraft {
  body: string;
  recommendation: Recommendation | null;
  editorNote?: string;
  state: "draft" | "submitted";
  version: number;
}

export function ReportForm({ proofId, round, latest }: { proofId: number; round: number; latest: ReportDraft | null }) {
  const router = useRouter();
  const [body, setBody] = useState(latest?.body ?? "");
  const [recommendation, setRecommendation] = useState<string>(latest?.recommendation ?? "");
  const [editorNote, setEditorNote] = useState(latest?.editorNote ?? "");
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const base = `/api/proofs/${proofId}/rounds/${round}/report`;
  const submitted = latest?.state === "submitted";
  const save = async () => {
    const res = await send(base, "PUT", { body, recommendation: recommendation || null, editorNote });
    setMessage(res.ok ? { ok: true, text: "Draft saved." } : { ok: false, text: res.error ?? "Not saved." });
    return res.ok;
  };
  const act = async (url: string, done: string) => {
    const res = await send(url, "POST");
    setMessage(res.ok ? { ok: true, text: done } : { ok: false, text: res.error ?? "Failed." });
    if (res.ok) router.refresh();
  };
  if (submitted)
    return (
      <div className="space-y-2" data-testid="report-submitted">
        <p className="text-sm">
          Version {latest.version} of your report is submitted and read-only. A correction starts version {latest.version + 1}; both are kept.
        </p>
        <button
          type="button"
          onClick={() => act(`${base}/corrections`, "Correction started.")}
          className="rounded border border-stone-300 bg-white px-3 py-1 text-sm hover:bg-stone-50"
        >
          Start a correction
        </button>
        {message && (
          <p role={message.ok ? "status" : "alert"} className={`text-sm ${message.ok ? "text-verified" : "text-refuted"}`}>
            {message.text}
          </p>
        )}
      </div>
    );
  return (
    <form className="space-y-3" data-testid="report-form" onSubmit={(e) => e.preventDefault()}>
      <TextField
        name="body"
        label={
          <>
            <span className="font-semibold">Your report</span>{" "}
            <span className="text-stone-600">(Markdown with $math$; the authors read it once the editor decides and attaches it)</span>
          </>
        }
        value={body}
        onChange={setBody}
        rows={10}
      />
      <RecommendationSelect name="recommendation" label="Recommendation" value={recommendation} onChange={setRecommendation} />
      <TextField
        name="editorNote"
        label={
          <>
            <span className="font-semibold">Note for the editors only</span>{" "}
            <span className="text-stone-600">(never shown to the authors or to other referees)</span>
          </>
        }
        value={editorNote}
        onChange={setEditorNote}
        rows={3}
        mono={false}
      />
      <div className="flex gap-2">
        <button
          type="button"
          onClick={async () => {
            if (await save()) router.refresh();
          }}
          className="rounded border border-stone-300 bg-white px-3 py-1 text-sm hover:bg-stone-50"
        >
          Save draft
        </button>
        <button
          type="button"
          onClick={async () => {
            if (await save()) await act(`${base}/submit`, "Report submitted.");
          }}
          className="rounded bg-lichen-700 px-3 py-1 text-sm text-white hover:bg-lichen-800"
        >
          Submit report
        </button>
      </div>
      {message && (
        <p role={message.ok ? "status" : "alert"} className={`text-sm ${message.ok ? "text-verified" : "text-refuted"}`}>
          {message.text}
        </p>
      )}
    </form>
  );
}
