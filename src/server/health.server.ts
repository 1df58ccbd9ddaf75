// Liveness of the services Hoopline needs: MariaDB and object storage.
import { databaseAnswers } from '../db/client.server';
import { storageAnswers } from './storage.server';

export async function checkHealth(): Promise<{ ok: boolean; db: boolean; storage: boolean }> {
  const [db, storage] = await Promise.all([databaseAnswers(), storageAnswers()]);
  return { ok: db && storage, db, storage };
}
