import type { ReactNode } from 'react';
import { formatStored, type FieldUnits } from '@frontend/lib/field-units';
import { formatCurrency, formatDay, formatNumber, formatPercent, formatPlantTime } from '@frontend/lib/format';
import { plantDayOf } from '@shared/domain/calendar/plant-day';
import type { HealthHeadline } from '../api/get-health';
import { NextCleaningDetail } from './next-cleaning-detail';

interface Props {
  headline: HealthHeadline;
  units: FieldUnits;
  currency: string;
  timeZone: string;
  /** now, in ms; passed in so the age of the data is computed in one place */
  now: number;
}

const STALE_AFTER_DAYS = 2;

function Tile({ label, value, tone = 'ink', children, testId }: { label: string; value: ReactNode; tone?: 'ink' | 'tube' | 'ledger' | 'air' | 'warn'; children?: ReactNode; testId: string }) {
  const colour = { ink: 'text-ink', tube: 'text-tube-700', ledger: 'text-ledger-700', air: 'text-[#5e3a7c]', warn: 'text-warn' }[tone];
  return (
    <div className="flex min-w-0 flex-col gap-1 rounded border border-rule bg-paper-raised px-3 py-2.5" data-testid={testId}>
      <p className="text-xs font-medium uppercase tracking-wide text-ink-soft">{label}</p>
      <p className={`text-2xl leading-tight font-semibold tabular-nums ${colour}`}>{value}</p>
      {children && <div className="text-xs leading-snug text-ink-soft">{children}</div>}
    </div>
  );
}

/** A bar from 0 to 100 % cleanliness: today's value filled, the reference marked. */
function CleanlinessGauge({ value, reference }: { value: number; reference: number | null }) {
  const pct = (v: number) => `${Math.max(0, Math.min(100, v * 100))}%`;
  return (
    <div className="relative mt-0.5 h-2 rounded-sm bg-paper-sunk" aria-hidden>
      <div className="absolute inset-y-0 left-0 rounded-sm bg-tube-500" style={{ width: pct(value) }} />
      {reference !== null && <div className="absolute -inset-y-1 w-0.5 bg-ink" style={{ left: pct(reference) }} title="reference" />}
    </div>
  );
}

/** The figures a manager reads first: how dirty, what it costs, what is not fouling, when to clean, how fresh. */
export function HealthHeadlineStrip({ headline: h, units, currency, timeZone, now }: Props) {
  const money = (v: number | null) => formatCurrency(v, currency);
  const excess = h.excessBackpressureKpa;
  const ageDays = h.lastSampleUtc ? (now - Date.parse(h.lastSampleUtc)) / 86_400_000 : null;
  const stale = ageDays !== null && ageDays > STALE_AFTER_DAYS;
  const next = h.nextCleaning;
  const today = plantDayOf(now, timeZone);
  const overdue = next?.status === 'planned' && next.next !== undefined && next.next.date < today;
  // How much of the excess is fouling, in money (the two parts are costed through the same turbine curve).
  const fouling = h.foulingCostPerDay ?? 0;
  const unexplained = Math.max(0, h.unexplainedCostPerDay ?? 0);
  const foulingShare = h.foulingCostPerDay !== null && fouling + unexplained > 0 ? Math.max(0, fouling) / (Math.max(0, fouling) + unexplained) : null;
  return (
    <section aria-labelledby="headline-heading" className="flex flex-col gap-2">
      <h2 id="headline-heading" className="sr-only">
        Condenser health now
      </h2>
      <div className="grid grid-cols-1 gap-2 sm:grid-cols-2 md:grid-cols-3 xl:grid-cols-6">
        <Tile label="Cleanliness" value={formatPercent(h.cleanliness, 1)} tone="tube" testId="headline-cleanliness">
          {h.cleanliness !== null && <CleanlinessGauge value={h.cleanliness} reference={h.referenceCleanliness} />}
          <p className="mt-1">
            Reference {formatPercent(h.referenceCleanliness, 0)}
            {h.designCleanliness !== null && h.designCleanliness !== h.referenceCleanliness && <> · design {formatPercent(h.designCleanliness, 0)}</>}
          </p>
          <p>Fitted trend {formatPercent(h.trendCleanliness, 1)}</p>
        </Tile>
        <Tile label="Excess backpressure" value={excess === null ? '—' : `${excess > 0 ? '+' : ''}${formatStored(excess, units.pressureDifferenceKpa)}`} testId="headline-excess">
          <p>Above what it would be at the reference cleanliness, same CW and load (7-day mean).</p>
          {foulingShare !== null && (
            <p className="mt-0.5 text-ink" data-testid="fouling-share">
              <span className="font-medium text-tube-700">{formatPercent(foulingShare, 0)} fouling</span>
              {foulingShare < 0.995 && <span className="text-[#5e3a7c]"> · {formatPercent(1 - foulingShare, 0)} unexplained</span>}
              <span className="text-ink-soft"> (by cost)</span>
            </p>
          )}
        </Tile>
        <Tile
          label="Fouling cost"
          value={
            <>
              {money(h.foulingCostPerDay)}
              <span className="text-sm font-normal text-ink-soft"> /day</span>
            </>
          }
          tone="ledger"
          testId="headline-fouling-cost"
        >
          <p data-testid="since-cleaning">
            <span className="font-medium text-ledger-700">{money(h.foulingCostSinceCleaning)}</span>{' '}
            {h.lastCleaning ? (
              <>
                since the last cleaning on <span className="whitespace-nowrap font-medium text-ink">{formatDay(h.lastCleaning.date)}</span>
              </>
            ) : (
              'over all data (no cleaning recorded)'
            )}
          </p>
        </Tile>
        <Tile
          label="Unexplained cost"
          value={
            <>
              {money(h.unexplainedCostPerDay)}
              <span className="text-sm font-normal text-ink-soft"> /day</span>
            </>
          }
          tone="air"
          testId="headline-unexplained-cost"
        >
          Air in-leakage or instruments: cleaning does not recover it
        </Tile>
        <Tile
          label="Next cleaning"
          value={next?.status === 'planned' && next.next ? formatDay(next.next.date) : next?.status === 'none-needed' ? 'Not needed' : 'Not available'}
          tone={overdue ? 'warn' : 'ink'}
          testId="headline-next-cleaning"
        >
          <NextCleaningDetail outlook={next} today={today} money={money} />
        </Tile>
        <Tile label="Data up to" value={h.asOf ? formatDay(h.asOf) : '—'} tone={stale ? 'warn' : 'ink'} testId="headline-freshness">
          <p>Last sample {formatPlantTime(h.lastSampleUtc, timeZone)}</p>
          {ageDays !== null && (
            <p className={stale ? 'font-medium text-warn' : ''} role={stale ? 'note' : undefined}>
              {stale ? '⚠ ' : ''}
              {formatNumber(Math.floor(ageDays))} {Math.floor(ageDays) === 1 ? 'day' : 'days'} old{stale ? ': import recent data for current figures' : ''}
            </p>
          )}
        </Tile>
      </div>
      <p className="text-2xs text-ink-faint" data-testid="headline-small-print">
        {h.averagingNote} {h.costBasis && <>Cost basis: {h.costBasis}</>}
        {next?.methodsBasis && <> Next cleaning from {next.methodsBasis}.</>}
      </p>
    </section>
  );
}
