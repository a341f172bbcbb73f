/**
 * Suspected air in-leakage from daily data (ENGINEERING.md §3): air blankets the tubes, so the measured
 * cleanliness drops within hours to days — faster than fouling, which trends over weeks — and the usual
 * witnesses rise with it: condensate subcooling (Tsat − hotwell), dissolved oxygen, air-removal flow
 * [pub: Putman & Harpster, EPRI condenser conference papers]. Thresholds are common practice, editable.
 */
import { dayNumber } from '../calendar/plant-date.js';
import { median } from '../statistics.js';

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
  /** cleanliness drop against the reference's trend that counts as a sudden loss (absolute CF) */
  dropWithEvidence: number;
  /** a drop this large is flagged on its own, only when no witness is measured */
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
  /** largest cleanliness drop against the reference window's trend */
  maxDrop: number;
  evidence: ('cleanliness-drop' | 'subcooling' | 'dissolved-oxygen' | 'air-removal')[];
}

export interface AirLeakDayVerdict {
  day: string;
  suspected: boolean;
  drop: number;
  evidence: AirLeakPeriod['evidence'];
}

/** After a cleaning the reference may be this short, and is taken right up to the day before. */
const MIN_REFERENCE_AFTER_CLEANING = 3;

/**
 * The reference never reaches back further than this: a state that lasts two months is the unit's new normal
 * (a leak is found and sealed within weeks), so the reference moves on and never freezes behind flagged days.
 * [common practice: engineering judgement, not from a standard]
 */
const MAX_REFERENCE_REACH_DAYS = 60;

/** With at least this many reference days the recent trend is extrapolated; with fewer, their median is the level. */
const MIN_DAYS_FOR_TREND = 7;

/**
 * A leak that opens over weeks moves the recent reference along with it, so witnesses are also held against an
 * earlier window, 30–45 days back (after the last cleaning). Two witnesses risen against it are needed, since
 * one alone drifts with season and instruments. [common practice: engineering judgement, not from a standard]
 */
const EARLIER_WINDOW_DAYS = { from: 45, to: 30 } as const;
const MIN_EARLIER_DAYS = 5;

/**
 * Cleanliness the reference days lead one to expect on day `t`: their robust straight line (Theil–Sen: median of
 * the pairwise slopes, median intercept) extrapolated, so steady fouling is expected and only a step against it
 * counts as a drop. A rising reference is taken as level: cleanliness does not climb between cleanings.
 */
function expectedCleanliness(reference: readonly AirLeakDay[], t: number): number {
  const cf = reference.map((r) => r.cleanliness);
  if (reference.length < MIN_DAYS_FOR_TREND) return median(cf)!;
  const ts = reference.map((r) => dayNumber(r.day));
  const slopes: number[] = [];
  for (let a = 0; a < ts.length; a++) for (let b = a + 1; b < ts.length; b++) if (ts[a] !== ts[b]) slopes.push((cf[b]! - cf[a]!) / (ts[b]! - ts[a]!));
  const slope = Math.min(0, median(slopes) ?? 0);
  return median(cf.map((c, k) => c - slope * (ts[k]! - t)))!;
}

/** The witnesses that rose on day `d` against the medians of `reference`. */
function witnessRises(d: AirLeakDay, reference: readonly AirLeakDay[], settings: AirLeakSettings): AirLeakPeriod['evidence'] {
  const ref = (pick: (x: AirLeakDay) => number | null) => median(reference.map(pick).filter((v): v is number => v !== null));
  const sub = ref((x) => x.subcoolingK);
  const o2 = ref((x) => x.dissolvedOxygenPpb);
  const air = ref((x) => x.airRemovalKgS);
  const rose: AirLeakPeriod['evidence'] = [];
  if (d.subcoolingK !== null && sub !== null && d.subcoolingK - sub >= settings.subcoolingRiseK) rose.push('subcooling');
  if (d.dissolvedOxygenPpb !== null && o2 !== null && d.dissolvedOxygenPpb >= settings.oxygenFactor * Math.max(o2, 1)) rose.push('dissolved-oxygen');
  if (d.airRemovalKgS !== null && air !== null && air > 0 && d.airRemovalKgS >= settings.airRemovalFactor * air) rose.push('air-removal');
  return rose;
}

/**
 * A day is suspected when its cleanliness steps down against the recent trend and the witnesses confirm it.
 * Fouling leaves the witnesses alone, so when any witness is measured a drop without a witness's rise is
 * fouling (or an instrument), never a leak; only when none is measured does a large step alone raise suspicion.
 *
 * @param cleanings dates ('YYYY-MM-DD') the cleanliness was restored: the reference never reaches back past
 *   one, since the fouled days before it would hide a drop that starts soon after
 */
export function judgeAirLeakDays(
  days: readonly AirLeakDay[],
  settings: AirLeakSettings = DEFAULT_AIR_LEAK_SETTINGS,
  cleanings: readonly string[] = [],
): AirLeakDayVerdict[] {
  const verdicts: AirLeakDayVerdict[] = [];
  const sortedCleanings = [...cleanings].sort();
  for (const [i, d] of days.entries()) {
    const t = dayNumber(d.day);
    const lastCleaning = sortedCleanings.filter((c) => c <= d.day).at(-1) ?? '';
    const freshlyCleaned = lastCleaning !== '' && days.slice(Math.max(0, i - settings.baselineDays - settings.gapDays), i).some((x) => x.day < lastCleaning);
    // Reference: the last `baselineDays` unsuspected days ending `gapDays` before this one (so a long leak
    // is still judged against the days before it began), never past the last cleaning nor further back than
    // the reach limit; in the first weeks after a cleaning the gap is dropped and a shorter reference will do.
    const gap = freshlyCleaned ? 0 : settings.gapDays;
    const minimum = freshlyCleaned ? MIN_REFERENCE_AFTER_CLEANING : settings.baselineDays / 2;
    const inReach = (k: number) => k >= 0 && days[k]!.day >= lastCleaning && t - dayNumber(days[k]!.day) <= MAX_REFERENCE_REACH_DAYS;
    let reference: AirLeakDay[] = [];
    for (let k = i - gap - 1; inReach(k) && reference.length < settings.baselineDays; k--) {
      if (!verdicts[k]!.suspected) reference.push(days[k]!);
    }
    if (reference.length < minimum) {
      // Too few unsuspected days within reach: the latest days, suspected or not, are the new normal.
      reference = [];
      for (let k = i - gap - 1; inReach(k) && reference.length < settings.baselineDays; k--) reference.push(days[k]!);
    }
    if (reference.length < minimum) {
      verdicts.push({ day: d.day, suspected: false, drop: 0, evidence: [] });
      continue;
    }
    const ref = (pick: (x: AirLeakDay) => number | null) => median(reference.map(pick).filter((v): v is number => v !== null));
    const drop = expectedCleanliness(reference, t) - d.cleanliness;
    const sub = ref((x) => x.subcoolingK);
    const o2 = ref((x) => x.dissolvedOxygenPpb);
    const air = ref((x) => x.airRemovalKgS);
    const witnessed =
      (d.subcoolingK !== null && sub !== null) || (d.dissolvedOxygenPpb !== null && o2 !== null) || (d.airRemovalKgS !== null && air !== null && air > 0);
    const evidence = witnessRises(d, reference, settings);
    let suspected = witnessed ? (drop >= settings.dropWithEvidence && evidence.length > 0) || evidence.length >= 2 : drop >= settings.dropAlone;
    if (!suspected && witnessed) {
      const earlier: AirLeakDay[] = [];
      for (let k = i - 1; k >= 0 && days[k]!.day >= lastCleaning; k--) {
        const age = t - dayNumber(days[k]!.day);
        if (age > EARLIER_WINDOW_DAYS.from) break;
        if (age >= EARLIER_WINDOW_DAYS.to && !verdicts[k]!.suspected) earlier.push(days[k]!);
      }
      if (earlier.length >= MIN_EARLIER_DAYS) {
        const rose = witnessRises(d, earlier, settings);
        if (rose.length >= 2) {
          suspected = true;
          evidence.splice(0, evidence.length, ...rose);
        }
      }
    }
    verdicts.push({
      day: d.day,
      suspected,
      drop,
      evidence: suspected ? (drop >= settings.dropWithEvidence ? ['cleanliness-drop', ...evidence] : evidence) : [],
    });
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
