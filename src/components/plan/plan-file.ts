// Plan files in and out of the editor (DESIGN 4.1 JSON). Import keeps every field of the file,
// known or not, so an export gives back what came in plus the edits. Pure.
import type { PlanDraft } from './plan-draft';

export type PlanFileRead = { ok: true; plan: PlanDraft } | { ok: false; message: string };

/** Parse a plan file's text: a JSON object, or a message that says what is wrong with the file. */
export function readPlanText(text: string, fileName = 'the file'): PlanFileRead {
  const body = text.replace(/^\uFEFF/, '');
  if (body.trim() === '') return { ok: false, message: `${fileName} is empty.` };
  let value: unknown;
  try {
    value = JSON.parse(body);
  } catch (e) {
    return { ok: false, message: `${fileName} is not valid JSON (${(e as Error).message}).` };
  }
  if (value === null || typeof value !== 'object' || Array.isArray(value))
    return {
      ok: false,
      message: `${fileName} must hold one JSON object (a test plan), not ${Array.isArray(value) ? 'a list' : typeof value === 'object' ? 'null' : 'a ' + typeof value}.`,
    };
  return { ok: true, plan: value as PlanDraft };
}

/** The plan as a downloadable file: pretty JSON with a final newline. */
export function serializePlan(plan: PlanDraft): string {
  return JSON.stringify(plan, null, 2) + '\n';
}

/** A safe file name from a test name: "AR-102 hydrotest" → `ar-102-hydrotest-plan.json`. */
export function planFileName(name: string | undefined | null): string {
  const slug = (name ?? '')
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return `${slug || 'test'}-plan.json`;
}
