"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { send } from "./api-client";

/** Clears the "since your last visit" list up to the newest change it showed (a later change stays listed). */
export function MarkSeenButton({ proofId, through }: { proofId: number; through: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <div className="mt-2">
      <button
        type="button"
        disabled={busy}
        className="rounded border border-stone-300 bg-white px-3 py-1 text-sm hover:bg-stone-50 disabled:opacity-50"
        onClick={async () => {
          setBusy(true);
          const res = await send(`/api/proofs/${proofId}/changes`, "POST", { through });
          setBusy(false);
          if (!res.ok) return setError(res.error ?? "Not saved.");
          router.refresh();
        }}
      >
        Mark as seen
      </button>
      {error && (
        <p role="alert" className="text-sm text-refuted">
          {error}
        </p>
      )}
    </div>
  );
}
