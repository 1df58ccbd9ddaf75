// Demo data: one account per role, generic materials, and an invented vessel.
// Idempotent: running it again updates passwords and leaves existing rows alone.
import { eq } from 'drizzle-orm';
import type { Db } from './client.server';
import { materials, users, vessels, type Role } from './schema';
import { hashPassword } from '../server/auth/passwords.server';

export const demoAccounts: { email: string; name: string; role: Role }[] = [
  { email: 'technician@example.com', name: 'Tomas Reyes (demo)', role: 'technician' },
  { email: 'engineer@example.com', name: 'Imke Sorensen (demo)', role: 'engineer' },
  { email: 'qa@example.com', name: 'Quentin Abara (demo)', role: 'qa' },
  { email: 'admin@example.com', name: 'Ada Mwangi (demo)', role: 'admin' },
];

/** Generic room-temperature properties; code tables vary by edition and temperature. */
export const genericMaterials = [
  { name: 'Carbon steel, generic', elasticModulusMPa: 203_000, poissonRatio: 0.3, yieldStrengthMPa: 260 },
  { name: 'Austenitic stainless, generic', elasticModulusMPa: 195_000, poissonRatio: 0.31, yieldStrengthMPa: 205 },
  { name: 'Aluminium 6061-T6', elasticModulusMPa: 68_900, poissonRatio: 0.33, yieldStrengthMPa: 240 },
];

export const demoVessel = {
  tag: 'LM-AR-102',
  name: 'Air receiver AR-102, Larchmere pilot plant (invented demo)',
  shape: 'cylinder' as const,
  ends: 'closed' as const,
  insideDiameterMm: 1200,
  wallThicknessMm: 12,
  lengthMm: 4200,
  features: [{ kind: 'nozzle', axialPosition: 2100, clockDeg: 0, size: 150 }],
};

export async function seedDemo(db: Db, password: string): Promise<{ users: number; materials: number }> {
  const hash = await hashPassword(password);
  for (const a of demoAccounts) {
    const existing = await db.query.users.findFirst({ where: eq(users.email, a.email) });
    if (existing)
      await db
        .update(users)
        .set({ passwordHash: hash, role: a.role, disabled: false })
        .where(eq(users.id, existing.id));
    else await db.insert(users).values({ ...a, passwordHash: hash });
  }
  let steelId: number | null = null;
  for (const m of genericMaterials) {
    const existing = await db.query.materials.findFirst({ where: eq(materials.name, m.name) });
    const id = existing?.id ?? (await db.insert(materials).values(m).$returningId())[0]!.id;
    if (m.name.startsWith('Carbon')) steelId = id;
  }
  const vessel = await db.query.vessels.findFirst({ where: eq(vessels.tag, demoVessel.tag) });
  if (!vessel) await db.insert(vessels).values({ ...demoVessel, materialId: steelId });
  return { users: demoAccounts.length, materials: genericMaterials.length };
}
