/** Numbers a person types, bounded to a physical range; the message names the range (and its US equivalent). */
import { z } from 'zod';

const plain = (n: number) => n.toLocaleString('en-US', { maximumFractionDigits: 3 });

/**
 * A number a person types, bounded to what is physical for a steam surface condenser and its turbine. The message
 * names the range in the stored unit and, where the forms may show another unit, in that unit too.
 */
export function within(what: string, min: number, max: number, unit = '', alsoIn?: { unit: string; fromSi: (v: number) => number }) {
  const u = unit ? ` ${unit}` : '';
  const other = alsoIn ? ` (${plain(Number(alsoIn.fromSi(min).toPrecision(3)))} to ${plain(Number(alsoIn.fromSi(max).toPrecision(3)))} ${alsoIn.unit})` : '';
  const message = `${what.charAt(0).toUpperCase()}${what.slice(1)} must be between ${plain(min)} and ${plain(max)}${u}${other}`;
  return z
    .number({ error: `Enter ${what}` })
    .min(min, message)
    .max(max, message);
}
export const count = (what: string, min: number, max: number) =>
  within(what, min, max).int(`${what.charAt(0).toUpperCase()}${what.slice(1)} is a whole number`);

/** Cleanliness factor: the plausibility band of a physically possible condenser (common practice), capped at 1.2. */
export const CLEANLINESS_RANGE = { min: 0.2, max: 1.2 } as const;
export const cleanlinessFactor = (what: string) => within(what, CLEANLINESS_RANGE.min, CLEANLINESS_RANGE.max, '', { unit: '%', fromSi: (v) => v * 100 });
