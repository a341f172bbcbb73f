import type { ReactNode } from 'react';

/**
 * Cell classes shared by every table, so lists read alike and print cleanly. Headers are written as sentences
 * (capital first letter only), in the ink of the text, a little heavier than it: read as labels, not as a banner.
 */
export const th = 'px-3 py-2 text-left align-bottom text-xs leading-snug font-semibold text-ink-soft';
export const td = 'px-3 py-2 align-top';
export const tr = 'border-b border-rule last:border-0';

/** A bordered, horizontally scrollable table with a sunk header row. */
export function DataTable({ head, children, caption }: { head: ReactNode; children: ReactNode; caption?: string }) {
  return (
    <div className="relative overflow-x-auto rounded border border-rule bg-paper-raised">
      <table className="w-full text-sm">
        {caption && <caption className="sr-only">{caption}</caption>}
        <thead className="border-b border-rule bg-paper-sunk">
          <tr>{head}</tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
