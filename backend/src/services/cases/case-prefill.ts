/**
 * A new case's inputs, filled from the unit as the cleaning outlook does (services/derived/cleaning-outlook.ts),
 * over two years: the current cycle's fitted fouling trend, monthly CW inlet and load from the daily history,
 * prices and discount rate from the economics setup, the condenser and turbine setup, planned outages from the
 * unit's timeline and the organisation's cleaning methods. Each input says where it came from.
 */
import type { EntityManager } from 'typeorm';
import { addDays, daysBetween } from '@shared/domain/calendar/plant-date.js';
import { plantDayOf } from '@shared/domain/calendar/plant-day.js';
import { monthlyProfilesFromHistory } from '@shared/domain/decision/drivers/seasonal-drivers.js';
import { buildUnitModel } from '@shared/domain/monitoring/index.js';
import { calcScheduleInput, type CalcScheduleInput } from '@shared/schemas/calc-schedule.js';
import type { InputSources } from '@shared/schemas/cases.js';
import { TYPICAL_CLEANING_METHODS, type CleaningMethod } from '@shared/schemas/cleaning-method.js';
import { storedUnitAnalysis } from '@shared/schemas/unit-analysis.js';
import type { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import type { Plant } from '../../entities/plant.entity.js';
import { UnitEvent } from '../../entities/unit-event.entity.js';
import { AppError } from '../../http/app-error.js';
import { methodsOf } from '../cleaning-method.service.js';
import { plannedOutages, pluggedTubesOn, unitSetupOf } from '../derived/unit-context.js';
import { dayText } from './day-text.js';
import { dailyMeansOf, lastDataDayOf } from './unit-history.js';

export const CASE_HORIZON_DAYS = 730;
export const CASE_TRIALS = 5000;
/** Planned outages are prefilled as far as the longest horizon a case may have, so lengthening it brings them in. */
export const OUTAGE_LOOKAHEAD_DAYS = 1830;
/** Most methods one case compares (the schedule input's limit). */
export const MAX_CASE_METHODS = 12;
/** Fewer measured months than this make the seasonal profile mostly design values (common practice: three quarters of a year). */
const MIN_MEASURED_MONTHS = 9;
/** A trend used beyond three times the span it was fitted on is an extrapolation to flag (common practice). */
const MAX_EXTRAPOLATION = 3;
const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

export interface Prefill {
  inputs: CalcScheduleInput;
  inputSources: InputSources;
  lastDataDay: string;
  currency: string;
  /** what the case rests on that its results should say (caseWarnings); to be added to the results' warnings */
  warnings: string[];
}

type Method = CleaningMethod;
const costOf = (m: Method, activeTubes: number) => m.fixedCost + m.costPerTube * activeTubes;

/**
 * The methods a new case compares: the whole library when it fits in a case; else every on-line and derate method
 * (they need no outage) and the cheapest outage methods, up to twelve, in the library's order.
 */
export function chooseMethods(library: readonly Method[], activeTubes: number): { methods: Method[]; left: number } {
  if (library.length <= MAX_CASE_METHODS) return { methods: [...library], left: 0 };
  const withoutOutage = library.filter((m) => m.unitDuringCleaning !== 'outage');
  const outage = library.filter((m) => m.unitDuringCleaning === 'outage').sort((a, b) => costOf(a, activeTubes) - costOf(b, activeTubes));
  const picked = new Set([...withoutOutage, ...outage].slice(0, MAX_CASE_METHODS));
  const methods = library.filter((m) => picked.has(m));
  return { methods, left: library.length - methods.length };
}

/**
 * The baseline a plant would follow without the case: with a planned outage in the horizon, cleaning at every
 * planned outage with the cheapest outage method (what a plant normally does); else no cleaning.
 */
export function baselineFor(
  outages: readonly { from: string; to: string }[],
  methods: readonly Method[],
  activeTubes: number,
  startDate: string,
  horizonDays: number,
): { baseline: CalcScheduleInput['baseline']; detail: string } {
  const end = addDays(startDate, horizonDays - 1);
  const inHorizon = outages.some((o) => o.from >= startDate && o.from <= end);
  const cheapest = methods.filter((m) => m.unitDuringCleaning === 'outage').sort((a, b) => costOf(a, activeTubes) - costOf(b, activeTubes))[0];
  if (inHorizon && cheapest) {
    return {
      baseline: { kind: 'every-planned-outage', methodId: cheapest.id },
      detail: `compared with cleaning at every planned outage with ${cheapest.name}, the cheapest outage method of the library (what a plant would normally do)`,
    };
  }
  return {
    baseline: { kind: 'never' },
    detail: inHorizon
      ? 'compared with no cleaning within the horizon: the library has no outage method to clean at the planned outages'
      : 'compared with no cleaning within the horizon: no planned outage falls within it',
  };
}

export { alignInitialToStart } from './input-sources.js';

const MEASURED_MONTHS = /measured in (\d+) of 12 months/;
const FITTED_SPAN = /a fit over (\d+) days/;

/**
 * What a case rests on that the calculation cannot see: a start before the last data or more than a year ahead,
 * seasonal drivers mostly from design values, a fouling trend extrapolated far beyond its data. The counts come from
 * the prefill's source details when not given, and count only while the input is still the prefilled one.
 */
export function caseWarnings(
  c: { inputs: CalcScheduleInput; inputSources: InputSources; lastDataDay: string; measuredMonths?: number; fittedSpanDays?: number },
  today: string,
): string[] {
  const out: string[] = [];
  const { inputs, inputSources: sources } = c;
  if (inputs.startDate <= c.lastDataDay) {
    out.push(
      `the case starts on ${dayText(inputs.startDate)}, before the last day of data (${dayText(c.lastDataDay)}): the days since the cleaning and the fouling there are already measured`,
    );
  }
  if (daysBetween(today, inputs.startDate) > 366)
    out.push(`the case starts on ${dayText(inputs.startDate)}, more than a year ahead: prices, outages and the fouling trend may have changed by then`);
  const cw = sources['drivers.cwInletC'];
  const months = c.measuredMonths ?? (cw && cw.source !== 'entered' ? Number(MEASURED_MONTHS.exec(cw.detail)?.[1] ?? 12) : 12);
  if (months < MIN_MEASURED_MONTHS) {
    out.push(
      `the seasonal CW inlet and load are measured in ${months} of 12 months only; the other months are design values: enter them if the plant has them`,
    );
  }
  const fouling = sources.fouling;
  const span = c.fittedSpanDays ?? (fouling && fouling.source !== 'entered' ? Number(FITTED_SPAN.exec(fouling.detail)?.[1] ?? 0) : 0);
  const reach = inputs.initial.daysSinceCleaning + inputs.horizonDays;
  if (span > 0 && reach > MAX_EXTRAPOLATION * span) {
    out.push(
      `the fouling trend was fitted over ${span} days and is extrapolated to ${reach} days after the cleaning over the ${inputs.horizonDays}-day horizon: treat the later years with caution`,
    );
  }
  return out;
}

const conflict = (message: string) => new AppError(409, message);

export async function prefillCase(em: EntityManager, unit: GeneratingUnit, plant: Plant, now = new Date()): Promise<Prefill> {
  const setup = unitSetupOf(unit);
  if (!setup) {
    const missing = (['condenser', 'turbine', 'economics'] as const).filter((p) => !unit[p]);
    throw conflict(`${unit.name} has no complete setup yet: enter its ${missing.join(', ')} setup first, then import its history`);
  }
  const parsed = unit.analysis ? storedUnitAnalysis.safeParse(unit.analysis) : null;
  if (!parsed?.success)
    throw conflict(
      `${unit.name} has no fouling trend yet: import its history (at least 10 days of valid data over 14 days since the last cleaning) and wait for the analysis to finish`,
    );
  const cycle = parsed.data.cycles.at(-1);
  if (!cycle || cycle.status !== 'fitted') {
    throw conflict(
      `${unit.name} has no fouling trend for its current cycle yet${cycle ? ` (${cycle.reason})` : ''}: import more history since the last cleaning`,
    );
  }
  const lastDataDay = (await lastDataDayOf(em, unit.id)) ?? parsed.data.lastDay;
  if (!lastDataDay) throw conflict(`${unit.name} has no valid data yet: import its history first`);

  const model = buildUnitModel(setup);
  const history = await dailyMeansOf(em, unit.id, model.ratingMw, model.minimumLoadFraction);
  const onLine = history.filter((h) => h.loadFraction > 0);
  // months without history: the design CW inlet, and the mean load of the days on line (availability aside)
  const meanLoad = onLine.length ? onLine.reduce((a, h) => a + h.loadFraction, 0) / onLine.length : 1;
  const profiles = monthlyProfilesFromHistory(history, { cwInletC: setup.condenser.designCwInletC, loadFraction: meanLoad });
  const measuredMonths = 12 - profiles.filledMonths.length;
  const offLine = history.length - onLine.length;
  const tomorrow = addDays(plantDayOf(now.getTime(), plant.timeZone), 1);
  const afterData = addDays(lastDataDay, 1);
  const startDate = tomorrow > afterData ? tomorrow : afterData;
  const endDate = addDays(startDate, OUTAGE_LOOKAHEAD_DAYS - 1);
  const events = await em.getRepository(UnitEvent).findBy({ unitId: unit.id });
  const outages = plannedOutages(events)
    .filter((o) => o.to >= startDate && o.from <= endDate)
    .sort((a, b) => a.from.localeCompare(b.from))
    .slice(0, 100);
  const plugged = pluggedTubesOn(events, setup.condenser.pluggedTubes)(lastDataDay);
  const library = await methodsOf(em, unit.organisationId);
  const e = setup.economics;
  const c = setup.condenser;
  const activeTubes = c.tubeCount - plugged;
  const chosen = chooseMethods(library.length ? library : [...TYPICAL_CLEANING_METHODS], activeTubes);
  const methods = chosen.methods;
  const baseline = baselineFor(outages, methods, activeTubes, startDate, CASE_HORIZON_DAYS);
  const currency = unit.economics?.currency ?? 'USD';
  const curve = setup.turbine.correctionCurve;

  const raw = {
    startDate,
    horizonDays: CASE_HORIZON_DAYS,
    drivers: {
      cwInletC: { monthly: profiles.cwInletC.map(round3) },
      loadFraction: { monthly: profiles.loadFraction.map(round4) },
      fuelPricePerMmbtu: e.fuelPricePerMmbtu,
      replacementPricePerMwh: e.replacementPricePerMwh,
      co2PricePerTonne: e.co2PricePerTonne,
    },
    unit: {
      ratingMw: model.ratingMw,
      heatRateBtuKwh: model.heatRateBtuKwh,
      co2KgPerMmbtu: e.co2KgPerMmbtu,
      capacityLimitedShare: e.capacityLimitedShare,
      condenser: {
        surfaceM2: c.surfaceM2,
        tubeCount: c.tubeCount,
        passes: c.passes,
        tubeOdMm: c.tubeOdMm,
        tubeBwg: c.tubeBwg,
        tubeMaterial: c.tubeMaterial,
        pluggedTubes: plugged,
        cwFlowM3s: c.designCwFlowM3s,
        designDutyMw: c.designDutyMw,
      },
      ...(curve ? { curve } : {}),
    },
    fouling: cycle.model,
    initial: {
      daysSinceCleaning: Math.max(0, daysBetween(cycle.startDay, startDate)),
      cleanlinessAfterCleaning: cycle.cleanlinessAfterCleaning,
      foulingRateMultiplier: 1,
    },
    methods,
    plannedOutages: outages,
    discountRate: e.discountRate,
    referenceCleanliness: model.referenceCleanliness,
    baseline: baseline.baseline,
    uncertainty: { trials: CASE_TRIALS, seed: 1 },
  };
  const checked = calcScheduleInput.safeParse(raw);
  if (!checked.success) {
    const issue = checked.error.issues[0];
    throw conflict(`The unit's data does not make a case yet: ${issue ? `${issue.path.join('.')} ${issue.message}` : 'its inputs do not check'}`);
  }
  const inputs = checked.data;

  const historyText = `${history.length} days of history to ${dayText(lastDataDay)}`;
  const filledNames = profiles.filledMonths.map((m) => MONTHS[m - 1]).join(', ');
  const measured = `measured in ${measuredMonths} of 12 months`;
  const driverSource = profiles.filledMonths.length ? ('prefilled' as const) : ('measured' as const);
  const cwFill = profiles.filledMonths.length ? `; ${filledNames} had no data and take the design CW inlet (${c.designCwInletC} °C)` : '';
  const loadFill = profiles.filledMonths.length ? `; ${filledNames} had no data and take the mean load on line (${(meanLoad * 100).toFixed(0)} %)` : '';
  const availability = `, ${offLine} days off line (no valid point or below the minimum load) counted as load 0, so the profile carries the history’s availability`;
  const fittedSpan = daysBetween(cycle.startDay, cycle.endDay ?? lastDataDay) + 1;
  const economics = `the unit’s economics setup`;
  const sources: InputSources = {
    startDate: { source: 'prefilled', detail: startDate === tomorrow ? 'tomorrow at the plant' : `the day after the last data (${dayText(lastDataDay)})` },
    horizonDays: { source: 'prefilled', detail: 'two years from the start' },
    'drivers.cwInletC': { source: driverSource, detail: `${measured}: monthly means of the CW inlet temperature over ${historyText}${cwFill}` },
    'drivers.loadFraction': { source: driverSource, detail: `${measured}: monthly means of the load over ${historyText}${availability}${loadFill}` },
    'drivers.fuelPricePerMmbtu': { source: 'prefilled', detail: `${economics} (${currency} per MMBtu)` },
    'drivers.replacementPricePerMwh': { source: 'prefilled', detail: `${economics} (${currency} per MWh)` },
    'drivers.co2PricePerTonne': { source: 'prefilled', detail: `${economics} (${currency} per tonne)` },
    'drivers.interpolation': { source: 'prefilled', detail: 'monthly values interpolated between month centres (the calculation’s default)' },
    unit: {
      source: 'prefilled',
      detail: `condenser, rating and heat rate from the unit’s setup (version ${unit.setupVersion}), ${plugged} tubes plugged on ${dayText(lastDataDay)}, ${curve ? 'its own' : 'the generic'} exhaust-pressure correction curve`,
    },
    fouling: {
      source: 'measured',
      detail: `fitted to ${cycle.pointsUsed} days of the current cycle, a fit over ${fittedSpan} days since ${dayText(cycle.startDay)} (${cycle.model.model}, R² ${cycle.rSquared.toFixed(2)})`,
    },
    initial: {
      source: 'measured',
      detail: `${inputs.initial.daysSinceCleaning} days since the current cycle began on ${dayText(cycle.startDay)}; cleanliness after a cleaning ${cycle.cleanlinessAfterCleaning.toFixed(3)} from the fit`,
    },
    methods: library.length
      ? {
          source: 'prefilled',
          detail: chosen.left
            ? `${methods.length} of the organisation’s ${library.length} cleaning methods (a case compares at most ${MAX_CASE_METHODS}): every on-line and derate method and the cheapest outage ones; ${chosen.left} left out can be added in place of others${methods.some((m) => m.typical) ? '; some still at typical values' : ''}`
            : `the organisation’s ${library.length} cleaning methods${library.some((m) => m.typical) ? ' (some still at typical values)' : ''}`,
        }
      : {
          source: 'prefilled',
          detail:
            'the typical cleaning methods at typical values: the organisation has no library of its own yet; replace them with your own costs and durations',
        },
    plannedOutages: {
      source: 'prefilled',
      detail: outages.length
        ? `${outages.length} planned outage${outages.length > 1 ? 's' : ''} from the unit’s timeline within five years of the start (those beyond the horizon are not used)`
        : 'no planned outage on the unit’s timeline within five years of the start',
    },
    minSpacingDays: { source: 'prefilled', detail: 'no minimum spacing between cleanings (the calculation’s default)' },
    discountRate: { source: 'prefilled', detail: economics },
    referenceCleanliness: {
      source: 'prefilled',
      detail: c.referenceCleanliness !== null ? 'the condenser setup’s reference cleanliness' : 'the condenser’s design cleanliness',
    },
    baseline: { source: 'prefilled', detail: baseline.detail },
    upfrontCost: { source: 'prefilled', detail: 'no upfront cost (the calculation’s default)' },
    uncertainty: {
      source: 'prefilled',
      detail: `${CASE_TRIALS.toLocaleString('en-US')} Monte Carlo trials over typical spreads (common practice, not plant data)`,
    },
    includeDaily: { source: 'prefilled', detail: 'the daily path is kept with the results' },
  };
  const warnings = caseWarnings({ inputs, inputSources: sources, lastDataDay, measuredMonths, fittedSpanDays: fittedSpan }, addDays(tomorrow, -1));
  return { inputs, inputSources: sources, lastDataDay, currency, warnings };
}

const round3 = (x: number) => Math.round(x * 1000) / 1000;
const round4 = (x: number) => Math.round(x * 10000) / 10000;
