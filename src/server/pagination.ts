import { pageQuery } from './api/schemas';
import { zodToAppError } from './http';

/** `?limit=&offset=` (limit 1–200, default 50); 400 naming the bad parameter. */
export function readPage(url: URL): { limit: number; offset: number } {
  const r = pageQuery.safeParse({
    limit: url.searchParams.get('limit') ?? undefined,
    offset: url.searchParams.get('offset') ?? undefined,
  });
  if (!r.success) throw zodToAppError(r.error);
  return r.data;
}
