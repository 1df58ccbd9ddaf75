import type { APIRoute } from 'astro';
import { json } from '../../server/http';
import { checkReadiness } from '../../server/readiness.server';

/** GET /api/ready — 200 when MariaDB and storage answer and migrations are current; else 503 (load balancers). */
export const GET: APIRoute = async () => {
  const r = await checkReadiness();
  return json(r, r.ready ? 200 : 503);
};
