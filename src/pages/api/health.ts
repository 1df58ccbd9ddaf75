import type { APIRoute } from 'astro';
import { getPool } from '../../db/client.server';
import { json } from '../../server/http';
import { storageAnswers } from '../../server/storage.server';

async function databaseAnswers(): Promise<boolean> {
  try {
    await Promise.race([
      getPool().query('SELECT 1'),
      new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), 2000)),
    ]);
    return true;
  } catch {
    return false;
  }
}

/** GET /api/health — { ok, db, storage }; 503 when either is down. */
export const GET: APIRoute = async () => {
  const [db, storage] = await Promise.all([databaseAnswers(), storageAnswers()]);
  const ok = db && storage;
  return json({ ok, db, storage }, ok ? 200 : 503);
};
