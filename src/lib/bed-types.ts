/**
 * The JSON shapes of the beds, plantings and growing-season API, as pure types: the server builds
 * them and the beds page's island reads them, without the browser importing anything from src/server.
 */
import type { AreaUnit } from './bed-schemas';
import type { CropCategory } from './crop-categories';
import type { SeasonFrostDates } from './growing-season';
import type { PlantingSlot } from './planting-slots';

/** A bed, its area in m² and in the household's unit. */
export interface BedJson {
  id: number;
  name: string;
  areaM2: number;
  /** The area in `areaUnit`, the household's unit. */
  area: number;
  areaUnit: AreaUnit;
  notes: string | null;
}

export interface PlantingJson {
  id: number;
  cropId: number;
  cropName: string;
  /** The crop's row in reference-data/crops.csv, or null. */
  referenceKey: string | null;
  bedId: number | null;
  bedName: string | null;
  areaM2: number;
  area: number;
  areaUnit: AreaUnit;
  seasonYear: number;
  slot: PlantingSlot;
  sowDate: string | null;
  harvestFrom: string | null;
  harvestTo: string | null;
  notes: string | null;
  fromPlan: boolean;
  /** kg harvested so far by harvests that name this planting. */
  harvestedKg: number;
}

/** One crop's yield in a season: the household's own (when harvests name its plantings) beside the reference typical. */
export interface CropYieldJson {
  cropId: number;
  cropName: string;
  referenceKey: string | null;
  /** kg per m², measured; null when no harvest names a planting of this crop in the season. */
  ownKgPerM2: number | null;
  harvestedKg: number;
  measuredAreaM2: number;
  /** Typical kg per m² of the crop's reference row, or null without one. */
  referenceKgPerM2: number | null;
  referenceSource: string | null;
}

export interface PlantingListJson {
  year: number;
  plantings: PlantingJson[];
  yields: CropYieldJson[];
}

/** GET/PUT /season: what is stored (null = default) and what is used. */
export interface SeasonJson {
  stored: { lastSpringFrost: string | null; firstAutumnFrost: string | null };
  season: SeasonFrostDates;
}

/** A reference crop row as the beds page's form needs it. */
export interface ReferenceCropOption {
  key: string;
  name: string;
  category: CropCategory;
  typicalKgPerM2: number;
  harvestFrom: { frost: 'spring' | 'autumn'; weeks: number };
  harvestTo: { frost: 'spring' | 'autumn'; weeks: number };
}
