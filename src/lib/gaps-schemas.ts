/**
 * Input rules of the Gaps page: the year asked of GET …/gaps, and the plan form (targets per
 * nutrient, year or month basis, an optional area limit) turned into the body of POST …/plan.
 * One zod schema per input, shared by the endpoint, the form's resolver and the tests.
 */
import { z } from 'zod';
import { SHARE_YEARS } from './share-query';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from './nutrients';

/**
 * Query of GET …/gaps: `year` is the calendar year the growing year starts in (YYYY), or absent
 * for the growing year containing today, e.g. gapsQuery.parse({ year: '2026' }) → { year: 2026 }.
 */
export const gapsQuery = z.object({
  year: z
    .string({ error: 'Give the year as four digits, for example 2026.' })
    .trim()
    .regex(/^\d{4}$/, { error: 'Give the year as four digits, for example 2026.' })
    .transform(Number)
    .refine((y) => y >= SHARE_YEARS.min && y <= SHARE_YEARS.max, { error: `The year must be between ${SHARE_YEARS.min} and ${SHARE_YEARS.max}.` })
    .optional(),
});
export type GapsQuery = z.output<typeof gapsQuery>;

/** The shares of need a grower can aim at in the form, in percent. */
export const TARGET_PERCENTS = [25, 50, 75, 100] as const;

/** What a plan's food must cover: the year's total, or every month on its own. */
export const PLAN_BASES = ['year', 'month'] as const;
export type PlanBasis = (typeof PLAN_BASES)[number];

/** The largest added area a form may ask for, m² (a hectare: far beyond a household garden). */
export const MAX_PLAN_AREA_M2 = 10_000;

/** The plan form's values as the inputs hold them (text, '' = no target or no limit). */
export interface PlanFormValues {
  targets: Partial<Record<ShareNutrientKey, string>>;
  basis: PlanBasis;
  maxAreaM2: string;
}

/** The body of POST …/plan that the form sends. */
export interface PlanRequestBody {
  year: number;
  targets: Partial<Record<ShareNutrientKey, number>>;
  basis: PlanBasis;
  maxAreaM2?: number;
}

const targetPercent = z
  .string()
  .trim()
  .refine((v) => v === '' || (/^\d+(\.\d+)?$/.test(v) && Number(v) > 0 && Number(v) <= 300), {
    error: 'A target is a share of need from 1 to 300 %, or none.',
  });

/**
 * The plan form: at least one target; the area limit, when given, a number of m² above 0,
 * e.g. planForm.parse({ targets: { energy_kcal: '50' }, basis: 'month', maxAreaM2: '' })
 *   → { targets: { energy_kcal: 0.5 }, basis: 'month' }.
 */
export const planForm = z
  .object({
    targets: z.object(Object.fromEntries(SHARE_NUTRIENTS.map((k) => [k, targetPercent.optional()])) as Record<ShareNutrientKey, z.ZodOptional<typeof targetPercent>>),
    basis: z.enum(PLAN_BASES, { error: 'Choose whether the plan covers the whole year or every month.' }),
    maxAreaM2: z
      .string()
      .trim()
      .refine((v) => v === '' || (/^\d+(\.\d+)?$/.test(v) && Number(v) > 0 && Number(v) <= MAX_PLAN_AREA_M2), {
        error: `The area limit is a number of m² above 0 and at most ${MAX_PLAN_AREA_M2.toLocaleString('en-US')}, or empty for none.`,
      }),
  })
  .transform((v) => {
    const targets: Partial<Record<ShareNutrientKey, number>> = {};
    for (const k of SHARE_NUTRIENTS) {
      const t = v.targets[k];
      if (t) targets[k] = Number(t) / 100;
    }
    return { targets, basis: v.basis, ...(v.maxAreaM2 ? { maxAreaM2: Number(v.maxAreaM2) } : {}) };
  })
  .superRefine((v, ctx) => {
    if (Object.keys(v.targets).length === 0) {
      ctx.addIssue({ code: 'custom', path: ['targets'], message: 'Choose a target for at least one nutrient, for example energy at 50 %.' });
    }
  });

/** The request body for a year from the parsed form. Example: `planBody(2026, planForm.parse(values))` */
export function planBody(year: number, form: z.output<typeof planForm>): PlanRequestBody {
  return { year, ...form };
}
