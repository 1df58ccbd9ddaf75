// Vessels and materials as the API shows and edits them (stored in SI).
import { z } from 'zod';
import { getDb, inTransaction } from '../db/client.server';
import {
  findMaterial,
  findVessel,
  findVesselByTag,
  insertMaterial,
  insertVessel,
  updateMaterial,
  updateVessel,
} from '../db/queries/vessels';
import { auditBy } from './audit.server';
import { AppError, errors } from './errors';
import type { RequestUser } from './http';

export const materialBody = z.object({
  name: z.string().trim().min(1).max(160),
  elasticModulusMPa: z.number().gt(500, 'is in MPa: 200 GPa is 200000'),
  poissonRatio: z.number().gte(0).lte(0.5),
  yieldStrengthMPa: z.number().gt(0),
});

const feature = z.object({
  id: z.string().max(60).optional(),
  name: z.string().max(120).optional(),
  kind: z.enum(['head', 'nozzle', 'support', 'thickness-change']),
  axialPosition: z.number(),
  clockDeg: z.number().min(0).max(360).optional(),
  size: z.number().min(0).optional(),
});

export const vesselBody = z
  .object({
    tag: z.string().trim().min(1).max(60),
    name: z.string().trim().min(1).max(160),
    shape: z.enum(['cylinder', 'sphere']),
    ends: z.enum(['closed', 'open']).default('closed'),
    insideDiameterMm: z.number().gt(0),
    wallThicknessMm: z.number().gt(0),
    lengthMm: z.number().gt(0).nullable().optional(),
    features: z.array(feature).default([]),
    materialId: z.number().int().positive().nullable().optional(),
    units: z.enum(['SI', 'US']).default('SI'),
  })
  .refine((v) => v.shape === 'sphere' || (v.lengthMm ?? null) !== null, {
    path: ['lengthMm'],
    message: 'is required for a cylinder',
  })
  .refine((v) => v.wallThicknessMm < v.insideDiameterMm / 2, {
    path: ['wallThicknessMm'],
    message: 'must be less than the inside radius',
  });

export function createMaterial(user: RequestUser, body: z.infer<typeof materialBody>) {
  return inTransaction(async (tx) => {
    const id = await insertMaterial(tx, body);
    await auditBy(tx, user, 'material-created', null, { materialId: id, name: body.name });
    return id;
  });
}

/** Edit a material. A released test keeps the material it was released with (its frozen record). */
export async function editMaterial(user: RequestUser, id: number, patch: Partial<z.infer<typeof materialBody>>) {
  await inTransaction(async (tx) => {
    if (!(await findMaterial(tx, id))) throw errors.notFound('material');
    await updateMaterial(tx, id, patch);
    await auditBy(tx, user, 'material-changed', null, { materialId: id, ...patch });
  });
}

export async function createVessel(user: RequestUser, body: z.infer<typeof vesselBody>) {
  const db = getDb();
  if (await findVesselByTag(db, body.tag))
    throw new AppError('tag-taken', `A vessel tagged '${body.tag}' exists already.`);
  if (body.materialId && !(await findMaterial(db, body.materialId)))
    throw errors.invalid('materialId: no material with that id');
  return inTransaction(async (tx) => {
    const id = await insertVessel(tx, {
      ...body,
      lengthMm: body.lengthMm ?? null,
      materialId: body.materialId ?? null,
      createdBy: user.id,
    });
    await auditBy(tx, user, 'vessel-created', null, { vesselId: id, tag: body.tag });
    return id;
  });
}

/** Edit a vessel. A released test keeps the vessel it was released with (its frozen record). */
export async function editVessel(user: RequestUser, id: number, patch: Record<string, unknown>) {
  const db = getDb();
  const before = await findVessel(db, id);
  if (!before) throw errors.notFound('vessel');
  const merged = vesselBody.safeParse({
    ...before,
    ...patch,
    materialId: patch.materialId ?? before.materialId ?? null,
  });
  if (!merged.success) throw merged.error;
  if (merged.data.tag !== before.tag) {
    const other = await findVesselByTag(db, merged.data.tag);
    if (other && other.id !== id)
      throw new AppError('tag-taken', `A vessel tagged '${merged.data.tag}' exists already.`);
  }
  await inTransaction(async (tx) => {
    await updateVessel(tx, id, {
      ...merged.data,
      lengthMm: merged.data.lengthMm ?? null,
      materialId: merged.data.materialId ?? null,
    });
    await auditBy(tx, user, 'vessel-changed', null, { vesselId: id, fields: Object.keys(patch) });
  });
}
