"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { ApiError, apiFetch } from "./api-client";
import { AddCaseForm } from "./add-case-form";
import { AddStepForm } from "./add-step-form";
import { EditCaseForm } from "./edit-case-form";
import { useMoveTargets } from "./case-targets";

type Pending = { what: "delete" } | { what: "move"; parentId: number | null };

/** An author's controls on one case: sub-case, step, reorder, move under another case, delete (confirmed when it holds work). */
export function CaseActions({
  proofId,
  caseId,
  number,
  first,
  last,
  title,
  condition,
  predicate,
}: {
  proofId: number;
  caseId: number;
  number: string;
  first: boolean;
  last: boolean;
  title: string;
  condition: string;
  /** The stored machine-readable condition (JSON text), or null. */
  predicate: string | null;
}) {
  const router = useRouter();
  const [open, setOpen] = useState<"case" | "step" | "edit" | null>(null);
  const [confirming, setConfirming] = useState<{ pending: Pending; message: string } | null>(null);
  const [error, setError] = useState<string | null>(null);
  // The menu's options are built when it is first focused: the page carries the list of cases once, not once per case.
  const [menuOpened, setMenuOpened] = useState(false);
  const targets = useMoveTargets(caseId, number);
  const url = `/api/proofs/${proofId}/cases/${caseId}`;

  const run = async (pending: Pending | { what: "reorder"; move: "up" | "down" }, confirm = false) => {
    setError(null);
    try {
      if (pending.what === "delete") await apiFetch(url, { method: "DELETE", body: { confirm } });
      else if (pending.what === "move") await apiFetch(url, { method: "PATCH", body: { parentId: pending.parentId, confirm } });
      else await apiFetch(url, { method: "PATCH", body: { move: pending.move } });
      setConfirming(null);
      router.refresh();
    } catch (e) {
      if (e instanceof ApiError && e.body.needsConfirmation && pending.what !== "reorder") setConfirming({ pending, message: e.message });
      else setError((e as Error).message);
    }
  };

  const button = "rounded border border-stone-300 px-2 py-0.5 hover:bg-stone-100 disabled:opacity-40";
  return (
    <div className="mt-2 text-xs" data-testid={`case-actions-${number}`}>
      <div className="flex flex-wrap items-center gap-2">
        <button type="button" className={button} onClick={() => setOpen(open === "step" ? null : "step")}>
          + Step
        </button>
        <button type="button" className={button} onClick={() => setOpen(open === "case" ? null : "case")}>
          + Sub-case
        </button>
        <button type="button" className={button} onClick={() => setOpen(open === "edit" ? null : "edit")}>
          ✎ Edit
        </button>
        <button type="button" className={button} disabled={first} onClick={() => run({ what: "reorder", move: "up" })} aria-label={`move case ${number} up`}>
          ↑
        </button>
        <button type="button" className={button} disabled={last} onClick={() => run({ what: "reorder", move: "down" })} aria-label={`move case ${number} down`}>
          ↓
        </button>
        <select
          className="rounded border border-stone-300 bg-white px-1 py-0.5"
          aria-label={`move case ${number} under`}
          value=""
          onFocus={() => setMenuOpened(true)}
          onPointerDown={() => setMenuOpened(true)}
          onChange={(e) => run({ what: "move", parentId: e.target.value === "top" ? null : Number(e.target.value) })}
        >
          <option value="">move under…</option>
          <option value="top">top level</option>
          {menuOpened &&
            targets.map((t) => (
              <option key={t.id} value={t.id}>
                → {t.number}
              </option>
            ))}
        </select>
        <button type="button" className={`${button} text-refuted`} onClick={() => run({ what: "delete" })}>
          ✗ Delete
        </button>
      </div>
      {confirming && (
        <div role="alertdialog" aria-label="confirm" className="mt-2 rounded border border-undecided/50 bg-amber-50 p-2">
          <p>⚠ {confirming.message}</p>
          <div className="mt-1 flex gap-2">
            <button type="button" className={`${button} bg-white`} onClick={() => run(confirming.pending, true)}>
              Yes, {confirming.pending.what === "delete" ? "delete" : "move"} it
            </button>
            <button type="button" className={`${button} bg-white`} onClick={() => setConfirming(null)}>
              Cancel
            </button>
          </div>
        </div>
      )}
      {error && (
        <p role="alert" className="mt-1 text-refuted">
          {error}
        </p>
      )}
      {open === "case" && <AddCaseForm proofId={proofId} parentId={caseId} onDone={() => setOpen(null)} />}
      {open === "step" && <AddStepForm proofId={proofId} caseId={caseId} />}
      {open === "edit" && (
        <EditCaseForm proofId={proofId} caseId={caseId} initial={{ title, condition, predicate: predicate ?? "" }} onDone={() => setOpen(null)} />
      )}
    </div>
  );
}
