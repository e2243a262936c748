"use client";
/** The editor's forms on the rounds page: open a round, record a decision, blind review and reminders. */
import { useState, type FormHTMLAttributes, type ReactNode } from "react";
import { useRouter } from "next/navigation";
import { send } from "@/components/proof/api-client";
import { RecommendationSelect, TextField } from "./round-fields";

/** A form that sends `body()` to `url` when submitted, refreshes the page when saved, and says how it went after its fields. */
function SendForm({
  url,
  method,
  body,
  done,
  children,
  ...form
}: { url: string; method: string; body: () => unknown; done: string; children: ReactNode } & Omit<FormHTMLAttributes<HTMLFormElement>, "onSubmit">) {
  const router = useRouter();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const submit = async () => {
    const res = await send(url, method, body());
    setMessage(res.ok ? { ok: true, text: done } : { ok: false, text: res.error ?? "Not saved." });
    if (res.ok) router.refresh();
  };
  return (
    <form
      {...form}
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
    >
      {children}
      {message && (
        <p role={message.ok ? "status" : "alert"} className={`text-sm ${message.ok ? "text-verified" : "text-refuted"}`}>
          {message.text}
        </p>
      )}
    </form>
  );
}

/** A number of days (0–60) inside a sentence. */
function DaysField({ value, onChange }: { value: string; onChange: (v: string) => void }) {
  return (
    <input type="number" min={0} max={60} value={value} onChange={(e) => onChange(e.target.value)} className="w-14 rounded border border-stone-300 px-1" />
  );
}

const button = "rounded border border-stone-300 bg-white px-3 py-1 text-sm hover:bg-stone-50";

export function OpenRoundForm({ proofId, next }: { proofId: number; next: number }) {
  const [dueAt, setDueAt] = useState("");
  return (
    <SendForm
      data-testid="open-round"
      className="flex flex-wrap items-end gap-2"
      url={`/api/proofs/${proofId}/rounds`}
      method="POST"
      body={() => ({ dueAt })}
      done={`Round ${next} opened.`}
    >
      <label className="text-sm">
        <span className="block font-semibold">Reports for round {next} due on</span>
        <input type="date" name="dueAt" value={dueAt} onChange={(e) => setDueAt(e.target.value)} className="mt-1 rounded border border-stone-300 px-2 py-1" />
      </label>
      <button type="submit" className={button}>
        Open round {next}
      </button>
    </SendForm>
  );
}

export function DecisionForm({ proofId, round }: { proofId: number; round: number }) {
  const [decision, setDecision] = useState("");
  const [letter, setLetter] = useState("");
  const [attachReports, setAttach] = useState(true);
  return (
    <SendForm
      data-testid="decision-form"
      className="space-y-2"
      url={`/api/proofs/${proofId}/rounds/${round}/decision`}
      method="POST"
      body={() => ({ decision, letter, attachReports })}
      done="Decision recorded; the authors were mailed."
    >
      <RecommendationSelect name="decision" label="Decision" value={decision} onChange={setDecision} />
      <TextField
        name="letter"
        label={
          <>
            <span className="font-semibold">Letter to the authors</span> (Markdown with $math$)
          </>
        }
        value={letter}
        onChange={setLetter}
        rows={6}
      />
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="attachReports" checked={attachReports} onChange={(e) => setAttach(e.target.checked)} />
        Attach the submitted reports (named as the blind setting allows; notes for the editors never go out)
      </label>
      <button type="submit" className={button}>
        Record the decision and mail the authors
      </button>
    </SendForm>
  );
}

export function ReviewPolicyForm({ proofId, blind, before, after }: { proofId: number; blind: boolean; before: number; after: number }) {
  const [b, setB] = useState(blind);
  const [days, setDays] = useState({ before: String(before), after: String(after) });
  return (
    <SendForm
      data-testid="review-policy"
      className="flex flex-wrap items-end gap-3"
      url={`/api/proofs/${proofId}/review-policy`}
      method="PATCH"
      body={() => ({ blind: b, remindBeforeDays: Number(days.before), remindAfterDays: Number(days.after) })}
      done="Saved."
    >
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" name="blind" checked={b} onChange={(e) => setB(e.target.checked)} />
        Blind review: authors see referees as “Referee 1, 2, …”
      </label>
      <label className="text-sm">
        Remind <DaysField value={days.before} onChange={(before) => setDays({ ...days, before })} /> days before
      </label>
      <label className="text-sm">
        and <DaysField value={days.after} onChange={(after) => setDays({ ...days, after })} /> days after a due date
      </label>
      <button type="submit" className={button}>
        Save
      </button>
    </SendForm>
  );
}

export function RefereeDueForm({ proofId, round, refereeId, current }: { proofId: number; round: number; refereeId: number; current: string }) {
  const [dueAt, setDueAt] = useState(current.slice(0, 10));
  return (
    <SendForm
      className="inline-flex items-center gap-1"
      url={`/api/proofs/${proofId}/rounds/${round}/referees/${refereeId}`}
      method="PATCH"
      body={() => ({ dueAt })}
      done="Moved."
    >
      <input
        type="date"
        aria-label="Due date"
        value={dueAt}
        onChange={(e) => setDueAt(e.target.value)}
        className="rounded border border-stone-300 px-1 text-xs"
      />
      <button type="submit" className="rounded border border-stone-300 bg-white px-2 py-0.5 text-xs hover:bg-stone-50">
        Move
      </button>
    </SendForm>
  );
}
