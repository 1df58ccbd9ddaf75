import type { APIRoute } from 'astro';
import { checkHealth } from '../../server/health.server';
import { json } from '../../server/http';

/** GET /api/health — { ok, db, storage }; 503 when either is down. */
export const GET: APIRoute = async () => {
  const health = await checkHealth();
  return json(health, health.ok ? 200 : 503);
};
