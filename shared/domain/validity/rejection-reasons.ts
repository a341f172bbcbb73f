/**
 * Stable codes for why a data point is left out of the calculations. Imports store the code and
 * show the message; the codes never change meaning (add new ones, never rename).
 */
export const REJECTION_REASONS = {
  'non-finite': 'a required value is missing or not a finite number',
  'out-of-range': 'a value is outside its plausible range',
  'rise-not-positive': 'CW outlet temperature is not above the inlet temperature (t2 ≤ t1)',
  'ttd-not-positive': 'CW outlet temperature is not below the saturation temperature at the backpressure (TTD ≤ 0)',
  'low-load': 'load is below the minimum for a valid point',
  'unsteady-load': 'load changed by more than the allowed share of rating within the steadiness window',
  'cw-pump-change': 'a circulating-water pump started or stopped within the steadiness window',
  'expected-out-of-range': 'the expected backpressure is outside the range a measured backpressure may have: check the setup or the instruments',
  'implausible-cleanliness': 'cleanliness is outside its plausible band: check the setup (surface, tube count, clean coefficient) or the instruments',
  'implausible-velocity': 'tube velocity is outside its plausible band: check the CW flow, tube count and passes',
  'instrument-status': 'the historian marked a value of this time as not good (a status word such as "Bad" or a quality flag)',
} as const;

/**
 * The range a measured backpressure may have, kPa(a): a point outside it is refused, and so is a model's
 * expected backpressure, and the turbine correction is never read beyond it [common practice, generous:
 * condensers run at about 1.5–3.5 inHgA (5–12 kPa); turbines trip far below 50 kPa].
 */
export const BACKPRESSURE_BOUNDS_KPA = { min: 0.7, max: 50 } as const;

export type RejectionReason = keyof typeof REJECTION_REASONS;

/** Thrown by the point calculation when the physics rejects a point; carries the stable code. */
export class PointRejectedError extends RangeError {
  readonly reason: RejectionReason;
  readonly field?: string;
  constructor(reason: RejectionReason, message: string, field?: string) {
    super(message);
    this.name = 'PointRejectedError';
    this.reason = reason;
    this.field = field;
  }
}
