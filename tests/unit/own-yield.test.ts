import { describe, expect, it } from 'vitest';
import { ownYields } from '@/lib/own-yield';

describe('own measured yield', () => {
  it('divides the kg harvested by the area of the plantings harvests name', () => {
    const plantings = [
      { id: 1, cropId: 7, seasonYear: 2026, areaM2: 4 },
      { id: 2, cropId: 7, seasonYear: 2026, areaM2: 2 },
      { id: 3, cropId: 7, seasonYear: 2026, areaM2: 10 }, // no harvest names it: left out
      { id: 4, cropId: 8, seasonYear: 2026, areaM2: 5 },
    ];
    const harvests = [
      { plantingId: 1, grams: 6000 },
      { plantingId: 1, grams: 3000 },
      { plantingId: 2, grams: 3000 },
      { plantingId: 4, grams: 1500 },
      { plantingId: 99, grams: 50_000 }, // a planting not listed: ignored
    ];
    // worked by hand: crop 7 → (6 + 3 + 3) kg / (4 + 2) m² = 2 kg/m²; crop 8 → 1.5 kg / 5 m² = 0.3 kg/m²
    expect(ownYields(plantings, harvests)).toEqual([
      { cropId: 7, seasonYear: 2026, harvestedKg: 12, areaM2: 6, kgPerM2: 2, plantings: 2 },
      { cropId: 8, seasonYear: 2026, harvestedKg: 1.5, areaM2: 5, kgPerM2: 0.3, plantings: 1 },
    ]);
  });

  it('keeps each season apart', () => {
    const y = ownYields(
      [
        { id: 1, cropId: 7, seasonYear: 2025, areaM2: 2 },
        { id: 2, cropId: 7, seasonYear: 2026, areaM2: 2 },
      ],
      [
        { plantingId: 1, grams: 2000 },
        { plantingId: 2, grams: 5000 },
      ],
    );
    expect(y.map((r) => [r.seasonYear, r.kgPerM2])).toEqual([
      [2025, 1],
      [2026, 2.5],
    ]);
  });

  it('has nothing to say without harvests naming a planting', () => {
    expect(ownYields([{ id: 1, cropId: 7, seasonYear: 2026, areaM2: 2 }], [])).toEqual([]);
  });

  it('refuses a negative weight with a sentence', () => {
    expect(() => ownYields([{ id: 1, cropId: 7, seasonYear: 2026, areaM2: 2 }], [{ plantingId: 1, grams: -5 }])).toThrow('weights are zero or more');
  });
});
