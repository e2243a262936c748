/**
 * Sends one file as the raw body of a POST with XMLHttpRequest, which (unlike fetch) reports upload
 * progress. Resolves with the status and the parsed JSON answer; rejects only when the network fails.
 */
export interface UploadAnswer {
  status: number;
  body: { file?: { id: number; name: string; description: string }; duplicate?: boolean; error?: { message?: string } } | null;
}

export function uploadWithProgress(url: string, file: Blob, onProgress: (sent: number, total: number) => void, signal?: AbortSignal): Promise<UploadAnswer> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
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
