"use client";
import { useState } from "react";
import useSWR from "swr";
import { jsonFetcher } from "@/components/proof/api-client";
import type { StepFileView } from "@/lib/data/files";
import { formatBytes, refusalText, sendFile } from "./upload-request";

/**
 * The files uploaded to a claim (supporting documents, a claims file), with download links, read from the step's file
 * list (one request for the whole step, shared with its file list); with `partSize`, a control to upload one more.
 */
export function ClaimFiles({ proofId, stepId, claimId, partSize }: { proofId: number; stepId: number; claimId: number; partSize?: number }) {
  const key = `/api/proofs/${proofId}/steps/${stepId}/files`;
  const { data, mutate } = useSWR<{ files: StepFileView[] }>(key, jsonFetcher);
  const files = (data?.files ?? []).filter((f) => f.claimIds.includes(claimId));
  const [state, setState] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const send = async (file: File | undefined) => {
    if (!file || partSize === undefined) return;
    setProblem(null);
    try {
      const answer = await sendFile(
        proofId,
        stepId,
        file,
        "",
        partSize,
        (sent, total) => setState(`Sending “${file.name}”: ${formatBytes(sent)} of ${formatBytes(total)}`),
        claimId,
      );
      if (answer.status === 200 || answer.status === 201) await mutate();
      else setProblem(refusalText(answer));
    } catch (e) {
      setProblem((e as Error).message);
    } finally {
      setState(null);
    }
  };
  if (files.length === 0 && partSize === undefined) return null;
  return (
    <div className="mt-3 text-sm" data-testid="claim-files">
      {files.length > 0 && (
        <ul className="space-y-1">
          {files.map((f) => (
            <li key={f.id} className="flex flex-wrap gap-x-2">
              <a href={f.href} download={f.name} className="font-mono text-lichen-700 hover:underline">
                {f.name}
              </a>
              <span className="text-stone-600">{f.description}</span>
              <span className="text-stone-500">{formatBytes(f.size)}</span>
            </li>
          ))}
        </ul>
      )}
      {partSize !== undefined && (
        <label className="mt-1 inline-block cursor-pointer text-lichen-700 underline">
          Upload a file to this claim (a document or a claims file)
          <input type="file" className="sr-only" disabled={!!state} onChange={(e) => void send(e.target.files?.[0])} data-testid="claim-file-input" />
        </label>
      )}
      {state && <p aria-live="polite">{state}</p>}
      {problem && (
        <p role="alert" className="text-refuted">
          ✗ {problem}
        </p>
      )}
    </div>
  );
}
