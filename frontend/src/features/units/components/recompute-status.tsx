import { Notice } from '@frontend/components/ui/notice';
import { ProgressBar } from '@frontend/components/ui/progress-bar';
import { formatDateTime } from '@frontend/lib/format';
import { jobIsActive, type UnitJob } from '../api/get-unit';

const JOB_WORDS: Record<string, string> = { recompute: 'Recomputing the unit’s derived data', import: 'Importing data' };

/** What the background work on this unit is doing now, or when it last finished. */
export function RecomputeStatus({ jobs }: { jobs: UnitJob[] }) {
  const active = jobs.find(jobIsActive);
  if (active) {
    return (
      <div className="rounded border border-tube-100 bg-tube-50 px-3 py-2" data-testid="recompute-status">
        <ProgressBar
          fraction={active.progress}
          label={JOB_WORDS[active.kind] ?? 'Background work'}
          message={`${JOB_WORDS[active.kind] ?? 'Background work'}${active.status === 'queued' ? ' — waiting to start' : active.message ? ` — ${active.message}` : '…'}`}
        />
      </div>
    );
  }
  const last = jobs[0];
  if (!last) return null;
  if (last.status === 'failed')
    return (
      <Notice tone="fault">
        The last {last.kind} failed: {last.message ?? 'no reason given'}. Save again to retry.
      </Notice>
    );
  return (
    <p className="text-xs text-ink-soft" data-testid="recompute-status" role="status">
      Derived data up to date (last {last.kind} finished {formatDateTime(last.finishedAt)}).
    </p>
  );
}
