// Browser-side fetch helper for islands: JSON in, JSON out, errors as thrown ApiError with the
// server's message (the error shape of DESIGN 5).
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: unknown,
  ) {
    super(message);
  }
}

export async function api<T = unknown>(
  path: string,
  init: RequestInit & { body?: BodyInit | null; jsonBody?: unknown } = {},
): Promise<T> {
  const { jsonBody, ...rest } = init;
  const headers = new Headers(rest.headers);
  if (jsonBody !== undefined) headers.set('content-type', 'application/json');
  const res = await fetch(path, {
    ...rest,
    headers,
    body: jsonBody !== undefined ? JSON.stringify(jsonBody) : rest.body,
    credentials: 'same-origin',
  });
  const text = await res.text();
  const data = text ? safeJson(text) : null;
  if (!res.ok) {
    const err = (data as { error?: { code?: string; message?: string; details?: unknown; requestId?: string } } | null)
      ?.error;
    const message = err?.message ?? messageForStatus(res.status);
    throw new ApiError(
      res.status,
      err?.code ?? 'http-' + res.status,
      err?.requestId ? `${message} (reference ${err.requestId})` : message,
      err?.details ?? null,
    );
  }
  return data as T;
}

/**
 * What a bare HTTP status means to the person who clicked, when no message came with it (a proxy
 * or a server that stopped answering): what happened, whether anything was stored, what to do.
 */
export function messageForStatus(status: number): string {
  if (status === 401) return 'Your session has ended. Sign in again; nothing was changed.';
  if (status === 403) return 'Your role does not allow this; nothing was changed.';
  if (status === 404) return 'This item no longer exists, or the address is wrong; nothing was changed.';
  if (status === 413) return 'The file or request is larger than this server accepts; nothing was stored.';
  if (status === 502 || status === 503 || status === 504)
    return 'The server is not answering just now; nothing was changed. Wait a moment and try again.';
  return `The server could not complete this (HTTP ${status}); nothing was changed. Try again, and if it happens again tell your administrator.`;
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return { error: { message: text.slice(0, 200) } };
  }
}

export function formatDateTime(value: string | Date | null | undefined): string {
  if (!value) return '—';
  const d = new Date(value);
  return d.toLocaleString('en-GB', {
    year: 'numeric',
    month: 'short',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
  });
}
