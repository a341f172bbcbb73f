import { ResponsiveBar, type BarCustomLayerProps } from '@nivo/bar';
import type { CalcScheduleOutput } from '@shared/schemas/calc-schedule';
import { CHART_COLOURS, CHART_THEME } from '@frontend/lib/chart-palette';
import { compactMoney } from './compact-money';

type MonteCarlo = NonNullable<CalcScheduleOutput['monteCarlo']>;
type Row = { bin: string; trials: number };

/** The Monte Carlo NPVs as a histogram, with P10, P50 and P90 marked where they fall. */
export default function MonteCarloChart({ monteCarlo, currency }: { monteCarlo: MonteCarlo; currency: string }) {
  const bins = monteCarlo.histogram;
  const rows: Row[] = bins.map((b, i) => ({ bin: String(i), trials: b.count }));
  const every = Math.max(1, Math.ceil(bins.length / 4));
  const Markers = ({ xScale, innerHeight }: BarCustomLayerProps<Row>) => {
    const band = (xScale as unknown as { bandwidth: () => number; step: () => number }).step?.() ?? 0;
    const x0 = xScale('0' as never) as number;
    const lo = bins[0]?.from ?? 0;
    const hi = bins.at(-1)?.to ?? 1;
    const at = (v: number) => x0 + ((v - lo) / (hi - lo || 1)) * band * bins.length;
    return (
      <g aria-hidden>
        {(
          [
            ['P10', monteCarlo.p10Npv],
            ['P50', monteCarlo.p50Npv],
            ['P90', monteCarlo.p90Npv],
          ] as const
        ).map(([label, v], i) => (
          <g key={label}>
            <line x1={at(v)} x2={at(v)} y1={0} y2={innerHeight} stroke={CHART_COLOURS.cleaning} strokeDasharray={label === 'P50' ? undefined : '4 3'} />
            <text x={at(v) + 3} y={10 + i * 11} fontSize={10} fill={CHART_COLOURS.cleaning}>
              {label}
            </text>
          </g>
        ))}
      </g>
    );
  };
  return (
    <div className="h-52 w-full print:h-44" role="img" aria-label={`Monte Carlo NPVs of ${monteCarlo.trials} trials with P10, P50 and P90`}>
      <ResponsiveBar<Row>
        data={rows}
        keys={['trials']}
        indexBy="bin"
        margin={{ top: 8, right: 16, bottom: 40, left: 48 }}
        padding={0.05}
        colors={[CHART_COLOURS.measured]}
        enableLabel={false}
        axisBottom={{
          tickSize: 4,
          tickValues: rows.filter((_, i) => i % every === 0).map((r) => r.bin),
          format: (v: string) => compactMoney(bins[Number(v)]?.from ?? 0, currency),
          legend: 'NPV',
          legendOffset: 32,
          legendPosition: 'middle',
        }}
        axisLeft={{ tickSize: 4, tickValues: 4, legend: 'Trials', legendOffset: -40, legendPosition: 'middle' }}
        layers={['grid', 'axes', 'bars', Markers]}
        isInteractive={false}
        animate={false}
        theme={CHART_THEME}
        role="presentation"
      />
    </div>
  );
}
