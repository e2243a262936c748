"use client";
import { useRef, useState } from "react";
import { useSWRConfig } from "swr";
import { formatBytes, refusalText, sendFile } from "./upload-request";

const KINDS = [
  { value: "", label: "decide by its content" },
  { value: "graph-list", label: "graph list (graph6, sparse6, edge lists; gzip allowed)" },
  { value: "claims", label: "claims file (cairn-claims/1)" },
  { value: "document", label: "document (PDF, PNG, plain text, TeX)" },
];

/**
 * Upload a file to a step: drop it on the area or choose it, watch the bytes go up, then see it in
 * the step's files. The server decides the type from the content and says so; a refusal says why.
 */
export function FileUpload({ proofId, stepId, partSize }: { proofId: number; stepId: number; /** Files larger than this go up in parts. */ partSize: number }) {
  const { mutate } = useSWRConfig();
  const input = useRef<HTMLInputElement>(null);
  const [kind, setKind] = useState("");
  const [over, setOver] = useState(false);
  const [progress, setProgress] = useState<{ name: string; sent: number; total: number } | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  const send = async (file: File | undefined) => {
    if (!file || progress) return;
    setMessage(null);
    setProblem(null);
    setProgress({ name: file.name, sent: 0, total: file.size });
    try {
      const answer = await sendFile(proofId, stepId, file, kind, partSize, (sent, total) => setProgress({ name: file.name, sent, total }));
      if (answer.status === 200 || answer.status === 201) {
        const f = answer.body!.file!;
        setMessage(
          answer.body!.duplicate ? `This step already has these bytes, as “${f.name}”: nothing new was stored.` : `Uploaded “${f.name}”: ${f.description}.`,
        );
        await mutate(`/api/proofs/${proofId}/steps/${stepId}/files`);
      } else {
        setProblem(refusalText(answer));
      }
    } catch (e) {
      setProblem((e as Error).message);
    } finally {
      setProgress(null);
      if (input.current) input.current.value = "";
    }
  };

  const percent = progress && progress.total > 0 ? Math.round((100 * progress.sent) / progress.total) : 0;
  return (
    <section className="mt-4 rounded border border-stone-200 bg-white p-4" aria-labelledby="upload-heading" data-testid="file-upload">
      <h3 id="upload-heading" className="font-semibold">
        Upload a file to this step
      </h3>
      <label className="mt-2 block text-sm">
        <span className="font-semibold">Kind</span>
        <select value={kind} onChange={(e) => setKind(e.target.value)} className="ml-2 max-w-full rounded border border-stone-300 bg-white px-1 py-0.5">
          {KINDS.map((k) => (
            <option key={k.value} value={k.value}>
              {k.label}
            </option>
          ))}
        </select>
      </label>
      <div
        onDragOver={(e) => {
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={(e) => {
          e.preventDefault();
          setOver(false);
          void send(e.dataTransfer.files[0]);
        }}
        className={`mt-3 rounded border-2 border-dashed p-6 text-center text-sm ${over ? "border-lichen-700 bg-lichen-50" : "border-stone-300"}`}
        data-testid="drop-area"
      >
        <p>Drop a file here, or</p>
        <label className="mt-1 inline-block cursor-pointer text-lichen-700 underline">
          choose one
          <input ref={input} type="file" className="sr-only" onChange={(e) => void send(e.target.files?.[0])} disabled={!!progress} data-testid="file-input" />
        </label>
      </div>
      {progress && (
        <div className="mt-3 text-sm" aria-live="polite">
          <p>
            Sending “{progress.name}”: {formatBytes(progress.sent)} of {formatBytes(progress.total)} ({percent}%)
          </p>
          <progress max={100} value={percent} className="w-full" aria-label="upload progress" />
        </div>
      )}
      {message && (
        <p className="mt-2 text-sm" aria-live="polite" data-testid="upload-message">
          ✓ {message}
        </p>
      )}
      {problem && (
        <p role="alert" className="mt-2 text-sm text-refuted" data-testid="upload-problem">
          ✗ {problem}
        </p>
      )}
    </section>
  );
}
