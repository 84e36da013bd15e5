import { describe, expect, it } from 'vitest';
import { bodyMassIndex, bodyWarnings, heightText, weightText } from '@/lib/body-plausibility';

describe('body-mass index', () => {
  it('is kilograms over metres squared', () => {
    expect(bodyMassIndex(180, 81)).toBeCloseTo(25, 10); // BMI = kg / m² (WHO): 81 / 1.8² = 25
  });
});

describe('questioning a height and a weight', () => {
  it('says nothing about an ordinary adult, in either unit system', () => {
    expect(bodyWarnings({ heightCm: 177.8, weightKg: 81.65, units: 'metric', ageYears: 40 })).toEqual([]);
    expect(bodyWarnings({ heightCm: 177.8, weightKg: 81.65, units: 'us', ageYears: 40 })).toEqual([]);
    expect(bodyWarnings({ heightCm: null, weightKg: 3.5, units: 'metric' })).toEqual([]);
  });

  it('says nothing about a baby or a child of ordinary build', () => {
    expect(bodyWarnings({ heightCm: 60, weightKg: 6, units: 'metric', ageYears: 0.25 })).toEqual([]);
    expect(bodyWarnings({ heightCm: 120, weightKg: 22, units: 'metric', ageYears: 7 })).toEqual([]);
  });

  it('reads "70" and "180" in a metric household as inches and pounds, and says what they would be', () => {
    const [w] = bodyWarnings({ heightCm: 70, weightKg: 180, units: 'metric' });
    expect(w!.code).toBe('looks_imperial');
    // 70 in = 177.8 cm; 180 lb = 81.6 kg (International Yard and Pound Agreement, 1959)
    expect(w!.message).toBe(
      '70 cm and 180 kg look like inches and pounds (70 in is 177.8 cm, 180 lb is 81.6 kg). Enter the height in centimetres and the weight in kilograms, or confirm they are right as typed.',
    );
  });

  it('asks about a body-mass index outside 12–60, naming the figures in the household’s units', () => {
    const [high] = bodyWarnings({ heightCm: 150, weightKg: 300, units: 'metric' }); // 300 / 1.5² = 133 (WHO: kg / m²)
    expect(high!.code).toBe('bmi_high');
    expect(high!.message).toContain('a body-mass index of 133');
    const [low] = bodyWarnings({ heightCm: 177.8, weightKg: 8.16, units: 'us' }); // 18 lb at 5 ft 10 in: 8.16 / 1.778² = 2.6
    expect(low!.code).toBe('bmi_low');
    expect(low!.message).toContain('A height of 5 ft 10 in and a weight of 18 lb');
  });

  it('asks whether a short adult height was meant in inches', () => {
    const [w] = bodyWarnings({ heightCm: 66, weightKg: null, units: 'metric', ageYears: 35 });
    expect(w!.code).toBe('short_adult');
    expect(w!.message).toContain('if it is in inches, that is 167.6 cm'); // 66 × 2.54 (International Yard and Pound Agreement, 1959)
    expect(bodyWarnings({ heightCm: 66, weightKg: null, units: 'metric', ageYears: 1 })).toEqual([]);
  });

  it('writes heights and weights as the household reads them', () => {
    expect(heightText(177.8, 'us')).toBe('5 ft 10 in');
    expect(heightText(177.8, 'metric')).toBe('177.8 cm');
    expect(weightText(81.65, 'us')).toBe('180 lb');
  });
});
