import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import type { PortfolioUnit } from '@shared/schemas/portfolio';
import { th, td, tr } from '@frontend/components/ui/data-table';
import type { UnitSystem } from '@frontend/lib/field-units';
import { fieldUnits, formatStored } from '@frontend/lib/field-units';
import { formatCurrency, formatDay, formatNumber, formatPercent } from '@frontend/lib/format';
import { physicalCostParts } from '@shared/text/physical-cost-text';
import { sortUnits, type SortKey, type SortOrder } from './portfolio-order';
import { CASE_WORDS, CONDITION_WORDS } from './portfolio-words';

interface Column {
  key: SortKey;
  label: string;
  /** numbers right-aligned */
  numeric?: boolean;
  /** larger first on the first press (costs, ages, counts) */
  largestFirst?: boolean;
}

const COLUMNS: Column[] = [
  { key: 'unit', label: 'Unit' },
  { key: 'conditions', label: 'Needs attention', largestFirst: true },
  { key: 'cleanliness', label: 'Cleanliness', numeric: true },
  { key: 'excess', label: 'Backpressure above expected', numeric: true, largestFirst: true },
  { key: 'costPerDay', label: 'Fouling cost per day', numeric: true, largestFirst: true },
  { key: 'costSince', label: 'Fouling cost since cleaning', numeric: true, largestFirst: true },
  { key: 'nextCleaning', label: 'Next recommended cleaning' },
  { key: 'cases', label: 'Open cases', largestFirst: true },
  { key: 'outage', label: 'Next outage' },
  { key: 'dataAge', label: 'Data through', largestFirst: true },
];

function SortHeader({ column, order, onSort }: { column: Column; order: SortOrder; onSort: (key: SortKey) => void }) {
  const active = order.key === column.key;
  const sticky = column.key === 'unit' ? 'sticky left-0 z-10 bg-paper-sunk' : '';
  return (
    <th scope="col" aria-sort={active ? order.direction : 'none'} className={`${th} ${column.numeric ? 'text-right' : ''} ${sticky}`}>
      <button type="button" onClick={() => onSort(column.key)} className="inline-flex items-center gap-1 hover:text-ink focus-visible:text-ink">
        {column.label}
        <span aria-hidden className="text-ink-faint">
          {active ? (order.direction === 'ascending' ? '▲' : '▼') : '↕'}
        </span>
      </button>
    </th>
  );
}

function Row({ u, system }: { u: PortfolioUnit; system: UnitSystem }) {
  const pressure = fieldUnits(system).pressureDifferenceKpa;
  const money = (v: number | null) => (u.currency ? formatCurrency(v, u.currency) : '—');
  const firstCase = u.openCases[0];
  return (
    <tr className={tr} data-testid="overview-unit" data-unit-id={u.unitId}>
      <th scope="row" className={`${td} sticky left-0 z-10 min-w-[10rem] bg-paper-raised text-left font-normal`}>
        <span className="block text-xs text-ink-faint">
          {u.plantName}
          {u.clientGroup && ` · ${u.clientGroup.name}`}
        </span>
        <Link to={`/units/${u.unitId}`} className="font-semibold text-tube-700 hover:underline">
          {u.unitName}
        </Link>
        {u.note && <span className="mt-1 block max-w-[14rem] text-xs text-ink-faint">{u.note}</span>}
      </th>
      <td className={td}>
        {u.alerts.length === 0 ? (
          <span className="text-ink-faint">Nothing now</span>
        ) : (
          <ul className="flex min-w-[11rem] max-w-[16rem] flex-col gap-1">
            {u.alerts.map((a) => (
              <li key={a.kind} className="text-xs" data-condition={a.kind}>
                <details>
                  <summary className="cursor-pointer font-medium text-warn">{CONDITION_WORDS[a.kind]}</summary>
                  <p className="mt-1 text-ink-soft">{a.sentence}</p>
                </details>
              </li>
            ))}
          </ul>
        )}
      </td>
      <td className={`${td} text-right tabular-nums`}>
        <span data-testid="unit-cleanliness">{formatPercent(u.cleanliness, 1)}</span>
        <span className="block text-xs text-ink-faint">reference {formatPercent(u.referenceCleanliness, 1)}</span>
      </td>
      <td className={`${td} text-right tabular-nums`}>{formatStored(u.excessBackpressureKpa, pressure)}</td>
      <td className={`${td} text-right tabular-nums`} data-testid="unit-cost-per-day">
        {money(u.foulingCostPerDay)}
        {u.foulingPhysical && u.foulingCostPerDay !== null && (
          <span className="block text-xs text-ink-faint" data-testid="unit-physical">
            {physicalCostParts(u.foulingPhysical.perDay, u.foulingPhysical.capacityLimitedShare, 'a day').map((part) => (
              <span key={part} className="block whitespace-nowrap">
                {part}
              </span>
            ))}
          </span>
        )}
      </td>
      <td className={`${td} text-right tabular-nums`}>
        {money(u.foulingCostSinceCleaning)}
        {u.lastCleaningDate && <span className="block text-xs text-ink-faint">since {formatDay(u.lastCleaningDate)}</span>}
      </td>
      <td className={td}>
        {u.nextCleaning ? (
          <>
            <span className="tabular-nums">{formatDay(u.nextCleaning.date)}</span>
            <span className="block text-xs text-ink-soft">{u.nextCleaning.methodName}</span>
            {u.nextCleaning.saving !== null && u.currency && (
              <span className="block text-xs text-ledger-700">plan saves {formatCurrency(u.nextCleaning.saving, u.currency)} in a year</span>
            )}
          </>
        ) : (
          <span className="text-xs text-ink-faint">{u.nextCleaningNote ?? '—'}</span>
        )}
      </td>
      <td className={td}>
        {firstCase ? (
          <>
            <Link to={`/cases/${firstCase.id}`} className="text-tube-700 hover:underline">
              {firstCase.title}
            </Link>
            <span className="block text-xs text-ink-soft">
              {CASE_WORDS[firstCase.status]}
              {u.openCases.length > 1 && ` · ${u.openCases.length - 1} more`}
            </span>
          </>
        ) : (
          <span className="text-ink-faint">None</span>
        )}
      </td>
      <td className={td}>
        {u.nextOutage ? (
          <>
            <Link to={`/outages/${u.nextOutage.id}`} className="text-tube-700 hover:underline">
              {u.nextOutage.name}
            </Link>
            <span className="block text-xs text-ink-soft">
              {formatDay(u.nextOutage.startDate)} – {formatDay(u.nextOutage.endDate)}
            </span>
          </>
        ) : (
          <span className="text-ink-faint">None planned</span>
        )}
      </td>
      <td className={`${td} whitespace-nowrap`}>
        <span className={u.stale ? 'font-medium text-warn' : ''}>{u.dataThrough ? formatDay(u.dataThrough) : 'No data'}</span>
        {u.dataAgeDays !== null && (
          <span className={`block text-xs ${u.stale ? 'text-warn' : 'text-ink-faint'}`}>
            <span data-testid="unit-data-age">{u.dataAgeDays === 1 ? '1 day old' : `${formatNumber(u.dataAgeDays)} days old`}</span>
            {u.stale && <span className="font-medium"> · stale</span>}
          </span>
        )}
      </td>
    </tr>
  );
}

/** The units as a table sorted by any column (header buttons, announced with aria-sort); the first column stays in view when scrolled. */
export function PortfolioTable({ units, system }: { units: readonly PortfolioUnit[]; system: UnitSystem }) {
  const [order, setOrder] = useState<SortOrder>({ key: 'conditions', direction: 'descending' });
  const sorted = useMemo(() => sortUnits(units, order), [units, order]);
  const onSort = (key: SortKey) =>
    setOrder((o) =>
      o.key === key
        ? { key, direction: o.direction === 'ascending' ? 'descending' : 'ascending' }
        : { key, direction: COLUMNS.find((c) => c.key === key)?.largestFirst ? 'descending' : 'ascending' },
    );
  return (
    <div className="overflow-x-auto rounded border border-rule bg-paper-raised" data-testid="portfolio-table">
      <table className="w-full min-w-[60rem] text-sm">
        <caption className="sr-only">Units with their figures now; press a column heading to sort by it</caption>
        <thead className="border-b border-rule bg-paper-sunk">
          <tr>
            {COLUMNS.map((c) => (
              <SortHeader key={c.key} column={c} order={order} onSort={onSort} />
            ))}
          </tr>
        </thead>
        <tbody>
          {sorted.map((u) => (
            <Row key={u.unitId} u={u} system={system} />
          ))}
        </tbody>
      </table>
    </div>
  );
}
