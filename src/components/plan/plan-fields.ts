// Where a plan problem is shown: an issue path from listPlanIssues or the server's 422
// (`gauges[2].channels[1]`) maps to the id of the input that edits it, or to the nearest section
// that holds it. Pure; used by the editor and its tests.
import type { PlanDraft, PlanPath } from './plan-draft';
import { labelForPath } from '../../lib/reduction/plan-words';

export interface PlanIssue {
  path: string;
  message: string;
}
export interface PlacedIssue extends PlanIssue {
  /** the input or section that shows it; null when only the summary can */
  fieldId: string | null;
  /** the field in words, for the summary */
  label: string;
}

/** `gauges[2].channels[1]` → ['gauges', 2, 'channels', 1]; `plan` (the root) → []. */
export function parseIssuePath(path: string): PlanPath {
  if (path === '' || path === 'plan') return [];
  const out: PlanPath = [];
  for (const part of path.match(/[^.[\]]+/g) ?? []) out.push(/^\d+$/.test(part) ? Number(part) : part);
  return out;
}

/** The DOM id of the input for a plan path: ['vessel', 'wallThickness'] → `plan-vessel-wallThickness`. */
export function fieldIdForPath(path: PlanPath): string {
  return ['plan', ...path].join('-');
}

const SECTION_FIELDS: Record<string, string[]> = {
  vessel: ['name', 'shape', 'ends', 'insideDiameter', 'wallThickness', 'length'],
  material: ['name', 'elasticModulus', 'poissonRatio', 'yieldStrength'],
  columns: ['pressure', 'time'],
  procedure: ['reference', 'codeEdition', 'testMedium', 'testTemperature', 'witness'],
  tolerances: [
    'slopeBand',
    'minRSquared',
    'hysteresis',
    'zeroShiftMicrostrain',
    'zeroShiftFraction',
    'noResponseMicrostrain',
    'yieldFraction',
    'holdCreepMicrostrain',
    'holdCreepFraction',
    'principalDirectionDeg',
    'bandMode',
  ],
  uncertainty: [
    'wallThickness',
    'insideDiameter',
    'elasticModulus',
    'poissonRatio',
    'gaugeFactor',
    'transverseSensitivity',
    'misalignmentDeg',
  ],
};
const FEATURE_FIELDS = ['kind', 'name', 'axialPosition', 'clockDeg', 'size'];
const GAUGE_FIELDS = [
  'id',
  'kind',
  'angleDeg',
  'gaugeFactor',
  'instrumentGaugeFactor',
  'transverseSensitivity',
  'distanceToDiscontinuity',
  'axialPosition',
  'clockDeg',
];

const list = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);

/** Every id the editor renders for this plan: inputs and the sections that show whole-section problems. */
export function listFieldIds(plan: PlanDraft): Set<string> {
  const ids = new Set<string>(['plan-units', 'plan-model', 'plan-testPressure', 'plan-gauges', 'plan-vessel-features']);
  for (const [section, fields] of Object.entries(SECTION_FIELDS)) {
    ids.add(fieldIdForPath([section]));
    for (const f of fields) ids.add(fieldIdForPath([section, f]));
  }
  const vessel = (plan.vessel ?? {}) as Record<string, unknown>;
  list(vessel.features).forEach((_, i) =>
    FEATURE_FIELDS.forEach((f) => ids.add(fieldIdForPath(['vessel', 'features', i, f]))),
  );
  list(plan.gauges).forEach((g, i) => {
    GAUGE_FIELDS.forEach((f) => ids.add(fieldIdForPath(['gauges', i, f])));
    const kind = (g as { kind?: unknown } | null)?.kind;
    const n = kind === 'rosette-rectangular' || kind === 'rosette-delta' ? 3 : 1;
    for (let k = 0; k < n; k++) ids.add(fieldIdForPath(['gauges', i, 'channels', k]));
  });
  return ids;
}

/**
 * The id that shows an issue at `path`: the input itself, else its first element (a list such as
 * a gauge's channels), else the nearest enclosing section; null for the plan as a whole.
 */
export function resolveFieldId(path: PlanPath, ids: Set<string>): string | null {
  for (let n = path.length; n > 0; n--) {
    const id = fieldIdForPath(path.slice(0, n));
    if (ids.has(id)) return id;
    if (n === path.length && ids.has(`${id}-0`)) return `${id}-0`;
  }
  return null;
}

export { labelForPath };

/** Every issue with the field that shows it and a label; and the messages per field id. */
export function placeIssues(
  issues: readonly PlanIssue[],
  plan: PlanDraft,
): { placed: PlacedIssue[]; byField: Map<string, string[]> } {
  const ids = listFieldIds(plan);
  const byField = new Map<string, string[]>();
  const placed = issues.map((i) => {
    const path = parseIssuePath(i.path);
    const fieldId = resolveFieldId(path, ids);
    if (fieldId) byField.set(fieldId, [...(byField.get(fieldId) ?? []), i.message]);
    return { ...i, fieldId, label: labelForPath(path, plan) };
  });
  return { placed, byField };
}
