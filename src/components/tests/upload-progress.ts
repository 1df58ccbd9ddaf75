// Upload with progress through XMLHttpRequest (fetch has no upload progress in browsers).

export interface UploadProgress {
  sent: number;
  total: number;
  rateBytesPerSecond: number;
  secondsLeft: number | null;
}

/** What the upload endpoint answers: the stored log, or the error shape (DESIGN 5). */
export interface UploadAnswer {
  id?: number;
  rows?: number;
  sha256?: string;
  error?: {
    code?: string;
    message?: string;
    details?: { missingColumns?: string[]; columns?: string[]; line?: number; column?: string | number } | null;
  };
}

/** POST a file as multipart field `file`; resolves to {status, body} (body null when not JSON). */
export function uploadWithProgress(
  url: string,
  file: File,
  onProgress: (p: UploadProgress) => void,
): Promise<{ status: number; body: UploadAnswer | null }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    const started = performance.now();
    xhr.open('POST', url);
    xhr.responseType = 'json';
    xhr.upload.onprogress = (e) => {
      const seconds = (performance.now() - started) / 1000;
      const rate = seconds > 0 ? e.loaded / seconds : 0;
      const total = e.lengthComputable ? e.total : file.size;
      onProgress({
        sent: e.loaded,
        total,
        rateBytesPerSecond: rate,
        secondsLeft: rate > 0 ? (total - e.loaded) / rate : null,
      });
    };
    xhr.onload = () => resolve({ status: xhr.status, body: (xhr.response as UploadAnswer | null) ?? null });
    xhr.onerror = () => reject(new Error('The upload was interrupted (network error). Nothing was stored; try again.'));
    const form = new FormData();
    form.append('file', file, file.name);
    xhr.send(form);
  });
}

export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 ** 2) return `${(n / 1024).toFixed(1)} KB`;
  if (n < 1024 ** 3) return `${(n / 1024 ** 2).toFixed(1)} MB`;
  return `${(n / 1024 ** 3).toFixed(2)} GB`;
}

export function formatSeconds(s: number | null): string {
  if (s === null || !Number.isFinite(s)) return '—';
  if (s < 60) return `${Math.ceil(s)} s`;
  return `${Math.floor(s / 60)} min ${Math.ceil(s % 60)} s`;
}
