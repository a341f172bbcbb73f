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
import { TYPICAL_CLEANING_METHODS } from '@shared/schemas/cleaning-method.js';
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
const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

export interface Prefill {
  inputs: CalcScheduleInput;
  inputSources: InputSources;
  lastDataDay: string;
  currency: string;
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
  const history = await dailyMeansOf(em, unit.id, model.ratingMw);
  const profiles = monthlyProfilesFromHistory(history);
  const tomorrow = addDays(plantDayOf(now.getTime(), plant.timeZone), 1);
  const afterData = addDays(lastDataDay, 1);
  const startDate = tomorrow > afterData ? tomorrow : afterData;
  const endDate = addDays(startDate, CASE_HORIZON_DAYS - 1);
  const events = await em.getRepository(UnitEvent).findBy({ unitId: unit.id });
  const outages = plannedOutages(events)
    .filter((o) => o.to >= startDate && o.from <= endDate)
    .sort((a, b) => a.from.localeCompare(b.from))
    .slice(0, 100);
  const plugged = pluggedTubesOn(events, setup.condenser.pluggedTubes)(lastDataDay);
  const library = await methodsOf(em, unit.organisationId);
  const methods = library.length ? library : [...TYPICAL_CLEANING_METHODS];
  const e = setup.economics;
  const c = setup.condenser;
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
    uncertainty: { trials: CASE_TRIALS, seed: 1 },
  };
  const checked = calcScheduleInput.safeParse(raw);
  if (!checked.success) {
    const issue = checked.error.issues[0];
    throw conflict(`The unit's data does not make a case yet: ${issue.path.join('.')} ${issue.message}`);
  }
  const inputs = checked.data;

  const historyText = `${history.length} days of history to ${dayText(lastDataDay)}`;
  const filled = profiles.filledMonths.length ? `; ${profiles.filledMonths.map((m) => MONTHS[m - 1]).join(', ')} had no data and were interpolated` : '';
  const economics = `the unit’s economics setup`;
  const sources: InputSources = {
    startDate: { source: 'prefilled', detail: startDate === tomorrow ? 'tomorrow at the plant' : `the day after the last data (${dayText(lastDataDay)})` },
    horizonDays: { source: 'prefilled', detail: 'two years from the start' },
    'drivers.cwInletC': { source: 'measured', detail: `monthly means of the CW inlet temperature over ${historyText}${filled}` },
    'drivers.loadFraction': { source: 'measured', detail: `monthly means of the load over ${historyText}${filled}` },
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
      detail: `fitted to ${cycle.pointsUsed} days of the current cycle, since ${dayText(cycle.startDay)} (${cycle.model.model}, R² ${cycle.rSquared.toFixed(2)})`,
    },
    initial: {
      source: 'measured',
      detail: `${inputs.initial.daysSinceCleaning} days since the current cycle began on ${dayText(cycle.startDay)}; cleanliness after a cleaning ${cycle.cleanlinessAfterCleaning.toFixed(3)} from the fit`,
    },
    methods: library.length
      ? {
          source: 'prefilled',
          detail: `the organisation’s ${library.length} cleaning methods${library.some((m) => m.typical) ? ' (some still at typical values)' : ''}`,
        }
      : {
          source: 'prefilled',
          detail:
            'the typical cleaning methods at typical values: the organisation has no library of its own yet; replace them with your own costs and durations',
        },
    plannedOutages: {
      source: 'prefilled',
      detail: outages.length
        ? `${outages.length} planned outage${outages.length > 1 ? 's' : ''} from the unit’s timeline within the two years`
        : 'no planned outage on the unit’s timeline within the two years',
    },
    minSpacingDays: { source: 'prefilled', detail: 'no minimum spacing between cleanings (the calculation’s default)' },
    discountRate: { source: 'prefilled', detail: economics },
    referenceCleanliness: {
      source: 'prefilled',
      detail: c.referenceCleanliness !== null ? 'the condenser setup’s reference cleanliness' : 'the condenser’s design cleanliness',
    },
    baseline: { source: 'prefilled', detail: 'compared with no cleaning within the horizon (the calculation’s default)' },
    upfrontCost: { source: 'prefilled', detail: 'no upfront cost (the calculation’s default)' },
    uncertainty: {
      source: 'prefilled',
      detail: `${CASE_TRIALS.toLocaleString('en-US')} Monte Carlo trials over typical spreads (common practice, not plant data)`,
    },
    includeDaily: { source: 'prefilled', detail: 'the daily path is kept with the results' },
  };
  return { inputs, inputSources: sources, lastDataDay, currency };
}

const round3 = (x: number) => Math.round(x * 1000) / 1000;
const round4 = (x: number) => Math.round(x * 10000) / 10000;
