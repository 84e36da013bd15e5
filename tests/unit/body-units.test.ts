import { describe, expect, it } from 'vitest';
import { cmToFeetInches, CM_PER_INCH, feetInchesToCm, kgToPounds, KG_PER_POUND, poundsToKg } from '@/lib/body-units';

describe('height and weight in feet, inches and pounds', () => {
  it('uses the exact international inch and pound', () => {
    expect(CM_PER_INCH).toBe(2.54); // 1 in = 2.54 cm exactly (International Yard and Pound Agreement, 1959)
    expect(KG_PER_POUND).toBe(0.45359237); // 1 lb = 0.45359237 kg exactly (International Yard and Pound Agreement, 1959)
  });

  it('turns 5 ft 10 in into 177.8 cm', () => {
    expect(feetInchesToCm(5, 10)).toBe(177.8); // 70 in × 2.54 cm (International Yard and Pound Agreement, 1959)
    expect(feetInchesToCm(0, 30.5)).toBe(77.5); // 30.5 in × 2.54 = 77.47 cm, to the millimetre (International Yard and Pound Agreement, 1959)
  });

  it('turns 180 lb into 81.65 kg, to ten grams', () => {
    expect(poundsToKg(180)).toBe(81.65); // 180 × 0.45359237 = 81.6466266 kg (International Yard and Pound Agreement, 1959)
    expect(poundsToKg(1)).toBe(0.45);
  });

  it('reads a stored height and weight back as they were typed', () => {
    expect(cmToFeetInches(177.8)).toEqual({ feet: 5, inches: 10 });
    expect(cmToFeetInches(182.88)).toEqual({ feet: 6, inches: 0 }); // 72 in × 2.54 (International Yard and Pound Agreement, 1959)
    expect(kgToPounds(81.65)).toBe(180);
    for (const lb of [7.5, 95, 180, 301.2]) expect(kgToPounds(poundsToKg(lb))).toBe(lb);
    for (const [ft, inch] of [[2, 3], [5, 4.5], [6, 11]] as const) expect(cmToFeetInches(feetInchesToCm(ft, inch))).toEqual({ feet: ft, inches: inch });
  });

  it('refuses negative and non-finite figures with a sentence', () => {
    expect(() => feetInchesToCm(-1, 0)).toThrow(/cannot be negative/);
    expect(() => poundsToKg(Number.NaN)).toThrow(/must be a finite number/);
  });
});
