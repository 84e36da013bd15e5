/**
 * The larder as the household sees it on one day: every stored or preserved lot with something
 * left, what is left in the entry's own unit and in grams, its energy and protein, the day it runs
 * out at the present rate, sums by crop and by category, and the months ahead with nothing left.
 * The lot arithmetic is larder.ts; this file only adds the lots up (server code passes them in).
 */
import { CROP_CATEGORY_LABELS, type CropCategory } from './crop-categories';
import { emptyMonths, lostBy, lotSchedule, remainingOn, type LotSchedule } from './larder';
import type { ExpectedLoss, LarderGroup, LarderLot, LarderOutcomeJson, LarderResponse } from './larder-types';
import type { PreserveMethod } from './retention';
import type { UnitSystem } from './units';
import type { EntryUnit } from './entry-units';

/** One lot as the server reads it: the harvest, its food's values and its outcomes. */
export interface LarderLotInput {
  harvestId: number;
  cropId: number | null;
  name: string;
  category: CropCategory | null;
  use: 'stored' | 'preserved';
  preserveMethod: PreserveMethod | null;
  date: string;
  spreadMonths: number;
  quantity: number;
  unit: EntryUnit;
  grams: number;
  edibleGrams: number;
  /** Per 100 g edible portion; null or missing = the dataset has no value. */
  per100g: { energy_kcal?: number | null; protein_g?: number | null };
  outcomes: LarderOutcomeJson[];
  expectedLoss: ExpectedLoss | null;
}

/** Where the crop table's winter-loss figures come from: the rows' sources cover yields, not losses. */
export const WINTER_LOSS_SOURCE = 'common practice (no published source)';

/**
 * The typical winter loss of a reference crop as an expectation, or null when the table has none,
 * e.g. expectedLossOf({ winterLossFraction: 0.1 }) → { fraction: 0.1, source: 'common practice (no published source)' }.
 */
export function expectedLossOf(row: { winterLossFraction: number | null } | undefined): ExpectedLoss | null {
  if (!row || row.winterLossFraction == null) return null;
  return { fraction: row.winterLossFraction, source: WINTER_LOSS_SOURCE };
}

const round = (n: number, decimals: number) => Math.round(n * 10 ** decimals) / 10 ** decimals;

/**
 * One lot on `today`, or null when the lot has no edible part,
 * e.g. larderLot({ …, date: '2026-10-01', spreadMonths: 3, quantity: 9.2, unit: 'kg', edibleGrams: 9200, … }, '2026-10-01').remainingQuantity → 9.2.
 */
export function larderLot(input: LarderLotInput, today: string): LarderLot | null {
  if (!(input.edibleGrams > 0)) return null;
  const schedule = lotSchedule(input, input.outcomes);
  return lotOn(input, schedule, today);
}

function lotOn(input: LarderLotInput, schedule: LotSchedule, today: string): LarderLot {
  const edibleLeft = remainingOn(schedule, today);
  const lost = lostBy(schedule, today);
  const share = edibleLeft / input.edibleGrams;
  const per = (v: number | null | undefined) => (v == null ? null : (edibleLeft / 100) * v);
  const energy = per(input.per100g.energy_kcal);
  const protein = per(input.per100g.protein_g);
  return {
    harvestId: input.harvestId,
    cropId: input.cropId,
    name: input.name,
    category: input.category,
    use: input.use,
    preserveMethod: input.preserveMethod,
    date: input.date,
    spreadMonths: input.spreadMonths,
    quantity: input.quantity,
    unit: input.unit,
    remainingQuantity: round(input.quantity * share, 3),
    remainingGrams: round(input.grams * share, 1),
    remainingEdibleGrams: round(edibleLeft, 1),
    energyKcal: energy === null ? null : round(energy, 1),
    proteinG: protein === null ? null : round(protein, 2),
    runsOut: schedule.runsOut,
    lostGrams: round(lost, 1),
    edibleGrams: input.edibleGrams,
    eatenEdibleGrams: round(Math.max(0, input.edibleGrams - edibleLeft - lost), 1),
    outcomes: input.outcomes,
    expectedLoss: input.expectedLoss,
  };
}

interface Sum {
  group: LarderGroup;
  energyKnown: boolean;
  proteinKnown: boolean;
}

/** Sums lots by a key; energy or protein stays null only when no lot of the group has a value. */
function groupLots(lots: readonly LarderLot[], keyOf: (l: LarderLot) => { key: string; label: string }): LarderGroup[] {
  const sums = new Map<string, Sum>();
  for (const l of lots) {
    const { key, label } = keyOf(l);
    let s = sums.get(key);
    if (!s) {
      s = { group: { key, label, remainingGrams: 0, energyKcal: 0, proteinG: 0, runsOut: l.runsOut, lots: 0 }, energyKnown: false, proteinKnown: false };
      sums.set(key, s);
    }
    s.group.remainingGrams = round(s.group.remainingGrams + l.remainingGrams, 1);
    if (l.energyKcal !== null) {
      s.group.energyKcal = round((s.group.energyKcal ?? 0) + l.energyKcal, 1);
      s.energyKnown = true;
    }
    if (l.proteinG !== null) {
      s.group.proteinG = round((s.group.proteinG ?? 0) + l.proteinG, 2);
      s.proteinKnown = true;
    }
    if (l.runsOut > s.group.runsOut) s.group.runsOut = l.runsOut;
    s.group.lots += 1;
  }
  return [...sums.values()]
    .map((s) => ({ ...s.group, energyKcal: s.energyKnown ? s.group.energyKcal : null, proteinG: s.proteinKnown ? s.group.proteinG : null }))
    .sort((a, b) => b.remainingGrams - a.remainingGrams || a.label.localeCompare(b.label));
}

/**
 * The larder on `today` ('YYYY-MM-DD', the household's date) from its stored and preserved lots:
 * lots with something left that morning, soonest to run out first, their sums, and the empty
 * months of the next twelve,
 * e.g. larderReport([potatoes], '2026-12-01', 'metric').byCrop[0].remainingGrams.
 */
export function larderReport(inputs: readonly LarderLotInput[], today: string, units: UnitSystem): LarderResponse {
  const lots = inputs
    .map((input) => larderLot(input, today))
    .filter((l): l is LarderLot => l !== null && l.remainingEdibleGrams > 0 && l.runsOut > today)
    .sort((a, b) => (a.runsOut < b.runsOut ? -1 : a.runsOut > b.runsOut ? 1 : a.name.localeCompare(b.name)));
  const byCrop = groupLots(lots, (l) => ({ key: l.cropId != null ? `crop:${l.cropId}` : `food:${l.name}`, label: l.name }));
  const byCategory = groupLots(lots, (l) => ({ key: l.category ?? 'other', label: CROP_CATEGORY_LABELS[l.category ?? 'other'] }));
  const all = groupLots(lots, () => ({ key: 'all', label: 'All' }))[0];
  return {
    today,
    lots,
    byCrop,
    byCategory,
    // Nothing in store is a known zero, not an unknown.
    totals: { remainingGrams: all?.remainingGrams ?? 0, energyKcal: all ? all.energyKcal : 0, proteinG: all ? all.proteinG : 0 },
    emptyMonths: emptyMonths(
      lots.map((l) => l.runsOut),
      today,
    ),
    units,
  };
}
