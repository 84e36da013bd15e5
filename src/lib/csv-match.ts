/**
 * The second step of a CSV import: matching each parsed row's crop name or food code to the
 * household's crops and the reference foods (through resolvers the server passes in), then checking
 * the row with the entry schemas. Pure: the database look-ups stay behind the resolvers.
 */
import { cropUseError, harvestInput, purchaseInput, type HarvestInput, type PurchaseInput } from './entry-schemas';
import { addIssues, byRow, cropNameKey, type CsvError, type ParsedHarvestRow, type ParsedPurchaseRow } from './csv-import';
import { foodCodeText } from './food-code-ref';

/** The row's food code as the person wrote it, and the message when no food has it. */
function unknownFood(row: { foodCode: string; foodDataset?: string }): { text: string; message: string } {
  const text = foodCodeText({ code: row.foodCode, dataset: row.foodDataset });
  const where = row.foodDataset === undefined ? '' : ` in dataset ${row.foodDataset}`;
  return { text, message: `There is no reference food with code "${row.foodCode}"${where}.` };
}

/** A matched crop: its id, and whether it is marked not food (for the use rule). */
export interface CropMatch {
  id: number;
  name?: string;
  notFood?: boolean | null;
}

/** The caller's lookups. cropByName gets the trimmed name and variety; compare with cropNameKey. */
export interface HarvestResolvers {
  cropByName(name: string, variety?: string): number | CropMatch | undefined;
  /** When two names are one crop (default: cropNameKey of both); the server passes the database's collation rule. */
  cropKey?(name: string, variety?: string): string;
  /** The food with this code: of `dataset` when the row names one, else the household's first dataset that has it. */
  foodByCode(code: string, dataset?: string): number | undefined;
}

export interface PurchaseResolvers {
  foodByCode(code: string, dataset?: string): number | undefined;
}

/** A row ready to be written, with its spreadsheet row number. */
export interface ResolvedRow<T> {
  row: number;
  input: T;
}

export interface HarvestResolution {
  inputs: ResolvedRow<HarvestInput>[];
  errors: CsvError[];
  /** Crops not found, once each (first spelling seen), so the page can offer to create them. */
  unknownCrops: { name: string; variety?: string }[];
  unknownFoodCodes: string[];
}

export interface PurchaseResolution {
  inputs: ResolvedRow<PurchaseInput>[];
  errors: CsvError[];
  unknownFoodCodes: string[];
}

function describeCrop(name: string, variety?: string): string {
  return variety === undefined ? `"${name}"` : `"${name}" (${variety})`;
}

/**
 * Matches each row's crop or food code with the caller's lookups and validates the complete harvest
 * (including the not-food rule). Example: `resolveHarvestRows(parsed.rows, { cropByName, foodByCode }).unknownCrops`
 *   → [{ name: 'Oca' }]
 */
export function resolveHarvestRows(rows: readonly ParsedHarvestRow[], resolvers: HarvestResolvers): HarvestResolution {
  const inputs: ResolvedRow<HarvestInput>[] = [];
  const errors: CsvError[] = [];
  const unknownCrops = new Map<string, { name: string; variety?: string }>();
  const unknownFoodCodes = new Set<string>();
  for (const parsed of rows) {
    let ref: { cropId: number } | { foodId: number } | undefined;
    let crop: CropMatch | undefined;
    if (parsed.crop !== undefined) {
      const found = resolvers.cropByName(parsed.crop, parsed.variety);
      crop = typeof found === 'number' ? { id: found } : found;
      if (crop === undefined) {
        const key = resolvers.cropKey?.(parsed.crop, parsed.variety) ?? `${cropNameKey(parsed.crop)}\u0000${cropNameKey(parsed.variety ?? '')}`;
        if (!unknownCrops.has(key)) unknownCrops.set(key, { name: parsed.crop, ...(parsed.variety !== undefined ? { variety: parsed.variety } : {}) });
        errors.push({ row: parsed.row, column: 'crop', message: `There is no crop ${describeCrop(parsed.crop, parsed.variety)} in this household.` });
        continue;
      }
      ref = { cropId: crop.id };
    } else if (parsed.foodCode !== undefined) {
      const foodId = resolvers.foodByCode(parsed.foodCode, parsed.foodDataset);
      if (foodId === undefined) {
        const unknown = unknownFood({ foodCode: parsed.foodCode, foodDataset: parsed.foodDataset });
        unknownFoodCodes.add(unknown.text);
        errors.push({ row: parsed.row, column: 'food_code', message: unknown.message });
        continue;
      }
      ref = { foodId };
    } else {
      errors.push({ row: parsed.row, column: 'crop', message: 'Give the crop name (or a food_code).' });
      continue;
    }
    const notFood = crop === undefined ? undefined : cropUseError(parsed.entry.use, { name: parsed.crop, notFood: crop.notFood });
    if (notFood !== undefined) {
      errors.push({ row: parsed.row, column: 'use', message: notFood });
      continue;
    }
    const result = harvestInput.safeParse({ ...parsed.entry, ...ref });
    if (result.success) inputs.push({ row: parsed.row, input: result.data });
    else addIssues(errors, parsed.row, result.error);
  }
  return { inputs, errors: byRow(errors), unknownCrops: [...unknownCrops.values()], unknownFoodCodes: [...unknownFoodCodes] };
}

/** Matches each bought-food row's food code. Example: `resolvePurchaseRows(parsed.rows, { foodByCode }).inputs[0]?.input.foodId` */
export function resolvePurchaseRows(rows: readonly ParsedPurchaseRow[], resolvers: PurchaseResolvers): PurchaseResolution {
  const inputs: ResolvedRow<PurchaseInput>[] = [];
  const errors: CsvError[] = [];
  const unknownFoodCodes = new Set<string>();
  for (const parsed of rows) {
    const foodId = resolvers.foodByCode(parsed.foodCode, parsed.foodDataset);
    if (foodId === undefined) {
      const unknown = unknownFood(parsed);
      unknownFoodCodes.add(unknown.text);
      errors.push({ row: parsed.row, column: 'food_code', message: unknown.message });
      continue;
    }
    const result = purchaseInput.safeParse({ ...parsed.entry, foodId });
    if (result.success) inputs.push({ row: parsed.row, input: result.data });
    else addIssues(errors, parsed.row, result.error);
  }
  return { inputs, errors: byRow(errors), unknownFoodCodes: [...unknownFoodCodes] };
}
