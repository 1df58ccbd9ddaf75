import { z } from 'zod';
import { zodToAppError } from './http';

const pageSchema = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50),
  offset: z.coerce.number().int().min(0).default(0),
});

/** `?limit=&offset=` (limit 1–200, default 50); 400 naming the bad parameter. */
export function readPage(url: URL): { limit: number; offset: number } {
  const r = pageSchema.safeParse({
    limit: url.searchParams.get('limit') ?? undefined,
    offset: url.searchParams.get('offset') ?? undefined,
  });
  if (!r.success) throw zodToAppError(r.error);
  return r.data;
}
