/**
 * Sends one file as the raw body of a POST with XMLHttpRequest, which (unlike fetch) reports upload
 * progress. Resolves with the status and the parsed JSON answer; rejects only when the network fails.
 */
export interface UploadAnswer {
  status: number;
  body: { file?: { id: number; name: string; description: string }; duplicate?: boolean; error?: { message?: string } } | null;
}

export function uploadWithProgress(
  url: string,
  file: Blob,
  onProgress: (sent: number, total: number) => void,
  signal?: AbortSignal,
  method: "POST" | "PUT" = "POST",
): Promise<UploadAnswer> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(method, url);
    xhr.setRequestHeader("content-type", "application/octet-stream");
    xhr.upload.onprogress = (e) => onProgress(e.loaded, e.lengthComputable ? e.total : file.size);
    xhr.onload = () => {
      let body: UploadAnswer["body"] = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = null;
      }
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () => reject(new Error("The connection failed during the upload; nothing was saved. Try again."));
    xhr.onabort = () => reject(new Error("Upload stopped; nothing was saved."));
    signal?.addEventListener("abort", () => xhr.abort());
    xhr.send(file);
  });
}

export const formatBytes = (n: number): string =>
  n < 1024 ? `${n} bytes` : n < 1024 * 1024 ? `${(n / 1024).toFixed(1)} KiB` : `${(n / (1024 * 1024)).toFixed(1)} MiB`;

interface PartUploadState {
  id: number;
  partSize: number;
  parts: number;
  missing: number[];
}

const ROUNDS = 4;

/**
 * Sends a file larger than one part as an upload in parts (lib/data/part-uploads.ts): start, each part (with its
 * bytes counted into the progress), then finish. A part that fails on the network is sent again after asking the
 * server which parts it has, up to ROUNDS rounds; a refusal (4xx) stops at once with the server's message.
 * Resolves with the finish's answer, or the first refusal.
 */
export async function uploadInParts(
  stepUrl: string,
  file: File,
  kind: string,
  onProgress: (sent: number, total: number) => void,
  signal?: AbortSignal,
  claimId?: number,
): Promise<UploadAnswer> {
  const json = async (res: Response): Promise<UploadAnswer["body"] & { upload?: PartUploadState }> => res.json().catch(() => null);
  const started = await fetch(`${stepUrl}/uploads`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ name: file.name, size: file.size, ...(kind ? { kind } : {}), ...(claimId ? { claimId } : {}) }),
    signal,
  });
  const start = await json(started);
  if (started.status !== 201 || !start?.upload) return { status: started.status, body: start };
  let upload = start.upload;
  const base = `${stepUrl}/uploads/${upload.id}`;
  const lengthOf = (n: number) => Math.min(upload.partSize, file.size - (n - 1) * upload.partSize);
  for (let round = 0; round < ROUNDS && upload.missing.length > 0; round++) {
    let done = file.size - upload.missing.reduce((sum, n) => sum + lengthOf(n), 0);
    for (const n of upload.missing) {
      const from = (n - 1) * upload.partSize;
      let answer: UploadAnswer;
      try {
        answer = await uploadWithProgress(
          `${base}/parts/${n}`,
          file.slice(from, from + lengthOf(n)),
          (sent) => onProgress(done + sent, file.size),
          signal,
          "PUT",
        );
      } catch (e) {
        if (signal?.aborted) throw e;
        break; // the connection dropped: ask the server which parts it has, then carry on
      }
      if (answer.status !== 200) return answer;
      done += lengthOf(n);
      onProgress(done, file.size);
    }
    const asked = await fetch(base, { signal });
    const state = await json(asked);
    if (asked.status !== 200 || !state?.upload) return { status: asked.status, body: state };
    upload = state.upload;
  }
  if (upload.missing.length > 0) throw new Error("The connection kept failing during the upload; nothing was saved. Try again.");
  const finished = await fetch(`${base}/finish`, { method: "POST", signal });
  return { status: finished.status, body: await json(finished) };
}

/**
 * Sends a file to a step (or, with `claimId`, to one of its claims): in one request up to `partSize` bytes, in parts above.
 */
export function sendFile(
  proofId: number,
  stepId: number,
  file: File,
  kind: string,
  partSize: number,
  onProgress: (sent: number, total: number) => void,
  claimId?: number,
): Promise<UploadAnswer> {
  const stepUrl = `/api/proofs/${proofId}/steps/${stepId}`;
  if (file.size > partSize) return uploadInParts(stepUrl, file, kind, onProgress, undefined, claimId);
  const query = new URLSearchParams({ name: file.name, ...(kind ? { kind } : {}) });
  return uploadWithProgress(`${claimId ? `/api/proofs/${proofId}/claims/${claimId}` : stepUrl}/files?${query}`, file, onProgress);
}
