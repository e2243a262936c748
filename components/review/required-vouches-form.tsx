"use client";
/** The editor sets the number of vouches each step needs. */
import { useState } from "react";
import { useRouter } from "next/navigation";
import { send } from "@/components/proof/api-client";

export function RequiredApprovalsForm({ proofId, current }: { proofId: number; current: number }) {
  const router = useRouter();
  const [value, setValue] = useState(String(current));
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      data-testid="required-vouches"
      onSubmit={async (e) => {
        e.preventDefault();
        const res = await send(`/api/proofs/${proofId}/settings`, "PATCH", { requiredApprovals: Number(value) });
        setMessage(res.ok ? { ok: true, text: "Saved." } : { ok: false, text: res.error ?? "Not saved." });
        if (res.ok) router.refresh();
      }}
    >
      <label className="text-sm">
        <span className="block font-semibold">Vouches required per step</span>
        <input
          type="number"
          min={1}
          max={9}
          value={value}
          onChange={(e) => setValue(e.target.value)}
          className="mt-1 w-20 rounded border border-stone-300 px-2 py-1 font-mono"
        />
      </label>
      <button type="submit" className="rounded border border-stone-300 bg-white px-3 py-1 text-sm hover:bg-stone-50">
        Save
      </button>
      {message && (
        <span role={message.ok ? "status" : "alert"} className={`text-sm ${message.ok ? "text-verified" : "text-refuted"}`}>
          {message.text}
        </span>
      )}
    </form>
  );
}
