import { describe, expect, it } from 'vitest';
import { CAUTIONS } from '@/lib/cautions';
import { furthestFromNeed, letterData, nothingEaten, pickSuggestion, type LetterData } from '@/lib/letter-content';
import { areaText, dayText, letterText, monthText } from '@/lib/letter-text';
import type { LarderResponse } from '@/lib/larder-types';
import type { GapsReport } from '@/lib/gaps';
import type { ShareNutrientKey } from '@/lib/nutrients';

// The figures below are invented for the wording tests; what they check is how a letter is written.
const links = {
  share: 'https://selfsown.test/households/7/share?from=2026-11&to=2026-11',
  account: 'https://selfsown.test/account',
  unsubscribe: 'https://selfsown.test/letters/unsubscribe?t=abc.def',
};

function data(over: Partial<LetterData> = {}): LetterData {
  return {
    householdName: 'Hillside Plot',
    month: '2026-11',
    units: 'metric',
    energy: { shareOfIntake: 0.426, shareOfNeed: 0.213, uncertain: false },
    protein: { shareOfIntake: 0.18, shareOfNeed: 0.09, uncertain: false },
    gapState: 'gaps',
    gaps: [
      { key: 'vitamin_b12_ug', name: 'Vitamin B12', unit: 'µg', home: 0, need: 72, shortfall: 72, shareOfNeed: 0 },
      { key: 'calcium_mg', name: 'Calcium', unit: 'mg', home: 3000, need: 30000, shortfall: 27000, shareOfNeed: 0.1 },
    ],
    crops: [{ name: 'Potato', energyKcal: 12345.6, proteinG: 328.4, shareOfHomeEnergy: 0.612 }],
    larder: { today: '2026-12-01', stores: [{ label: 'Potato', remainingGrams: 42500, runsOut: '2027-03-14' }], moreStores: 2, totalGrams: 61000, firstEmptyMonth: '2027-04' },
    suggestion: { nutrient: 'Vitamin C', unit: 'mg', shortfall: 1234, crop: 'Kale', areaM2: 2.5, yieldSource: 'reference' },
    links,
    ...over,
  };
}

describe('monthly letter text', () => {
  it('names the month in words, the household and the home share of calories in the subject', () => {
    const t = letterText(data());
    expect(t.subject).toBe('Hillside Plot · November 2026: 43 % of calories home-grown');
    expect(t.text).toContain('Calories: 43 % of what you ate was home-grown; that is 21 % of what the household needs.');
    expect(t.text).toContain('Protein: 18 % of what you ate was home-grown; that is 9 % of what the household needs.');
  });

  it('with gaps: lists the nutrients furthest from need with their amounts, and says nothing of "no gaps"', () => {
    const t = letterText(data());
    expect(t.text).toContain('FURTHEST FROM NEED');
    expect(t.text).toContain('- Vitamin B12: 0 % of the recommended intake from the garden (0 of 72 µg, 72 µg short).');
    expect(t.text).toContain('- Calcium: 10 % of the recommended intake from the garden (3,000 of 30,000 mg, 27,000 mg short).');
    expect(t.text).not.toMatch(/No gaps/);
    expect(t.html).toContain('Furthest from need');
  });

  it('without gaps: says the garden met every need, and lists no shortfall', () => {
    const t = letterText(data({ gapState: 'none', gaps: [] }));
    expect(t.text).toContain('No gaps in November 2026: the garden met the recommended intake of every nutrient');
    expect(t.text).not.toContain('FURTHEST FROM NEED');
    expect(t.text).not.toMatch(/short\)/);
  });

  it('with no need known (no people): points to the People page instead of inventing gaps', () => {
    const t = letterText(data({ gapState: 'unknown', gaps: [], energy: { shareOfIntake: 0.5, shareOfNeed: null, uncertain: false } }));
    expect(t.text).toContain('No need could be worked out for November 2026. Add the people who eat at home');
    expect(t.text).toContain('Calories: 50 % of what you ate was home-grown.');
  });

  it('writes crops, the larder and the suggestion with units and formatted numbers', () => {
    const t = letterText(data());
    expect(t.text).toContain('- Potato: 12,346 kcal, 328 g protein (61 % of the home-grown calories).');
    expect(t.text).toContain('- Potato: 42.5 kg, runs out about 14 Mar 2027.');
    expect(t.text).toContain('61 kg in store altogether. And 2 more in store. At the present rate nothing stored is left to eat in April 2027.');
    expect(t.text).toContain('Vitamin C is furthest behind this growing year (1,234 mg short so far). The crop that gives the most of it per square metre is Kale: about 2.5 m² would cover that, by a typical reference yield.');
  });

  it('says plainly when the larder is empty and when the gap finder has no idea', () => {
    const t = letterText(data({ larder: { today: '2026-12-01', stores: [], moreStores: 0, totalGrams: 0, firstEmptyMonth: null }, suggestion: null }));
    expect(t.text).toContain('Nothing is recorded in store on 1 Dec 2026.');
    expect(t.text).toContain('The gap finder has nothing to suggest');
  });

  it('escapes the household name in the HTML and keeps it as typed in the text and subject', () => {
    const t = letterText(data({ householdName: '<b>&"' }));
    expect(t.html).toContain('&lt;b&gt;&amp;&quot;');
    expect(t.html).not.toContain('<b>&"');
    expect(t.text).toContain('Selfsown · <b>&" · November 2026');
    expect(t.subject.startsWith('<b>&" · ')).toBe(true);
  });

  it('uses inline styles only and escapes the links it places in attributes', () => {
    const t = letterText(data({ links: { ...links, unsubscribe: 'https://selfsown.test/letters/unsubscribe?t=a.b&x="y"' } }));
    expect(t.html).not.toMatch(/<style|<link|class=/);
    expect(t.html).toContain('href="https://selfsown.test/letters/unsubscribe?t=a.b&amp;x=&quot;y&quot;"');
  });

  it('ends with the diet caution and the unsubscribe and account links, in text and HTML', () => {
    const t = letterText(data());
    expect(t.text).toContain(CAUTIONS.medical);
    expect(t.text).toContain(`Stop the monthly letter (no sign-in needed): ${links.unsubscribe}`);
    expect(t.text).toContain(links.account);
    expect(t.html).toContain('registered dietitian or a physician');
    expect(t.html).toContain(`href="${links.unsubscribe.replace(/&/g, '&amp;')}"`);
  });

  it('marks an uncertain share so it is not read as a clean number', () => {
    expect(letterText(data({ energy: { shareOfIntake: 0.4, shareOfNeed: null, uncertain: true } })).text).toContain('40 % (uncertain: some of it has no value) of what you ate');
  });

  it('names months, days and areas right', () => {
    expect(monthText('2026-12')).toBe('December 2026');
    expect(monthText('2027-01')).toBe('January 2027');
    expect(dayText('2027-02-28')).toBe('28 Feb 2027');
    // 1 ft² = 0.09290304 m² exactly (International Yard and Pound Agreement, 1959): 2.5 m² = 26.9 ft²
    expect(areaText(2.5, 'us')).toBe('2.5 m² (26.9 ft²)');
    expect(areaText(2.5, 'metric')).toBe('2.5 m²');
  });
});

// A share report of one month, as far as the letter reads it.
function month(values: Partial<Record<ShareNutrientKey, { home: number | null; bought?: number | null; need: number | null }>>) {
  const v = Object.fromEntries(
    Object.entries(values).map(([k, x]) => [
      k,
      { home: x.home, bought: x.bought ?? 0, need: x.need, needLow: null, needHigh: null, shareOfIntake: null, shareOfNeed: x.home !== null && x.need ? x.home / x.need : null, unknownGrams: 0, unknownShare: null, uncertain: false },
    ]),
  );
  return { month: '2026-11', days: 30, beforeRecords: false, future: false, values: v } as never;
}
const NUTRIENTS = [
  { key: 'energy_kcal', name: 'Energy', unit: 'kcal' },
  { key: 'vitamin_c_mg', name: 'Vitamin C', unit: 'mg' },
  { key: 'calcium_mg', name: 'Calcium', unit: 'mg' },
  { key: 'iron_mg', name: 'Iron', unit: 'mg' },
  { key: 'zinc_mg', name: 'Zinc', unit: 'mg' },
] as { key: ShareNutrientKey; name: string; unit: string }[];

describe('what the letter picks from the reports', () => {
  it('names at most three nutrients that fell short, lowest share of need first, and leaves covered ones out', () => {
    const share = {
      nutrients: NUTRIENTS,
      months: [month({ energy_kcal: { home: 50_000, need: 60_000 }, vitamin_c_mg: { home: 3000, need: 2700 }, calcium_mg: { home: 3000, need: 30_000 }, iron_mg: { home: 100, need: 540 }, zinc_mg: { home: 10, need: 330 } })],
    };
    const r = furthestFromNeed(share, '2026-11');
    expect(r.state).toBe('gaps');
    expect(r.gaps.map((g) => g.key)).toEqual(['zinc_mg', 'calcium_mg', 'iron_mg']);
    expect(r.gaps[0]!.shortfall).toBe(320); // need − home, the gap finder's shortfall
  });

  it('finds no gaps when every known need was met, and no state at all without a need', () => {
    const covered = { nutrients: NUTRIENTS.slice(0, 2), months: [month({ energy_kcal: { home: 70_000, need: 60_000 }, vitamin_c_mg: { home: 3000, need: 2700 } })] };
    expect(furthestFromNeed(covered, '2026-11')).toEqual({ state: 'none', gaps: [] });
    const noPeople = { nutrients: NUTRIENTS.slice(0, 2), months: [month({ energy_kcal: { home: 70_000, need: null }, vitamin_c_mg: { home: 3000, need: null } })] };
    expect(furthestFromNeed(noPeople, '2026-11').state).toBe('unknown');
  });

  it('calls a month with nothing home-grown or bought empty', () => {
    expect(nothingEaten({ months: [month({ energy_kcal: { home: 0, bought: 0, need: 60_000 } })] }, '2026-11')).toBe(true);
    expect(nothingEaten({ months: [month({ energy_kcal: { home: 0, bought: 9000, need: 60_000 } })] }, '2026-11')).toBe(false);
  });

  it('takes the suggestion from the year nutrient with the lowest share that has a shortfall and a crop', () => {
    const crop = (name: string, area: number) => ({ cropKey: name.toLowerCase(), name, perM2: 1, m2PerUnit: 1, areaToCloseM2: area, yieldSource: 'reference' as const, yieldKgM2: 2 });
    const gap = (key: ShareNutrientKey, shareOfNeed: number, shortfall: number, crops: ReturnType<typeof crop>[]) =>
      ({ key, name: key, unit: 'mg', need: 100, home: 100 - shortfall, shortfall, shareOfNeed, months: [], leanMonths: [], leastAreaCrops: crops, carryCrops: [] });
    const report: GapsReport<ShareNutrientKey> = {
      countedMonths: ['2026-11'],
      nutrients: [gap('iron_mg', 0.5, 50, [crop('Beans', 4)]), gap('zinc_mg', 0.2, 80, []), gap('calcium_mg', 0.3, 70, [crop('Kale', 3.5)]), gap('vitamin_c_mg', 1.2, 0, [crop('Pepper', 0)])],
    };
    expect(pickSuggestion(report)).toMatchObject({ nutrient: 'calcium_mg', crop: 'Kale', areaM2: 3.5, shortfall: 70 });
    expect(pickSuggestion({ countedMonths: [], nutrients: [gap('vitamin_c_mg', 1.2, 0, [crop('Pepper', 0)])] })).toBeNull();
  });

  it("builds a letter from the reports: the month's own shares, the top crops by energy and the larder soonest out first", () => {
    const larder: LarderResponse = {
      today: '2026-12-01',
      lots: [],
      byCrop: [
        { key: 'crop:1', label: 'Squash', remainingGrams: 8000, energyKcal: 3600, proteinG: 80, runsOut: '2027-02-01', lots: 1 },
        { key: 'crop:2', label: 'Onion', remainingGrams: 3000, energyKcal: 1200, proteinG: 33, runsOut: '2027-01-10', lots: 1 },
      ],
      byCategory: [],
      totals: { remainingGrams: 11000, energyKcal: 4800, proteinG: 113 },
      emptyMonths: ['2027-02', '2027-03'],
      units: 'us',
    };
    const share = {
      nutrients: NUTRIENTS.slice(0, 1),
      months: [month({ energy_kcal: { home: 30_000, bought: 30_000, need: 60_000 } })],
      topCrops: [
        { cropId: 1, foodId: 1, name: 'Potato', values: { energy_kcal: 20_000, protein_g: 500 }, shareOfHome: { energy_kcal: 0.66 } },
        { cropId: 2, foodId: 2, name: 'Lettuce', values: { energy_kcal: 0, protein_g: 0 }, shareOfHome: { energy_kcal: 0 } },
      ],
    } as never;
    const d = letterData({ householdName: 'H', month: '2026-11', share, yearGaps: null, larder, links });
    expect(d.energy.shareOfNeed).toBe(0.5);
    expect(d.crops.map((c) => c.name)).toEqual(['Potato']);
    expect(d.larder.stores.map((s) => s.label)).toEqual(['Onion', 'Squash']);
    expect(d.larder.firstEmptyMonth).toBe('2027-02');
    expect(d.units).toBe('us');
    expect(d.suggestion).toBeNull();
  });
});
