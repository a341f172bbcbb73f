/**
 * What each colour means on every chart, defined once. The cool accent ("tube") is the measured
 * condenser, the warm accent ("ledger") is money, grey dashes are what a condenser at the reference
 * cleanliness would do, plum is air in-leakage (and the unexplained part it usually is), ink is a
 * cleaning. Fouling is rust, set apart from the cooling water's blues, and its excess backpressure is
 * shaded in the same rust. Every stroke and bar colour has at least 3:1 contrast on paper (WCAG 2.2, 1.4.11).
 */
export const CHART_COLOURS = {
  measured: '#2f7a99',
  fitted: '#1a4f66',
  forecast: '#1a4f66',
  forecastBand: 'rgba(26, 79, 102, 0.22)',
  reference: '#6b6f78',
  expected: '#4a4e57',
  cost: '#b8661c',
  /** actual backpressure above expected (the excess), and below it */
  excessFill: 'rgba(178, 58, 22, 0.42)',
  shortfallFill: 'rgba(47, 122, 153, 0.28)',
  excessEdge: '#8a3a1c',
  cleaning: '#1d1f23',
  airLeak: '#7b4f9e',
  airLeakShade: 'rgba(123, 79, 158, 0.13)',
} as const;

/** The deviation breakdown's causes, in the calculation's fixed order, each with its colour and words. */
export const CAUSE_STYLES = {
  cwInletKpa: { label: 'CW inlet temperature', colour: '#2f5f80' },
  cwFlowKpa: { label: 'CW flow', colour: '#6b93ae' },
  loadKpa: { label: 'Load and duty', colour: '#6b7a3a' },
  pluggingKpa: { label: 'Plugged tubes', colour: '#5c5f66' },
  foulingKpa: { label: 'Fouling (recoverable by cleaning)', colour: '#b23a16' },
  unexplainedKpa: { label: 'Unexplained (air in-leakage, instruments)', colour: '#7b4f9e' },
} as const;

/** nivo theme in the ink-and-paper tokens. */
export const CHART_THEME = {
  background: 'transparent',
  text: { fontSize: 11, fill: '#4a4e57', fontFamily: 'Inter Variable, ui-sans-serif, system-ui, sans-serif' },
  axis: {
    domain: { line: { stroke: '#b9b4a9', strokeWidth: 1 } },
    ticks: { line: { stroke: '#b9b4a9', strokeWidth: 1 }, text: { fontSize: 11, fill: '#4a4e57' } },
    legend: { text: { fontSize: 12, fill: '#1d1f23', fontWeight: 500 } },
  },
  grid: { line: { stroke: '#e6e2da', strokeWidth: 1 } },
  crosshair: { line: { stroke: '#1d1f23', strokeWidth: 1, strokeOpacity: 0.5 } },
} as const;

const COARSEST_TICK_STEP = { days: 365, tickValues: 'every year', format: '%Y' } as const;
const TICK_STEPS = [
  { days: 7, tickValues: 'every 7 days', format: '%-d %b' },
  { days: 14, tickValues: 'every 14 days', format: '%-d %b' },
  { days: 30.4, tickValues: 'every month', format: '%b %Y' },
  { days: 61, tickValues: 'every 2 months', format: '%b %Y' },
  { days: 91, tickValues: 'every 3 months', format: '%b %Y' },
  { days: 182, tickValues: 'every 6 months', format: '%b %Y' },
  COARSEST_TICK_STEP,
] as const;

/** Ticks on a time axis: the finest step that keeps at most `maxTicks` labels (about one per 70 px). */
export function timeTicks(spanDays: number, maxTicks = 8): { tickValues: string; format: string } {
  const step = TICK_STEPS.find((s) => spanDays / s.days <= maxTicks) ?? COARSEST_TICK_STEP;
  return { tickValues: step.tickValues, format: step.format };
}

/** A plant-local day ("2025-04-20") as a Date at UTC midnight, the form the charts' time scales use. */
export const dayToDate = (day: string): Date => new Date(`${day}T00:00:00Z`);
