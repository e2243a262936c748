"use client";
import { useState } from "react";
import useSWR, { useSWRConfig } from "swr";
import { apiFetch, jsonFetcher } from "@/components/proof/api-client";
import type { StepFileView } from "@/lib/data/files";
import { formatBytes } from "./upload-request";

/** The files uploaded to a step, each with what its content is and a download link (members only). */
export function FileList({
  proofId,
  stepId,
  initial,
  canAttach = false,
}: {
  proofId: number;
  stepId: number;
  initial: StepFileView[];
  /** Offer "attach its claims" on claims files (those who may upload). */
  canAttach?: boolean;
}) {
  const { data } = useSWR<{ files: StepFileView[] }>(`/api/proofs/${proofId}/steps/${stepId}/files`, jsonFetcher, { fallbackData: { files: initial } });
  const { mutate } = useSWRConfig();
  const [said, setSaid] = useState<string | null>(null);
  const files = data?.files ?? initial;
  const attach = async (f: StepFileView) => {
    setSaid(null);
    try {
      const { claims } = await apiFetch<{ claims: unknown[] }>(`/api/proofs/${proofId}/files/${f.id}/claims`, { method: "POST" });
      setSaid(`Attached ${claims.length} ${claims.length === 1 ? "claim" : "claims"} from “${f.name}”; the checker is working on them.`);
      await mutate(`/api/proofs/${proofId}/steps/${stepId}/claims`);
    } catch (e) {
      setSaid(`✗ ${(e as Error).message}`);
    }
  };
  return (
    <section className="mt-8" aria-labelledby="files-heading">
      <h2 id="files-heading" className="text-lg font-semibold">
        Files
      </h2>
      {files.length === 0 ? (
        <p className="text-sm text-stone-600">No file has been uploaded to this step.</p>
      ) : (
        <ul className="mt-2 divide-y divide-stone-200 rounded border border-stone-200 bg-white" data-testid="file-list">
          {files.map((f) => (
            <li key={f.id} className="flex flex-wrap items-baseline gap-x-3 px-3 py-2 text-sm">
              <a href={f.href} className="font-mono text-lichen-700 hover:underline" download={f.name}>
                {f.name}
              </a>
              <span>{f.description}</span>
              <span className="text-stone-500">{formatBytes(f.size)}</span>
              <span className="text-stone-500">
                by {f.uploaderName ?? "someone"} · {new Date(f.createdAt).toISOString().slice(0, 10)}
              </span>
              <span className="font-mono text-xs text-stone-400" title="SHA-256 of the bytes">
                {f.sha256.slice(0, 12)}…
              </span>
              {canAttach && f.kind === "claims" && (
                <button type="button" onClick={() => void attach(f)} className="text-lichen-700 underline" data-testid="attach-file-claims">
                  attach its claims to this step
                </button>
              )}
            </li>
          ))}
        </ul>
      )}
      {said && (
        <p className="mt-2 text-sm" aria-live="polite" data-testid="attach-file-message">
          {said}
        </p>
      )}
    </section>
  );
}
