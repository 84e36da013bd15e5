/**
 * The gaps report as GET /api/households/{id}/gaps sends it and the Gaps page reads it. Wire
 * types live in src/lib beside the pure code that fills them, so islands import them without
 * reaching into server modules.
 */
import type { FrostDates } from './growing-season';
import type { GapCrop, GapsReport } from './gaps';
import type { ShareNutrientKey } from './nutrients';
import type { DatasetRef } from './share-types';

export interface GapsResponse extends GapsReport<ShareNutrientKey> {
  /** The calendar year the growing year starts in; the plan is asked for the same year. */
  year: number;
  from: string;
  to: string;
  /** How the year is called, e.g. '2026' or '2025/26'. */
  label: string;
  /** The frost dates the harvest windows were placed by, and whether they are the hemisphere's default. */
  frostDates: FrostDates & { defaulted: boolean };
  /** People counted for the need. */
  peopleCount: number;
  /** Reference crops weighed (grown on ground, with a composition). */
  cropCount: number;
  /** Crops whose yield is the household's own measured one. */
  ownYieldCrops: string[];
  datasets: DatasetRef[];
  /** Every reference crop weighed, with its nutrient per m² (for working out an edited plan in the browser). */
  crops: GapCrop[];
}
