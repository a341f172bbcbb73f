import type { ReactNode } from 'react';
import { formatStored, type FieldUnits } from '@frontend/lib/field-units';
import { formatCurrency, formatDay, formatNumber, formatPercent, formatPlantTime } from '@frontend/lib/format';
import { plantDayOf } from '@shared/domain/calendar/plant-day';
import { physicalCostShort, physicalCostWords } from '@shared/text/physical-cost-text';
import type { HealthHeadline } from '../api/get-health';
import { healthSentence, STALE_AFTER_DAYS } from './health-sentence';
import { NextCleaningDetail } from './next-cleaning-detail';

interface Props {
  headline: HealthHeadline;
  units: FieldUnits;
  currency: string;
  timeZone: string;
  /** now, in ms; passed in so the age of the data is computed in one place */
  now: number;
}

type Tone = 'ink' | 'tube' | 'ledger' | 'air' | 'warn';
const TONE: Record<Tone, string> = { ink: 'text-ink', tube: 'text-tube-700', ledger: 'text-ledger-700', air: 'text-[#5e3a7c]', warn: 'text-warn' };

/** One line of a group: what it is on the left, the figure and what it means on the right. */
function Figure({ label, value, tone = 'ink', children, testId }: { label: string; value: ReactNode; tone?: Tone; children?: ReactNode; testId: string }) {
  return (
    <div className="grid gap-x-4 gap-y-0.5 border-t border-rule/70 py-2.5 first:border-t-0 sm:grid-cols-[8.5rem_minmax(0,1fr)]" data-testid={testId}>
      <p className="pt-1 text-sm text-ink-soft">{label}</p>
      <div className="flex min-w-0 flex-col gap-0.5">
        <p className={`text-xl leading-tight font-semibold tabular-nums ${TONE[tone]}`}>{value}</p>
        {children && <div className="text-xs leading-snug text-ink-soft">{children}</div>}
      </div>
    </div>
  );
}

/** A group of figures under a plain heading, marked on its left edge with the colour its charts use. */
function Group({ title, accent, children, testId }: { title: string; accent: string; children: ReactNode; testId: string }) {
  return (
    <section className={`flex flex-col rounded-r border border-l-4 border-rule bg-paper-raised px-4 pt-2 pb-1 ${accent}`} data-testid={testId}>
      <h3 className="text-sm font-semibold text-ink">{title}</h3>
      {children}
    </section>
  );
}

/** A bar from 0 to 100 % cleanliness: today's value filled, the reference marked. */
function CleanlinessGauge({ value, reference }: { value: number; reference: number | null }) {
  const pct = (v: number) => `${Math.max(0, Math.min(100, v * 100))}%`;
  return (
    <div className="relative my-1 h-2 max-w-xs rounded-sm bg-paper-sunk" aria-hidden>
      <div className="absolute inset-y-0 left-0 rounded-sm bg-tube-500" style={{ width: pct(value) }} />
      {reference !== null && <div className="absolute -inset-y-1 w-0.5 bg-ink" style={{ left: pct(reference) }} title="reference" />}
    </div>
  );
}

/** What the cost per day stands for: output lost in the capacity-limited hours and the CO2 of the extra fuel in the others. */
function PhysicalLines({ physical }: { physical: NonNullable<HealthHeadline['foulingPhysical']> }) {
  const words = physicalCostWords(physical.perDay, physical.capacityLimitedShare, 'a day');
  return (
    <p className="text-ink" data-testid="fouling-physical">
      <span data-testid="fouling-physical-output">{capitalise(words.output)}</span>
      {words.co2 && (
        <>
          {'; '}
          <span data-testid="fouling-physical-co2">{words.co2}</span>
        </>
      )}
      .
    </p>
  );
}

const capitalise = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

const perDay = (text: string) => (
  <>
    {text}
    <span className="text-sm font-normal text-ink-soft"> a day</span>
  </>
);

/** The head of the health view: one sentence of what matters now, then the figures by condition and by money. */
export function HealthHeadlineStrip({ headline: h, units, currency, timeZone, now }: Props) {
  const money = (v: number | null) => formatCurrency(v, currency);
  const excess = h.excessBackpressureKpa;
  const ageDays = h.lastSampleUtc ? (now - Date.parse(h.lastSampleUtc)) / 86_400_000 : null;
  const stale = ageDays !== null && ageDays > STALE_AFTER_DAYS;
  const next = h.nextCleaning;
  const today = plantDayOf(now, timeZone);
  const firstDate = next?.plan?.[0]?.date ?? next?.next?.date;
  const overdue = next?.status === 'planned' && firstDate !== undefined && firstDate < today;
  // How much of the excess is fouling, in money (the two parts are costed through the same turbine curve).
  const fouling = h.foulingCostPerDay ?? 0;
  const unexplained = Math.max(0, h.unexplainedCostPerDay ?? 0);
  const foulingShare = h.foulingCostPerDay !== null && fouling + unexplained > 0 ? Math.max(0, fouling) / (Math.max(0, fouling) + unexplained) : null;
  return (
    <section aria-labelledby="headline-heading" className="flex flex-col gap-3">
      <h2 id="headline-heading" className="sr-only">
        What matters now
      </h2>
      <p className="max-w-5xl text-lg leading-snug text-ink" data-testid="headline-sentence">
        {healthSentence(h, today, currency)}
      </p>
      <div className="grid gap-3 lg:grid-cols-2">
        <Group title="Condition of the tubes" accent="border-l-tube-500" testId="headline-condition">
          <Figure label="Cleanliness" value={formatPercent(h.cleanliness, 1)} tone="tube" testId="headline-cleanliness">
            {h.cleanliness !== null && <CleanlinessGauge value={h.cleanliness} reference={h.referenceCleanliness} />}
            <p>
              Reference {formatPercent(h.referenceCleanliness, 0)}
              {h.designCleanliness !== null && h.designCleanliness !== h.referenceCleanliness && <> · design {formatPercent(h.designCleanliness, 0)}</>} ·
              fitted trend {formatPercent(h.trendCleanliness, 1)}
            </p>
          </Figure>
          <Figure
            label="Excess backpressure"
            value={excess === null ? '—' : `${excess > 0 ? '+' : ''}${formatStored(excess, units.pressureDifferenceKpa)}`}
            testId="headline-excess"
          >
            <p>Above what it would be at the reference cleanliness, same CW and load (7-day mean).</p>
            {foulingShare !== null && (
              <p className="mt-0.5 text-ink" data-testid="fouling-share">
                <span className="font-medium text-[#b23a16]">{formatPercent(foulingShare, 0)} fouling</span>
                {foulingShare < 0.995 && <span className="text-[#5e3a7c]"> · {formatPercent(1 - foulingShare, 0)} unexplained</span>}
                <span className="text-ink-soft"> (by cost)</span>
              </p>
            )}
          </Figure>
          <Figure label="Data up to" value={h.asOf ? formatDay(h.asOf) : '—'} tone={stale ? 'warn' : 'ink'} testId="headline-freshness">
            <p>Last sample {formatPlantTime(h.lastSampleUtc, timeZone)} (plant time)</p>
            {ageDays !== null && (
              <p className={stale ? 'font-medium text-warn' : ''} role={stale ? 'note' : undefined}>
                {stale ? '⚠ ' : ''}
                {formatNumber(Math.floor(ageDays))} {Math.floor(ageDays) === 1 ? 'day' : 'days'} old{stale ? ': import recent data for current figures' : ''}
              </p>
            )}
          </Figure>
        </Group>
        <Group title="Money and the next cleaning" accent="border-l-ledger-500" testId="headline-money">
          <Figure label="Fouling costs" value={perDay(money(h.foulingCostPerDay))} tone="ledger" testId="headline-fouling-cost">
            {h.foulingPhysical && h.foulingCostPerDay !== null && <PhysicalLines physical={h.foulingPhysical} />}
            <p data-testid="since-cleaning">
              <span className="font-medium text-ledger-700">{money(h.foulingCostSinceCleaning)}</span>{' '}
              {h.lastCleaning ? (
                <>
                  since the last cleaning on <span className="whitespace-nowrap font-medium text-ink">{formatDay(h.lastCleaning.date)}</span>
                </>
              ) : (
                'over all data (no cleaning recorded)'
              )}
              {h.foulingPhysical?.sinceCleaning && h.foulingCostSinceCleaning !== null && (
                <span data-testid="since-cleaning-physical">
                  {' '}
                  ({physicalCostShort(h.foulingPhysical.sinceCleaning, h.foulingPhysical.capacityLimitedShare, 'in all')})
                </span>
              )}
            </p>
          </Figure>
          <Figure label="Unexplained" value={perDay(money(h.unexplainedCostPerDay))} tone="air" testId="headline-unexplained-cost">
            Air in-leakage or instruments: cleaning does not recover it
          </Figure>
          <Figure
            label="Next cleaning"
            value={next?.status === 'planned' && firstDate ? formatDay(firstDate) : next?.status === 'none-needed' ? 'Not needed' : 'Not available'}
            tone={overdue ? 'warn' : 'ink'}
            testId="headline-next-cleaning"
          >
            <NextCleaningDetail outlook={next} today={today} money={money} />
          </Figure>
        </Group>
      </div>
      <p className="text-2xs text-ink-faint" data-testid="headline-small-print">
        {h.averagingNote} {h.costBasis && <>Cost basis: {h.costBasis}</>}
        {next?.methodsBasis && <> Next cleaning from {next.methodsBasis}.</>}
      </p>
    </section>
  );
}
