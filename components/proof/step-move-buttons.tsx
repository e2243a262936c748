"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { apiFetch } from "./api-client";

/** An author's ↑ ↓ for a step within its case; the tree renumbers after the move. */
export function StepMoveButtons({ proofId, stepId, label, first, last }: { proofId: number; stepId: number; label: string; first: boolean; last: boolean }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const move = async (direction: "up" | "down") => {
    setError(null);
    try {
      await apiFetch(`/api/proofs/${proofId}/steps/${stepId}`, { method: "PATCH", body: { move: direction } });
      router.refresh();
    } catch (e) {
      setError((e as Error).message);
    }
  };
  const button = "rounded border border-stone-300 px-1.5 hover:bg-stone-100 disabled:opacity-40";
  return (
    <span className="inline-flex items-center gap-1">
      <button type="button" className={button} disabled={first} onClick={() => void move("up")} aria-label={`move step ${label} up`}>
        ↑
      </button>
      <button type="button" className={button} disabled={last} onClick={() => void move("down")} aria-label={`move step ${label} down`}>
        ↓
      </button>
      {error && (
        <span role="alert" className="text-refuted">
          ✗ {error}
        </span>
      )}
    </span>
  );
}
