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
    const err = (data as { error?: { code?: string; message?: string; details?: unknown } } | null)?.error;
    throw new ApiError(
      res.status,
      err?.code ?? 'http-' + res.status,
      err?.message ?? `The server answered ${res.status}.`,
      err?.details ?? null,
    );
  }
  return data as T;
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
