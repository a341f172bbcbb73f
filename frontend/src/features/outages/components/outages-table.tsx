import { Link } from 'react-router-dom';
import type { OutageSummary } from '@shared/schemas/outages';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { formatCurrency, formatDateTime } from '@frontend/lib/format';
import { OutageStatusBadge } from './outage-status-badge';
import { unitsText, windowText } from './outage-words';

/** Outages in a table: window, units, budget, where the decision stands and what the chosen work costs and returns. */
export function OutagesTable({ outages }: { outages: OutageSummary[] }) {
  return (
    <DataTable
      caption="Outages"
      head={
        <>
          <th className={th}>Outage</th>
          <th className={th}>Window</th>
          <th className={th}>Units</th>
          <th className={`${th} text-right`}>Budget</th>
          <th className={th}>Status</th>
          <th className={`${th} text-right`}>Chosen work: cost</th>
          <th className={`${th} text-right`}>Benefit</th>
        </>
      }
    >
      {outages.map((o) => (
        <tr key={o.id} className={tr} data-testid="outage-row">
          <td className={td}>
            <Link to={`/outages/${o.id}`} className="font-medium text-tube-700 hover:underline">
              {o.name}
            </Link>
            <span className="block text-2xs text-ink-faint">
              {o.itemCount} {o.itemCount === 1 ? 'item' : 'items'} · changed {formatDateTime(o.updatedAt)}
            </span>
          </td>
          <td className={`${td} tabular-nums`}>{windowText(o.startDate, o.endDate)}</td>
          <td className={td}>{unitsText(o.units.map((u) => ({ name: u.name, plantName: u.plantName })))}</td>
          <td className={`${td} text-right tabular-nums whitespace-nowrap`}>{formatCurrency(o.budget, o.currency)}</td>
          <td className={td}>
            <OutageStatusBadge status={o.status} />
          </td>
          <td className={`${td} text-right tabular-nums whitespace-nowrap`}>
            {o.totalCost === null ? <span className="text-ink-faint">not proposed yet</span> : formatCurrency(o.totalCost, o.currency)}
          </td>
          <td className={`${td} text-right tabular-nums whitespace-nowrap text-ledger-700`}>
            {o.totalBenefit === null ? '—' : formatCurrency(o.totalBenefit, o.currency)}
          </td>
        </tr>
      ))}
    </DataTable>
  );
}
