"use client";
import { useState, useTransition } from "react";
import { useRouter } from "next/navigation";
import type { ExportKind } from "@/lib/core/certificates/bundle";
import type { ExportActionResult } from "@/lib/validations/export";

/**
 * The two export buttons. Certified is offered only when the proof is ready; a refusal shows its reasons.
 * The page hands in its server action (`create`), so this component imports nothing from a route.
 */
export function ExportActions({
  proofId,
  ready,
  create,
}: {
  proofId: number;
  ready: boolean;
  create: (proofId: number, kind: ExportKind) => Promise<ExportActionResult>;
}) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [result, setResult] = useState<ExportActionResult | null>(null);
  const run = (kind: ExportKind) =>
    start(async () => {
      const r = await create(proofId, kind);
      setResult(r);
      if (r.ok) router.refresh();
    });
  const button = "rounded border px-4 py-2 font-semibold disabled:cursor-not-allowed disabled:opacity-50";
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-3">
        <button
          type="button"
          className={`${button} border-lichen-600 bg-lichen-600 text-white hover:bg-lichen-700`}
          disabled={pending || !ready}
          onClick={() => run("certified")}
        >
          ▲ Export certified
        </button>
        <button
          type="button"
          className={`${button} border-stone-400 bg-white text-stone-800 hover:bg-stone-100`}
          disabled={pending}
          onClick={() => run("draft")}
        >
          △ Export draft
        </button>
        {pending && (
          <span className="self-center text-sm text-stone-600" aria-live="polite">
            Sealing the bundle…
          </span>
        )}
      </div>
      {result?.ok && (
        <p role="status" className="text-sm text-verified" data-testid="export-made">
          ✓ Export #{result.exportId} made; manifest digest <span className="break-all font-mono">{result.manifestDigest}</span>
        </p>
      )}
      {result && !result.ok && (
        <div role="alert" className="rounded border border-refuted/40 bg-red-50 p-3 text-sm" data-testid="export-refused">
          <p>✗ {result.message}</p>
        </div>
      )}
    </div>
  );
}
