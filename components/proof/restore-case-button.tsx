"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { apiFetch } from "./api-client";

/** Brings a deleted case back (authors); a refusal (its parent is deleted too) is shown beside the button. */
export function RestoreCaseButton({ proofId, caseId }: { proofId: number; caseId: number }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const restore = async () => {
    setBusy(true);
    setError(null);
    try {
      await apiFetch(`/api/proofs/${proofId}/cases/${caseId}/restore`, { method: "POST" });
      router.refresh();
    } catch (e) {
      setError((e as Error).message);
    } finally {
      setBusy(false);
    }
  };
  return (
    <>
      <button
        type="button"
        onClick={restore}
        disabled={busy}
        className="ml-2 rounded border border-stone-300 px-2 py-0.5 text-xs hover:bg-stone-100 disabled:opacity-40"
      >
        ↺ Restore
      </button>
      {error && (
        <span role="alert" className="ml-2 text-refuted">
          ✗ {error}
        </span>
      )}
    </>
  );
}
