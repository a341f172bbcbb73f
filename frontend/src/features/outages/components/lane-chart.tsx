import { useEffect, useRef, useState } from 'react';
import type { OutageItemView } from '@shared/schemas/outages';
import { addDays } from '@shared/domain/calendar/plant-date';
import { ChartTable } from '@frontend/components/ui/chart-table';
import { formatDay } from '@frontend/lib/format';
import { daysText } from './outage-words';

/** One chosen item placed in its lane: days from the window's first day, counted from 0. */
export interface PlacedWork {
  item: Pick<OutageItemView, 'id' | 'title' | 'lane' | 'durationDays'>;
  fromDay: number;
  toDay: number;
}

/** The chosen items lane by lane, one after another in the order listed (lanes side by side, each from day 0). */
export function placeWork(
  items: readonly Pick<OutageItemView, 'id' | 'title' | 'lane' | 'durationDays'>[],
): { lane: string; work: PlacedWork[]; days: number }[] {
  const lanes = new Map<string, PlacedWork[]>();
  for (const item of items) {
    const work = lanes.get(item.lane) ?? [];
    const fromDay = work.at(-1)?.toDay ?? 0;
    work.push({ item, fromDay, toDay: fromDay + item.durationDays });
    lanes.set(item.lane, work);
  }
  return [...lanes].map(([lane, work]) => ({ lane, work, days: work.at(-1)?.toDay ?? 0 }));
}

const ROW = 34;
const LABEL = 150;
/** The drawing's width follows its box, so its text stays the size of the page's (a scaled drawing would grow it). */
function useBoxWidth(fallback: number) {
  const ref = useRef<HTMLDivElement>(null);
  const [width, setWidth] = useState(fallback);
  useEffect(() => {
    const box = ref.current;
    if (!box) return;
    const measure = () => box.clientWidth > 0 && setWidth(Math.max(320, Math.floor(box.clientWidth)));
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(box);
    return () => observer.disconnect();
  }, []);
  return { ref, width };
}

const TOP = 22;
const WORK = '#2f7a99';
const WORK_EDGE = '#1a4f66';
const OVERRUN = '#a3262a';

/**
 * The chosen work across the outage window: a row per crew lane, its jobs end to end from the first day; the
 * window's last day is the dark line, and work past it is drawn in red. A table of the same placing opens below.
 */
export function LaneChart({ items, startDate, windowDays }: { items: readonly OutageItemView[]; startDate: string; windowDays: number }) {
  const { ref, width: WIDTH } = useBoxWidth(720);
  const lanes = placeWork(items);
  const span = Math.max(windowDays, ...lanes.map((l) => l.days), 1);
  const plot = WIDTH - LABEL - 12;
  const x = (day: number) => LABEL + (day / span) * plot;
  const height = TOP + lanes.length * ROW + 24;
  const ticks = [0, Math.round(windowDays / 2), windowDays].filter((d, i, all) => all.indexOf(d) === i);
  const rows = lanes.flatMap((l) =>
    l.work.map((w, i) => [
      `${l.lane} ${i + 1}: ${w.item.title}`,
      formatDay(addDays(startDate, w.fromDay)),
      formatDay(addDays(startDate, w.toDay - 1)),
      daysText(w.item.durationDays),
      w.toDay > windowDays ? 'past the window' : 'inside',
    ]),
  );
  if (lanes.length === 0) return <p className="text-sm text-ink-soft">No work chosen, so no lanes to draw.</p>;
  return (
    <div ref={ref} className="flex min-w-0 flex-col gap-2" data-testid="outage-lane-chart">
      <svg
        viewBox={`0 0 ${WIDTH} ${height}`}
        width={WIDTH}
        height={height}
        className="max-w-full"
        role="img"
        aria-label={`Chosen work in ${lanes.length} ${lanes.length === 1 ? 'lane' : 'lanes'} across a window of ${daysText(windowDays)}; longest lane ${daysText(Math.max(...lanes.map((l) => l.days)))}`}
      >
        {ticks.map((d) => (
          <g key={d}>
            <line
              x1={x(d)}
              x2={x(d)}
              y1={TOP - 4}
              y2={height - 22}
              stroke={d === windowDays ? '#1d1f23' : '#d9d5cc'}
              strokeWidth={d === windowDays ? 1.5 : 1}
            />
            <text x={x(d)} y={height - 8} fontSize={11} fill="#4a4e57" textAnchor={d === 0 ? 'start' : d === windowDays ? 'end' : 'middle'}>
              {d === windowDays ? `${formatDay(addDays(startDate, windowDays - 1))} (end)` : formatDay(addDays(startDate, d))}
            </text>
          </g>
        ))}
        <text x={x(windowDays)} y={TOP - 8} fontSize={10} fill="#4a4e57" textAnchor="end">
          window: {daysText(windowDays)}
        </text>
        {lanes.map((l, row) => {
          const y = TOP + row * ROW;
          return (
            <g key={l.lane}>
              <text x={0} y={y + ROW / 2 + 4} fontSize={12} fill="#1d1f23">
                {l.lane.length > 20 ? `${l.lane.slice(0, 19)}…` : l.lane}
              </text>
              <text x={LABEL - 8} y={y + ROW / 2 + 4} fontSize={10} fill="#6b6f78" textAnchor="end">
                {l.days} d
              </text>
              {l.work.map((w) => {
                const x0 = x(w.fromDay);
                const inside = Math.min(w.toDay, windowDays);
                const w0 = Math.max(0, x(inside) - x0);
                const over = w.toDay > windowDays ? x(w.toDay) - x(Math.max(w.fromDay, windowDays)) : 0;
                const width = x(w.toDay) - x0;
                return (
                  <g key={w.item.id}>
                    <title>{`${w.item.title}: ${daysText(w.item.durationDays)}, ${formatDay(addDays(startDate, w.fromDay))} to ${formatDay(addDays(startDate, w.toDay - 1))}`}</title>
                    {w0 > 0 && <rect x={x0} y={y + 5} width={w0} height={ROW - 10} fill={WORK} stroke={WORK_EDGE} strokeWidth={1} />}
                    {over > 0 && <rect x={x(Math.max(w.fromDay, windowDays))} y={y + 5} width={over} height={ROW - 10} fill={OVERRUN} />}
                    {width > 40 && (
                      <text x={x0 + 4} y={y + ROW / 2 + 4} fontSize={10} fill="#ffffff">
                        {w.item.title.length > width / 6 ? `${w.item.title.slice(0, Math.max(1, Math.floor(width / 6) - 1))}…` : w.item.title}
                      </text>
                    )}
                  </g>
                );
              })}
            </g>
          );
        })}
      </svg>
      <ChartTable
        table={{
          caption: 'Chosen work by lane, with the days each job takes in the window',
          columns: ['Lane and job', 'First day', 'Last day', 'Days', 'Window'],
          rows,
        }}
      />
    </div>
  );
}
