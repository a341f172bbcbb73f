import { useId, useState } from 'react';
import { Button } from './button';

export interface ChartTableData {
  /** what the rows are, read before the table by a screen reader */
  caption: string;
  columns: string[];
  /**
   * already formatted, in the person's units; the first cell names the row (a day, a month). A function is called
   * only when the table is opened, so a long table costs nothing while the chart is being drawn.
   */
  rows: string[][] | (() => string[][]);
}

/**
 * The values behind a chart as a plain table, opened from a button under the chart: every value can be reached by
 * keyboard and read by a screen reader, which a drawing cannot offer.
 */
export function ChartTable({ table }: { table: ChartTableData }) {
  const [open, setOpen] = useState(false);
  const id = useId();
  const rows = open ? (typeof table.rows === 'function' ? table.rows() : table.rows) : [];
  return (
    <div className="no-print flex flex-col gap-2">
      <div>
        <Button variant="quiet" aria-expanded={open} aria-controls={id} onClick={() => setOpen((o) => !o)} className="px-2 py-0.5 text-xs">
          {open ? 'Hide the table' : 'Show as a table'}
        </Button>
      </div>
      {open && (
        // the table scrolls on its own, so it is focusable and named for keyboard users
        // eslint-disable-next-line jsx-a11y/no-noninteractive-tabindex
        <div id={id} className="max-h-80 overflow-auto rounded border border-rule" tabIndex={0} role="region" aria-label={table.caption}>
          <table className="w-full text-xs" data-testid="chart-table">
            <caption className="sr-only">{table.caption}</caption>
            <thead className="sticky top-0 bg-paper-sunk">
              <tr>
                {table.columns.map((c, i) => (
                  <th key={c} scope="col" className={`px-2 py-1 font-medium text-ink-soft ${i === 0 ? 'text-left' : 'text-right'}`}>
                    {c}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r[0]} className="border-t border-rule">
                  {r.map((cell, i) =>
                    i === 0 ? (
                      <th key={i} scope="row" className="px-2 py-0.5 text-left font-normal whitespace-nowrap">
                        {cell}
                      </th>
                    ) : (
                      <td key={i} className="px-2 py-0.5 text-right tabular-nums whitespace-nowrap">
                        {cell}
                      </td>
                    ),
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </div>
  );
}
