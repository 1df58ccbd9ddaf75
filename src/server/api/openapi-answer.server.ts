// GET /api/openapi.json: the document is built once per process (it depends on the code only),
// with a strong ETag of its bytes; a client that has it gets 304.
import { createHash } from 'node:crypto';
import { buildOpenApi } from './openapi';

let cached: { body: string; etag: string } | null = null;

function document(): { body: string; etag: string } {
  if (!cached) {
    const body = JSON.stringify(buildOpenApi(), null, 2);
    cached = { body, etag: `"openapi-${createHash('sha256').update(body).digest('base64url').slice(0, 22)}"` };
  }
  return cached;
}

export function openApiAnswer(request: Request): Response {
  const { body, etag } = document();
  const headers = {
    etag,
    // public: the same for everyone; revalidated after five minutes (a new release changes it)
    'cache-control': 'public, max-age=300, must-revalidate',
    vary: 'Accept-Encoding',
  };
  const inm = request.headers.get('if-none-match');
  if (inm && inm.split(',').some((t) => t.trim().replace(/^W\//, '') === etag || t.trim() === '*'))
    return new Response(null, { status: 304, headers });
  return new Response(body, { headers: { ...headers, 'content-type': 'application/json; charset=utf-8' } });
}
