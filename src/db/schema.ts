/**
 * The whole database schema (Drizzle, MariaDB). Migrations in drizzle/ are generated from this file
 * with `npm run db:generate` and applied with `npm run db:migrate`.
 */
import {
  bigint,
  boolean,
  char,
  date,
  decimal,
  double,
  index,
  mediumtext,
  int,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  smallint,
  text,
  timestamp,
  tinyint,
  uniqueIndex,
  varchar,
} from 'drizzle-orm/mysql-core';
import { CROP_CATEGORIES } from '@/lib/crop-categories';
import { ROLE_VALUES } from '@/lib/household-schemas';
import { ACTIVITY_LEVELS, CONDITIONS, SEXES } from '@/lib/people-schemas';
import { UNIT_SYSTEMS } from '@/lib/units';
import { ENTRY_UNITS } from '@/lib/entry-units';
import { USES } from '@/lib/uses';
import { DIETS } from '@/lib/diet';
import { PRESERVE_METHODS } from '@/lib/retention';
import { PLANTING_SLOTS } from '@/lib/planting-slots';
import { LARDER_OUTCOMES } from '@/lib/larder-outcomes';
import { mediumblob } from './column-types';
import { foods } from './schema-reference';
import { user } from './schema-auth';

// Reference foods live in their own file, one job each; the schema is still imported from here.
export * from './schema-reference';

// Accounts (better-auth's tables and site administrators) live in their own file too.
export * from './schema-auth';

/** Accounts a site administrator disabled: sign-in is refused and their sessions are deleted. */
export const disabledAccounts = mysqlTable('disabled_accounts', {
  userId: varchar('user_id', { length: 36 }).primaryKey().references(() => user.id, { onDelete: 'cascade' }),
  disabledBy: varchar('disabled_by', { length: 36 }).references(() => user.id, { onDelete: 'set null' }),
  disabledAt: timestamp('disabled_at').notNull().defaultNow(),
});

/** Every site administrator's action (who, what, when); the address is copied so the row outlives the account. */
export const adminActions = mysqlTable(
  'admin_actions',
  {
    id: bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey(),
    userId: varchar('user_id', { length: 36 }).references(() => user.id, { onDelete: 'set null' }),
    userEmail: varchar('user_email', { length: 255 }).notNull(),
    action: varchar('action', { length: 60 }).notNull(),
    subject: varchar('subject', { length: 255 }).notNull(),
    detail: varchar('detail', { length: 1000 }).notNull().default(''),
    createdAt: timestamp('created_at', { fsp: 3 }).notNull().defaultNow(),
  },
  (t) => [index('admin_actions_created_idx').on(t.createdAt)],
);

// ── Households, members and invitations ──────────────────────────────────────────────────

/** The roles, from the one list in src/lib/household-schemas.ts. */
export const ROLES = ROLE_VALUES;
export type Role = (typeof ROLES)[number];

export const households = mysqlTable('households', {
  id: int('id').autoincrement().primaryKey(),
  name: varchar('name', { length: 120 }).notNull(),
  /** IANA time zone; entry dates are the household's local dates. */
  timezone: varchar('timezone', { length: 64 }).notNull(),
  units: mysqlEnum('units', UNIT_SYSTEMS).notNull().default('metric'),
  /** Month (1–12) the household's growing year starts. */
  yearStartMonth: tinyint('year_start_month').notNull().default(1),
  /** 'YYYY-MM': months before it carry no need and stay out of totals; null = the default rule (src/lib/records-start.ts). */
  recordsSince: char('records_since', { length: 7 }),
  /** Growing season as 'MM-DD' (last spring frost, first autumn frost); null = the default for the time zone's hemisphere. */
  lastSpringFrost: char('last_spring_frost', { length: 5 }),
  firstAutumnFrost: char('first_autumn_frost', { length: 5 }),
  /** ISO 4217 code new purchases start with; null = none chosen yet. */
  currency: char('currency', { length: 3 }),
  /** Dataset slugs in the order food search ranks them, comma-separated; null = the order they were loaded. */
  datasetOrder: varchar('dataset_order', { length: 400 }),
  createdAt: timestamp('created_at').notNull().defaultNow(),
});

export const memberships = mysqlTable(
  'memberships',
  {
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    userId: varchar('user_id', { length: 36 })
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    role: mysqlEnum('role', ROLES).notNull(),
    /** Whether this member gets the monthly letter: owners and growers from the day they join, viewers when they choose. */
    monthlyLetter: boolean('monthly_letter').notNull().default(false),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.householdId, t.userId] }), index('memberships_user_idx').on(t.userId)],
);

export const invitations = mysqlTable(
  'invitations',
  {
    id: int('id').autoincrement().primaryKey(),
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    email: varchar('email', { length: 255 }).notNull(),
    role: mysqlEnum('role', ROLES).notNull(),
    /** SHA-256 of the single-use token sent by e-mail (the token itself is never stored). */
    tokenHash: varchar('token_hash', { length: 64 }).notNull(),
    invitedBy: varchar('invited_by', { length: 36 }).references(() => user.id, { onDelete: 'set null' }),
    expiresAt: timestamp('expires_at').notNull(),
    acceptedAt: timestamp('accepted_at'),
    acceptedBy: varchar('accepted_by', { length: 36 }).references(() => user.id, { onDelete: 'set null' }),
    revokedAt: timestamp('revoked_at'),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [uniqueIndex('invitations_token_uq').on(t.tokenHash), index('invitations_household_idx').on(t.householdId)],
);

export type Household = typeof households.$inferSelect;
export type Membership = typeof memberships.$inferSelect;

// ── The household's records: crops, harvests, bought food, staples, people ──────────────────


/** The household's own catalogue of what it grows or keeps, each matched to one reference food. */
export const crops = mysqlTable(
  'crops',
  {
    id: int('id').autoincrement().primaryKey(),
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    name: varchar('name', { length: 120 }).notNull(),
    variety: varchar('variety', { length: 120 }).notNull().default(''),
    foodId: int('food_id').references(() => foods.id, { onDelete: 'restrict' }),
    category: mysqlEnum('category', CROP_CATEGORIES).notNull().default('other'),
    /** Share of the weight the household eats, overriding the food's refuse (0–1). */
    edibleFraction: double('edible_fraction'),
    defaultUse: mysqlEnum('default_use', USES),
    defaultSpreadMonths: tinyint('default_spread_months'),
    /** Ornamental or toxic: never counted as food. */
    notFood: boolean('not_food').notNull().default(false),
    /** The row of reference-data/crops.csv this crop is (yields, harvest window, sowing rate); null = none. */
    referenceKey: varchar('reference_key', { length: 40 }),
    /** Grams of one piece, bunch or head as the grower counts this crop; null = use the food's household weights. */
    countGrams: double('count_grams'),
    /** Place among the pinned crop chips (1 = first); null = not pinned. */
    pinRank: tinyint('pin_rank'),
    archived: boolean('archived').notNull().default(false),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [uniqueIndex('crops_household_name_variety_uq').on(t.householdId, t.name, t.variety)],
);

/** A bed (or any growing area: a row, an orchard strip, a hen run) with its area. */
export const beds = mysqlTable(
  'beds',
  {
    id: int('id').autoincrement().primaryKey(),
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    name: varchar('name', { length: 120 }).notNull(),
    /** Always stored in m²; a US-units household enters ft². */
    areaM2: double('area_m2').notNull(),
    notes: varchar('notes', { length: 500 }),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [uniqueIndex('beds_household_name_uq').on(t.householdId, t.name)],
);

/** A crop grown in a bed in one season (and succession slot), planned or sown. */
export const plantings = mysqlTable(
  'plantings',
  {
    id: int('id').autoincrement().primaryKey(),
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    cropId: int('crop_id')
      .notNull()
      .references(() => crops.id, { onDelete: 'restrict' }),
    /** Null while a planned planting has no bed yet. */
    bedId: int('bed_id').references(() => beds.id, { onDelete: 'set null' }),
    areaM2: double('area_m2').notNull(),
    seasonYear: smallint('season_year').notNull(),
    slot: mysqlEnum('slot', PLANTING_SLOTS).notNull().default('main'),
    sowDate: date('sow_date', { mode: 'string' }),
    harvestFrom: date('harvest_from', { mode: 'string' }),
    harvestTo: date('harvest_to', { mode: 'string' }),
    notes: varchar('notes', { length: 500 }),
    /** Made from a plan with one action (the planner's suggestion), not typed by hand. */
    fromPlan: boolean('from_plan').notNull().default(false),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [
    index('plantings_household_season_idx').on(t.householdId, t.seasonYear),
    index('plantings_bed_idx').on(t.bedId),
  ],
);

/** One weighing (or one part of a split weighing) and what happened to it. */
export const harvests = mysqlTable(
  'harvests',
  {
    id: bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey(),
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    cropId: int('crop_id').references(() => crops.id, { onDelete: 'restrict' }),
    /** The reference food (the crop's, or chosen directly); null only for a not-food crop without one. */
    foodId: int('food_id').references(() => foods.id, { onDelete: 'restrict' }),
    date: date('date', { mode: 'string' }).notNull(),
    quantity: double('quantity').notNull(),
    unit: mysqlEnum('unit', ENTRY_UNITS).notNull(),
    grams: double('grams').notNull(),
    edibleGrams: double('edible_grams').notNull(),
    /** Where a count or volume got its grams ("USDA SR28 01123: 1 large = 50 g"); null for a weight. */
    weightSource: varchar('weight_source', { length: 200 }),
    use: mysqlEnum('use', USES).notNull(),
    spreadMonths: tinyint('spread_months').notNull().default(1),
    /** The planting it came from, so the household's own yield per m² can be measured. */
    plantingId: int('planting_id').references(() => plantings.id, { onDelete: 'set null' }),
    /** How a preserved entry was kept; its vitamins are reduced by the retention factors (src/lib/retention.ts). */
    preserveMethod: mysqlEnum('preserve_method', PRESERVE_METHODS),
    trimmed: boolean('trimmed').notNull().default(false),
    note: varchar('note', { length: 500 }),
    /** Entries saved from one split weighing share this id. */
    splitGroup: varchar('split_group', { length: 36 }),
    createdBy: varchar('created_by', { length: 36 }).references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at').notNull().defaultNow(),
    updatedAt: timestamp('updated_at').notNull().defaultNow().onUpdateNow(),
  },
  (t) => [
    index('harvests_household_date_idx').on(t.householdId, t.date),
    index('harvests_household_crop_idx').on(t.householdId, t.cropId),
  ],
);

/** Bought food, staples above all; bulk buys are spread over the months they last. */
export const purchases = mysqlTable(
  'purchases',
  {
    id: bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey(),
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    foodId: int('food_id')
      .notNull()
      .references(() => foods.id, { onDelete: 'restrict' }),
    date: date('date', { mode: 'string' }).notNull(),
    quantity: double('quantity').notNull(),
    unit: mysqlEnum('unit', ENTRY_UNITS).notNull(),
    grams: double('grams').notNull(),
    edibleGrams: double('edible_grams').notNull(),
    /** Where a count or volume got its grams; null for a weight. */
    weightSource: varchar('weight_source', { length: 200 }),
    price: decimal('price', { precision: 12, scale: 2 }),
    currency: varchar('currency', { length: 3 }),
    spreadMonths: tinyint('spread_months').notNull().default(1),
    trimmed: boolean('trimmed').notNull().default(false),
    note: varchar('note', { length: 500 }),
    createdBy: varchar('created_by', { length: 36 }).references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at').notNull().defaultNow(),
    updatedAt: timestamp('updated_at').notNull().defaultNow().onUpdateNow(),
  },
  (t) => [index('purchases_household_date_idx').on(t.householdId, t.date)],
);

/** Entry-creating requests already answered, by Idempotency-Key: a retry gets the first answer. */
export const idempotencyKeys = mysqlTable(
  'idempotency_keys',
  {
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    /** The member who sent it: the same key from another member is another key ('' for keys stored before migration 0008). */
    userId: varchar('user_id', { length: 36 }).notNull().default(''),
    key: varchar('key', { length: 100 }).notNull(),
    route: varchar('route', { length: 40 }).notNull(),
    /** SHA-256 (hex) of the request's path and body: the key reused with another body is refused ('' = not recorded). */
    requestHash: char('request_hash', { length: 64 }).notNull().default(''),
    status: smallint('status').notNull(),
    response: text('response').notNull(),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.householdId, t.userId, t.key] })],
);

/** Foods a household buys again and again: one tap to log another. */
export const staples = mysqlTable(
  'staples',
  {
    id: int('id').autoincrement().primaryKey(),
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    foodId: int('food_id')
      .notNull()
      .references(() => foods.id, { onDelete: 'restrict' }),
    label: varchar('label', { length: 120 }).notNull(),
    quantity: double('quantity').notNull(),
    unit: mysqlEnum('unit', ENTRY_UNITS).notNull(),
    spreadMonths: tinyint('spread_months').notNull().default(1),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [uniqueIndex('staples_household_food_uq').on(t.householdId, t.foodId, t.quantity, t.unit)],
);

/** People who eat in the household (not the same as members who sign in). */
export const people = mysqlTable(
  'people',
  {
    id: int('id').autoincrement().primaryKey(),
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    name: varchar('name', { length: 120 }).notNull(),
    sex: mysqlEnum('sex', SEXES).notNull(),
    ageYears: double('age_years'),
    birthYear: smallint('birth_year'),
    /** 'YYYY-MM': age is then counted in months (wins over age and birth year). */
    birthMonth: char('birth_month', { length: 7 }),
    heightCm: double('height_cm'),
    weightKg: double('weight_kg'),
    activity: mysqlEnum('activity', ACTIVITY_LEVELS).notNull().default('low'),
    condition: mysqlEnum('condition', CONDITIONS).notNull().default('none'),
    /** Dated pregnancy and lactation ('YYYY-MM'); when given they replace the condition flag. */
    pregnancyDueMonth: char('pregnancy_due_month', { length: 7 }),
    lactationFrom: char('lactation_from', { length: 7 }),
    lactationTo: char('lactation_to', { length: 7 }),
    /** A baby under 6 months adds need only when fed from the household's food. */
    fedFromHousehold: boolean('fed_from_household').notNull().default(false),
    diet: mysqlEnum('diet', DIETS).notNull().default('omnivore'),
    kcalPerDay: double('kcal_per_day'),
    atHomePct: double('at_home_pct').notNull().default(100),
    presentFrom: date('present_from', { mode: 'string' }),
    presentTo: date('present_to', { mode: 'string' }),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [index('people_household_idx').on(t.householdId)],
);

export type Crop = typeof crops.$inferSelect;
export type Harvest = typeof harvests.$inferSelect;
export type Purchase = typeof purchases.$inferSelect;
export type Person = typeof people.$inferSelect;
export type Bed = typeof beds.$inferSelect;
export type Planting = typeof plantings.$inferSelect;

/**
 * What happened to a stored or preserved lot (one harvest row) after it went into store. Outcomes
 * apply in date order to what remained on their date (src/lib/larder.ts); the share report follows them.
 */
export const larderOutcomes = mysqlTable(
  'larder_outcomes',
  {
    id: bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey(),
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    harvestId: bigint('harvest_id', { mode: 'number', unsigned: true })
      .notNull()
      .references(() => harvests.id, { onDelete: 'cascade' }),
    kind: mysqlEnum('kind', LARDER_OUTCOMES).notNull(),
    /** The day it happened (or was noticed), the household's local date. */
    date: date('date', { mode: 'string' }).notNull(),
    /** Spoiled: the share (0–1] of what remained that day that was lost. */
    lostFraction: double('lost_fraction'),
    /** Lasting longer: the day the rest is now expected to run out (excluded). */
    until: date('until', { mode: 'string' }),
    note: varchar('note', { length: 500 }),
    createdBy: varchar('created_by', { length: 36 }).references(() => user.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [index('larder_outcomes_household_harvest_idx').on(t.householdId, t.harvestId)],
);

/**
 * One monthly letter (household, month, member), claimed under its unique key before it is sent,
 * so two app servers, or a run restarted midway, never send it twice; a failed send is retried.
 */
export const letters = mysqlTable(
  'letters',
  {
    id: bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey(),
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    userId: varchar('user_id', { length: 36 })
      .notNull()
      .references(() => user.id, { onDelete: 'cascade' }),
    /** 'YYYY-MM': the month the letter reports on. */
    month: char('month', { length: 7 }).notNull(),
    status: mysqlEnum('status', ['sending', 'sent', 'failed']).notNull(),
    /** Which run claimed it (a random id per run), so only that run marks it. */
    claimedBy: varchar('claimed_by', { length: 36 }).notNull(),
    attempts: tinyint('attempts').notNull().default(1),
    error: varchar('error', { length: 500 }),
    claimedAt: timestamp('claimed_at').notNull().defaultNow(),
    sentAt: timestamp('sent_at'),
  },
  (t) => [uniqueIndex('letters_household_month_user_uq').on(t.householdId, t.month, t.userId)],
);

// ── The share report's rollup and stored answers (issue 14) ─────────────────────────────────────
// Kept by triggers on the entry tables (drizzle/0009_share_rollup.sql), so every write — the API,
// an import, a raw statement — updates them in its own transaction. See src/server/share-rollup.ts.

/**
 * Harvests summed as the share report groups them: by household, day (a lot eaten by day: stored or
 * preserved over 2 months or more) or month's first day (the rest), use, spread, preserving method
 * ('' = none), crop (0 = none) and food (0 = none). Lots with larder records are left out (the report
 * reads them one by one). A group whose last entry goes is deleted, so `entries` is never 0.
 */
export const harvestGroups = mysqlTable(
  'harvest_groups',
  {
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    day: date('day', { mode: 'string' }).notNull(),
    use: mysqlEnum('use', USES).notNull(),
    spread: tinyint('spread').notNull(),
    preserveMethod: varchar('preserve_method', { length: 12 }).notNull().default(''),
    cropId: int('crop_id').notNull().default(0),
    foodId: int('food_id').notNull().default(0),
    grams: double('grams').notNull(),
    edibleGrams: double('edible_grams').notNull(),
    entries: int('entries').notNull(),
  },
  (t) => [primaryKey({ name: 'harvest_groups_pk', columns: [t.householdId, t.day, t.use, t.spread, t.preserveMethod, t.cropId, t.foodId] })],
);

/** Bought food summed the same way: by household, day or month's first day (spread ≥ 2: by day), spread and food. */
export const purchaseGroups = mysqlTable(
  'purchase_groups',
  {
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    day: date('day', { mode: 'string' }).notNull(),
    spread: tinyint('spread').notNull(),
    foodId: int('food_id').notNull(),
    grams: double('grams').notNull(),
    edibleGrams: double('edible_grams').notNull(),
    entries: int('entries').notNull(),
  },
  (t) => [primaryKey({ name: 'purchase_groups_pk', columns: [t.householdId, t.day, t.spread, t.foodId] })],
);

/**
 * A household's share data version: a new stamp on every statement that writes its entries, larder
 * records, crops or people (the statement's start to the microsecond, server and connection: the
 * same for every row of one statement, so a bulk insert writes it once, and never the same for two).
 */
export const shareVersions = mysqlTable('share_versions', {
  householdId: int('household_id')
    .primaryKey()
    .references(() => households.id, { onDelete: 'cascade' }),
  version: varchar('version', { length: 64 }).notNull(),
});

/**
 * Share report answers as sent (JSON; `body_gzip` the same gzip-compressed, for clients that accept it), by household and a key naming the request as asked (range
 * or none, build), with the context they were worked out in (the range it meant, current month,
 * zone, records start, creation, year start); valid while that context is still the household's
 * and the household's share version and the reference datasets' revision are the ones stored beside them.
 */
export const shareCache = mysqlTable(
  'share_cache',
  {
    householdId: int('household_id')
      .notNull()
      .references(() => households.id, { onDelete: 'cascade' }),
    answerKey: varchar('answer_key', { length: 190 }).notNull(),
    version: varchar('version', { length: 64 }).notNull(),
    referenceRevision: bigint('reference_revision', { mode: 'number', unsigned: true }).notNull(),
    context: varchar('context', { length: 255 }).notNull().default(''),
    body: mediumtext('body').notNull(),
    bodyGzip: mediumblob('body_gzip'),
    createdAt: timestamp('created_at').notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.householdId, t.answerKey] })],
);

export type LarderOutcome = typeof larderOutcomes.$inferSelect;
export type Letter = typeof letters.$inferSelect;
