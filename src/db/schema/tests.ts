import { bigint, double, index, int, mysqlEnum, mysqlTable, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref, json } from './columns';
import { users } from './users';
import { vessels } from './vessels';
import { testStatuses, verdicts, gaugeKinds, noteKinds } from '../../lib/domain';
export { testStatuses, verdicts, gaugeKinds, noteKinds };

export type { TestStatus } from '../../lib/domain';

export const tests = mysqlTable(
  'tests',
  {
    id: id(),
    name: varchar('name', { length: 200 }).notNull(),
    vesselId: ref('vessel_id')
      .notNull()
      .references(() => vessels.id),
    status: mysqlEnum('status', testStatuses).notNull().default('draft'),
    /** the plan exactly as imported or last saved (DESIGN 4.1) */
    plan: json('plan').$type<unknown>().notNull(),
    ownerId: ref('owner_id').references(() => users.id),
    /** the newest reduction that is not superseded */
    currentReductionId: bigint('current_reduction_id', { mode: 'number', unsigned: true }),
    verdict: mysqlEnum('verdict', verdicts),
    flaggedCount: int('flagged_count').notNull().default(0),
    createdAt: createdAt(),
    updatedAt: at('updated_at')
      .notNull()
      .$defaultFn(() => new Date()),
    lastActivityAt: at('last_activity_at')
      .notNull()
      .$defaultFn(() => new Date()),
  },
  (t) => [
    index('tests_vessel_idx').on(t.vesselId),
    index('tests_status_idx').on(t.status),
    index('tests_activity_idx').on(t.lastActivityAt),
  ],
);

/** The test plan's installation, one row per gauge, rewritten from the plan on every save. */
export const gauges = mysqlTable(
  'gauges',
  {
    id: id(),
    testId: ref('test_id')
      .notNull()
      .references(() => tests.id),
    gaugeId: varchar('gauge_id', { length: 60 }).notNull(),
    kind: mysqlEnum('kind', gaugeKinds).notNull(),
    channels: json('channels').$type<string[]>().notNull(),
    angleDeg: double('angle_deg').notNull(),
    gaugeFactor: double('gauge_factor').notNull(),
    instrumentGaugeFactor: double('instrument_gauge_factor').notNull(),
    transverseSensitivity: double('transverse_sensitivity').notNull().default(0),
    distanceToDiscontinuity: double('distance_to_discontinuity'),
    axialPosition: double('axial_position'),
    clockDeg: double('clock_deg'),
  },
  (t) => [uniqueIndex('gauges_test_gauge_uq').on(t.testId, t.gaugeId)],
);

export const notes = mysqlTable(
  'notes',
  {
    id: id(),
    testId: ref('test_id')
      .notNull()
      .references(() => tests.id),
    userId: ref('user_id')
      .notNull()
      .references(() => users.id),
    kind: mysqlEnum('kind', noteKinds).notNull().default('general'),
    body: text('body').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('notes_test_idx').on(t.testId)],
);

export type Test = typeof tests.$inferSelect;
export type NewTest = typeof tests.$inferInsert;
export type Gauge = typeof gauges.$inferSelect;
export type NewGauge = typeof gauges.$inferInsert;
export type Note = typeof notes.$inferSelect;
