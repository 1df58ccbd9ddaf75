import { double, index, mysqlEnum, mysqlTable, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { at, createdAt, id, ref, json } from './columns';
import { users } from './users';
import { shapes, endKinds } from '../../lib/domain';
export { shapes, endKinds };

/** Stored in SI (MPa); the UI converts for US customary display. */
export const materials = mysqlTable(
  'materials',
  {
    id: id(),
    name: varchar('name', { length: 160 }).notNull(),
    elasticModulusMPa: double('elastic_modulus_mpa').notNull(),
    poissonRatio: double('poisson_ratio').notNull(),
    yieldStrengthMPa: double('yield_strength_mpa').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('materials_name_idx').on(t.name)],
);

/** Geometry stored in SI (mm); `units` is the owner's preferred display system. */
export const vessels = mysqlTable(
  'vessels',
  {
    id: id(),
    tag: varchar('tag', { length: 60 }).notNull(),
    name: varchar('name', { length: 160 }).notNull(),
    shape: mysqlEnum('shape', shapes).notNull(),
    ends: mysqlEnum('ends', endKinds).notNull().default('closed'),
    insideDiameterMm: double('inside_diameter_mm').notNull(),
    wallThicknessMm: double('wall_thickness_mm').notNull(),
    lengthMm: double('length_mm'),
    features: json('features')
      .$type<unknown[]>()
      .notNull()
      .$defaultFn(() => []),
    materialId: ref('material_id').references(() => materials.id),
    units: mysqlEnum('units', ['SI', 'US']).notNull().default('SI'),
    createdBy: ref('created_by').references(() => users.id),
    createdAt: createdAt(),
    updatedAt: at('updated_at')
      .notNull()
      .$defaultFn(() => new Date()),
  },
  (t) => [uniqueIndex('vessels_tag_uq').on(t.tag), index('vessels_material_idx').on(t.materialId)],
);

export type Material = typeof materials.$inferSelect;
export type NewMaterial = typeof materials.$inferInsert;
export type Vessel = typeof vessels.$inferSelect;
export type NewVessel = typeof vessels.$inferInsert;
