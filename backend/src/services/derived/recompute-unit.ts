/**
 * Recomputes everything derived for one unit from its stored raw samples. Runs as a background job after an
 * import, an undo, a setup change or a new event. The steps, in order (each in its own file here):
 * read valid samples → daily cleanliness and witnesses → air in-leakage verdicts → fouling cycles →
 * per-sample analysis → write-back → daily aggregates → cleaning outlook and forecast band → e-mail alerts.
 * Samples are read in id order in chunks, twice (the per-sample analysis needs the trend the first pass fits),
 * so memory stays bounded whatever the history length; the second pass gathers the daily figures as it analyses.
 */
import type { DataSource } from 'typeorm';
import { dailyFiguresOfUnit } from '../../repositories/daily-aggregate.repository.js';
import { clearAnalysesOfUnit } from '../../repositories/sample-analysis.repository.js';
import { countSamplesOfUnit } from '../../repositories/sample.repository.js';
import { judgeAirLeaks } from './air-leak-verdicts.js';
import { DailyAccumulator, rebuildDailyAggregates, storeDailyAggregates } from './daily-aggregates.js';
import { measureDailyCleanliness, witnessMedians } from './daily-witnesses.js';
import { currentFigures } from './current-figures.js';
import { forecastBand } from './forecast-band.js';
import { cycleSummary, fitCycles, trendCleanlinessOn, type CycleTrend } from './fouling-cycles.js';
import { readEverySample, readValidSamples } from './read-valid-samples.js';
import { analyseAndGather } from './sample-analysis.js';
import { loadUnitContext } from './unit-context.js';
import { planCleaningOutlook, storeUnitAnalysis, unitAnalysis } from './unit-analysis.js';
import { writeBackAnalyses } from './write-back.js';
import { alertsAfterRecompute } from '../alerts/alert-checks.js';

export interface RecomputeOutcome {
  samples: number;
  days: number;
  cycles: CycleTrend[];
}

type Progress = (fraction: number, message: string) => Promise<void>;

export async function recomputeUnit(ds: DataSource, unitId: string, onProgress: Progress = async () => {}): Promise<RecomputeOutcome> {
  const ctx = await loadUnitContext(ds, unitId);
  const { unit, model, setup, dayOf, pluggedTubesOn } = ctx;
  const total = await countSamplesOfUnit(ds.manager, unitId);
  if (!model || !setup) {
    await clearAnalysesOfUnit(ds.manager, unitId);
    const days = await rebuildDailyAggregates(ds, unitId, dayOf);
    await storeUnitAnalysis(ds, unitId, null);
    return { samples: total, days, cycles: [] };
  }

  await onProgress(0.05, 'Measuring cleanliness');
  const measured = await measureDailyCleanliness({ model, dayOf, pluggedTubesOn, samples: readValidSamples(ds, unitId) });
  const airLeaks = judgeAirLeaks(measured, ctx.cleanings);
  // Suspected air in-leakage days are left out of the fit, so a weeks-long leak is not booked as fouling.
  const cycles = fitCycles(measured.dailyCleanliness, ctx.cleanings, airLeaks.suspectedDays);

  const daily = new DailyAccumulator(dayOf);
  await writeBackAnalyses(ds, {
    setupVersion: unit.setupVersion,
    chunks: analyseAndGather({ model, dayOf, pluggedTubesOn, cycles }, readEverySample(ds, unitId), daily),
    onChunk: (done) => onProgress(0.1 + 0.8 * (done / Math.max(1, total)), `Analysed ${done.toLocaleString('en-US')} points`),
  });

  await onProgress(0.92, 'Building daily figures');
  const dayCount = await storeDailyAggregates(ds, unitId, daily, {
    trendCleanliness: (day) => trendCleanlinessOn(cycles, day) ?? null,
    airLeakSuspected: (day) => airLeaks.suspectedDays.has(day),
    heatBalanceDutyMw: (meanLoadMw) => model.heatBalanceDutyMw(meanLoadMw / model.ratingMw),
    witnesses: (day) => witnessMedians(measured, day),
  });

  await onProgress(0.97, 'Planning the next cleaning');
  const lastDay = measured.days.at(-1) ?? null;
  const outlook = await planCleaningOutlook(ds, {
    organisationId: unit.organisationId,
    unitId,
    model,
    setup,
    lastDay,
    today: dayOf(Date.now()),
    cycles,
    plannedOutages: ctx.plannedOutages,
  });
  // The forecast band is drawn from the stored daily figures exactly as the health view would draw it.
  // So are the figures now that the portfolio lists.
  const days = await dailyFiguresOfUnit(ds.manager, unitId);
  const forecast = forecastBand(days, cycles.map(cycleSummary).at(-1));
  const current = currentFigures(
    days,
    ctx.events.filter((e) => e.kind === 'cleaning'),
  );
  await storeUnitAnalysis(
    ds,
    unitId,
    unitAnalysis({ setupVersion: unit.setupVersion, lastDay, cycles, airLeakPeriods: airLeaks.periods, outlook, forecast, current }),
  );
  // The figures are stored: a failed alert run must not fail (and repeat) the recompute; the hourly check sends what it missed.
  await alertsAfterRecompute(ds, unit.organisationId, unitId).catch(() => undefined);
  return { samples: total, days: dayCount, cycles };
}
