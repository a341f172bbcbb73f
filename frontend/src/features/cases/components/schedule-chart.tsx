import { ResponsiveLine, type LineCustomSvgLayerProps, type LineSvgLayer } from '@nivo/line';
import { useMemo } from 'react';
import type { CalcScheduleOutput } from '@shared/schemas/calc-schedule';
import { addDays, daysBetween } from '@shared/domain/calendar/plant-date';
import { CHART_COLOURS, CHART_THEME, dayToDate, timeTicks } from '@frontend/lib/chart-palette';
import { formatPercent } from '@frontend/lib/format';

type Series = { id: string; data: { x: Date; y: number }[] };
type LayerProps = LineCustomSvgLayerProps<Series>;

const OUTAGE_SHADE = 'rgba(107, 111, 120, 0.16)';
const CLEANING_SHADE = 'rgba(184, 102, 28, 0.35)';

/**
 * The recommended schedule on the horizon's timeline: cleanliness day by day along the schedule, planned
 * outages shaded grey, each cleaning a warm block from its first to its last day, numbered as in the table.
 */
export default function ScheduleChart({
  results,
  startDate,
  horizonDays,
  outages,
  narrow,
}: {
  results: CalcScheduleOutput;
  startDate: string;
  horizonDays: number;
  outages: { from: string; to: string }[];
  narrow?: boolean;
}) {
  const end = addDays(startDate, horizonDays - 1);
  const daily = useMemo(() => results.daily ?? [], [results.daily]);
  const data: Series[] = useMemo(() => [{ id: 'cleanliness', data: daily.map((d) => ({ x: dayToDate(d.date), y: d.cleanliness })) }], [daily]);
  const ticks = timeTicks(Math.max(1, daysBetween(startDate, end)), narrow ? 4 : 8);
  const layers = useMemo(() => {
    const block = (xScale: LayerProps['xScale'], from: string, to: string) => {
      const x0 = xScale(dayToDate(from < startDate ? startDate : from));
      const x1 = xScale(dayToDate(to >= end ? end : addDays(to, 1)));
      return { x: x0, width: Math.max(2, x1 - x0) };
    };
    const Shades = ({ xScale, innerHeight }: LayerProps) => (
      <g aria-hidden>
        {outages
          .filter((o) => o.to >= startDate && o.from <= end)
          .map((o) => (
            <rect key={`o-${o.from}`} {...block(xScale, o.from, o.to)} y={0} height={innerHeight} fill={OUTAGE_SHADE} />
          ))}
        {results.cleanings.map((c, i) => {
          const b = block(xScale, c.date, c.endDate);
          return (
            <g key={`c-${c.date}`}>
              <rect {...b} y={0} height={innerHeight} fill={CLEANING_SHADE} />
              <text x={b.x + b.width / 2} y={-6} textAnchor="middle" fontSize={10} fontWeight={600} fill={CHART_COLOURS.cleaning}>
                {i + 1}
              </text>
            </g>
          );
        })}
      </g>
    );
    return ['grid', Shades, 'axes', 'lines'] as LineSvgLayer<Series>[];
  }, [outages, results.cleanings, startDate, end]);
  const ys = daily.map((d) => d.cleanliness);
  const yMin = ys.length ? Math.max(0, Math.min(...ys) - 0.05) : 0;
  const yMax = ys.length ? Math.max(...ys) + 0.05 : 1;
  return (
    <div
      className="h-56 w-full print:h-48"
      role="img"
      aria-label={`Recommended schedule: ${results.cleanings.length} cleanings over the horizon, planned outages shaded`}
    >
      <ResponsiveLine
        data={data}
        margin={{ top: 30, right: 12, bottom: 36, left: 52 }}
        xScale={{ type: 'time', useUTC: true, precision: 'day', min: dayToDate(startDate), max: dayToDate(end) }}
        yScale={{ type: 'linear', min: yMin, max: yMax }}
        axisBottom={{ tickValues: ticks.tickValues, format: ticks.format, tickSize: 4 }}
        axisLeft={{
          tickValues: 5,
          tickSize: 4,
          format: (v: number) => formatPercent(v, 0),
          legend: 'Cleanliness',
          legendOffset: -44,
          legendPosition: 'middle',
        }}
        colors={[CHART_COLOURS.fitted]}
        lineWidth={2}
        enablePoints={false}
        enableGridX={false}
        gridYValues={5}
        isInteractive={false}
        layers={layers}
        animate={false}
        theme={CHART_THEME}
        role="presentation"
      />
    </div>
  );
}
