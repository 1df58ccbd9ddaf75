// Helpers for Astro pages that show one test: load it or answer 404 in the page itself.
import { getDb } from '../db/client.server';
import { findTestWithVessel } from '../db/queries/tests';

/** The test with vessel and material for a page, or null (the page answers 404). */
export async function loadTestForPage(idParam: string | undefined) {
  const id = Number(idParam);
  if (!Number.isSafeInteger(id) || id <= 0) return null;
  return (await findTestWithVessel(getDb(), id)) ?? null;
}
