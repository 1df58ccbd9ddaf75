// Tests and their plans: validate a plan with the engine's schema (and the gauge-id rule),
// create or match its material and vessel, keep the gauge rows in step, and refuse changes to a
// released test. Each change commits with its audit row in one transaction under the test's lock.
import { getDb, inTransaction, type Conn } from '../db/client.server';
import { findTest, insertTest, replaceGauges, updateTest } from '../db/queries/tests';
import { findVesselByTag, insertMaterial, insertVessel, matchMaterial, matchVessel } from '../db/queries/vessels';
import type { Test } from '../db/schema';
import { parsePlan, type Plan } from '../lib/reduction/plan';
import { inToMm, psiToMPa } from '../lib/reduction/units';
import { auditBy } from './audit.server';
import { AppError, errors } from './errors';
import type { RequestUser } from './http';
import { withLockedTest } from './locks.server';

/**
 * Gauge ids end up in a column of 60 characters, in file names people save and in CSV cells:
 * a letter or digit first, then letters, digits, space, `.`, `_` or `-`, at most 60 in all.
 */
export const GAUGE_ID_PATTERN = /^[A-Za-z0-9][A-Za-z0-9 ._-]{0,59}$/;

/** The problems of a plan's gauge ids, as the plan's 422 lists them (empty when they are fine). */
export function gaugeIdIssues(plan: Plan): { path: string; message: string }[] {
  const issues: { path: string; message: string }[] = [];
  plan.gauges.forEach((g, i) => {
    if (g.id.length > 60)
      issues.push({ path: `gauges[${i}].id`, message: `is ${g.id.length} characters long; at most 60` });
    else if (!GAUGE_ID_PATTERN.test(g.id))
      issues.push({
        path: `gauges[${i}].id`,
        message: `'${g.id.slice(0, 60)}' may hold only letters, digits, space, '.', '_' and '-', starting with a letter or digit`,
      });
  });
  return issues;
}

/** Validate a plan; an invalid plan throws 422 `invalid-plan` listing every problem by field. */
export function validatePlan(raw: unknown): Plan {
  const plan = parsePlan(raw);
  const issues = gaugeIdIssues(plan);
  if (issues.length) throw new AppError('invalid-plan', `${issues[0]!.path}: ${issues[0]!.message}`, { issues });
  return plan;
}

/** The plan's material and vessel in SI (the database's units). */
export function planToSI(plan: Plan) {
  const len = (v: number) => (plan.units === 'US' ? inToMm(v) : v);
  const stress = (v: number) => (plan.units === 'US' ? psiToMPa(v) : v);
  return {
    material: {
      name: plan.material.name?.trim() || 'Unnamed material',
      elasticModulusMPa: stress(plan.material.elasticModulus),
      poissonRatio: plan.material.poissonRatio,
      yieldStrengthMPa: stress(plan.material.yieldStrength),
    },
    vessel: {
      shape: plan.vessel.shape,
      ends: plan.vessel.ends,
      insideDiameterMm: len(plan.vessel.insideDiameter),
      wallThicknessMm: len(plan.vessel.wallThickness),
      lengthMm: plan.vessel.length === undefined ? null : len(plan.vessel.length),
      features: plan.vessel.features.map((f) => ({
        ...f,
        axialPosition: len(f.axialPosition),
        size: f.size === undefined ? undefined : len(f.size),
      })),
    },
  };
}

/** The vessel and material a plan describes: matched by values, created when new. */
async function resolveVessel(db: Conn, plan: Plan, user: RequestUser): Promise<number> {
  const si = planToSI(plan);
  const material = await matchMaterial(db, si.material);
  const materialId = material?.id ?? (await insertMaterial(db, si.material));
  const match = await matchVessel(db, { ...si.vessel, materialId });
  if (match) return match.id;
  const named = plan.vessel.name?.trim().slice(0, 40);
  const stamp = Date.now().toString(36).toUpperCase();
  const tag = named && !(await findVesselByTag(db, named)) ? named : named ? `${named}-${stamp}` : `V-${stamp}`;
  return insertVessel(db, {
    tag,
    name:
      plan.vessel.name?.trim() ||
      `Vessel from plan (${plan.vessel.shape}, ID ${plan.vessel.insideDiameter} ${plan.units === 'US' ? 'in' : 'mm'})`,
    ...si.vessel,
    materialId,
    units: plan.units,
    createdBy: user.id,
  });
}

/** The gauge rows (the installation as planned) of a plan. */
export function gaugeRows(plan: Plan) {
  return plan.gauges.map((g) => ({
    gaugeId: g.id,
    kind: g.kind,
    channels: g.channels,
    angleDeg: g.angleDeg,
    gaugeFactor: g.gaugeFactor,
    instrumentGaugeFactor: g.instrumentGaugeFactor,
    transverseSensitivity: g.transverseSensitivity,
    distanceToDiscontinuity: g.distanceToDiscontinuity ?? null,
    axialPosition: g.axialPosition ?? null,
    clockDeg: g.clockDeg ?? null,
  }));
}

/** POST /api/tests: a new test in `draft` from a name and a plan. */
export async function createTestFromPlan(
  user: RequestUser,
  name: string,
  rawPlan: unknown,
  vesselId?: number,
): Promise<number> {
  const plan = validatePlan(rawPlan);
  return inTransaction(async (tx) => {
    const vid = vesselId ?? (await resolveVessel(tx, plan, user));
    const id = await insertTest(tx, { name, vesselId: vid, plan: rawPlan, ownerId: user.id });
    await replaceGauges(tx, id, gaugeRows(plan));
    await auditBy(tx, user, 'test-created', id, { name, vesselId: vid, gauges: plan.gauges.length });
    return id;
  });
}

/**
 * The test, or 404; with `forWrite`, 409 when it is released. A quick check before slow work
 * (an upload); the change itself re-checks under the test's lock (withLockedTest).
 */
export async function loadTest(id: number, forWrite = false): Promise<Test> {
  const test = await findTest(getDb(), id);
  if (!test) throw errors.notFound('test');
  if (forWrite && test.status === 'released') throw new AppError('test-released');
  return test;
}

/** PUT /api/tests/{id}/plan: replace the plan. Results of a plan that changed need a new reduction. */
export async function replacePlan(user: RequestUser, testId: number, rawPlan: unknown): Promise<void> {
  const plan = validatePlan(rawPlan);
  await withLockedTest(testId, { forWrite: true }, async (tx, test) => {
    const vesselId = await resolveVessel(tx, plan, user);
    const status = test.status === 'reduced' || test.status === 'reviewed' ? 'logging' : test.status;
    await updateTest(tx, testId, { plan: rawPlan, vesselId, status });
    await replaceGauges(tx, testId, gaugeRows(plan));
    await auditBy(tx, user, 'plan-changed', testId, {
      gauges: plan.gauges.length,
      statusBefore: test.status,
      statusAfter: status,
    });
    if (test.status === 'reviewed')
      await auditBy(tx, user, 'review-withdrawn', testId, { reason: 'the plan changed after the review' });
  });
}

/** PATCH /api/tests/{id} {name}: rename a test that is not released. */
export async function renameTest(user: RequestUser, testId: number, name: string): Promise<void> {
  await withLockedTest(testId, { forWrite: true }, async (tx) => {
    await updateTest(tx, testId, { name });
    await auditBy(tx, user, 'test-renamed', testId, { name });
  });
}
