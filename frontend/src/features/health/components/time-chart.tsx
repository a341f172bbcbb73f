import { ResponsiveLine, type LineCustomSvgLayerProps, type LineSvgLayer, type SliceTooltipProps } from '@nivo/line';
import { useMemo } from 'react';
import { addDays, daysBetween } from '@shared/domain/calendar/plant-date';
import { gapShapes } from '@frontend/lib/chart-cycles';
import { CHART_COLOURS, CHART_THEME, dayToDate, timeTicks } from '@frontend/lib/chart-palette';
import { formatDay } from '@frontend/lib/format';
import { useAfterFirstPaint } from './after-first-paint';
import { TooltipBox } from './chart-frame';
import { thinDots, thinLine } from './thin-for-drawing';

export interface TimeSeriesSpec {
  id: string;
  label: string;
  colour: string;
  style: 'line' | 'dash' | 'points';
  width?: number;
  values: { day: string; y: number | null }[];
}

export interface TimeChartProps {
  series: TimeSeriesSpec[];
  /** a shaded band between two values per day (the forecast band) */
  band?: { day: string; low: number; high: number }[];
  /** shaded day ranges (suspected air in-leakage), `to` inclusive */
  shades?: { from: string; to: string }[];
  /** cleanings as labelled vertical markers */
  cleanings?: { day: string; label: string }[];
  /** a dashed horizontal reference line with its label */
  reference?: { value: number; label: string };
  from: string;
  to: string;
  yLegend: string;
  /** a value on the y axis, for ticks */
  yTick: (v: number) => string;
  /** a value with its unit, for the tooltip */
  yValue: (v: number) => string;
  /** y axis starts at zero (costs) instead of fitting the data */
  yFromZero?: boolean;
  ariaLabel: string;
  narrow?: boolean;
  /** shade the area between two series (by id): where `upper` is above `lower`, and where below */
  gap?: { upper: string; lower: string; aboveFill: string; belowFill: string };
  /** short labels at points (each cleaning cycle's cost at its end) */
  annotations?: { day: string; y: number; label: string; below?: boolean }[];
}

type Datum = { x: Date; y: number | null };
type Series = { id: string; data: Datum[] };
type LayerProps = LineCustomSvgLayerProps<Series>;

const nextDay = (day: string) => dayToDate(addDays(day, 1));

/** A daily time chart in the view's shared language: styled lines, band, shaded periods, cleaning markers. */
export default function TimeChart(props: TimeChartProps) {
  const {
    series,
    band = [],
    shades = [],
    cleanings = [],
    reference,
    from,
    to,
    yLegend,
    yTick,
    yValue,
    yFromZero,
    ariaLabel,
    narrow,
    gap,
    annotations = [],
  } = props;
  const interactive = useAfterFirstPaint();
  const spanDays = Math.max(1, daysBetween(from, to));
  const ticks = timeTicks(spanDays, narrow ? 4 : 8);

  const data: Series[] = useMemo(() => series.map((s) => ({ id: s.id, data: s.values.map((v) => ({ x: dayToDate(v.day), y: v.y })) })), [series]);
  const [yMin, yMax] = useMemo(() => {
    const all = [...series.flatMap((s) => s.values.map((v) => v.y)), ...band.flatMap((b) => [b.low, b.high]), reference?.value ?? null].filter(
      (v): v is number => v !== null && Number.isFinite(v),
    );
    if (all.length === 0) return [0, 1];
    let lo = Math.min(...all);
    let hi = Math.max(...all);
    const pad = (hi - lo || Math.abs(hi) || 1) * 0.06;
    lo = yFromZero ? Math.min(0, lo) : lo - pad;
    hi += pad;
    return [lo, hi];
  }, [series, band, reference, yFromZero]);

  const layers = useMemo(() => {
    const styleOf = new Map(series.map((s) => [s.id, s]));
    const Shades = ({ xScale, innerHeight }: LayerProps) => (
      <g aria-hidden>
        {shades.map((s) => {
          const x0 = xScale(dayToDate(s.from < from ? from : s.from));
          const x1 = xScale(s.to >= to ? dayToDate(to) : nextDay(s.to));
          return x1 > x0 ? <rect key={s.from} x={x0} y={0} width={x1 - x0} height={innerHeight} fill={CHART_COLOURS.airLeakShade} /> : null;
        })}
      </g>
    );
    const Band = ({ xScale, yScale }: LayerProps) => {
      if (band.length < 2) return null;
      const top = band.map((b) => `${xScale(dayToDate(b.day))},${yScale(b.high)}`);
      const bottom = [...band].reverse().map((b) => `${xScale(dayToDate(b.day))},${yScale(b.low)}`);
      return (
        <polygon
          aria-hidden
          points={[...top, ...bottom].join(' ')}
          fill={CHART_COLOURS.forecastBand}
          stroke={CHART_COLOURS.forecast}
          strokeWidth={1}
          strokeDasharray="3 3"
        />
      );
    };
    const Gap = ({ xScale, yScale }: LayerProps) => {
      if (!gap) return null;
      const upper = styleOf.get(gap.upper)?.values ?? [];
      const lower = new Map((styleOf.get(gap.lower)?.values ?? []).map((v) => [v.day, v.y]));
      const shapes = gapShapes(
        upper.map((v) => ({
          x: xScale(dayToDate(v.day)),
          actual: v.y === null ? null : yScale(v.y),
          expected: lower.get(v.day) == null ? null : yScale(lower.get(v.day)!),
        })),
      );
      // in screen coordinates a higher value is a smaller y: "above" on screen is where actual is below expected
      return (
        <g aria-hidden>
          {shapes.map((sh, i) => (
            <polygon
              key={i}
              points={sh.points.map((p) => `${p[0].toFixed(1)},${p[1].toFixed(1)}`).join(' ')}
              fill={sh.side === 'below' ? gap.aboveFill : gap.belowFill}
              stroke="none"
            />
          ))}
        </g>
      );
    };
    const Annotations = ({ xScale, yScale }: LayerProps) => (
      <g aria-hidden>
        {annotations.map((a) => (
          <text
            key={a.day}
            x={xScale(dayToDate(a.day)) - 3}
            y={yScale(a.y) + (a.below ? 14 : -6)}
            textAnchor="end"
            fontSize={10.5}
            fontWeight={600}
            fill="#1d1f23"
            paintOrder="stroke"
            stroke="#fbfaf7"
            strokeWidth={3}
          >
            {a.label}
          </text>
        ))}
      </g>
    );
    const Lines = ({ series: computed, xScale, yScale }: LayerProps) => (
      <g aria-hidden>
        {/* lines first, measured points on top, so the measurement is never hidden under its own trend */}
        {[...computed]
          .sort((a, b) => Number(styleOf.get(String(a.id))?.style === 'points') - Number(styleOf.get(String(b.id))?.style === 'points'))
          .map((s) => {
            const style = styleOf.get(String(s.id));
            if (!style) return null;
            const pts = s.data.map((d) => (d.data.y === null ? null : ([xScale(d.data.x), yScale(d.data.y)] as const)));
            if (style.style === 'points') {
              // one dot per pixel, all in one path (a zero-length stroke with round ends is a dot): one shape to draw, not hundreds
              const r = pts.length > 500 ? 1.5 : 2.2;
              return (
                <path
                  key={s.id}
                  d={thinDots(pts)
                    .map((p) => `M${p[0].toFixed(1)} ${p[1].toFixed(1)}h0`)
                    .join('')}
                  stroke={style.colour}
                  strokeWidth={2 * r}
                  strokeLinecap="round"
                  fill="none"
                />
              );
            }
            const segments: string[] = [];
            let current = '';
            for (const p of thinLine(pts)) {
              if (!p) {
                if (current) segments.push(current);
                current = '';
                continue;
              }
              current += `${current ? 'L' : 'M'}${p[0].toFixed(1)},${p[1].toFixed(1)}`;
            }
            if (current) segments.push(current);
            return (
              <path
                key={s.id}
                d={segments.join(' ')}
                fill="none"
                stroke={style.colour}
                strokeWidth={style.width ?? 2}
                strokeDasharray={style.style === 'dash' ? '5 4' : undefined}
                strokeLinejoin="round"
              />
            );
          })}
      </g>
    );
    const Reference = ({ yScale, innerWidth }: LayerProps) => {
      if (!reference) return null;
      const y = yScale(reference.value);
      return (
        <g aria-hidden>
          <line x1={0} x2={innerWidth} y1={y} y2={y} stroke={CHART_COLOURS.reference} strokeWidth={1.5} strokeDasharray="6 4" />
          <text x={innerWidth - 4} y={y - 5} textAnchor="end" fontSize={10} fill="#4a4e57">
            {reference.label}
          </text>
        </g>
      );
    };
    const Cleanings = ({ xScale, innerHeight }: LayerProps) => (
      <g aria-hidden>
        {cleanings
          .filter((c) => c.day >= from && c.day <= to)
          .map((c) => {
            const x = xScale(dayToDate(c.day));
            return (
              <g key={c.day}>
                <line x1={x} x2={x} y1={0} y2={innerHeight} stroke={CHART_COLOURS.cleaning} strokeWidth={1.5} />
                <text x={x + 3} y={10} fontSize={10} fill={CHART_COLOURS.cleaning}>
                  {c.label}
                </text>
              </g>
            );
          })}
      </g>
    );
    const drawn = ['grid', Shades, Band, Gap, 'axes', Reference, Cleanings, Lines, Annotations] as LineSvgLayer<Series>[];
    // the hover layers (a target per day) come once the figure is on screen
    return interactive ? ([...drawn, 'crosshair', 'slices'] as LineSvgLayer<Series>[]) : drawn;
  }, [series, band, shades, cleanings, reference, from, to, gap, annotations, interactive]);

  const SliceTip = ({ slice }: SliceTooltipProps<Series>) => {
    const day = (slice.points[0]?.data.x as Date | undefined)?.toISOString().slice(0, 10);
    const rows = slice.points
      .filter((p) => p.data.y !== null)
      .map((p) => {
        const s = series.find((x) => x.id === String(p.seriesId));
        return { label: s?.label ?? String(p.seriesId), value: yValue(p.data.y as number), colour: s?.colour };
      });
    const b = band.find((x) => x.day === day);
    if (b) rows.push({ label: 'Forecast band', value: `${yValue(b.low)} – ${yValue(b.high)}`, colour: CHART_COLOURS.forecastBand });
    const leak = day && shades.some((s) => day >= s.from && day <= s.to);
    if (leak) rows.push({ label: 'Suspected air in-leakage', value: 'yes', colour: CHART_COLOURS.airLeak });
    return <TooltipBox title={formatDay(day)} rows={rows} />;
  };

  return (
    <div className="h-64 w-full print:h-56" role="img" aria-label={ariaLabel}>
      <ResponsiveLine
        data={data}
        margin={{ top: 16, right: 16, bottom: 40, left: 60 }}
        xScale={{ type: 'time', useUTC: true, precision: 'day', min: dayToDate(from), max: dayToDate(to) }}
        yScale={{ type: 'linear', min: yMin, max: yMax }}
        axisBottom={{ tickValues: ticks.tickValues, format: ticks.format, tickSize: 4, tickPadding: 4 }}
        axisLeft={{ legend: yLegend, legendOffset: -50, legendPosition: 'middle', tickSize: 4, tickValues: 5, format: (v: number) => yTick(v) }}
        enableGridX={false}
        gridYValues={5}
        layers={layers}
        enableSlices={interactive ? 'x' : false}
        sliceTooltip={SliceTip}
        enablePoints={false}
        animate={false}
        theme={CHART_THEME}
        role="presentation"
      />
    </div>
  );
}
