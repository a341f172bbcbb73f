import { Link } from 'react-router-dom';
import type { CaseView } from '@shared/schemas/cases';
import { formatDateTime, formatDay } from '@frontend/lib/format';
import { CaseStatusBadge } from './case-status-badge';

/** Which case, whose, where it stands, and what data it was built on. */
export function CaseHeader({ view }: { view: CaseView }) {
  const built = view.builtFrom.lastDataDay;
  return (
    <div className="flex flex-col gap-1">
      <p className="text-xs text-ink-soft">
        <Link to="/cases" className="hover:text-ink hover:underline">
          Cases
        </Link>{' '}
        ›{' '}
        <Link to={`/units/${view.unitId}/cases`} className="hover:text-ink hover:underline">
          {view.plantName} — {view.unitName}
        </Link>
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <h1 data-testid="case-title">{view.title}</h1>
        <CaseStatusBadge status={view.status} />
      </div>
      <p className="text-sm text-ink-soft" data-testid="case-built-from">
        {built ? `Built on data to ${formatDay(built)}` : 'Built without measured data'} (setup version {view.builtFrom.setupVersion}, engine{' '}
        {view.engineVersion}){view.newerData && `; ${view.newerData.days} days of newer data, to ${formatDay(view.newerData.lastDataDay)}`}.
      </p>
      <p className="text-xs text-ink-faint">
        By {view.author.name}, changed {formatDateTime(view.updatedAt)}
        {view.submittedAt && ` · submitted ${formatDateTime(view.submittedAt)}`}
        {view.decidedBy && ` · ${view.status === 'returned' ? 'sent back' : 'decided'} by ${view.decidedBy.name} ${formatDateTime(view.decidedAt)}`}
      </p>
    </div>
  );
}
