/**
 * Multipart upload with progress: XMLHttpRequest reports bytes sent (fetch cannot), and the
 * server's progress for the same key is polled while it reads, checks and stores the rows.
 */
import { ApiError } from '../ui/api';

export interface ServerProgress {
  phase: 'reading' | 'checking' | 'storing' | 'done' | 'failed';
  bytesRead: number;
  bytesTotal: number;
  rowsValidated: number;
  rowsStored: number;
  rowsToStore: number;
}

export interface UploadProgress {
  sent: number;
  total: number;
  server: ServerProgress | null;
}

export function newProgressKey(): string {
  return Array.from(crypto.getRandomValues(new Uint8Array(12)), (b) => b.toString(16).padStart(2, '0')).join('');
}

export function uploadForm<T>(url: string, form: FormData, progressUrl: string | null, onProgress: (p: UploadProgress) => void): Promise<T> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    const state: UploadProgress = { sent: 0, total: 0, server: null };
    let polling: ReturnType<typeof setInterval> | undefined;
    const stopPolling = () => polling && clearInterval(polling);
    xhr.upload.onprogress = (e) => {
      state.sent = e.loaded;
      state.total = e.total;
      onProgress({ ...state });
    };
    xhr.upload.onload = () => {
      if (!progressUrl) return;
      polling = setInterval(async () => {
        try {
          const r = await fetch(progressUrl, { credentials: 'same-origin' });
          if (r.ok) {
            state.server = (await r.json()) as ServerProgress;
            onProgress({ ...state });
          }
        } catch {
          /* the answer will come anyway */
        }
      }, 400);
    };
    xhr.onload = () => {
      stopPolling();
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON */
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as T);
      const err = (body as { error?: { code?: string; message?: string; details?: unknown } } | null)?.error;
      reject(new ApiError(xhr.status, err?.code ?? `http_${xhr.status}`, err?.message ?? `The server answered ${xhr.status}.`, err?.details ?? null));
    };
    xhr.onerror = () => {
      stopPolling();
      reject(new ApiError(0, 'network', 'The upload was interrupted. Check your connection and try again.', null));
    };
    xhr.open('POST', url);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.send(form);
  });
}
