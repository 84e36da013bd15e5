/**
 * The input rules for recording what happened to a stored or preserved lot, shared by the larder
 * page's form and `POST /api/households/{id}/larder/outcomes`. Whether the outcome fits its lot
 * (not before it, not after today, something left that day) needs the lot and is checked by
 * lotSchedule() in larder.ts.
 */
import { z } from 'zod';
import { isoDate, note, recordId } from './entry-schemas';
import { LARDER_OUTCOMES } from './larder-outcomes';
import { oneOf } from './zod-messages';

/** Share lost of what remained: more than 0, at most 1. Example: `lostFraction.parse(0.25)` → 0.25 */
export const lostFraction = z
  .number({ error: 'The share lost must be a number from 0 to 1 (for example 0.25 for a quarter).' })
  .gt(0, { error: 'The share lost must be more than 0.' })
  .lte(1, { error: 'The share lost can be at most 1 (all of it).' });

/**
 * An outcome: `lostFraction` only for a spoilage (default: all of what remained), `until` only and
 * always for a lot lasting longer, after `date`,
 * e.g. larderOutcomeInput.parse({ harvestId: 7, kind: 'spoiled', date: '2027-01-10', lostFraction: 0.2 }).
 */
export const larderOutcomeInput = z
  .object({
    harvestId: recordId,
    kind: z.enum(LARDER_OUTCOMES, { error: oneOf('What happened', LARDER_OUTCOMES) }),
    date: isoDate,
    lostFraction: lostFraction.optional(),
    until: isoDate.optional(),
    note: note.optional(),
  })
  .superRefine((v, ctx) => {
    if (v.kind !== 'spoiled' && v.lostFraction !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['lostFraction'], message: 'A share lost belongs to a spoilage only.' });
    }
    if (v.kind === 'lasted_longer') {
      if (v.until === undefined) ctx.addIssue({ code: 'custom', path: ['until'], message: 'Enter the day the rest is now expected to last until.' });
      else if (v.until <= v.date) ctx.addIssue({ code: 'custom', path: ['until'], message: 'The new end must be after the day you record it.' });
    } else if (v.until !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['until'], message: 'A new end belongs to a lot that lasts longer only.' });
    }
  });

export type LarderOutcomeInput = z.output<typeof larderOutcomeInput>;

/** `GET …/larder/outcomes?harvestId=N`: the harvest whose records to list. Example: `larderOutcomesQuery.parse({ harvestId: '7' })` → { harvestId: 7 } */
export const larderOutcomesQuery = z.object({
  harvestId: z.coerce.number({ error: 'Give harvestId, the id of the harvest whose larder records to list.' }).pipe(recordId),
});
