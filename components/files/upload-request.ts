import { ApiError, apiFetch } from "@/components/proof/api-client";

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

/** What the upload forms show for a refused upload: the server's message, or its status when it gave none. */
export const refusalText = (answer: UploadAnswer): string => answer.body?.error?.message ?? `The server answered ${answer.status}; nothing was saved.`;

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
 * The upload's JSON calls (start, which parts are in, finish) go through the one API client; a refusal comes back as
 * the answer, with the server's error body, as a refused upload in one request does, so the form shows the server's
 * message; a call that cannot reach the server says so. The parts themselves are raw bytes, not JSON: they go by
 * uploadWithProgress (XMLHttpRequest, which reports upload progress; neither fetch nor the JSON client does).
 */
async function uploadCall<T>(url: string, init: { method?: string; body?: unknown; signal?: AbortSignal }): Promise<{ ok: T } | { refused: UploadAnswer }> {
  try {
    return { ok: await apiFetch<T>(url, init) };
  } catch (e) {
    // The server's own message (the form says "The server answered …; nothing was saved." when it gave none).
    if (e instanceof ApiError)
      return { refused: { status: e.status, body: { error: { message: typeof e.body.message === "string" ? e.body.message : undefined } } } };
    if (init.signal?.aborted) throw e;
    throw new Error("The connection failed during the upload; nothing was saved. Try again.");
  }
}

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
  const started = await uploadCall<{ upload: PartUploadState }>(`${stepUrl}/uploads`, {
    method: "POST",
    body: { name: file.name, size: file.size, ...(kind ? { kind } : {}), ...(claimId ? { claimId } : {}) },
    signal,
  });
  if ("refused" in started) return started.refused;
  let upload = started.ok.upload;
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
    const asked = await uploadCall<{ upload: PartUploadState }>(base, { signal });
    if ("refused" in asked) return asked.refused;
    upload = asked.ok.upload;
  }
  if (upload.missing.length > 0) throw new Error("The connection kept failing during the upload; nothing was saved. Try again.");
  const finished = await uploadCall<NonNullable<UploadAnswer["body"]>>(`${base}/finish`, { method: "POST", signal });
  if ("refused" in finished) return finished.refused;
  // The finish answers 201 for a new file and 200 when the step already had these bytes (duplicate).
  return { status: finished.ok.duplicate ? 200 : 201, body: finished.ok };
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
