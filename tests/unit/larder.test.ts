import { describe, expect, it } from 'vitest';
import { emptyMonths, LarderOutcomeError, lostBy, lotSchedule, remainingOn } from '@/lib/larder';
import { expectedLossOf, larderReport, type LarderLotInput } from '@/lib/larder-report';
import { larderOutcomeInput } from '@/lib/larder-schemas';
import { lotGroupRows } from '@/lib/larder-share';
import { addDays } from '@/lib/months';
import { outcomeBody } from '@/components/larder/outcome-form-values';
import { spreadBetween, spreadEnd } from '@/lib/spread';

// 24 kg of potatoes stored on 1 Oct 2026 over 6 months: USDA SR28, NDB 11352 "Potatoes, flesh and
// skin, raw": 25 % refuse, so 18 000 g edible; 77 kcal and 2.05 g protein per 100 g.
// 1 Oct 2026 – 1 Apr 2027 = 31 + 30 + 31 + 31 + 28 + 31 = 182 days (Gregorian calendar).
const potatoes = { date: '2026-10-01', spreadMonths: 6, edibleGrams: 18000 };
const DAYS = 182;

describe('dates the larder needs', () => {
  it('adds days across month and year ends', () => {
    // Gregorian calendar: 2026 is not a leap year, 2028 is
    expect(addDays('2026-02-28', 1)).toBe('2026-03-01');
    expect(addDays('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDays('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDays('2027-01-01', -1)).toBe('2026-12-31');
  });

  it('ends a spread with date-fns addMonths semantics', () => {
    expect(spreadEnd('2027-01-31', 1)).toBe('2027-02-28');
    expect(spreadEnd('2026-10-01', 6)).toBe('2027-04-01');
  });

  it('spreads between two days by the days in each month', () => {
    // 20 Jan – 10 Feb: 12 days in January, 9 in February
    const parts = spreadBetween('2027-01-20', '2027-02-10');
    expect(parts.map((p) => p.offset)).toEqual([0, 1]);
    expect(parts[0]!.fraction).toBeCloseTo(12 / 21, 12);
    expect(() => spreadBetween('2027-01-20', '2027-01-20')).toThrow(RangeError);
  });
});

describe('a lot without outcomes', () => {
  it('is eaten evenly per day and runs out on the day its spread ends', () => {
    const s = lotSchedule(potatoes, []);
    expect(s.runsOut).toBe('2027-04-01');
    expect(s.segments).toEqual([{ from: '2026-10-01', until: '2027-04-01', edibleGrams: 18000 }]);
    expect(remainingOn(s, '2026-10-01')).toBe(18000);
    // 1 Dec 2026 is 61 days in (31 + 30): 121 of 182 days left
    expect(remainingOn(s, '2026-12-01')).toBeCloseTo((18000 * 121) / DAYS, 9);
    expect(remainingOn(s, '2027-04-01')).toBe(0);
    expect(remainingOn(s, '2026-09-30')).toBe(18000);
  });
});

describe('recorded outcomes', () => {
  const left1Dec = (18000 * 121) / DAYS;

  it('a spoilage moves a share of what remained that day to lost and keeps the end', () => {
    const s = lotSchedule(potatoes, [{ kind: 'spoiled', date: '2026-12-01', lostFraction: 0.25 }]);
    expect(s.runsOut).toBe('2027-04-01');
    expect(s.lost).toEqual([{ date: '2026-12-01', edibleGrams: expect.closeTo(0.25 * left1Dec, 9) }]);
    expect(s.segments).toHaveLength(2);
    expect(s.segments[0]).toEqual({ from: '2026-10-01', until: '2026-12-01', edibleGrams: expect.closeTo(18000 - left1Dec, 9) });
    expect(s.segments[1]).toEqual({ from: '2026-12-01', until: '2027-04-01', edibleGrams: expect.closeTo(0.75 * left1Dec, 9) });
    // The morning before the loss the whole remainder is still in store; that morning three quarters.
    expect(remainingOn(s, '2026-11-30')).toBeCloseTo((18000 * 122) / DAYS, 9);
    expect(remainingOn(s, '2026-12-01')).toBeCloseTo(0.75 * left1Dec, 9);
    // 1 Jan 2027: 90 of the 121 days from 1 Dec left
    expect(remainingOn(s, '2027-01-01')).toBeCloseTo((0.75 * left1Dec * 90) / 121, 9);
    expect(lostBy(s, '2026-11-30')).toBe(0);
    expect(lostBy(s, '2026-12-01')).toBeCloseTo(0.25 * left1Dec, 9);
    // Eaten + lost = the whole lot
    const eaten = s.segments.reduce((sum, x) => sum + x.edibleGrams, 0);
    expect(eaten + lostBy(s, '2027-12-31')).toBeCloseTo(18000, 9);
  });

  it('a spoilage of the whole remainder empties the lot that day', () => {
    const s = lotSchedule(potatoes, [{ kind: 'spoiled', date: '2026-12-01' }]);
    expect(s.runsOut).toBe('2026-12-01');
    expect(remainingOn(s, '2026-12-01')).toBe(0);
    expect(s.segments).toHaveLength(1);
    expect(() => lotSchedule(potatoes, [{ kind: 'spoiled', date: '2026-12-01' }, { kind: 'used_up', date: '2026-12-05' }])).toThrow(
      /Nothing of this lot was left on 2026-12-05: the rest of it was lost on 2026-12-01/,
    );
  });

  it('an early use-up eats the remainder on its day; the lot is empty the next morning', () => {
    const s = lotSchedule(potatoes, [
      { kind: 'spoiled', date: '2026-12-01', lostFraction: 0.25 },
      { kind: 'used_up', date: '2027-01-15' },
    ]);
    expect(s.runsOut).toBe('2027-01-16');
    // 1 Dec – 15 Jan is 45 days of the 121 from 1 Dec, so 76 are left on the morning of 15 Jan
    const left15Jan = (0.75 * left1Dec * 76) / 121;
    expect(s.segments.at(-1)).toEqual({ from: '2027-01-15', until: '2027-01-16', edibleGrams: expect.closeTo(left15Jan, 9) });
    expect(remainingOn(s, '2027-01-15')).toBeCloseTo(left15Jan, 9);
    expect(remainingOn(s, '2027-01-16')).toBe(0);
    expect(() => lotSchedule(potatoes, [{ kind: 'used_up', date: '2027-01-15' }, { kind: 'spoiled', date: '2027-01-20' }])).toThrow(
      /Nothing of this lot was left on 2027-01-20: it was used up on 2027-01-15/,
    );
  });

  it('a lot that lasts longer re-spreads what remained over the new days', () => {
    const s = lotSchedule(potatoes, [{ kind: 'lasted_longer', date: '2027-03-01', until: '2027-05-01' }]);
    // 1 Mar is 151 days in: 31 of 182 days left → re-spread over 1 Mar – 1 May (61 days)
    const left1Mar = (18000 * 31) / DAYS;
    expect(s.runsOut).toBe('2027-05-01');
    expect(remainingOn(s, '2027-04-01')).toBeCloseTo((left1Mar * 30) / 61, 9);
    expect(() => lotSchedule(potatoes, [{ kind: 'lasted_longer', date: '2027-03-01', until: '2027-03-01' }])).toThrow(/new end after 2027-03-01/);
    // 24 months at most from the day it went into store (ENTRY_LIMITS.maxSpreadMonths)
    expect(() => lotSchedule(potatoes, [{ kind: 'lasted_longer', date: '2027-03-01', until: '2028-10-02' }])).toThrow(/latest end is 2028-10-01/);
  });

  it('applies outcomes in date order whatever order they come in', () => {
    const a = lotSchedule(potatoes, [
      { id: 2, kind: 'used_up', date: '2027-01-15' },
      { id: 1, kind: 'spoiled', date: '2026-12-01', lostFraction: 0.25 },
    ]);
    expect(a.runsOut).toBe('2027-01-16');
    expect(a.lost).toHaveLength(1);
  });

  it('refuses an outcome before the lot, after today, or after the lot ran out, naming the day', () => {
    expect(() => lotSchedule(potatoes, [{ kind: 'used_up', date: '2026-09-30' }])).toThrow(/went into store on 2026-10-01/);
    expect(() => lotSchedule(potatoes, [{ kind: 'used_up', date: '2026-12-02' }], { today: '2026-12-01' })).toThrow(/after today \(2026-12-01\)/);
    const late = () => lotSchedule(potatoes, [{ id: 9, kind: 'spoiled', date: '2027-04-01' }]);
    expect(late).toThrow(LarderOutcomeError);
    expect(late).toThrow(/left on 2027-04-01: the last of it was eaten on 2027-03-31/);
    try {
      late();
    } catch (e) {
      expect((e as LarderOutcomeError).outcomeId).toBe(9);
    }
  });
});

describe('empty months', () => {
  it('lists the months of the next twelve that start with every lot run out', () => {
    // Lots running out on 10 Feb and 1 Apr 2027: March is still fed by the second; April on is empty
    expect(emptyMonths(['2027-02-10', '2027-04-01'], '2026-12-05')).toEqual([
      '2027-04', '2027-05', '2027-06', '2027-07', '2027-08', '2027-09', '2027-10', '2027-11',
    ]);
    expect(emptyMonths([], '2026-12-05', 2)).toEqual(['2026-12', '2027-01']);
  });
});

function lot(over: Partial<LarderLotInput>): LarderLotInput {
  return {
    harvestId: 1,
    cropId: 1,
    name: 'Potatoes',
    category: 'root_tuber',
    use: 'stored',
    preserveMethod: null,
    date: '2026-10-01',
    spreadMonths: 6,
    quantity: 24,
    unit: 'kg',
    grams: 24000,
    edibleGrams: 18000,
    // USDA SR28, NDB 11352: 77 kcal and 2.05 g protein per 100 g
    per100g: { energy_kcal: 77, protein_g: 2.05 },
    outcomes: [],
    expectedLoss: null,
    ...over,
  };
}

describe('the larder on a day', () => {
  it('sums several lots by crop and category, with what is left in the entry unit and its energy', () => {
    const onions = lot({
      harvestId: 2,
      cropId: 2,
      name: 'Onions',
      category: 'other',
      date: '2026-09-01',
      spreadMonths: 4,
      quantity: 10,
      unit: 'lb',
      // 10 lb = 4535.9237 g (International Yard and Pound Agreement, 1959); USDA SR28, NDB 11282 "Onions, raw": 10 % refuse
      grams: 4535.9237,
      edibleGrams: 4082.33133,
      // USDA SR28, NDB 11282: 40 kcal and 1.10 g protein per 100 g
      per100g: { energy_kcal: 40, protein_g: 1.1 },
    });
    const squash = lot({ harvestId: 3, cropId: 3, name: 'Squash', category: 'squash', date: '2026-10-01', spreadMonths: 1, per100g: { energy_kcal: null } });
    const spoiled = lot({ harvestId: 4, outcomes: [{ id: 1, kind: 'spoiled', date: '2026-12-01', lostFraction: 0.25, until: null, note: null }] });
    const r = larderReport([lot({}), onions, squash, spoiled], '2026-12-01', 'metric');
    // Squash ran out on 1 Nov (spread of one month); onions 1 Sep + 4 months = 1 Jan 2027, 31 of 122 days left
    expect(r.lots.map((l) => l.harvestId)).toEqual([2, 1, 4]);
    const [o, p, s] = r.lots;
    expect(o!.runsOut).toBe('2027-01-01');
    expect(o!.remainingQuantity).toBeCloseTo((10 * 31) / 122, 3);
    expect(o!.energyKcal).toBeCloseTo(((4082.33133 * 31) / 122 / 100) * 40, 1);
    expect(p!.remainingQuantity).toBeCloseTo((24 * 121) / DAYS, 3);
    expect(p!.energyKcal).toBeCloseTo(((18000 * 121) / DAYS / 100) * 77, 1);
    expect(p!.proteinG).toBeCloseTo(((18000 * 121) / DAYS / 100) * 2.05, 2);
    expect(s!.remainingGrams).toBeCloseTo((0.75 * 24000 * 121) / DAYS, 1);
    expect(s!.lostGrams).toBeCloseTo((0.25 * 18000 * 121) / DAYS, 1);
    expect(s!.eatenEdibleGrams).toBeCloseTo((18000 * 61) / DAYS, 1);
    const crop1 = r.byCrop.find((g) => g.key === 'crop:1')!;
    expect(crop1.lots).toBe(2);
    expect(crop1.remainingGrams).toBeCloseTo((1.75 * 24000 * 121) / DAYS, 0);
    expect(r.byCategory.map((g) => g.key).sort()).toEqual(['other', 'root_tuber']);
    expect(r.totals.energyKcal).toBeCloseTo(o!.energyKcal! + p!.energyKcal! + s!.energyKcal!, 1);
    // Potatoes last until 1 Apr 2027: December to March are fed, April to November empty
    expect(r.emptyMonths[0]).toBe('2027-04');
    expect(r.emptyMonths).toHaveLength(8);
  });

  it('keeps unknown energy unknown, never 0', () => {
    const r = larderReport([lot({ per100g: {} })], '2026-12-01', 'us');
    expect(r.lots[0]!.energyKcal).toBeNull();
    expect(r.byCrop[0]!.energyKcal).toBeNull();
    expect(r.totals.energyKcal).toBeNull();
    expect(r.units).toBe('us');
  });

  it('shows a typical winter loss as an expectation only', () => {
    const withLoss = lot({ expectedLoss: expectedLossOf({ winterLossFraction: 0.1 }) });
    const r = larderReport([withLoss], '2026-12-01', 'metric');
    // common practice (no published source): about a tenth of stored potatoes lost over a winter
    expect(r.lots[0]!.expectedLoss).toEqual({ fraction: 0.1, source: 'common practice (no published source)' });
    expect(r.lots[0]!.remainingEdibleGrams).toBeCloseTo((18000 * 121) / DAYS, 1);
    expect(expectedLossOf({ winterLossFraction: null })).toBeNull();
  });
});

describe('the input rules and the share rows of a lot with records', () => {
  it('asks for a new end only when a lot lasts longer, and a share lost only for a spoilage', () => {
    expect(larderOutcomeInput.safeParse({ harvestId: 1, kind: 'used_up', date: '2027-01-10' }).success).toBe(true);
    const noEnd = larderOutcomeInput.safeParse({ harvestId: 1, kind: 'lasted_longer', date: '2027-01-10' });
    expect(noEnd.success).toBe(false);
    const stray = larderOutcomeInput.safeParse({ harvestId: 1, kind: 'used_up', date: '2027-01-10', lostFraction: 0.5 });
    expect(stray.success).toBe(false);
    expect(larderOutcomeInput.safeParse({ harvestId: 1, kind: 'spoiled', date: '2027-01-10', lostFraction: 1.5 }).success).toBe(false);
    expect(larderOutcomeInput.safeParse({ harvestId: 1, kind: 'lasted_longer', date: '2027-01-10', until: '2027-01-10' }).success).toBe(false);
  });

  it('the form sends only what the kind uses', () => {
    expect(outcomeBody(7, { kind: 'spoiled', date: '2027-01-10', lostFraction: '0.25', until: '2027-09-09', note: ' ' })).toEqual({ harvestId: 7, kind: 'spoiled', date: '2027-01-10', lostFraction: 0.25 });
  });

  it('splits a spoiled lot into eaten parts and a lost part of the harvest month, adding up to the lot', () => {
    const rows = lotGroupRows(
      { date: '2026-10-01', use: 'stored', spread: 6, preserveMethod: null, cropId: 1, foodId: 2, name: 'Potatoes', grams: 24000, edibleGrams: 18000 },
      [{ kind: 'spoiled', date: '2026-12-01', lostFraction: 0.25 }],
    );
    expect(rows.map((r) => [r.use, r.month])).toEqual([['stored', '2026-10'], ['stored', '2026-10'], ['lost', '2026-10']]);
    expect(rows.reduce((s, r) => s + r.edibleGrams, 0)).toBeCloseTo(18000, 9);
    expect(rows.reduce((s, r) => s + r.grams, 0)).toBeCloseTo(24000, 9);
    expect(rows.map((r) => r.entries)).toEqual([1, 0, 1]);
    expect(rows[1]).toMatchObject({ eatenFrom: '2026-12-01', until: '2027-04-01' });
  });
});
