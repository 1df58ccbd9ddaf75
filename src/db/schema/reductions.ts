import { boolean, double, index, int, mysqlEnum, mysqlTable, text, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref, json } from './columns';
import { tests } from './tests';
import { users } from './users';
import { jobStatuses } from '../../lib/domain';
export { jobStatuses };

export type { JobStatus } from '../../lib/domain';

/** A reduction job and, when done, its result. Old reductions stay, marked superseded. */
export const reductions = mysqlTable(
  'reductions',
  {
    id: id(),
    testId: ref('test_id')
      .notNull()
      .references(() => tests.id),
    status: mysqlEnum('status', jobStatuses).notNull().default('queued'),
    progress: double('progress').notNull().default(0),
    leaseOwner: varchar('lease_owner', { length: 120 }),
    leaseUntil: at('lease_until'),
    attempts: int('attempts').notNull().default(0),
    maxAttempts: int('max_attempts').notNull().default(3),
    /** storage or database faults so far; they back off and do not use up `attempts` */
    transientFailures: int('transient_failures').notNull().default(0),
    /** a job put back after a transient fault waits until then */
    notBefore: at('not_before'),
    engineVersion: varchar('engine_version', { length: 40 }),
    /** plan snapshot and the log ids reduced */
    parameters: json('parameters').$type<{ plan: unknown; logIds: number[] }>().notNull(),
    result: json('result').$type<unknown>(),
    seriesKey: varchar('series_key', { length: 400 }),
    error: text('error'),
    superseded: boolean('superseded').notNull().default(false),
    queuedBy: ref('queued_by').references(() => users.id),
    createdAt: createdAt(),
    startedAt: at('started_at'),
    finishedAt: at('finished_at'),
  },
  (t) => [index('reductions_queue_idx').on(t.status, t.leaseUntil), index('reductions_test_idx').on(t.testId)],
);

export const gaugeResults = mysqlTable(
  'gauge_results',
  {
    id: id(),
    reductionId: ref('reduction_id')
      .notNull()
      .references(() => reductions.id),
    gaugeId: varchar('gauge_id', { length: 64 }).notNull(),
    channel: varchar('channel', { length: 120 }).notNull(),
    angleDeg: double('angle_deg').notNull(),
    measuredSlope: double('measured_slope'),
    predictedSlope: double('predicted_slope').notNull(),
    ratio: double('ratio'),
    deviation: double('deviation'),
    ciLow: double('ci_low'),
    ciHigh: double('ci_high'),
    rSquared: double('r_squared'),
    unloadingSlope: double('unloading_slope'),
    hysteresis: double('hysteresis'),
    zeroShift: double('zero_shift'),
    peakStrain: double('peak_strain'),
    effectiveThickness: double('effective_thickness'),
    flags: json('flags').$type<string[]>().notNull(),
    outcome: varchar('outcome', { length: 20 }).notNull(),
  },
  (t) => [index('gauge_results_reduction_idx').on(t.reductionId, t.gaugeId)],
);

export const rosetteResults = mysqlTable(
  'rosette_results',
  {
    id: id(),
    reductionId: ref('reduction_id')
      .notNull()
      .references(() => reductions.id),
    rosetteId: varchar('rosette_id', { length: 60 }).notNull(),
    principalStrain1: double('principal_strain_1').notNull(),
    principalStrain2: double('principal_strain_2').notNull(),
    principalAngleDeg: double('principal_angle_deg').notNull(),
    principalStress1: double('principal_stress_1').notNull(),
    principalStress2: double('principal_stress_2').notNull(),
    vonMises: double('von_mises').notNull(),
    flags: json('flags').$type<string[]>().notNull(),
  },
  (t) => [index('rosette_results_reduction_idx').on(t.reductionId)],
);

export type Reduction = typeof reductions.$inferSelect;
export type NewReduction = typeof reductions.$inferInsert;
export type GaugeResultRow = typeof gaugeResults.$inferSelect;
export type RosetteResultRow = typeof rosetteResults.$inferSelect;
