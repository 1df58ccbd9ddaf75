import { asc, count, eq } from 'drizzle-orm';
import type { Conn } from '../client.server';
import { materials, vessels, type NewMaterial, type NewVessel } from '../schema';
import { insertedId } from './inserted-id';

export async function listMaterials(db: Conn, page: { limit: number; offset: number }) {
  const [items, [total]] = await Promise.all([
    db.select().from(materials).orderBy(asc(materials.name)).limit(page.limit).offset(page.offset),
    db.select({ n: count() }).from(materials),
  ]);
  return { items, total: total?.n ?? 0 };
}

export const findMaterial = (db: Conn, id: number) => db.query.materials.findFirst({ where: eq(materials.id, id) });

export const findMaterialByName = (db: Conn, name: string) =>
  db.query.materials.findFirst({ where: eq(materials.name, name) });

export async function insertMaterial(db: Conn, m: NewMaterial) {
  return insertedId(await db.insert(materials).values(m).$returningId());
}

export async function updateMaterial(db: Conn, id: number, m: Partial<NewMaterial>) {
  await db.update(materials).set(m).where(eq(materials.id, id));
}

/** A material with the same name and values (within rounding), or undefined. */
export async function matchMaterial(
  db: Conn,
  m: { name: string; elasticModulusMPa: number; poissonRatio: number; yieldStrengthMPa: number },
) {
  const same = (a: number, b: number) => Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(b));
  const rows = await db.select().from(materials).where(eq(materials.name, m.name));
  return rows.find(
    (r) =>
      same(r.elasticModulusMPa, m.elasticModulusMPa) &&
      same(r.poissonRatio, m.poissonRatio) &&
      same(r.yieldStrengthMPa, m.yieldStrengthMPa),
  );
}

export async function listVessels(db: Conn, page: { limit: number; offset: number }) {
  const [items, [total]] = await Promise.all([
    db
      .select({ vessel: vessels, material: materials })
      .from(vessels)
      .leftJoin(materials, eq(materials.id, vessels.materialId))
      .orderBy(asc(vessels.tag))
      .limit(page.limit)
      .offset(page.offset),
    db.select({ n: count() }).from(vessels),
  ]);
  return { items: items.map((r) => ({ ...r.vessel, material: r.material })), total: total?.n ?? 0 };
}

export async function findVessel(db: Conn, id: number) {
  const [row] = await db
    .select({ vessel: vessels, material: materials })
    .from(vessels)
    .leftJoin(materials, eq(materials.id, vessels.materialId))
    .where(eq(vessels.id, id));
  return row ? { ...row.vessel, material: row.material } : undefined;
}

export const findVesselByTag = (db: Conn, tag: string) => db.query.vessels.findFirst({ where: eq(vessels.tag, tag) });

export async function insertVessel(db: Conn, v: NewVessel) {
  return insertedId(await db.insert(vessels).values(v).$returningId());
}

export async function updateVessel(db: Conn, id: number, v: Partial<NewVessel>) {
  await db
    .update(vessels)
    .set({ ...v, updatedAt: new Date() })
    .where(eq(vessels.id, id));
}

/** A vessel with the same geometry and material, or undefined (plans carry no vessel id). */
export async function matchVessel(
  db: Conn,
  v: {
    shape: 'cylinder' | 'sphere';
    ends: 'closed' | 'open';
    insideDiameterMm: number;
    wallThicknessMm: number;
    lengthMm: number | null;
    materialId: number;
  },
) {
  const same = (a: number | null, b: number | null) =>
    a === null || b === null ? a === b : Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(b));
  const rows = await db.select().from(vessels).where(eq(vessels.materialId, v.materialId));
  return rows.find(
    (r) =>
      r.shape === v.shape &&
      r.ends === v.ends &&
      same(r.insideDiameterMm, v.insideDiameterMm) &&
      same(r.wallThicknessMm, v.wallThicknessMm) &&
      same(r.lengthMm, v.lengthMm),
  );
}
