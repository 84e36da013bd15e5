/**
 * The rules for beds, plantings and the growing season, shared by the beds page's forms and the
 * API. Areas arrive in the household's own unit — m² for a metric household, ft² for a US one —
 * and are stored in m²; the conversion lives here, next to the rule, so the form, the endpoint and
 * the tests use one factor.
 */
import { z } from 'zod';
import { isoDate, recordId, ENTRY_LIMITS } from './entry-schemas';
import { isMonthDay } from './growing-season';
import { lineText, noteText } from './text-schemas';
import { PLANTING_SLOTS } from './planting-slots';
import type { UnitSystem } from './units';
import { mustBeNumber, mustBeWhole, oneOf } from './zod-messages';

/** Area units: square metres and square feet. Example: `AREA_UNITS[1]` → 'ft2' */
export const AREA_UNITS = ['m2', 'ft2'] as const;
export type AreaUnit = (typeof AREA_UNITS)[number];

/** How each area unit is written. Example: `AREA_UNIT_LABELS.ft2` → 'ft²' */
export const AREA_UNIT_LABELS: Readonly<Record<AreaUnit, string>> = { m2: 'm²', ft2: 'ft²' };

/** m² in one square foot: (0.3048 m)², exact since the 1959 international foot. Example: `M2_PER_FT2` → 0.09290304 */
export const M2_PER_FT2 = 0.09290304;

/** The area unit of a unit system. Example: `areaUnitFor('us')` → 'ft2' */
export function areaUnitFor(units: UnitSystem): AreaUnit {
  return units === 'us' ? 'ft2' : 'm2';
}

/** An area in its unit as m². Example: `toM2(100, 'ft2')` → 9.290304 */
export function toM2(area: number, unit: AreaUnit): number {
  if (!Number.isFinite(area) || area < 0) throw new Error(`An area must be zero or more, got ${String(area)}.`);
  return unit === 'ft2' ? area * M2_PER_FT2 : area;
}

/** m² as an area in a unit. Example: `fromM2(9.290304, 'ft2')` → 100 (within rounding) */
export function fromM2(m2: number, unit: AreaUnit): number {
  if (!Number.isFinite(m2) || m2 < 0) throw new Error(`An area must be zero or more, got ${String(m2)}.`);
  return unit === 'ft2' ? m2 / M2_PER_FT2 : m2;
}

/** Limits of the bed and planting rules. Example: `BED_LIMITS.maxArea` → 100000 */
export const BED_LIMITS = {
  /** Largest area in one bed or planting, in its unit: 10 ha in m²; catches a slipped keyboard. */
  maxArea: 100_000,
  maxNameLength: 120,
  maxNotesLength: 500,
  maxPlanCrops: 100,
} as const;

const L = BED_LIMITS;

/** An area in the given unit, more than 0. Example: `area.parse(12.5)` → 12.5 */
export const area = z
  .number({ error: (iss) => (iss.input === undefined ? 'Enter the area.' : mustBeNumber('The area')) })
  .positive({ error: 'The area must be more than 0.' })
  .max(L.maxArea, { error: `The area is too large (at most ${L.maxArea.toLocaleString('en')} in its unit); check the unit.` });

/** m² or ft²; absent means the household's own unit. */
export const areaUnit = z.enum(AREA_UNITS, { error: oneOf('The area unit', AREA_UNITS) });

const name = lineText('The name', L.maxNameLength).min(1, { error: 'Give the bed a name.' });

const notesText = noteText('The notes', L.maxNotesLength);
const notes = notesText.transform((s) => (s === '' ? undefined : s));
const notesOrClear = z.union([notesText.transform((s) => (s === '' ? null : s)), z.null()]);

function checkNotEmpty(value: object, ctx: z.RefinementCtx): void {
  if (Object.values(value).every((v) => v === undefined)) {
    ctx.addIssue({ code: 'custom', path: [], message: 'Nothing to change: give at least one field.' });
  }
}

function checkUnitHasArea(value: { area?: number | undefined; areaUnit?: AreaUnit | undefined }, ctx: z.RefinementCtx): void {
  if (value.areaUnit !== undefined && value.area === undefined) {
    ctx.addIssue({ code: 'custom', path: ['area'], message: 'Give the area together with its unit.' });
  }
}

/**
 * A bed: name, area in the household's unit (or in `areaUnit`), notes.
 * Example: `bedInput.parse({ name: 'North bed', area: 12 })` → { name: 'North bed', area: 12 }
 */
export const bedInput = z.strictObject({ name, area, areaUnit: areaUnit.optional(), notes: notes.optional() });
export type BedInput = z.output<typeof bedInput>;
export type BedInputRaw = z.input<typeof bedInput>;

/** A change to a bed: any field, at least one; null clears the notes. Example: `bedPatch.parse({ notes: null })` */
export const bedPatch = z
  .strictObject({ name, area, areaUnit, notes: notesOrClear })
  .partial()
  .superRefine(checkNotEmpty)
  .superRefine(checkUnitHasArea);
export type BedPatch = z.output<typeof bedPatch>;

/** A season year. Example: `seasonYear.parse(2027)` → 2027 */
export const seasonYear = z
  .number({ error: mustBeNumber('The season year') })
  .int({ error: mustBeWhole('The season year') })
  .min(ENTRY_LIMITS.minYear, { error: `The season year must be between ${ENTRY_LIMITS.minYear} and ${ENTRY_LIMITS.maxYear}.` })
  .max(ENTRY_LIMITS.maxYear, { error: `The season year must be between ${ENTRY_LIMITS.minYear} and ${ENTRY_LIMITS.maxYear}.` });

/** A key of reference-data/crops.csv. Example: `referenceKey.parse('winter-squash')` → 'winter-squash' */
export const referenceKey = z
  .string({ error: 'Choose a crop from the reference list.' })
  .trim()
  .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, { error: 'A reference crop key is lower-case letters, digits and hyphens, e.g. winter-squash.' })
  .max(40, { error: 'A reference crop key has at most 40 characters.' });

const slot = z.enum(PLANTING_SLOTS, { error: oneOf('The slot', PLANTING_SLOTS) });

type PlantingDates = { seasonYear?: number | undefined; sowDate?: string | null | undefined; harvestFrom?: string | null | undefined; harvestTo?: string | null | undefined };

// The harvest may not end before it starts; a sowing more than a year away from its season is a slip
// (autumn-sown grain is sown the year before its season, so one year either side is allowed).
function checkDates(v: PlantingDates, ctx: z.RefinementCtx): void {
  if (v.harvestFrom && v.harvestTo && v.harvestFrom > v.harvestTo) {
    ctx.addIssue({ code: 'custom', path: ['harvestTo'], message: 'The harvest ends before it starts: check both dates.' });
  }
  if (v.sowDate && v.seasonYear !== undefined && Math.abs(Number(v.sowDate.slice(0, 4)) - v.seasonYear) > 1) {
    ctx.addIssue({ code: 'custom', path: ['sowDate'], message: `The sowing date is far from the ${v.seasonYear} season: sow in ${v.seasonYear - 1}, ${v.seasonYear} or ${v.seasonYear + 1}.` });
  }
  if (v.harvestFrom && v.sowDate && v.harvestFrom < v.sowDate) {
    ctx.addIssue({ code: 'custom', path: ['harvestFrom'], message: 'The harvest starts before the sowing date: check both dates.' });
  }
}

/**
 * A planting: the household crop (`cropId`) or a reference crop (`referenceKey`, which finds or
 * adds the household's crop of that row), the bed (or none yet), area in the household's unit,
 * season year, succession slot (default main), sowing date, expected harvest window (absent: worked
 * out from the reference row and the frost dates), notes.
 * Example: `plantingInput.parse({ cropId: 3, bedId: 1, area: 4, seasonYear: 2027 })` → { …, slot: 'main' }
 */
export const plantingInput = z
  .strictObject({
    cropId: recordId.optional(),
    referenceKey: referenceKey.optional(),
    bedId: recordId.nullable().default(null),
    area,
    areaUnit: areaUnit.optional(),
    seasonYear,
    slot: slot.default('main'),
    sowDate: isoDate.optional(),
    harvestFrom: isoDate.optional(),
    harvestTo: isoDate.optional(),
    notes: notes.optional(),
  })
  // The crop choice is checked even when another field is wrong, so a form shows every problem at once.
  .superRefine(
    (v, ctx) => {
      if (v.cropId !== undefined && v.referenceKey !== undefined) {
        ctx.addIssue({ code: 'custom', path: ['referenceKey'], message: 'Give either a crop of the household or a reference crop, not both.' });
      } else if (v.cropId === undefined && v.referenceKey === undefined) {
        ctx.addIssue({ code: 'custom', path: ['cropId'], message: 'Choose the crop this planting grows.' });
      }
    },
    { when: (payload) => typeof payload.value === 'object' && payload.value !== null },
  )
  .superRefine(checkDates);
export type PlantingInput = z.output<typeof plantingInput>;
export type PlantingInputRaw = z.input<typeof plantingInput>;

/** A change to a planting: any field, at least one; null clears the bed, dates or notes. Example: `plantingPatch.parse({ bedId: null })` */
export const plantingPatch = z
  .strictObject({
    cropId: recordId,
    bedId: recordId.nullable(),
    area,
    areaUnit,
    seasonYear,
    slot,
    sowDate: isoDate.nullable(),
    harvestFrom: isoDate.nullable(),
    harvestTo: isoDate.nullable(),
    notes: notesOrClear,
  })
  .partial()
  .superRefine(checkNotEmpty)
  .superRefine(checkUnitHasArea)
  .superRefine(checkDates);
export type PlantingPatch = z.output<typeof plantingPatch>;

/** Which plantings to list: one season year (default: this year in the household). Example: `plantingQuery.parse({ year: '2027' })` → { year: 2027 } */
export const plantingQuery = z.object({
  year: z.preprocess((v) => (typeof v === 'string' && v.trim() === '' ? undefined : v), z.coerce.number({ error: mustBeNumber('The year') }).pipe(seasonYear).optional()),
});

const monthDay = z
  .string({ error: 'Write the frost date as MM-DD, for example 05-01.' })
  .trim()
  .refine(isMonthDay, { error: 'Write the frost date as MM-DD with a day every year has, for example 05-01 (not 02-29).' });

/**
 * The household's growing season: both frost dates as 'MM-DD', or null for the default of its
 * time zone's hemisphere. Both keys are required, so a form always says what it means.
 * Example: `seasonInput.parse({ lastSpringFrost: '04-20', firstAutumnFrost: null })`
 */
export const seasonInput = z
  .strictObject({ lastSpringFrost: monthDay.nullable(), firstAutumnFrost: monthDay.nullable() })
  .superRefine((v, ctx) => {
    if (v.lastSpringFrost !== null && v.lastSpringFrost === v.firstAutumnFrost) {
      ctx.addIssue({ code: 'custom', path: ['firstAutumnFrost'], message: 'The first autumn frost must fall on another day than the last spring frost.' });
    }
  });
export type SeasonInput = z.output<typeof seasonInput>;

/**
 * A plan's crops turned into plantings: the season year and, per reference crop key, the m² to grow.
 * Example: `fromPlanInput.parse({ year: 2027, crops: [{ cropKey: 'potatoes', areaM2: 12 }] })`
 */
export const fromPlanInput = z.strictObject({
  year: seasonYear,
  crops: z
    .array(z.strictObject({ cropKey: referenceKey, areaM2: area }), { error: 'List the plan’s crops.' })
    .min(1, { error: 'A plan needs at least one crop to turn into plantings.' })
    .max(L.maxPlanCrops, { error: `A plan can have at most ${L.maxPlanCrops} crops.` })
    .superRefine((list, ctx) => {
      const seen = new Set<string>();
      list.forEach((c, i) => {
        if (seen.has(c.cropKey)) ctx.addIssue({ code: 'custom', path: [i, 'cropKey'], message: `${c.cropKey} is listed twice: give each crop once, with its whole area.` });
        seen.add(c.cropKey);
      });
    }),
});
export type FromPlanInput = z.output<typeof fromPlanInput>;
