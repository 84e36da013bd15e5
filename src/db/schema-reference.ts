/**
 * The reference food composition data (datasets, foods, their nutrients and household weights),
 * shared by every household and loaded by `npm run db:import-foods`. Part of the one schema:
 * src/db/schema.ts re-exports it, and code imports it from there.
 */
import { bigint, double, index, int, mediumtext, mysqlEnum, mysqlTable, primaryKey, smallint, text, timestamp, tinyint, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { DATASET_JOB_KINDS, DATASET_JOB_STATUSES, FDC_FORMATS } from '@/lib/dataset-jobs';
import { longblob } from './column-types';
// ── Reference data: food composition datasets ────────────────────────────────────────────────

/** A public food composition dataset (e.g. USDA SR28), with its release and licence. */
export const datasets = mysqlTable(
  'datasets',
  {
    id: int('id').autoincrement().primaryKey(),
    slug: varchar('slug', { length: 40 }).notNull(),
    name: varchar('name', { length: 200 }).notNull(),
    release: varchar('release', { length: 80 }).notNull(),
    publisher: varchar('publisher', { length: 200 }).notNull(),
    licence: varchar('licence', { length: 200 }).notNull(),
    sourceNote: varchar('source_note', { length: 400 }).notNull().default(''),
    foodCount: int('food_count').notNull().default(0),
    /** One more on every load of the dataset, so stored share answers resting on it are voided. */
    revision: int('revision').notNull().default(1),
    importedAt: timestamp('imported_at').notNull().defaultNow(),
  },
  (t) => [uniqueIndex('datasets_slug_uq').on(t.slug)],
);

/** The nutrients the app knows; rows mirror src/lib/nutrients.ts (written by the importer). */
export const nutrients = mysqlTable('nutrients', {
  key: varchar('key', { length: 40 }).primaryKey(),
  name: varchar('name', { length: 80 }).notNull(),
  unit: varchar('unit', { length: 8 }).notNull(),
  nutrientGroup: varchar('nutrient_group', { length: 16 }).notNull(),
  sortOrder: smallint('sort_order').notNull(),
});

/** One food of a dataset. `code` is the dataset's own code (SR28: the 5-digit NDB number). */
export const foods = mysqlTable(
  'foods',
  {
    id: int('id').autoincrement().primaryKey(),
    datasetId: int('dataset_id')
      .notNull()
      .references(() => datasets.id, { onDelete: 'cascade' }),
    code: varchar('code', { length: 20 }).notNull(),
    name: varchar('name', { length: 255 }).notNull(),
    originalName: varchar('original_name', { length: 255 }).notNull(),
    foodGroup: varchar('food_group', { length: 80 }).notNull(),
    /** Refuse, % of weight as bought or harvested that is not eaten; null when not given. */
    refusePct: double('refuse_pct'),
    /** 0 = raw/whole form, higher = more processed; used to rank search results. */
    rawness: tinyint('rawness').notNull().default(5),
    /** Words the FULLTEXT index searches: readable name, original text, group. */
    searchText: text('search_text').notNull(),
  },
  (t) => [
    uniqueIndex('foods_dataset_code_uq').on(t.datasetId, t.code),
    index('foods_code_idx').on(t.code),
    index('foods_group_idx').on(t.foodGroup),
  ],
);

/** Amount per 100 g edible portion. A missing row means the dataset has no value (unknown, not 0). */
export const foodNutrients = mysqlTable(
  'food_nutrients',
  {
    foodId: int('food_id')
      .notNull()
      .references(() => foods.id, { onDelete: 'cascade' }),
    nutrientKey: varchar('nutrient_key', { length: 40 })
      .notNull()
      .references(() => nutrients.key),
    amount: double('amount').notNull(),
  },
  (t) => [primaryKey({ columns: [t.foodId, t.nutrientKey] }), index('food_nutrients_key_idx').on(t.nutrientKey)],
);

/** Household measures from the dataset ("1 cup, cubes" = 140 g). */
export const foodWeights = mysqlTable(
  'food_weights',
  {
    id: bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey(),
    foodId: int('food_id')
      .notNull()
      .references(() => foods.id, { onDelete: 'cascade' }),
    seq: tinyint('seq').notNull(),
    description: varchar('description', { length: 200 }).notNull(),
    grams: double('grams').notNull(),
  },
  (t) => [uniqueIndex('food_weights_food_seq_uq').on(t.foodId, t.seq)],
);

/** Each load of a dataset (built in or uploaded), newest last: the dataset's release history. */
export const datasetReleases = mysqlTable(
  'dataset_releases',
  {
    id: int('id').autoincrement().primaryKey(),
    datasetId: int('dataset_id')
      .notNull()
      .references(() => datasets.id, { onDelete: 'cascade' }),
    release: varchar('release', { length: 80 }).notNull(),
    foodCount: int('food_count').notNull(),
    amountCount: int('amount_count').notNull(),
    /** The administrator's user id for an upload; null for `npm run db:import-foods`. */
    importedBy: varchar('imported_by', { length: 36 }),
    importedAt: timestamp('imported_at').notNull().defaultNow(),
  },
  (t) => [index('dataset_releases_dataset_idx').on(t.datasetId)],
);

/**
 * A dataset job the admin pages follow. An administrator's FoodData Central upload: read and checked
 * into `payload` (gzipped JSON of the foods and amounts) with progress the page polls, then applied
 * in one transaction on confirmation. Or a reload of a built-in dataset (SR28, IFCT 2017).
 */
export const datasetJobs = mysqlTable('dataset_jobs', {
  id: int('id').autoincrement().primaryKey(),
  kind: mysqlEnum('kind', DATASET_JOB_KINDS).notNull().default('fdc_upload'),
  slug: varchar('slug', { length: 40 }).notNull(),
  name: varchar('name', { length: 200 }).notNull(),
  release: varchar('release', { length: 80 }).notNull(),
  publisher: varchar('publisher', { length: 200 }).notNull(),
  licence: varchar('licence', { length: 200 }).notNull(),
  format: mysqlEnum('format', FDC_FORMATS),
  status: mysqlEnum('status', DATASET_JOB_STATUSES).notNull(),
  /** What the job is doing now, in words ("reading food_nutrient.csv"). */
  phase: varchar('phase', { length: 200 }).notNull().default(''),
  rowsRead: int('rows_read').notNull().default(0),
  bytesRead: bigint('bytes_read', { mode: 'number' }).notNull().default(0),
  bytesTotal: bigint('bytes_total', { mode: 'number' }).notNull().default(0),
  foodCount: int('food_count').notNull().default(0),
  amountCount: int('amount_count').notNull().default(0),
  /** JSON: the rejected rows [{ file, line, column, message }] (first 100). */
  errors: mediumtext('errors'),
  /** JSON: what a new release would change, per household (src/lib/release-changes.ts). */
  preview: mediumtext('preview'),
  payload: longblob('payload'),
  createdBy: varchar('created_by', { length: 36 }).notNull(),
  /** The server process running it ("host:pid:boot id", src/lib/job-runner.ts) while reading or applying. */
  runner: varchar('runner', { length: 160 }),
  /** Touched every few seconds while it runs: a running job with an old heartbeat was left by a server that stopped. */
  heartbeatAt: timestamp('heartbeat_at'),
  /** The slug while the job loads into the database: the unique key lets one load per dataset run at a time. */
  activeSlug: varchar('active_slug', { length: 40 }).unique('dataset_jobs_active_slug'),
  createdAt: timestamp('created_at').notNull().defaultNow(),
  updatedAt: timestamp('updated_at').notNull().defaultNow().onUpdateNow(),
});

export type Dataset = typeof datasets.$inferSelect;
export type DatasetJob = typeof datasetJobs.$inferSelect;
export type Food = typeof foods.$inferSelect;
export type NewFood = typeof foods.$inferInsert;
