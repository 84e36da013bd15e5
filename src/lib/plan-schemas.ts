/**
 * The request for a planting plan (POST /api/households/{id}/plan), one zod schema shared by the
 * endpoint and the plan form: the growing year, the share of need to reach per nutrient, whether the
 * targets hold over the year or in every month, an optional area limit, the crops to choose from and
 * the largest share of the energy need one crop may give. Unknown fields are refused by name.
 */
import { z } from 'zod';
import { DEFAULT_MAX_SHARE_OF_ENERGY_PER_CROP } from './plan-model';
import { SHARE_NUTRIENTS, type ShareNutrientKey } from './nutrients';
import { mustBeNumber, oneOf } from './zod-messages';

const CROP_KEY = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** The largest target: three times the need (beyond that a plan grows food to sell, not to eat). */
export const MAX_TARGET_SHARE = 3;

const share = z
  .number({ error: mustBeNumber('A target') })
  .min(0, 'A target is a share of need from 0 to 3 (1 = all of it).')
  .max(MAX_TARGET_SHARE, 'A target is a share of need from 0 to 3 (1 = all of it).');

const targets = z
  .record(z.string(), share, { error: 'Give targets as an object of nutrient key → share of need, e.g. { "energy_kcal": 0.5 }.' })
  .superRefine((value, ctx) => {
    const keys = Object.keys(value);
    if (keys.length === 0) ctx.addIssue({ code: 'custom', message: 'Give at least one target, e.g. { "energy_kcal": 0.5 }.' });
    for (const key of keys) {
      if (!(SHARE_NUTRIENTS as readonly string[]).includes(key)) {
        ctx.addIssue({ code: 'custom', path: [key], message: oneOf('The nutrient', SHARE_NUTRIENTS) });
      }
    }
  })
  .transform((value) => value as Partial<Record<ShareNutrientKey, number>>);

export const planRequest = z.strictObject({
  year: z
    .number({ error: 'Give the growing year as a number, e.g. 2027.' })
    .int('Give the growing year as a whole number, e.g. 2027.')
    .min(1900, 'The growing year must be from 1900 to 2200.')
    .max(2200, 'The growing year must be from 1900 to 2200.'),
  targets,
  basis: z.enum(['year', 'month'], { error: oneOf('The basis', ['year', 'month']) }).default('year'),
  maxAreaM2: z
    .number({ error: mustBeNumber('The area limit') })
    .gt(0, 'The area limit must be more than 0 m².')
    .max(1_000_000, 'The area limit can be at most 1 000 000 m² (100 ha).')
    .optional(),
  crops: z
    .array(z.string({ error: 'A crop is its key in the reference table, e.g. "potatoes".' }).regex(CROP_KEY, 'A crop is its key in the reference table, e.g. "potatoes".'), {
      error: 'Give the crops as a list of keys, e.g. ["potatoes", "kale"].',
    })
    .min(1, 'Give at least one crop, or leave crops out to consider every crop.')
    .max(200, 'Give at most 200 crops.')
    .optional(),
  maxShareOfEnergyPerCrop: z
    .number({ error: mustBeNumber('The largest share of energy per crop') })
    .gt(0, 'The largest share of energy per crop must be more than 0 and at most 1.')
    .max(1, 'The largest share of energy per crop must be more than 0 and at most 1.')
    .default(DEFAULT_MAX_SHARE_OF_ENERGY_PER_CROP),
});

export type PlanRequest = z.infer<typeof planRequest>;
