"use client";
import { useEffect, useRef, useState } from "react";
import { useRouter } from "next/navigation";
import { ApiError, apiFetch } from "./api-client";
import { AddCaseForm } from "./add-case-form";
import { AddStepForm } from "./add-step-form";
import { EditCaseForm } from "./edit-case-form";
import { useMoveTargets } from "./case-targets";
import { Choice } from "@/components/ui/choice";

type Pending = { what: "delete" } | { what: "move"; parentId: number | null };

/**
 * An author's controls on one case, gathered in one menu (a native <details>, so it opens by keyboard and works
 * before the script loads): step, sub-case, edit, reorder, move under another case, delete (confirmed when it holds work).
 */
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
  // The menu's choices (and the "move under" options) are built when it is first opened: the page carries the list of cases once, not once per case.
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

  const menu = useRef<HTMLDetailsElement>(null);
  // Opened before the script ran: show the choices as soon as it runs.
  useEffect(() => {
    if (menu.current?.open) setMenuOpened(true);
  }, []);
  /** Each choice closes the menu: the form or the confirmation it opens shows below it. */
  const choose = (action: () => void) => () => {
    if (menu.current) menu.current.open = false;
    action();
  };
  const button = "rounded border border-stone-300 px-2 py-0.5 hover:bg-stone-100 disabled:opacity-40";
  const item = "rounded px-2 py-1 text-left hover:bg-stone-100 disabled:opacity-40";
  return (
    <div className="mt-2 text-xs" data-testid={`case-actions-${number}`}>
      <details ref={menu} className="inline-block" onToggle={(e) => e.currentTarget.open && setMenuOpened(true)}>
        <summary className="cursor-pointer rounded border border-stone-300 px-2 py-0.5 text-stone-700 hover:bg-stone-100">Change case {number} ▾</summary>
        {/* The choices are rendered once the menu is first opened: an outline of many cases carries one summary per case. */}
        {menuOpened && (
          <div
            className="mt-1 flex flex-wrap items-center gap-1 rounded border border-stone-200 bg-white p-1"
            role="group"
            aria-label={`Changes to case ${number}`}
          >
            <button type="button" className={item} onClick={choose(() => setOpen(open === "step" ? null : "step"))}>
              Add a step
            </button>
            <button type="button" className={item} onClick={choose(() => setOpen(open === "case" ? null : "case"))}>
              Add a sub-case
            </button>
            <button type="button" className={item} onClick={choose(() => setOpen(open === "edit" ? null : "edit"))}>
              Edit title and condition
            </button>
            {(
              [
                ["up", "↑ Move up", first],
                ["down", "↓ Move down", last],
              ] as const
            ).map(([move, words, disabled]) => (
              <button
                key={move}
                type="button"
                className={item}
                disabled={disabled}
                onClick={choose(() => run({ what: "reorder", move }))}
                aria-label={`move case ${number} ${move}`}
              >
                {words}
              </button>
            ))}
            <Choice
              className="rounded border border-stone-300 bg-white px-1 py-0.5"
              aria-label={`move case ${number} under`}
              value=""
              onChange={(e) => choose(() => run({ what: "move", parentId: e.target.value === "top" ? null : Number(e.target.value) }))()}
              options={[["", "Move under…"], ["top", "top level"], ...targets.map((t) => [String(t.id), `→ ${t.number}`] as const)]}
            />
            <button type="button" className={`${item} text-refuted`} onClick={choose(() => run({ what: "delete" }))}>
              Delete case…
            </button>
          </div>
        )}
      </details>
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
