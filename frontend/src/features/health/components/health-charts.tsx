import { ResponsiveBar, type BarTooltipProps } from '@nivo/bar';
import { useMemo } from 'react';
import { BREAKDOWN_CAUSES } from '@shared/schemas/health';
import { costCycles } from '@frontend/lib/chart-cycles';
import { CAUSE_STYLES, CHART_COLOURS, CHART_THEME } from '@frontend/lib/chart-palette';
import { formatStored, type FieldUnits } from '@frontend/lib/field-units';
import { formatCurrency, formatDay, formatMonth, formatNumber } from '@frontend/lib/format';
import { formatQuantity } from '@shared/text/physical-cost-text';
import type { UnitHealth } from '../api/get-health';
import { ChartFrame, TooltipBox, type LegendItem } from './chart-frame';
import TimeChart, { type TimeSeriesSpec } from './time-chart';

export interface HealthChartsProps {
  health: UnitHealth;
  units: FieldUnits;
  currency: string;
  narrow: boolean;
}

const pct = (v: number | null) => (v === null ? null : v * 100);
const shortDay = (day: string) => new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' }).format(new Date(`${day}T00:00:00Z`));

/** The four charts of the health view; loaded on demand because the chart library is most of the bundle. */
export default function HealthCharts({ health, units, currency, narrow }: HealthChartsProps) {
  const from = health.period.from ?? health.series[0]?.day ?? '';
  const lastDataDay = health.period.to ?? health.series.at(-1)?.day ?? '';
  const forecastEnd = health.forecast.at(-1)?.day;
  const to = forecastEnd && forecastEnd > lastDataDay ? forecastEnd : lastDataDay;
  const cleanings = useMemo(
    () =>
      health.events
        .filter((e) => e.kind === 'cleaning')
        .map((e) => ({ day: e.endDate ?? e.startDate, label: `Cleaning ${shortDay(e.endDate ?? e.startDate)}` })),
    [health.events],
  );
  const shades = health.airLeakPeriods;
  const p = units.pressureKpa;
  const ref = health.headline.referenceCleanliness;
  if (!from || !to) return null;

  const cleanlinessSeries: TimeSeriesSpec[] = [
    {
      id: 'measured',
      label: 'Measured (daily median)',
      colour: CHART_COLOURS.measured,
      style: 'points',
      values: health.series.map((d) => ({ day: d.day, y: pct(d.cleanliness) })),
    },
    {
      id: 'trend',
      label: 'Fitted trend',
      colour: CHART_COLOURS.fitted,
      style: 'line',
      width: 2.5,
      values: health.series.map((d) => ({ day: d.day, y: pct(d.trendCleanliness) })),
    },
    {
      id: 'forecast',
      label: 'Forecast',
      colour: CHART_COLOURS.forecast,
      style: 'dash',
      width: 1.25,
      values: health.forecast.map((f) => ({ day: f.day, y: f.cleanliness * 100 })),
    },
  ];
  const hasLeak = shades.length > 0;
  const hasCleaning = cleanings.some((c) => c.day >= from && c.day <= to);
  const common: LegendItem[] = [
    ...(hasCleaning ? [{ label: 'Cleaning', colour: CHART_COLOURS.cleaning, mark: 'marker' as const }] : []),
    ...(hasLeak ? [{ label: 'Suspected air in-leakage (left out of the trend)', colour: CHART_COLOURS.airLeakShade, mark: 'shade' as const }] : []),
  ];
  const trend = health.trend;
  const bandPercent = Math.round(((trend?.status === 'fitted' ? trend.bandProbability : undefined) ?? 0.9) * 100);
  // a narrow band (a tight fit) is hard to see under its line: its end is labelled with its width in words
  const bandEnd = health.forecast.at(-1);
  const bandLabel = bandEnd
    ? [
        {
          day: bandEnd.day,
          y: bandEnd.low * 100,
          below: true,
          label: `${bandPercent} % band ${formatNumber(bandEnd.low * 100, 1)}–${formatNumber(bandEnd.high * 100, 1)} %`,
        },
      ]
    : [];

  return (
    <div className="grid gap-3 xl:grid-cols-2">
      <ChartFrame
        testId="chart-cleanliness"
        points={health.series.length}
        table={{
          caption: 'Cleanliness factor by day: measured daily median and fitted trend, then the forecast with its band',
          columns: ['Day', 'Measured', 'Fitted trend', 'Forecast', 'Band'],
          rows: () => [
            ...health.series.map((d) => [
              formatDay(d.day),
              d.cleanliness === null ? '—' : `${formatNumber(d.cleanliness * 100, 1)} %`,
              d.trendCleanliness === null ? '—' : `${formatNumber(d.trendCleanliness * 100, 1)} %`,
              '',
              '',
            ]),
            ...health.forecast.map((f) => [
              formatDay(f.day),
              '',
              '',
              `${formatNumber(f.cleanliness * 100, 1)} %`,
              `${formatNumber(f.low * 100, 1)}–${formatNumber(f.high * 100, 1)} %`,
            ]),
          ],
        }}
        title="Cleanliness factor over time"
        subtitle="How clean the tubes are: 100 % is a new, clean condenser. The trend restarts at each cleaning."
        legend={[
          { label: 'Measured (daily median)', colour: CHART_COLOURS.measured, mark: 'points' },
          { label: 'Fitted trend', colour: CHART_COLOURS.fitted, mark: 'line' },
          ...(health.forecast.length ? [{ label: `Forecast with ${bandPercent} % band`, colour: CHART_COLOURS.forecastBand, mark: 'band' as const }] : []),
          { label: 'Reference cleanliness', colour: CHART_COLOURS.reference, mark: 'dash' },
          ...common,
        ]}
        noteTestId="trend-note"
        note={
          trend?.status === 'fitted' ? (
            <>
              Trend since {formatDay(trend.startDay)}: {trend.model.model} model, R² {formatNumber(trend.rSquared, 3)}, scatter ±
              {formatNumber(trend.residualStdCleanliness * 100, 1)} % CF over {formatNumber(trend.pointsUsed)} days.
            </>
          ) : trend ? (
            <>
              Trend since {formatDay(trend.startDay)}: {trend.reason}.
            </>
          ) : null
        }
      >
        <TimeChart
          series={cleanlinessSeries}
          band={health.forecast.map((f) => ({ day: f.day, low: f.low * 100, high: f.high * 100 }))}
          shades={shades}
          cleanings={cleanings}
          reference={ref === null ? undefined : { value: ref * 100, label: `Reference ${formatNumber(ref * 100, 0)} %` }}
          from={from}
          to={to}
          yLegend="Cleanliness factor (%)"
          yTick={(v) => formatNumber(v, 0)}
          yValue={(v) => `${formatNumber(v, 1)} %`}
          ariaLabel="Cleanliness factor by day: measured, fitted trend and forecast"
          annotations={bandLabel}
          narrow={narrow}
        />
      </ChartFrame>

      <ChartFrame
        drawLater
        testId="chart-backpressure"
        points={health.series.length}
        table={{
          caption: `Backpressure by day: the daily mean, what a condenser at the reference cleanliness would hold, and the difference (${p.label})`,
          columns: ['Day', 'Actual', 'Expected at reference', 'Actual above expected'],
          rows: () =>
            health.series.map((d) => [
              formatDay(d.day),
              d.backpressureKpa === null ? '—' : formatNumber(p.fromSi(d.backpressureKpa), p.decimals),
              d.expectedBackpressureKpa === null ? '—' : formatNumber(p.fromSi(d.expectedBackpressureKpa), p.decimals),
              d.backpressureKpa === null || d.expectedBackpressureKpa === null
                ? '—'
                : formatNumber(p.fromSi(d.backpressureKpa) - p.fromSi(d.expectedBackpressureKpa), p.decimals),
            ]),
        }}
        title="Backpressure above what a clean condenser would hold"
        subtitle={`Daily means. The line is what the condenser would hold at the reference cleanliness${ref === null ? '' : ` (${formatNumber(ref * 100, 0)} %)`} with the same CW and load; the shading is how far the actual backpressure sits above it (fouling and any unexplained part) or below it.`}
        legend={[
          { label: 'Expected at reference cleanliness', colour: CHART_COLOURS.expected, mark: 'line' },
          { label: 'Actual above expected (excess)', colour: CHART_COLOURS.excessFill, mark: 'shade' },
          { label: 'Actual below expected', colour: CHART_COLOURS.shortfallFill, mark: 'shade' },
          ...common,
        ]}
      >
        <TimeChart
          series={[
            {
              id: 'actual',
              label: 'Actual',
              colour: CHART_COLOURS.excessEdge,
              style: 'line',
              width: 0.75,
              values: health.series.map((d) => ({ day: d.day, y: d.backpressureKpa === null ? null : p.fromSi(d.backpressureKpa) })),
            },
            {
              id: 'expected',
              label: 'Expected',
              colour: CHART_COLOURS.expected,
              style: 'line',
              width: 1.75,
              values: health.series.map((d) => ({ day: d.day, y: d.expectedBackpressureKpa === null ? null : p.fromSi(d.expectedBackpressureKpa) })),
            },
          ]}
          shades={shades}
          cleanings={cleanings}
          from={from}
          to={lastDataDay}
          yLegend={`Backpressure (${p.label})`}
          yTick={(v) => formatNumber(v, p.decimals - 1)}
          yValue={(v) => `${formatNumber(v, p.decimals)} ${p.label}`}
          ariaLabel="Actual and expected backpressure by day"
          gap={{ upper: 'actual', lower: 'expected', aboveFill: CHART_COLOURS.excessFill, belowFill: CHART_COLOURS.shortfallFill }}
          narrow={narrow}
        />
      </ChartFrame>

      <DeviationChart health={health} units={units} narrow={narrow} />

      <CostChart health={health} currency={currency} cleanings={cleanings} common={common} shades={shades} from={from} to={lastDataDay} narrow={narrow} />
    </div>
  );
}

/** The fouling cost run up in each cleaning cycle: the running cost restarts at every cleaning, each cycle labelled with its total. */
function CostChart({
  health,
  currency,
  cleanings,
  common,
  shades,
  from,
  to,
  narrow,
}: {
  health: UnitHealth;
  currency: string;
  cleanings: { day: string; label: string }[];
  common: LegendItem[];
  shades: UnitHealth['airLeakPeriods'];
  from: string;
  to: string;
  narrow: boolean;
}) {
  const cycles = useMemo(
    () =>
      costCycles(
        health.series,
        cleanings.map((c) => c.day),
      ),
    [health.series, cleanings],
  );
  const total = cycles.reduce((a, c) => a + c.cost, 0);
  const money = (v: number) => formatCurrency(v, currency);
  // the MW and t CO2 behind each day's cost (sent with the series; null without economics)
  const byDay = useMemo(() => new Map(health.series.map((d) => [d.day, d])), [health.series]);
  const hasPhysical = health.headline.foulingPhysical !== null;
  const physicalOf = (from: string, to: string) =>
    health.series
      .filter((d) => d.day >= from && d.day <= to)
      .reduce((a, d) => ({ co2: a.co2 + (d.foulingCo2Tonnes ?? 0), mwh: a.mwh + (d.foulingLostMwh ?? 0) }), { co2: 0, mwh: 0 });
  const quantity = (v: number | null | undefined, unit: string) =>
    v === null || v === undefined ? '—' : v === 0 ? 'none' : `${v <= -0.05 ? '−' : ''}${formatQuantity(v)} ${unit}`;
  const series: TimeSeriesSpec[] = cycles.map((c, i) => ({
    id: `cycle-${i}`,
    label: c.startsAtCleaning ? `Since the cleaning on ${formatDay(c.from)}` : `Since ${formatDay(c.from)} (start of the period)`,
    colour: CHART_COLOURS.cost,
    style: 'line',
    width: 2.5,
    values: c.running,
  }));
  return (
    <ChartFrame
      drawLater
      testId="chart-cost"
      points={health.series.length}
      table={{
        caption: `Fouling cost by day and its running total since the cycle began (${currency})`,
        columns: [
          'Day',
          'Cycle from',
          'Fouling cost that day',
          'Running total in the cycle',
          ...(hasPhysical ? ['CO2 of the extra fuel that day', 'Output lost that day (capacity-limited hours)'] : []),
        ],
        rows: () =>
          cycles.flatMap((c) =>
            c.running.map((r, i) => [
              formatDay(r.day),
              formatDay(c.from),
              money(i === 0 ? r.y : r.y - (c.running[i - 1]?.y ?? 0)),
              money(r.y),
              ...(hasPhysical ? [quantity(byDay.get(r.day)?.foulingCo2Tonnes, 't'), quantity(byDay.get(r.day)?.foulingLostMwh, 'MWh')] : []),
            ]),
          ),
      }}
      title="Fouling cost, cleaning cycle by cycle"
      subtitle="Extra fuel and replacement power because the tubes are dirtier than the reference. The running cost starts again at each cleaning; each cycle is labelled with what it cost in this period."
      legend={[{ label: `Fouling cost since the last cleaning (${currency})`, colour: CHART_COLOURS.cost, mark: 'line' }, ...common]}
      note={
        <>
          <span data-testid="cost-cycles">
            {cycles.map((c, i) => (
              <span key={c.from} className="whitespace-nowrap">
                {i > 0 && ' · '}
                {formatDay(c.from)} – {formatDay(c.to)}: <span className="font-medium text-ledger-700">{money(c.cost)}</span>
                {hasPhysical && <span className="text-ink-soft"> ({quantity(physicalOf(c.from, c.to).co2, 't CO2')})</span>}
              </span>
            ))}
          </span>
          . Whole period: <span className="font-medium text-ledger-700">{money(total)}</span>
          {hasPhysical && (
            <span data-testid="cost-physical">
              {' '}
              ({quantity(physicalOf(from, to).co2, 't CO2')} from extra fuel, {quantity(physicalOf(from, to).mwh, 'MWh')} of output lost in capacity-limited
              hours)
            </span>
          )}
          ; the unexplained part ({money(health.series.reduce((a, d) => a + (d.unexplainedCost ?? 0), 0))}) is not included.
        </>
      }
    >
      <TimeChart
        series={series}
        shades={shades}
        cleanings={cleanings}
        from={from}
        to={to}
        yFromZero
        yLegend={`Cost (${currency})`}
        yTick={(v) => compactMoney(v, currency)}
        yValue={(v) => money(v)}
        ariaLabel="Fouling cost since the last cleaning, by day, restarting at each cleaning"
        narrow={narrow}
        annotations={cycles.filter((c) => c.running.length > 0).map((c) => ({ day: c.to, y: c.cost, label: compactMoney(c.cost, currency) }))}
      />
    </ChartFrame>
  );
}

function compactMoney(v: number, currency: string): string {
  try {
    return new Intl.NumberFormat('en-US', { style: 'currency', currency, notation: 'compact', maximumFractionDigits: 1 }).format(v);
  } catch {
    return formatNumber(v, 0);
  }
}

type BarRow = { period: string } & Record<(typeof BREAKDOWN_CAUSES)[number], number>;

function DeviationChart({ health, units, narrow }: { health: UnitHealth; units: FieldUnits; narrow: boolean }) {
  const dp = units.pressureDifferenceKpa;
  const byWeek = health.period.breakdownBy === 'week';
  const rows: BarRow[] = useMemo(
    () =>
      health.breakdown.map(
        (b) => ({ period: b.period, ...Object.fromEntries(BREAKDOWN_CAUSES.map((c) => [c, b[c] === null ? 0 : dp.fromSi(b[c]!)])) }) as BarRow,
      ),
    [health.breakdown, dp],
  );
  const label = (period: string) => (byWeek ? shortDay(period) : formatMonth(period));
  const every = Math.max(1, Math.ceil(rows.length / (narrow ? 5 : 10)));
  const offset = health.design?.modelOffsetKpa ?? null;
  const Tip = ({ indexValue, data }: BarTooltipProps<BarRow>) => {
    const source = health.breakdown.find((b) => b.period === indexValue);
    const total = BREAKDOWN_CAUSES.reduce((a, c) => a + (data[c] ?? 0), 0);
    return (
      <TooltipBox
        title={byWeek ? `Week of ${formatDay(String(indexValue))}` : label(String(indexValue))}
        rows={[
          ...BREAKDOWN_CAUSES.map((c) => ({ label: CAUSE_STYLES[c].label, value: signed(data[c], dp.decimals, dp.label), colour: CAUSE_STYLES[c].colour })),
          { label: 'Sum of the parts', value: signed(total, dp.decimals, dp.label) },
          {
            label: 'Excess over expected',
            value: source?.meanExcessBackpressureKpa === null || !source ? '—' : signed(dp.fromSi(source.meanExcessBackpressureKpa), dp.decimals, dp.label),
          },
        ]}
      />
    );
  };
  return (
    <ChartFrame
      drawLater
      testId="chart-breakdown"
      points={rows.length}
      table={{
        caption: `Why backpressure differs from design, each cause's mean by ${byWeek ? 'week' : 'month'} (${dp.label})`,
        columns: [byWeek ? 'Week of' : 'Month', ...BREAKDOWN_CAUSES.map((c) => CAUSE_STYLES[c].label)],
        rows: () =>
          rows.map((r) => [byWeek ? formatDay(r.period) : formatMonth(r.period), ...BREAKDOWN_CAUSES.map((c) => signed(r[c], dp.decimals, dp.label))]),
      }}
      title={`Why backpressure differs from design, by ${byWeek ? 'week' : 'month'}`}
      subtitle={
        health.design
          ? `Mean of each cause against the design backpressure (${formatStored(health.design.datasheetBackpressureKpa, units.pressureKpa)}); above zero raises backpressure, below zero lowers it. Only fouling is recovered by cleaning.`
          : 'Mean of each cause against the design backpressure; only fouling is recovered by cleaning.'
      }
      legend={BREAKDOWN_CAUSES.map((c) => ({ label: CAUSE_STYLES[c].label, colour: CAUSE_STYLES[c].colour, mark: 'bar' as const }))}
      note={
        offset !== null ? (
          <>
            Model offset (not in the bars):{' '}
            {Math.abs(dp.fromSi(offset)) < 0.5 * 10 ** -dp.decimals ? (
              <>
                the model at the design point matches the datasheet design backpressure to within {formatNumber(10 ** -dp.decimals, dp.decimals)} {dp.label}.
              </>
            ) : (
              <>the model at the design point reads {signed(dp.fromSi(offset), dp.decimals, dp.label)} against the datasheet design backpressure.</>
            )}
          </>
        ) : undefined
      }
    >
      <div className="h-64 w-full print:h-56" role="img" aria-label={`Backpressure deviation by cause, one bar per ${byWeek ? 'week' : 'month'}`}>
        <ResponsiveBar<BarRow>
          data={rows}
          keys={[...BREAKDOWN_CAUSES]}
          indexBy="period"
          groupMode="stacked"
          margin={{ top: 12, right: 16, bottom: 40, left: 60 }}
          padding={rows.length > 40 ? 0.1 : 0.25}
          colors={({ id }) => CAUSE_STYLES[id as (typeof BREAKDOWN_CAUSES)[number]].colour}
          borderWidth={rows.length > 60 ? 0 : 0.75}
          borderColor="#ffffff"
          enableLabel={false}
          valueScale={{ type: 'linear', min: 'auto', max: 'auto', nice: true }}
          axisBottom={{ tickSize: 4, tickValues: rows.filter((_, i) => i % every === 0).map((r) => r.period), format: (v: string) => label(v) }}
          axisLeft={{
            legend: `Deviation (${dp.label})`,
            legendOffset: -50,
            legendPosition: 'middle',
            tickSize: 4,
            tickValues: 6,
            format: (v: number) => formatNumber(v, dp.decimals),
          }}
          markers={[{ axis: 'y', value: 0, lineStyle: { stroke: '#1d1f23', strokeWidth: 1 } }]}
          tooltip={Tip}
          animate={false}
          theme={CHART_THEME}
          role="presentation"
        />
      </div>
    </ChartFrame>
  );
}

const signed = (v: number | null | undefined, decimals: number, unit: string) =>
  v === null || v === undefined || !Number.isFinite(v) ? '—' : `${v > 0 ? '+' : v < 0 ? '−' : ''}${formatNumber(Math.abs(v), decimals)} ${unit}`;
