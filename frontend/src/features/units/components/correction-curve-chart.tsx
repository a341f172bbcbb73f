import { useMemo } from 'react';
import { ResponsiveLine, type Point } from '@nivo/line';
import { engineCurveLine, type CurveLinePoint } from './correction-curve-line';

export interface CurveChartProps {
  series: { id: string; data: { x: number; y: number }[] }[];
  pressureLabel: string;
  basisLabel: string;
}

// One cool hue, darker for higher load, so the lines read as "the measured condenser's" family.
const LOAD_COLOURS = ['#1a4f66', '#2f7a99', '#5b9bb5', '#8fbccd', '#b9d6e1'];

type CurveLine = { id: string; data: CurveLinePoint[] };

/**
 * Only the entered points get a dot; the samples between them just carry the line. nivo's types call `datum` a
 * point, but it passes the point's data item (x, y and our own fields).
 */
function EnteredDot({ datum, size, color }: { datum: Point<CurveLine>; size: number; color: string }) {
  const item = datum as unknown as Partial<CurveLinePoint> & { data?: Partial<CurveLinePoint> };
  return (item.entered ?? item.data?.entered) ? <circle r={size / 2} fill={color} /> : null;
}

/**
 * % change of heat rate (or output) against backpressure, one line per load: the monotone cubic the costs evaluate,
 * drawn through dense samples with straight segments (no smoothing of the chart's own). Loaded lazily: nivo is large.
 */
export default function CorrectionCurveChart({ series, pressureLabel, basisLabel }: CurveChartProps) {
  const lines = useMemo<CurveLine[]>(() => series.map((s) => ({ id: s.id, data: engineCurveLine(s.data) })), [series]);
  return (
    <div className="h-72 w-full" role="img" aria-label={`${basisLabel} against backpressure, one line per load`}>
      <ResponsiveLine
        data={lines}
        margin={{ top: 12, right: 110, bottom: 46, left: 56 }}
        xScale={{ type: 'linear', min: 'auto', max: 'auto' }}
        yScale={{ type: 'linear', min: 'auto', max: 'auto' }}
        curve="linear"
        colors={LOAD_COLOURS}
        lineWidth={2}
        pointSize={5}
        pointSymbol={EnteredDot}
        enableGridX={false}
        axisBottom={{ legend: `Backpressure (${pressureLabel})`, legendOffset: 36, legendPosition: 'middle', tickSize: 4 }}
        axisLeft={{ legend: `${basisLabel} (%)`, legendOffset: -44, legendPosition: 'middle', tickSize: 4 }}
        markers={[{ axis: 'y', value: 0, lineStyle: { stroke: '#6b6f78', strokeWidth: 1, strokeDasharray: '3 3' } }]}
        useMesh
        animate={false}
        theme={{
          text: { fontSize: 11, fill: '#4a4e57' },
          axis: { legend: { text: { fontSize: 12, fill: '#1d1f23' } } },
          grid: { line: { stroke: '#e6e2da' } },
        }}
        legends={[{ anchor: 'right', direction: 'column', translateX: 104, itemWidth: 96, itemHeight: 18, symbolSize: 10, symbolShape: 'circle' }]}
      />
    </div>
  );
}
