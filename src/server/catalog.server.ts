// Vessels and materials as the API shows and edits them (stored in SI).
import { type z } from 'zod';
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
import { vesselBody, type materialBody } from './api/schemas';

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
