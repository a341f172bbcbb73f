/** `calc fouling-fit`: fouling trend since the last cleaning, model chosen by AIC, forecast with a band (ENGINEERING.md §5). */
import type { CalcCommand } from '../run-calc.js';
import { calcFoulingFitInput, calcFoulingFitOutput, type CalcFoulingFitOutput } from '@shared/schemas/calc-fouling-fit.js';
import { fitFoulingTrend, type ModelFitSummary } from '@shared/domain/decision/fouling/fouling-trend.js';

const r6 = (x: number) => Number(x.toFixed(6));
const sig = (x: number) => Number(x.toPrecision(8));

function summary(m: ModelFitSummary) {
  const { model, ...parameters } = m.model;
  return {
    model,
    parameters: Object.fromEntries(Object.entries(parameters).map(([k, v]) => [k, sig(v)])),
    ...(m.foulingResistance ? { foulingResistance: Object.fromEntries(Object.entries(m.foulingResistance).map(([k, v]) => [k, sig(v)])) } : {}),
    cleanlinessAfterCleaning: r6(m.cleanlinessAfterCleaning),
    aic: Number(m.aic.toFixed(4)),
    rSquared: r6(m.rSquared),
    residualStdCleanliness: sig(m.residualStdCleanliness),
  };
}

const command: CalcCommand = {
  input: calcFoulingFitInput,
  output: calcFoulingFitOutput,
  run(input: unknown): CalcFoulingFitOutput {
    const v = calcFoulingFitInput.parse(input);
    const r = fitFoulingTrend(v);
    if (r.status === 'not-enough-data') return r;
    const warnings = r.outlierDays.length ? [`${r.outlierDays.length} day(s) left out as outliers`] : [];
    return {
      status: 'fitted',
      chosen: summary(r.chosen),
      models: r.models.map(summary),
      pointsUsed: r.pointsUsed,
      excludedDays: r.excludedDays,
      outlierDays: r.outlierDays,
      bandProbability: r.bandProbability,
      forecast: r.forecast.map((f) => ({ day: f.day, cleanliness: r6(f.cleanliness), low: r6(f.low), high: Number.isFinite(f.high) ? r6(f.high) : null })),
      ...(warnings.length ? { warnings } : {}),
    };
  },
};

export default command;
