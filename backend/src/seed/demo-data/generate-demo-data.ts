/**
 * Several years of hourly performance data for a demo unit, made by the project's own condenser
 * model (shared/domain/condenser) from a known "true" cleanliness, so the app's calculations can be
 * checked against the truth. Seeded and deterministic: the same seed gives the same rows.
 *
 * Story of each unit: seasonal CW inlet temperature (sinusoid + weather), daily and weekly dispatch
 * with some low-load nights, planned and forced outages, fouling that grows asymptotically after each
 * cleaning (Kern–Seaton form, CF(t) = 1/(1/CF0 + k·(1 − e^(−t/θ))), ENGINEERING.md §5), cleanings that
 * restore it, one air in-leakage episode (backpressure above what fouling explains, with higher
 * subcooling, dissolved oxygen and air-removal flow), sensor noise, and a few non-physical rows
 * (outlet at or below inlet, outlet above saturation, a stuck outlet sensor, a pressure spike).
 * No value is ever missing: the file stays importable, the bad rows get validity codes.
 *
 * The story is written for 2023–2025 and played moved so that it ends the day before the given "today"
 * (demo-calendar.ts): the same seed and the same today give the same rows. A shorter span plays only the
 * story's last days (the same dates, cleanings and fouling state; tests use it to stay quick).
 */
import { DateTime } from 'luxon';
import { backpressureAtCleanlinessKpa, cwRiseK } from '@shared/domain/condenser/index.js';
import { liquidDensityKgM3, saturationTemperatureC } from '@shared/domain/steam/index.js';
import { daysBetween } from '@shared/domain/calendar/plant-date.js';
import { massFlowToKgS } from '../../import/quantity-conversion.js';
import { DemoRandom, seedFromText } from './demo-random.js';
import { DEMO_END_LOCAL, DEMO_SCENARIO_SEED, DEMO_START_LOCAL, demoPlant, type DemoUnitSpec } from './demo-scenario.js';
import { demoShiftDays, shiftDay, shiftUnitDates } from './demo-calendar.js';

export type DemoFault = 'outlet-not-above-inlet' | 'outlet-above-saturation' | 'stuck-outlet-sensor' | 'pressure-spike';

/** One hour as the historian would record it (SI), with the truth behind it. */
export interface DemoHour {
  timestampUtc: number;
  loadMw: number;
  backpressureKpa: number;
  cwInletC: number;
  cwOutletC: number;
  cwFlowM3s: number;
  hotwellC: number;
  dissolvedOxygenPpb: number;
  airRemovalKgS: number;
  barometerKpa: number;
  truth: {
    /** Fouling cleanliness, the quantity the fouling trend should recover. */
    cleanliness: number;
    /** Cleanliness the model ran with (lower during the air leak). */
    effectiveCleanliness: number;
    dutyMw: number;
    cwFlowM3s: number;
    backpressureKpa: number;
    offline: boolean;
    airLeak: boolean;
    fault: DemoFault | null;
  };
}

export interface DemoCleaning {
  /** Local date (plant time zone) the cleaning finished. */
  date: string;
  method: string;
  cfBefore: number;
  cfAfter: number;
}

export interface DemoOutage {
  start: string;
  end: string;
  kind: 'planned' | 'forced';
}

export interface DemoGenerationOptions {
  /** The plant-local day the demo is made on (YYYY-MM-DD): the history ends with the day before. */
  today: string;
  seed?: number;
  /** Days of history, ending the day before today: MIN_DEMO_SPAN_DAYS up to the whole story (the default). */
  days?: number;
}

export interface DemoUnitData {
  /** The unit with its story's dates as played (moved to end the day before today). */
  unit: DemoUnitSpec;
  timeZone: string;
  hours: DemoHour[];
  cleanings: DemoCleaning[];
  outages: DemoOutage[];
  airLeak: { start: string; end: string; startUtc: number; endUtc: number };
  designBackpressureKpa: number;
}

const MS_PER_HOUR = 3_600_000;
/** The shortest span that still leaves room for the injected faults (they keep 500 hours from either end). */
export const MIN_DEMO_SPAN_DAYS = 60;
const AIR_REMOVAL_NORMAL_KGS = massFlowToKgS(7, 'scfm');
const AIR_REMOVAL_LEAK_KGS = massFlowToKgS(26, 'scfm');

/** Duty at a load: the part-load ratio rises as the cycle efficiency falls [common practice, rough]. */
export const dutyAtLoadMw = (unit: DemoUnitSpec, loadMw: number): number => loadMw * (unit.dutyPerMwFullLoad + 0.25 * (1 - loadMw / unit.turbine.ratingMw));

export function designBackpressureKpa(unit: DemoUnitSpec): number {
  return backpressureAtCleanlinessKpa({
    geometry: unit.geometry,
    cwInletC: unit.design.cwInletC,
    cwFlowM3s: unit.design.cwFlowM3s,
    dutyMw: dutyAtLoadMw(unit, unit.turbine.ratingMw),
    pluggedTubes: unit.pluggedTubes,
    cleanliness: unit.design.cleanliness,
  });
}

/** Forced outages of the story as written (one a year, clear of the planned outages and the leak). */
function forcedOutages(unit: DemoUnitSpec, rng: DemoRandom): DemoOutage[] {
  const out: DemoOutage[] = [];
  const startYear = Number(DEMO_START_LOCAL.slice(0, 4));
  const endYear = Number(DEMO_END_LOCAL.slice(0, 4));
  for (let year = startYear; year < endYear; year++) {
    for (let attempt = 0; attempt < 20; attempt++) {
      const start = DateTime.fromObject({ year, month: 1, day: 1 }).plus({ days: rng.integer(20, 330) });
      const end = start.plus({ days: rng.integer(2, 5) });
      const s = start.toISODate()!;
      const e = end.toISODate()!;
      const clash = [...unit.plannedOutages, unit.airLeak].some((p) => !(e < p.start || s > p.end));
      if (!clash) {
        out.push({ start: s, end: e, kind: 'forced' });
        break;
      }
    }
  }
  return out;
}

/** Cleanliness after `days` of fouling from CF0 (Kern–Seaton asymptotic fouling resistance). */
export function foulingCleanliness(unit: DemoUnitSpec, cf0: number, days: number): number {
  const k = 1 / unit.fouling.asymptoticCf - 1 / unit.fouling.cleanCf;
  return 1 / (1 / cf0 + k * (1 - Math.exp(-days / unit.fouling.timeConstantDays)));
}

export function generateDemoUnitData(written: DemoUnitSpec, options: DemoGenerationOptions): DemoUnitData {
  const shift = demoShiftDays(options.today);
  const unit = shiftUnitDates(written, shift);
  const plant = demoPlant(unit.plantKey);
  const zone = plant.timeZone;
  const rng = new DemoRandom(seedFromText(unit.key, (options.seed ?? DEMO_SCENARIO_SEED) + unit.seed));
  const storyStartDay = shiftDay(DEMO_START_LOCAL, shift);
  const endDay = shiftDay(DEMO_END_LOCAL, shift);
  const startDay = options.days === undefined ? storyStartDay : shiftDay(endDay, -checkedSpanDays(options.days));
  const startMs = DateTime.fromISO(startDay, { zone }).toMillis();
  const endMs = DateTime.fromISO(endDay, { zone }).toMillis();
  const rating = unit.turbine.ratingMw;
  const forced = forcedOutages(written, rng).map((o) => ({ ...o, start: shiftDay(o.start, shift), end: shiftDay(o.end, shift) }));
  const outages: DemoOutage[] = [...unit.plannedOutages.map((o) => ({ start: o.start, end: o.end, kind: 'planned' as const })), ...forced]
    .filter((o) => o.end >= startDay && o.start < endDay)
    .sort((a, b) => a.start.localeCompare(b.start));
  const cleaningByEnd = new Map(unit.plannedOutages.filter((o) => o.cleaning).map((o) => [o.end, o.cleaning!]));
  const airLeakStartUtc = DateTime.fromISO(unit.airLeak.start, { zone }).toMillis();
  const airLeakEndUtc = DateTime.fromISO(unit.airLeak.end, { zone }).plus({ days: 1 }).toMillis();

  const hours: DemoHour[] = [];
  const cleanings: DemoCleaning[] = [];
  // the fouling state the story has reached by the first day played: its start, then each cleaning before that day
  let cf0 = unit.fouling.cleanCf;
  let cleanedAtMs = DateTime.fromISO(storyStartDay, { zone }).toMillis() - unit.fouling.daysSinceCleaningAtStart * 24 * MS_PER_HOUR;
  for (const [end, cleaning] of [...cleaningByEnd].sort(([a], [b]) => a.localeCompare(b))) {
    if (end >= startDay) break;
    cf0 = cleaning.cfAfter;
    cleanedAtMs = DateTime.fromISO(end, { zone }).toMillis();
  }
  let weather = 0;
  let baroWeather = 0;
  let winterLineup = false;
  let day = '';
  let dayLevel = 1;
  let nightLevel = 0.6;
  for (let t = startMs; t < endMs; t += MS_PER_HOUR) {
    const local = DateTime.fromMillis(t, { zone });
    const date = local.toISODate()!;
    if (date !== day) {
      day = date;
      const weekend = local.weekday >= 6;
      const summer = local.month >= 6 && local.month <= 9;
      dayLevel = summer ? rng.uniform(0.94, 1.0) : weekend ? rng.uniform(0.68, 0.85) : rng.uniform(0.86, 0.99);
      nightLevel = rng.next() < 0.07 ? rng.uniform(0.3, 0.37) : weekend ? rng.uniform(0.48, 0.6) : rng.uniform(0.55, 0.72);
      const finishedCleaning = cleaningByEnd.get(date);
      if (finishedCleaning) {
        cleanings.push({
          date,
          method: finishedCleaning.method,
          cfBefore: foulingCleanliness(unit, cf0, (t - cleanedAtMs) / (24 * MS_PER_HOUR)),
          cfAfter: finishedCleaning.cfAfter,
        });
        cf0 = finishedCleaning.cfAfter;
        cleanedAtMs = t;
      }
    }
    const offline = outages.some((o) => date >= o.start && date <= o.end);
    const doy = local.ordinal;
    weather = 0.995 * weather + rng.normal(0, unit.climate.weatherSdK * Math.sqrt(1 - 0.995 ** 2));
    baroWeather = 0.99 * baroWeather + rng.normal(0, 0.6 * Math.sqrt(1 - 0.99 ** 2));
    const seasonal = unit.climate.meanInletC - unit.climate.amplitudeK * Math.cos((2 * Math.PI * (doy - unit.climate.coldestDayOfYear)) / 365.25);
    const diurnal = 0.3 * Math.sin((2 * Math.PI * (local.hour - 9)) / 24);
    const t1 = Math.max(0.5, seasonal + weather + diurnal);
    if (t1 < 9) winterLineup = true;
    else if (t1 > 11) winterLineup = false;
    const flow = unit.design.cwFlowM3s * (winterLineup ? unit.winterFlowFraction : 1) * (1 + rng.normal(0, 0.003));
    const baro = unit.barometerKpa + baroWeather;
    const cleanliness = foulingCleanliness(unit, cf0, (t - cleanedAtMs) / (24 * MS_PER_HOUR));
    const airLeak = t >= airLeakStartUtc && t < airLeakEndUtc;
    const leakRamp = airLeak ? Math.min(1, (t - airLeakStartUtc) / (12 * MS_PER_HOUR)) : 0;
    const effective = cleanliness * (1 - unit.airLeak.cfLossFraction * leakRamp);
    const level = local.hour >= 6 && local.hour < 22 ? dayLevel : nightLevel;
    const load = offline ? 0 : level * rating;
    let hour: DemoHour;
    if (offline) {
      // vacuum broken, CW pumps running: the historian still records the instruments
      hour = {
        timestampUtc: t,
        loadMw: 0,
        backpressureKpa: baro,
        cwInletC: t1 + rng.normal(0, 0.06),
        cwOutletC: t1 + 0.1 + rng.normal(0, 0.06),
        cwFlowM3s: flow * (1 + rng.normal(0, 0.006)),
        hotwellC: t1 + 3,
        dissolvedOxygenPpb: 80 + rng.normal(0, 10),
        airRemovalKgS: 0,
        barometerKpa: baro,
        truth: { cleanliness, effectiveCleanliness: effective, dutyMw: 0, cwFlowM3s: flow, backpressureKpa: baro, offline, airLeak, fault: null },
      };
    } else {
      const duty = dutyAtLoadMw(unit, load);
      const p = backpressureAtCleanlinessKpa({
        geometry: unit.geometry,
        cwInletC: t1,
        cwFlowM3s: flow,
        dutyMw: duty,
        pluggedTubes: unit.pluggedTubes,
        cleanliness: effective,
      });
      const t2 = t1 + cwRiseK(t1, liquidDensityKgM3(t1) * flow, duty);
      const ts = saturationTemperatureC(p);
      const subcooling = airLeak ? 2.2 * leakRamp + 0.4 + Math.abs(rng.normal(0, 0.3)) : 0.4 + Math.abs(rng.normal(0, 0.12));
      hour = {
        timestampUtc: t,
        loadMw: load + rng.normal(0, 0.002 * rating),
        backpressureKpa: p * (1 + rng.normal(0, 0.003)),
        cwInletC: t1 + rng.normal(0, 0.06),
        cwOutletC: t2 + rng.normal(0, 0.06),
        cwFlowM3s: flow * (1 + rng.normal(0, 0.006)),
        hotwellC: ts - subcooling,
        dissolvedOxygenPpb: Math.max(1, airLeak ? 5 + 25 * leakRamp + rng.normal(0, 4) : 5 + rng.normal(0, 1.2)),
        airRemovalKgS: Math.max(
          0,
          (airLeak ? AIR_REMOVAL_NORMAL_KGS + (AIR_REMOVAL_LEAK_KGS - AIR_REMOVAL_NORMAL_KGS) * leakRamp : AIR_REMOVAL_NORMAL_KGS) * (1 + rng.normal(0, 0.08)),
        ),
        barometerKpa: baro,
        truth: { cleanliness, effectiveCleanliness: effective, dutyMw: duty, cwFlowM3s: flow, backpressureKpa: p, offline, airLeak, fault: null },
      };
    }
    hours.push(hour);
  }
  injectFaults(hours, rng);
  return {
    unit,
    timeZone: zone,
    hours,
    cleanings,
    outages,
    airLeak: { start: unit.airLeak.start, end: unit.airLeak.end, startUtc: airLeakStartUtc, endUtc: airLeakEndUtc },
    designBackpressureKpa: designBackpressureKpa(unit),
  };
}

/** The story's length in days (1,096: 2023-01-01 to 2026-01-01). */
const STORY_DAYS = daysBetween(DEMO_START_LOCAL, DEMO_END_LOCAL);

function checkedSpanDays(days: number): number {
  if (!Number.isInteger(days) || days < MIN_DEMO_SPAN_DAYS || days > STORY_DAYS)
    throw new RangeError(`a demo span is a whole number of days from ${MIN_DEMO_SPAN_DAYS} to ${STORY_DAYS}, not ${days}`);
  return days;
}

/** A few non-physical or faulty readings at random operating hours (values stay present). */
function injectFaults(hours: DemoHour[], rng: DemoRandom): void {
  // An index from 500 to length − 500 inclusive: always an hour, as a span holds at least 60 × 24 of them.
  const pick = (): number => {
    for (;;) {
      const i = rng.integer(500, hours.length - 500);
      const truth = hours[i]!.truth;
      if (!truth.offline && !truth.airLeak && truth.fault === null) return i;
    }
  };
  for (let k = 0; k < 4; k++) {
    const h = hours[pick()]!;
    h.cwOutletC = h.cwInletC - rng.uniform(0, 0.4);
    h.truth.fault = 'outlet-not-above-inlet';
  }
  for (let k = 0; k < 3; k++) {
    const h = hours[pick()]!;
    h.cwOutletC = saturationTemperatureC(h.backpressureKpa) + rng.uniform(0.3, 1.5);
    h.truth.fault = 'outlet-above-saturation';
  }
  for (let k = 0; k < 2; k++) {
    const h = hours[pick()]!;
    h.backpressureKpa = rng.uniform(55, 70);
    h.truth.fault = 'pressure-spike';
  }
  const stuckFrom = pick();
  const stuckValue = hours[stuckFrom]!.cwOutletC;
  for (const h of hours.slice(stuckFrom, stuckFrom + 36)) {
    if (h.truth.fault !== null) continue;
    h.cwOutletC = stuckValue;
    h.truth.fault = 'stuck-outlet-sensor';
  }
}
