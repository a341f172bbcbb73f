/**
 * Seasonal drivers of the fouling cost: CW inlet temperature, load and prices, as monthly profiles
 * (12 values, January first) derived from a unit's history or entered, expanded to one value per plant-local day.
 */
import { civilFromDayNumber, dateFromDayNumber, dayNumber, dayNumberFromCivil, daysInMonth } from '../../calendar/plant-date.js';

export type MonthlyValues = readonly number[];

/** How a driver is given: a constant, 12 monthly values, or one value per horizon day. */
export type DriverSpec = number | { monthly: MonthlyValues } | { daily: readonly number[] };

/** 'step' holds each month's value for the whole month; 'mid-month' interpolates linearly between month centres. */
export type MonthlyInterpolation = 'step' | 'mid-month';

export interface UnitHistoryDay {
  date: string;
  /** null on a day off line without a CW inlet mean: the day counts for the load only */
  cwInletC: number | null;
  loadFraction: number;
}

export interface MonthlyProfiles {
  cwInletC: number[];
  loadFraction: number[];
  /** months (1..12) with no history: from the design fill when given, else interpolated cyclically between observed months */
  filledMonths: number[];
}

/** Values for months without history (the design CW inlet and a typical load) instead of interpolating across a gap. */
export interface MonthFill {
  cwInletC: number;
  loadFraction: number;
}

function assertTwelve(values: MonthlyValues): void {
  if (values.length !== 12) throw new Error(`a monthly profile needs 12 values (January first), got ${values.length}`);
}

/** Fills gaps in a 12-month array cyclically (December is next to January). */
function fillCyclic(values: (number | null)[]): number[] {
  const known = values.map((v, i) => (v === null ? -1 : i)).filter((i) => i >= 0);
  if (known.length === 0) throw new Error('no month has any history');
  return values.map((v, i) => {
    if (v !== null) return v;
    let back = 1;
    while (values[(i - back + 12) % 12] === null) back++;
    let ahead = 1;
    while (values[(i + ahead) % 12] === null) ahead++;
    const a = values[(i - back + 12) % 12] as number;
    const b = values[(i + ahead) % 12] as number;
    return a + ((b - a) * back) / (back + ahead);
  });
}

/** Monthly means of a unit's daily history, pooled over the years present; months without history from `fill` when given. */
export function monthlyProfilesFromHistory(history: readonly UnitHistoryDay[], fill?: MonthFill): MonthlyProfiles {
  const sumT = new Array<number>(12).fill(0);
  const countT = new Array<number>(12).fill(0);
  const sumL = new Array<number>(12).fill(0);
  const count = new Array<number>(12).fill(0);
  for (const h of history) {
    const m = civilFromDayNumber(dayNumber(h.date)).month - 1;
    if (h.cwInletC !== null) {
      sumT[m]! += h.cwInletC;
      countT[m]!++;
    }
    sumL[m]! += h.loadFraction;
    count[m]!++;
  }
  const mean = (sums: number[], n: number[]) => sums.map((s, m) => (n[m] ? s / n[m]! : null));
  const filled = (values: (number | null)[], value: number | undefined) => (value === undefined ? fillCyclic(values) : values.map((v) => v ?? value));
  const cw = mean(sumT, countT);
  // a month whose days were all off line has a load (0) but no CW inlet: fill its CW inlet from its neighbours
  const cwFilled = fill ? fillCyclic(cw.map((v, m) => (v === null && count[m] ? null : (v ?? fill.cwInletC)))) : fillCyclic(cw);
  return {
    cwInletC: cwFilled,
    loadFraction: filled(mean(sumL, count), fill?.loadFraction),
    filledMonths: count.flatMap((c, m) => (c ? [] : [m + 1])),
  };
}

/** Centre of a month as a fractional day number. */
function monthCentre(year: number, month: number): number {
  return dayNumberFromCivil({ year, month, day: 1 }) + daysInMonth(year, month) / 2;
}

export function expandMonthly(values: MonthlyValues, startDate: string, days: number, interpolation: MonthlyInterpolation = 'mid-month'): Float64Array {
  assertTwelve(values);
  const out = new Float64Array(days);
  const start = dayNumber(startDate);
  for (let d = 0; d < days; d++) {
    const { year, month } = civilFromDayNumber(start + d);
    const here = values[month - 1]!;
    if (interpolation === 'step') {
      out[d] = here;
      continue;
    }
    const x = start + d + 0.5;
    const centre = monthCentre(year, month);
    const [ny, nm] = x >= centre ? (month === 12 ? [year + 1, 1] : [year, month + 1]) : month === 1 ? [year - 1, 12] : [year, month - 1];
    const other = values[nm - 1]!;
    const otherCentre = monthCentre(ny, nm);
    out[d] = here + ((other - here) * (x - centre)) / (otherCentre - centre);
  }
  return out;
}

export function expandDriver(spec: DriverSpec, startDate: string, days: number, interpolation: MonthlyInterpolation = 'mid-month'): Float64Array {
  if (typeof spec === 'number') return new Float64Array(days).fill(spec);
  if ('monthly' in spec) return expandMonthly(spec.monthly, startDate, days, interpolation);
  if (spec.daily.length < days) throw new Error(`a daily driver needs ${days} values for the horizon, got ${spec.daily.length}`);
  return Float64Array.from(spec.daily.slice(0, days));
}

export interface DriverSpecs {
  cwInletC: DriverSpec;
  loadFraction: DriverSpec;
  fuelPricePerMmbtu: DriverSpec;
  replacementPricePerMwh: DriverSpec;
  co2PricePerTonne: DriverSpec;
}

/** One value per plant-local day of the horizon for every driver. */
export interface DailyDrivers {
  startDate: string;
  dates: string[];
  cwInletC: Float64Array;
  loadFraction: Float64Array;
  fuelPricePerMmbtu: Float64Array;
  replacementPricePerMwh: Float64Array;
  co2PricePerTonne: Float64Array;
}

export function expandDrivers(specs: DriverSpecs, startDate: string, days: number, interpolation: MonthlyInterpolation = 'mid-month'): DailyDrivers {
  const start = dayNumber(startDate);
  return {
    startDate,
    dates: Array.from({ length: days }, (_, d) => dateFromDayNumber(start + d)),
    cwInletC: expandDriver(specs.cwInletC, startDate, days, interpolation),
    loadFraction: expandDriver(specs.loadFraction, startDate, days, interpolation),
    fuelPricePerMmbtu: expandDriver(specs.fuelPricePerMmbtu, startDate, days, interpolation),
    replacementPricePerMwh: expandDriver(specs.replacementPricePerMwh, startDate, days, interpolation),
    co2PricePerTonne: expandDriver(specs.co2PricePerTonne, startDate, days, interpolation),
  };
}
