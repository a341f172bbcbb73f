/**
 * Seeded pseudo-random numbers for reproducible Monte Carlo runs: mulberry32 (Tommy Ettinger's public-domain
 * 32-bit generator, as widely reproduced). Not for cryptography.
 */
export type RandomSource = () => number;

/** Uniform numbers in [0, 1) from a 32-bit seed. */
export function mulberry32(seed: number): RandomSource {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Inverse CDF of the triangular distribution (low ≤ mode ≤ high) at u in [0, 1). */
export function triangularQuantile(low: number, mode: number, high: number, u: number): number {
  if (!(low <= mode && mode <= high)) throw new Error('a triangular distribution needs low ≤ base ≤ high');
  if (high === low) return mode;
  const split = (mode - low) / (high - low);
  return u < split ? low + Math.sqrt(u * (high - low) * (mode - low)) : high - Math.sqrt((1 - u) * (high - low) * (high - mode));
}
