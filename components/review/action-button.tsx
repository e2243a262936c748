"use client";
/** A button that calls one API route and refreshes the page (retry a mail, share the whole proof, remove a member). */
import { useState } from "react";
import { useRouter } from "next/navigation";
import { send } from "@/components/proof/api-client";

export function ActionButton({
  url,
  method = "POST",
  label,
  doneText,
  body,
  confirmText,
}: {
  url: string;
  method?: string;
  label: string;
  doneText?: string;
  body?: unknown;
  confirmText?: string;
}) {
  const router = useRouter();
  const [state, setState] = useState<{ busy: boolean; error: string | null; done: boolean }>({ busy: false, error: null, done: false });
  return (
    <span className="inline-flex items-center gap-2">
      <button
        type="button"
        disabled={state.busy}
        onClick={async () => {
          if (confirmText && !window.confirm(confirmText)) return;
          setState({ busy: true, error: null, done: false });
          const res = await send(url, method, body);
          setState({ busy: false, error: res.ok ? null : (res.error ?? "Failed."), done: res.ok });
          if (res.ok) router.refresh();
        }}
        className="rounded border border-stone-300 bg-white px-2 py-0.5 text-xs hover:bg-stone-50 disabled:opacity-60"
      >
        {label}
      </button>
      {state.done && doneText && <span className="text-xs text-stone-600">{doneText}</span>}
      {state.error && (
        <span role="alert" className="text-xs text-refuted">
          {state.error}
        </span>
      )}
    </span>
  );
}
