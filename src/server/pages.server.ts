// Helpers for Astro pages that show one test: load it or answer 404 in the page itself.
import { getDb } from '../db/client.server';
import { findTestWithVessel } from '../db/queries/tests';

/** The test with vessel and material for a page, or null (the page answers 404). */
export async function loadTestForPage(idParam: string | undefined) {
  const id = Number(idParam);
  if (!Number.isSafeInteger(id) || id <= 0) return null;
  return (await findTestWithVessel(getDb(), id)) ?? null;
}

export const canWrite = {
  upload: (role: string) => role === 'technician' || role === 'engineer' || role === 'admin',
  plan: (role: string) => role === 'engineer' || role === 'admin',
  disposition: (role: string) => role === 'engineer' || role === 'admin',
  review: (role: string) => role === 'engineer',
  release: (role: string) => role === 'qa',
  share: (role: string) => role === 'qa' || role === 'admin',
  audit: (role: string) => role === 'qa' || role === 'admin',
};
