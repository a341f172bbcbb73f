/**
 * Plausibility bands for a condenser point's model results: what a working condenser can physically show,
 * not its design range. A result outside a band is kept out of trends and daily medians and carries a warning.
 */
import type { RejectionReason } from '../validity/rejection-reasons.js';

/**
 * Cleanliness factor [common practice]: fouled condensers still in service read 0.4–0.6, clean ones 0.85–1.0,
 * and a little above 1 from instrument error or a conservative clean coefficient; below 0.2 or above 1.3 the
 * setup (surface, tube count, clean coefficient) or an instrument is wrong, not the tubes.
 */
export const PLAUSIBLE_CLEANLINESS = { min: 0.2, max: 1.3 } as const;

/**
 * Mean tube velocity, m/s [common practice]: designs run 1.8–2.4 m/s (6–8 ft/s); one CW pump of two gives about
 * 1.2–1.5 m/s and is ordinary operation; below 0.3 m/s the flow is barely turbulent and above 4.5 m/s the tubes
 * would erode within months, so a reading outside 0.3–4.5 m/s means a wrong flow, tube count or pass count.
 */
export const PLAUSIBLE_TUBE_VELOCITY_MS = { min: 0.3, max: 4.5 } as const;

export interface ImplausibleResult {
  reason: Extract<RejectionReason, 'implausible-cleanliness' | 'implausible-velocity'>;
  message: string;
}

/** The results outside their bands, each with a message in the product's words (empty when all is plausible). */
export function implausibleResults(r: { cleanliness: number; velocityMs: number }): ImplausibleResult[] {
  const found: ImplausibleResult[] = [];
  const cf = PLAUSIBLE_CLEANLINESS;
  if (!(r.cleanliness >= cf.min && r.cleanliness <= cf.max)) {
    found.push({
      reason: 'implausible-cleanliness',
      message: `cleanliness ${r.cleanliness.toFixed(2)} is outside ${cf.min}–${cf.max} (common practice): check the surface, tube count and clean coefficient, or the instruments`,
    });
  }
  const v = PLAUSIBLE_TUBE_VELOCITY_MS;
  if (!(r.velocityMs >= v.min && r.velocityMs <= v.max)) {
    found.push({
      reason: 'implausible-velocity',
      message: `tube velocity ${r.velocityMs.toFixed(2)} m/s is outside ${v.min}–${v.max} m/s (common practice): check the CW flow, tube count and passes`,
    });
  }
  return found;
}
