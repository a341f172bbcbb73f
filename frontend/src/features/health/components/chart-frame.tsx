import type { ReactNode } from 'react';
import { ChartTable, type ChartTableData } from '@frontend/components/ui/chart-table';
import { useAfterFirstPaint } from './after-first-paint';

export type LegendMark = 'line' | 'dash' | 'points' | 'band' | 'shade' | 'marker' | 'bar';

export interface LegendItem {
  label: string;
  colour: string;
  mark: LegendMark;
}

function Swatch({ mark, colour }: { mark: LegendMark; colour: string }) {
  return (
    <svg width="22" height="12" aria-hidden className="shrink-0">
      {mark === 'line' && <line x1="1" x2="21" y1="6" y2="6" stroke={colour} strokeWidth="2.5" />}
      {mark === 'dash' && <line x1="1" x2="21" y1="6" y2="6" stroke={colour} strokeWidth="2" strokeDasharray="4 3" />}
      {mark === 'points' && (
        <>
          <circle cx="5" cy="7" r="2.2" fill={colour} />
          <circle cx="11" cy="4" r="2.2" fill={colour} />
          <circle cx="17" cy="6" r="2.2" fill={colour} />
        </>
      )}
      {mark === 'band' && <rect x="1" y="1" width="20" height="10" fill={colour} stroke="#1a4f66" strokeDasharray="3 2" strokeWidth="1" />}
      {mark === 'shade' && <rect x="1" y="0" width="20" height="12" fill={colour} />}
      {mark === 'marker' && <line x1="11" x2="11" y1="0" y2="12" stroke={colour} strokeWidth="1.5" />}
      {mark === 'bar' && <rect x="5" y="1" width="12" height="10" fill={colour} />}
    </svg>
  );
}

/** A chart with its title, what it shows, a legend in words and a note; prints on one piece of paper. */
export function ChartFrame({
  title,
  subtitle,
  legend,
  note,
  children,
  testId,
  noteTestId,
  points,
  table,
  drawLater,
}: {
  title: string;
  subtitle?: ReactNode;
  legend: LegendItem[];
  note?: ReactNode;
  children: ReactNode;
  testId: string;
  noteTestId?: string;
  /** how many points or bars are drawn; read by the browser test to see the chart follow the period */
  points: number;
  /** the values drawn, for the chart's "Show as a table" */
  table?: ChartTableData;
  /** a chart further down: its frame shows at once, its drawing once the first chart is on screen */
  drawLater?: boolean;
}) {
  const painted = useAfterFirstPaint();
  return (
    <figure className="chart-frame flex min-w-0 flex-col gap-2 rounded border border-rule bg-paper-raised p-3" data-testid={testId} data-points={points}>
      <figcaption className="flex flex-col gap-1">
        <h3 className="text-sm font-semibold">{title}</h3>
        {subtitle && <p className="text-xs text-ink-soft">{subtitle}</p>}
        <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink">
          {legend.map((l) => (
            <li key={l.label} className="flex items-center gap-1.5">
              <Swatch mark={l.mark} colour={l.colour} />
              {l.label}
            </li>
          ))}
        </ul>
      </figcaption>
      {drawLater && !painted ? <div className="h-64 w-full animate-pulse rounded bg-paper-sunk print:h-56" aria-hidden /> : children}
      {table && <ChartTable table={table} />}
      {note && (
        <p className="text-2xs text-ink-faint" data-testid={noteTestId}>
          {note}
        </p>
      )}
    </figure>
  );
}

/** The box a chart's tooltip is drawn in. */
export function TooltipBox({ title, rows }: { title: string; rows: { label: string; value: string; colour?: string }[] }) {
  return (
    <div className="rounded border border-rule bg-paper-raised px-2.5 py-1.5 text-xs shadow-sm">
      <p className="mb-1 font-medium text-ink">{title}</p>
      <table>
        <tbody>
          {rows.map((r) => (
            <tr key={r.label}>
              <td className="pr-3 text-ink-soft">
                {r.colour && <span className="mr-1.5 inline-block h-2 w-2 rounded-full align-middle" style={{ background: r.colour }} />}
                {r.label}
              </td>
              <td className="text-right tabular-nums text-ink whitespace-nowrap">{r.value}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
