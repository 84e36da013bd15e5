/**
 * The household's growing season in the database: its own frost dates (households.last_spring_frost
 * and first_autumn_frost, 'MM-DD'), or null for the default of its time zone's hemisphere
 * (src/lib/growing-season.ts). Owners and growers set them on the beds page.
 */
import { eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { households, type Household } from '@/db/schema';
import type { SeasonInput } from '@/lib/bed-schemas';
import type { SeasonJson } from '@/lib/bed-types';
import { seasonFrostDates } from '@/lib/growing-season';

/** The stored frost dates and the ones in use. Example: `seasonJson(h).season.lastSpringFrost` → '05-01' */
export function seasonJson(h: Pick<Household, 'lastSpringFrost' | 'firstAutumnFrost' | 'timezone'>): SeasonJson {
  const stored = { lastSpringFrost: h.lastSpringFrost, firstAutumnFrost: h.firstAutumnFrost };
  return { stored, season: seasonFrostDates(stored, h.timezone) };
}

/** Stores the household's frost dates (null = the default) and answers them. */
export async function setSeason(h: Pick<Household, 'id' | 'timezone'>, input: SeasonInput): Promise<SeasonJson> {
  await getDb().update(households).set({ lastSpringFrost: input.lastSpringFrost, firstAutumnFrost: input.firstAutumnFrost }).where(eq(households.id, h.id));
  return seasonJson({ ...input, timezone: h.timezone });
}
