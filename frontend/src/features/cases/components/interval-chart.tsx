import { ResponsiveLine, type LineCustomSvgLayerProps, type LineSvgLayer } from '@nivo/line';
import { CHART_COLOURS, CHART_THEME } from '@frontend/lib/chart-palette';
import { compactMoney } from './compact-money';
import type { IntervalCurve } from './interval-curve';

type Series = { id: string; data: { x: number; y: number }[] };

/** The average cost per day of a repeating cycle against its length, the least-cost interval marked. */
export default function IntervalChart({ curve, currency }: { curve: Extract<IntervalCurve, { ok: true }>; currency: string }) {
  const data: Series[] = [{ id: 'cost', data: curve.points.map((p) => ({ x: p.intervalDays, y: p.averageCostPerDay })) }];
  const best = curve.optimum.optimalIntervalDays;
  const Optimum = ({ xScale, innerHeight }: LineCustomSvgLayerProps<Series>) => {
    if (best === null || best > curve.cycleDays) return null;
    const x = xScale(best);
    return (
      <g aria-hidden>
        <line x1={x} x2={x} y1={0} y2={innerHeight} stroke={CHART_COLOURS.cleaning} strokeDasharray="4 3" />
        <text x={x + 4} y={12} fontSize={10} fill={CHART_COLOURS.cleaning}>
          least cost: {Math.round(best)} days
        </text>
      </g>
    );
  };
  return (
    <div className="h-52 w-full print:h-44" role="img" aria-label="Average cost per day against the cleaning interval">
      <ResponsiveLine
        data={data}
        margin={{ top: 16, right: 16, bottom: 40, left: 70 }}
        xScale={{ type: 'linear', min: 0, max: 'auto' }}
        yScale={{ type: 'linear', min: 0, max: 'auto' }}
        axisBottom={{ tickValues: 6, tickSize: 4, legend: 'Days between cleanings', legendOffset: 32, legendPosition: 'middle' }}
        axisLeft={{
          tickValues: 5,
          tickSize: 4,
          format: (v: number) => compactMoney(v, currency),
          legend: 'Cost per day',
          legendOffset: -62,
          legendPosition: 'middle',
        }}
        colors={[CHART_COLOURS.cost]}
        lineWidth={2}
        enablePoints={false}
        enableGridX={false}
        isInteractive={false}
        layers={['grid', 'axes', Optimum, 'lines'] as LineSvgLayer<Series>[]}
        animate={false}
        theme={CHART_THEME}
        role="presentation"
      />
    </div>
  );
}
