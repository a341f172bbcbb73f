/**
 * Suspected air in-leakage from daily data (ENGINEERING.md §3): air blankets the tubes, so the measured
 * cleanliness drops within hours to days — faster than fouling, which trends over weeks — and the usual
 * witnesses rise with it: condensate subcooling (Tsat − hotwell), dissolved oxygen, air-removal flow
 * [pub: Putman & Harpster, EPRI condenser conference papers]. Thresholds are common practice, editable.
 */
export interface AirLeakDay {
  day: string;
  /** median measured cleanliness of the day */
  cleanliness: number;
  subcoolingK: number | null;
  dissolvedOxygenPpb: number | null;
  airRemovalKgS: number | null;
}

export interface AirLeakSettings {
  /** days in the reference window, which ends `gapDays` before the day judged */
  baselineDays: number;
  gapDays: number;
  /** cleanliness drop against the reference that counts as a sudden loss (absolute CF) */
  dropWithEvidence: number;
  /** a drop this large is flagged even when no witness is measured */
  dropAlone: number;
  subcoolingRiseK: number;
  oxygenFactor: number;
  airRemovalFactor: number;
}

/** [common practice: typical screening values, not from a standard] */
export const DEFAULT_AIR_LEAK_SETTINGS: AirLeakSettings = {
  baselineDays: 14,
  gapDays: 2,
  dropWithEvidence: 0.03,
  dropAlone: 0.07,
  subcoolingRiseK: 1,
  oxygenFactor: 2,
  airRemovalFactor: 1.5,
};

export interface AirLeakPeriod {
  from: string;
  to: string;
  /** largest cleanliness drop against the reference window */
  maxDrop: number;
  evidence: ('cleanliness-drop' | 'subcooling' | 'dissolved-oxygen' | 'air-removal')[];
}

export interface AirLeakDayVerdict {
  day: string;
  suspected: boolean;
  drop: number;
  evidence: AirLeakPeriod['evidence'];
}

function median(values: number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** After a cleaning the reference may be this short, and is taken right up to the day before. */
const MIN_REFERENCE_AFTER_CLEANING = 3;

/**
 * @param cleanings dates ('YYYY-MM-DD') the cleanliness was restored: the reference never reaches back past
 *   one, since the fouled days before it would hide a drop that starts soon after
 */
export function judgeAirLeakDays(days: readonly AirLeakDay[], settings: AirLeakSettings = DEFAULT_AIR_LEAK_SETTINGS, cleanings: readonly string[] = []): AirLeakDayVerdict[] {
  const verdicts: AirLeakDayVerdict[] = [];
  const sortedCleanings = [...cleanings].sort();
  for (let i = 0; i < days.length; i++) {
    const d = days[i];
    const lastCleaning = sortedCleanings.filter((c) => c <= d.day).at(-1) ?? '';
    const freshlyCleaned = lastCleaning !== '' && days.slice(Math.max(0, i - settings.baselineDays - settings.gapDays), i).some((x) => x.day < lastCleaning);
    // Reference: the last `baselineDays` unsuspected days ending `gapDays` before this one (so a long leak
    // is still judged against the days before it began), looking back at most 90 days and never past the
    // last cleaning; in the first weeks after a cleaning the gap is dropped and a shorter reference will do.
    const gap = freshlyCleaned ? 0 : settings.gapDays;
    const reference: AirLeakDay[] = [];
    for (let k = i - gap - 1; k >= 0 && k >= i - 90 && reference.length < settings.baselineDays && days[k].day >= lastCleaning; k--) {
      if (!verdicts[k].suspected) reference.push(days[k]);
    }
    const minimum = freshlyCleaned ? MIN_REFERENCE_AFTER_CLEANING : settings.baselineDays / 2;
    if (reference.length < minimum) {
      verdicts.push({ day: d.day, suspected: false, drop: 0, evidence: [] });
      continue;
    }
    const ref = (pick: (x: AirLeakDay) => number | null) => median(reference.map(pick).filter((v): v is number => v !== null));
    const drop = (ref((x) => x.cleanliness) ?? d.cleanliness) - d.cleanliness;
    const evidence: AirLeakPeriod['evidence'] = [];
    const sub = ref((x) => x.subcoolingK);
    if (d.subcoolingK !== null && sub !== null && d.subcoolingK - sub >= settings.subcoolingRiseK) evidence.push('subcooling');
    const o2 = ref((x) => x.dissolvedOxygenPpb);
    if (d.dissolvedOxygenPpb !== null && o2 !== null && d.dissolvedOxygenPpb >= settings.oxygenFactor * Math.max(o2, 1)) evidence.push('dissolved-oxygen');
    const air = ref((x) => x.airRemovalKgS);
    if (d.airRemovalKgS !== null && air !== null && air > 0 && d.airRemovalKgS >= settings.airRemovalFactor * air) evidence.push('air-removal');
    const suspected = (drop >= settings.dropWithEvidence && evidence.length > 0) || drop >= settings.dropAlone || evidence.length >= 2;
    verdicts.push({ day: d.day, suspected, drop, evidence: suspected ? (drop >= settings.dropWithEvidence ? ['cleanliness-drop', ...evidence] : evidence) : [] });
  }
  return verdicts;
}

/** Consecutive suspected days (gaps of up to two days bridged) as periods. */
export function airLeakPeriods(verdicts: readonly AirLeakDayVerdict[]): AirLeakPeriod[] {
  const periods: AirLeakPeriod[] = [];
  let current: AirLeakPeriod | null = null;
  let quiet = 0;
  for (const v of verdicts) {
    if (v.suspected) {
      if (!current) current = { from: v.day, to: v.day, maxDrop: v.drop, evidence: [] };
      current.to = v.day;
      current.maxDrop = Math.max(current.maxDrop, v.drop);
      for (const e of v.evidence) if (!current.evidence.includes(e)) current.evidence.push(e);
      quiet = 0;
    } else if (current && ++quiet > 2) {
      periods.push(current);
      current = null;
      quiet = 0;
    }
  }
  if (current) periods.push(current);
  return periods;
}
