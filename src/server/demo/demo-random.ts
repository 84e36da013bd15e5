/**
 * Seeded randomness for the demo generator (npm `pure-rand`, xoroshiro128+). Each crop and season
 * draws from its own stream, named by a label, so adding a crop or a year to the demo does not shift
 * the weights of every other one, and the same seed always gives the same household.
 */
import prand from 'pure-rand';

/** A stream of numbers in [0, 1) and the few shapes the generator needs. */
export interface Rng {
  next(): number;
  /** A number in [low, high). Example: `rng.between(0.8, 1.2)` → 0.97… */
  between(low: number, high: number): number;
  /** A whole number from low to high, both included. */
  int(low: number, high: number): number;
}

// FNV-1a over the label's UTF-16 units: a stable 32-bit number per label.
function labelHash(label: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < label.length; i++) {
    h ^= label.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h;
}

/** The stream named `label` under `seed`. Example: `streamOf(7, 'potatoes:2025').next()` is the same on every run. */
export function streamOf(seed: number, label: string): Rng {
  if (!Number.isInteger(seed)) throw new Error(`The demo seed must be a whole number, got ${seed}.`);
  const gen = prand.xoroshiro128plus((seed ^ labelHash(label)) | 0);
  const next = () => prand.unsafeUniformIntDistribution(0, 0x3fffffff, gen) / 0x40000000;
  return {
    next,
    between: (low, high) => low + (high - low) * next(),
    int: (low, high) => prand.unsafeUniformIntDistribution(low, high, gen),
  };
}
