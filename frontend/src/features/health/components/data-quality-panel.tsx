import { REJECTION_REASONS, type RejectionReason } from '@shared/domain/validity/rejection-reasons';
import { formatDay, formatNumber, formatPercent } from '@frontend/lib/format';
import { healthLeftOutNote } from '@frontend/lib/left-out-words';
import type { UnitHealth } from '../api/get-health';

const SENSOR_WORDS: Record<string, string> = {
  backpressureKpa: 'Backpressure',
  cwInletC: 'CW inlet temperature',
  cwOutletC: 'CW outlet temperature',
  cwFlowM3s: 'CW flow',
  loadMw: 'Gross load',
  hotwellC: 'Hotwell temperature',
  dissolvedOxygenPpb: 'Dissolved oxygen',
  airRemovalKgS: 'Air-removal flow',
};

const reasonWords = (code: string) => {
  // Points the models refused after the import are stored as `model:<reason>`.
  const text: string | undefined = REJECTION_REASONS[code.replace(/^model:/, '') as RejectionReason];
  return text ? text.charAt(0).toUpperCase() + text.slice(1) : code;
};

/** How much of the data the figures rest on, what was left out and why, and which instruments look doubtful. */
export function DataQualityPanel({ quality, period }: { quality: UnitHealth['dataQuality']; period: UnitHealth['period'] }) {
  const total = quality.pointsUsed + quality.pointsDropped;
  const reasons = Object.entries(quality.droppedByReason).sort((a, b) => b[1] - a[1]);
  const gap = quality.dutyGap;
  return (
    <section aria-labelledby="quality-heading" className="flex flex-col gap-3 rounded border border-rule bg-paper-raised p-3" data-testid="data-quality-panel">
      <h2 id="quality-heading" className="text-base">
        Data quality
      </h2>
      <p className="text-sm">
        <span className="font-medium tabular-nums">{formatNumber(quality.pointsUsed)}</span> hourly points used,{' '}
        <span className="font-medium tabular-nums">{formatNumber(quality.pointsDropped)}</span> left out (
        {formatPercent(total ? quality.pointsDropped / total : null, 1)}); valid data on {formatNumber(quality.daysWithValidData)} of{' '}
        {formatNumber(quality.daysInPeriod)} days.
      </p>
      <p className="text-xs text-ink-soft" data-testid="left-out-note">
        {healthLeftOutNote(period, quality.droppedByReason)}
      </p>
      {reasons.length > 0 && (
        <table className="w-full text-sm">
          <caption className="sr-only">Points left out by reason</caption>
          <thead>
            <tr className="border-b border-rule text-xs text-ink-soft">
              <th className="py-1 text-left font-medium">Left out because</th>
              <th className="py-1 text-right font-medium">Points</th>
              <th className="py-1 pl-2 text-right font-medium">Share</th>
            </tr>
          </thead>
          <tbody>
            {reasons.map(([code, n]) => (
              <tr key={code} className="border-b border-rule/60 last:border-0">
                <td className="py-1 pr-2">{reasonWords(code)}</td>
                <td className="py-1 text-right whitespace-nowrap tabular-nums">{formatNumber(n)}</td>
                <td className="py-1 pl-2 text-right whitespace-nowrap tabular-nums">{formatPercent(total ? n / total : null, 1)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <div className="text-sm" data-testid="duty-gap">
        <p>
          <span className="font-medium">CW-side duty against heat-balance duty:</span> mean gap{' '}
          <span className="tabular-nums">{gap.meanPct === null ? '—' : `${gap.meanPct > 0 ? '+' : ''}${formatNumber(gap.meanPct, 1)} %`}</span>;{' '}
          <span className={gap.daysOver5Pct > 0 ? 'font-medium text-warn' : ''}>
            {formatNumber(gap.daysOver5Pct)} {gap.daysOver5Pct === 1 ? 'day' : 'days'} over 5 %
          </span>
          .
        </p>
        <p className="text-xs text-ink-soft">{gap.note}</p>
      </div>
      <div className="text-sm">
        <p className="font-medium">Sensors that look stuck</p>
        {quality.stuckSensors.length === 0 ? (
          <p className="text-ink-soft">None: every instrument moved as expected.</p>
        ) : (
          <ul className="ml-4 list-disc">
            {quality.stuckSensors.map((s) => (
              <li key={s.sensor} className="text-warn">
                {SENSOR_WORDS[s.sensor] ?? s.sensor}: flat on {formatNumber(s.days)} {s.days === 1 ? 'day' : 'days'}, last {formatDay(s.lastDay)}; check the
                transmitter and historian tag.
              </li>
            ))}
          </ul>
        )}
      </div>
    </section>
  );
}
