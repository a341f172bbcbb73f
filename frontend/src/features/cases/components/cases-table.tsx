import { Link } from 'react-router-dom';
import type { CaseSummary } from '@shared/schemas/cases';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { formatCurrency, formatDateTime, formatDay } from '@frontend/lib/format';
import { CaseStatusBadge } from './case-status-badge';

/** Cases in a table: what, where, where it stands, what it is worth and when it cleans first. */
export function CasesTable({ cases, showUnit }: { cases: CaseSummary[]; showUnit: boolean }) {
  return (
    <DataTable
      caption="Cleaning cases"
      head={
        <>
          <th className={th}>Case</th>
          {showUnit && <th className={th}>Unit</th>}
          <th className={th}>Status</th>
          <th className={`${th} text-right`}>NPV</th>
          <th className={th}>First cleaning</th>
          <th className={th}>Author</th>
          <th className={th}>Changed</th>
        </>
      }
    >
      {cases.map((c) => (
        <tr key={c.id} className={tr} data-testid="case-row">
          <td className={td}>
            <Link to={`/cases/${c.id}`} className="font-medium text-tube-700 hover:underline">
              {c.title}
            </Link>
          </td>
          {showUnit && (
            <td className={td}>
              {c.plantName} — {c.unitName}
            </td>
          )}
          <td className={td}>
            <CaseStatusBadge status={c.status} />
          </td>
          <td className={`${td} text-right tabular-nums whitespace-nowrap`}>{formatCurrency(c.npv, c.currency)}</td>
          <td className={`${td} whitespace-nowrap`}>
            {c.firstCleaning ? formatDay(c.firstCleaning.date) : '—'}
            {c.firstCleaning && <span className="block text-2xs text-ink-faint">{c.firstCleaning.methodName}</span>}
          </td>
          <td className={td}>{c.authorName}</td>
          <td className={`${td} whitespace-nowrap text-ink-soft`}>{formatDateTime(c.updatedAt)}</td>
        </tr>
      ))}
    </DataTable>
  );
}
