import { Link } from 'react-router-dom';
import type { OutageView } from '@shared/schemas/outages';
import { formatCurrency, formatDateTime } from '@frontend/lib/format';
import { OutageStatusBadge } from './outage-status-badge';
import { unitsText, windowText } from './outage-words';

/** Which outage, its window, units and budget, and who made and decided it. */
export function OutageHeader({ outage }: { outage: OutageView }) {
  return (
    <div className="flex flex-col gap-1">
      <p className="text-xs text-ink-soft">
        <Link to="/outages" className="hover:text-ink hover:underline">
          Outages
        </Link>{' '}
        › {unitsText(outage.units.map((u) => ({ name: u.name, plantName: u.plantName })))}
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <h1 data-testid="outage-name">{outage.name}</h1>
        <OutageStatusBadge status={outage.status} />
      </div>
      <dl className="flex flex-wrap gap-x-6 gap-y-1 text-sm">
        <div className="flex gap-1.5">
          <dt className="text-ink-soft">Window</dt>
          <dd className="tabular-nums" data-testid="outage-window">
            {windowText(outage.startDate, outage.endDate, outage.windowDays)}
          </dd>
        </div>
        <div className="flex gap-1.5">
          <dt className="text-ink-soft">Budget</dt>
          <dd className="tabular-nums">{formatCurrency(outage.budget, outage.currency)}</dd>
        </div>
      </dl>
      <p className="text-xs text-ink-faint">
        By {outage.createdBy.name}, changed {formatDateTime(outage.updatedAt)}
        {outage.approvedBy && ` · approved by ${outage.approvedBy.name} ${formatDateTime(outage.approvedAt)}`}
      </p>
    </div>
  );
}
