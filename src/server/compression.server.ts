// Response compression for JSON answers over a few KB: brotli or gzip as the caller's
// Accept-Encoding prefers, in zlib's thread pool so the event loop keeps serving.
import { promisify } from 'node:util';
import { brotliCompress, constants, gzip } from 'node:zlib';

const brotliAsync = promisify(brotliCompress);
const gzipAsync = promisify(gzip);

/** Smaller answers are sent as they are: compressing them saves less than it costs. */
export const COMPRESS_MIN_BYTES = 2048;

export type ContentCoding = 'br' | 'gzip' | 'identity';

/** The coding to answer with: br, then gzip, by the q-values in Accept-Encoding. */
export function chooseCoding(acceptEncoding: string | null): ContentCoding {
  if (!acceptEncoding) return 'identity';
  const q = new Map<string, number>();
  for (const part of acceptEncoding.split(',')) {
    const [name, ...params] = part.trim().toLowerCase().split(';');
    if (!name) continue;
    const qp = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
    const value = qp ? Number(qp.slice(2)) : 1;
    q.set(name, Number.isFinite(value) ? value : 0);
  }
  const of = (c: string) => q.get(c) ?? q.get('*') ?? 0;
  if (of('br') > 0 && of('br') >= of('gzip')) return 'br';
  if (of('gzip') > 0) return 'gzip';
  return 'identity';
}

/** Compress bytes; brotli at a quality that is fast enough per request (stored answers use more). */
export async function compressBytes(
  bytes: Uint8Array,
  coding: Exclude<ContentCoding, 'identity'>,
  effort: 'fast' | 'small' = 'fast',
): Promise<Buffer> {
  if (coding === 'br')
    return brotliAsync(bytes, {
      params: {
        [constants.BROTLI_PARAM_QUALITY]: effort === 'fast' ? 4 : 9,
        [constants.BROTLI_PARAM_MODE]: constants.BROTLI_MODE_TEXT,
        [constants.BROTLI_PARAM_SIZE_HINT]: bytes.byteLength,
      },
    });
  return gzipAsync(bytes, { level: effort === 'fast' ? 6 : 9 });
}

function isCompressibleJson(request: Request, response: Response): boolean {
  if (request.method === 'HEAD' || !response.body) return false;
  if (response.status === 204 || response.status === 304 || response.status < 200) return false;
  // a handler that negotiated the coding itself (stored, precompressed answers) says so in Vary
  if (response.headers.has('content-encoding') || /accept-encoding/i.test(response.headers.get('vary') ?? ''))
    return false;
  return /^application\/(?:[\w.+-]+\+)?json\b/i.test(response.headers.get('content-type') ?? '');
}

/** The response compressed when it is JSON over COMPRESS_MIN_BYTES and the caller accepts br or gzip. */
export async function compressJsonResponse(request: Request, response: Response): Promise<Response> {
  if (!isCompressibleJson(request, response)) return response;
  const coding = chooseCoding(request.headers.get('accept-encoding'));
  const headers = new Headers(response.headers);
  headers.append('vary', 'Accept-Encoding');
  const bytes = new Uint8Array(await response.arrayBuffer());
  const init = { status: response.status, statusText: response.statusText, headers };
  if (coding === 'identity' || bytes.byteLength < COMPRESS_MIN_BYTES) return new Response(bytes, init);
  const body = await compressBytes(bytes, coding);
  headers.set('content-encoding', coding);
  headers.delete('content-length');
  return new Response(new Uint8Array(body), init);
}
