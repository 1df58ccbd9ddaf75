// The one demo seed (DEMO=true only): one account per role, generic materials, an invented
// vessel, and the invented scenario — air receiver AR-102 of the Larchmere pilot plant,
// hydrotested at 1.95 MPa (1.3 × MAWP 1.5 MPa). One test is logged and queued for reduction (the
// worker reduces it on start) with one axial gauge reading 12 % low (a poor bond) and one hoop
// gauge beside the nozzle (edge zone); a second test is still in planning.
// Idempotent: a missing account is created; an existing one is left alone unless `reset` (the
// seed script passes DEMO_RESET=true), which puts it back to its demo role and password and
// enables it. Other rows are created once.
import { getDb, inTransaction, type Db } from '../db/client.server';
import { queueReduction } from '../db/queries/reductions';
import { findTest, findTestByName, insertNote, insertTest, replaceGauges, updateTest } from '../db/queries/tests';
import { createUser, findUserByEmail, resetUser } from '../db/queries/users';
import { findMaterialByName, findVesselByTag, insertMaterial, insertVessel } from '../db/queries/vessels';
import type { Role } from '../lib/roles';
import { hashPassword } from './auth/passwords.server';
import { passwordProblem } from './auth/password-policy.server';
import { Readable } from 'node:stream';
import { parsePlan, type PlanInput } from '../lib/reduction';
import { syntheticLog, type SyntheticOptions } from '../lib/reduction/testing/synthetic-log';
import { audit } from './audit.server';
import { gaugeRows } from './plans.server';
import type { RequestUser } from './http';
import { storeLog } from './logs.server';

export const demoAccounts: { email: string; name: string; role: Role }[] = [
  { email: 'technician@example.com', name: 'Tomas Reyes (demo)', role: 'technician' },
  { email: 'engineer@example.com', name: 'Imke Sorensen (demo)', role: 'engineer' },
  { email: 'qa@example.com', name: 'Quentin Abara (demo)', role: 'qa' },
  { email: 'admin@example.com', name: 'Ada Mwangi (demo)', role: 'admin' },
];

/** Generic room-temperature properties; code tables vary by edition and temperature. */
export const genericMaterials = [
  { name: 'Carbon steel, generic', elasticModulusMPa: 200_000, poissonRatio: 0.3, yieldStrengthMPa: 260 },
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

/** The demo password DESIGN 6 names as the default of DEMO_PASSWORD. */
export const CONTRACT_DEMO_PASSWORD = 'hoopline-demo';

/**
 * The demo accounts (with `password`), the generic materials and the demo vessel. Existing
 * accounts keep their password, role and state unless `reset` is true (DEMO_RESET=true).
 */
export async function seedDemoAccounts(
  db: Db,
  password: string,
  opts: { reset: boolean },
): Promise<{ users: number; created: number; reset: number; materials: number }> {
  // the contract's default is published with the product, so its strength is moot: demo mode serves
  // loopback only and prints a warning; a DEMO_PASSWORD someone chooses must be a real password
  const problem = password === CONTRACT_DEMO_PASSWORD ? null : passwordProblem(password);
  if (problem) throw new Error(`DEMO_PASSWORD: ${problem}`);
  const passwordHash = await hashPassword(password);
  let created = 0;
  let reset = 0;
  for (const a of demoAccounts) {
    const existing = await findUserByEmail(db, a.email);
    if (!existing) {
      await createUser(db, { ...a, passwordHash });
      created++;
    } else if (opts.reset) {
      await resetUser(db, existing.id, { role: a.role, passwordHash });
      reset++;
    }
  }
  let steelId: number | null = null;
  for (const m of genericMaterials) {
    const id = (await findMaterialByName(db, m.name))?.id ?? (await insertMaterial(db, m));
    if (m.name.startsWith('Carbon')) steelId = id;
  }
  if (!(await findVesselByTag(db, demoVessel.tag))) await insertVessel(db, { ...demoVessel, materialId: steelId });
  return { users: demoAccounts.length, created, reset, materials: genericMaterials.length };
}

export const demoPlan: PlanInput & { remarks?: string } = {
  units: 'SI',
  vessel: {
    name: 'AR-102',
    shape: 'cylinder',
    ends: 'closed',
    insideDiameter: 1200,
    wallThickness: 12,
    length: 4200,
    features: [
      { kind: 'nozzle', name: 'N1 inlet', axialPosition: 2100, clockDeg: 0, size: 150 },
      { kind: 'support', name: 'Saddle W', axialPosition: 700, size: 300 },
      { kind: 'support', name: 'Saddle E', axialPosition: 3500, size: 300 },
    ],
  },
  material: { name: 'Carbon steel, generic', elasticModulus: 200000, poissonRatio: 0.3, yieldStrength: 260 },
  model: 'lame',
  testPressure: 1.95,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  // invented for the demo: no real procedure, code body or person
  procedure: {
    reference: 'DEMO-HT-07 rev A (demo procedure)',
    codeEdition: 'demo: name the governing code and its edition here',
    testMedium: 'water',
    testTemperature: 16,
    witness: 'demo witness (authorised inspector), invented',
  },
  gauges: [
    { id: 'H1', kind: 'uniaxial', channels: ['CH01'], angleDeg: 90, axialPosition: 1500, clockDeg: 90 },
    { id: 'H2', kind: 'uniaxial', channels: ['CH02'], angleDeg: 90, axialPosition: 2800, clockDeg: 270 },
    { id: 'A1', kind: 'uniaxial', channels: ['CH03'], angleDeg: 0, axialPosition: 1500, clockDeg: 100 },
    { id: 'A2', kind: 'uniaxial', channels: ['CH04'], angleDeg: 0, axialPosition: 2800, clockDeg: 260 },
    { id: 'H3', kind: 'uniaxial', channels: ['CH05'], angleDeg: 90, axialPosition: 2100, clockDeg: 12 },
    {
      id: 'R1',
      kind: 'rosette-rectangular',
      channels: ['CH06', 'CH07', 'CH08'],
      angleDeg: 0,
      axialPosition: 2400,
      clockDeg: 180,
      transverseSensitivity: 0.01,
    },
  ],
};

/**
 * The demo's log: an invented test, made to read like a real one. The acquisition unit's noise
 * (2–4 µε, more on the long leads to the far end), the pressure settling for some seconds at the
 * start of each hold, a slow drift of the zero as the water warms, and one gauge (H2) creeping a
 * little through the hold at test pressure. A2 reads 12 % low (a lifted edge) and H3 beside the
 * inlet nozzle 22 % high (local bending): the two flags the demo is about.
 */
export const demoLogOptions: SyntheticOptions = {
  rateHz: 2,
  holdSeconds: 120,
  rampSeconds: 60,
  levels: [0, 0.25, 0.5, 0.75, 0.9, 1, 0.75, 0.5, 0.25, 0],
  seed: 102,
  pressureNoise: 0.0025,
  strainNoise: 2.5,
  settleSeconds: 9,
  gauges: {
    H1: { offset: 14, driftPerHour: 6, noise: 2.2, seatingMicrostrain: 4 },
    H2: { offset: -9, driftPerHour: -5, noise: 3.6, creepMicrostrain: 13, seatingMicrostrain: 6 },
    A1: { offset: 6, driftPerHour: 5, noise: 2.4, seatingMicrostrain: 1.5 },
    A2: { scale: 0.86, offset: -21, driftPerHour: 3, noise: 3.1, seatingMicrostrain: 2.5 },
    H3: { scale: 1.22, offset: 3, driftPerHour: 7, noise: 2.8, seatingMicrostrain: 9 },
    R1: { offset: 11, driftPerHour: -3, noise: 2.6, seatingMicrostrain: 3 },
  },
  format: { preamble: ['unit,DAQ bay 2', 'operator,demo', 'sample rate,2 Hz'], digits: 1 },
};

const LOGGED = 'AR-102 hydrotest at 1.95 MPa (demo)';
const PLANNED = 'AR-102 re-test after nozzle repair (demo, planning)';

/** Create the demo tests once; later runs leave them as they are. */
export async function seedDemoScenario(): Promise<string[]> {
  const db = getDb();
  const done: string[] = [];
  const engineer = await findUserByEmail(db, 'engineer@example.com');
  const technician = await findUserByEmail(db, 'technician@example.com');
  const vessel = await findVesselByTag(db, demoVessel.tag);
  if (!engineer || !technician || !vessel) return done;
  const plan = parsePlan(demoPlan);
  const rows = gaugeRows(plan);

  if (!(await findTestByName(db, LOGGED))) {
    const testId = await insertTest(db, {
      name: LOGGED,
      vesselId: vessel.id,
      plan: demoPlan,
      ownerId: engineer.id,
      status: 'logging',
    });
    await replaceGauges(db, testId, rows);
    const csv = syntheticLog(plan, demoLogOptions);
    // the same path as an upload: the engine's header check, object storage, the log row and its audit row
    const asTechnician: RequestUser = {
      id: technician.id,
      email: technician.email,
      name: technician.name,
      role: 'technician',
      via: 'session',
      scopes: null,
    };
    const test = (await findTest(db, testId))!;
    const { log } = await storeLog({
      test,
      plan,
      source: Readable.from([Buffer.from(csv)]),
      filename: 'ar102-hydrotest.csv',
      user: asTechnician,
      auditDetails: { demo: true },
    });
    const logId = log.id;
    await insertNote(db, {
      testId,
      userId: technician.id,
      kind: 'pressure-held',
      body: 'Held 1.95 MPa for 120 s; pressure settled within 10 s of each stop. No leak at the N1 flange. Water 13 °C at the start, 15 °C at the end; shell 14 °C.',
    });
    const reductionId = await queueReduction(db, { testId, plan: demoPlan, logIds: [logId], queuedBy: technician.id });
    await updateTest(db, testId, {});
    await inTransaction(async (tx) => {
      await audit(tx, {
        userId: technician.id,
        actor: technician.email,
        action: 'reduction-queued',
        testId,
        details: { reductionId, demo: true },
      });
    });
    done.push(LOGGED);
  }
  if (!(await findTestByName(db, PLANNED))) {
    const testId = await insertTest(db, { name: PLANNED, vesselId: vessel.id, plan: demoPlan, ownerId: engineer.id });
    await replaceGauges(db, testId, rows);
    done.push(PLANNED);
  }
  return done;
}
