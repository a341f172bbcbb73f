import { useState } from 'react';
import { Button } from '@frontend/components/ui/button';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { Notice } from '@frontend/components/ui/notice';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { formatDay, formatMoney, formatNumber, formatPercent } from '@frontend/lib/format';
import { useDeleteEvent } from '../api/delete-event';
import { useEvents, type UnitEventView } from '../api/get-events';
import { EVENT_KIND_LABELS, EventForm, type MethodChoice } from './event-form';

interface Props {
  organisationId: string;
  unitId: string;
  currency: string;
  /** The organisation's cleaning methods for the cleaning select; undefined while they load. */
  methods?: MethodChoice[];
  cannotWrite: string | null;
}

const dates = (e: UnitEventView) => (e.endDate && e.endDate !== e.startDate ? `${formatDay(e.startDate)} – ${formatDay(e.endDate)}` : formatDay(e.startDate));

/** The unit's events, newest first, with add, change and delete for people who may change the unit. */
export function EventsTimeline({ organisationId, unitId, currency, methods, cannotWrite }: Props) {
  const events = useEvents(organisationId, unitId);
  const remove = useDeleteEvent(organisationId, unitId);
  const [editing, setEditing] = useState<string | null>(null);

  const methodName = (key: string) => methods?.find((m) => m.id === key)?.name ?? key;
  const columns = cannotWrite ? 7 : 8;
  const list = events.data ? [...events.data].sort((a, b) => b.startDate.localeCompare(a.startDate)) : [];
  return (
    <div className="flex flex-col gap-4">
      {cannotWrite ? (
        <ReadOnlyReason reason={cannotWrite} action="record, change and delete events" />
      ) : (
        <EventForm organisationId={organisationId} unitId={unitId} currency={currency} methods={methods} />
      )}
      {remove.isError && <Notice tone="fault">{remove.error.message}</Notice>}
      {events.isPending ? (
        <LoadingState what="events" />
      ) : events.isError ? (
        <ErrorState what="events" error={events.error} onRetry={() => events.refetch()} />
      ) : list.length === 0 ? (
        <EmptyState
          title="No events recorded"
          next={
            cannotWrite
              ? 'Cleanings, tube plugging, air in-leakage repairs and outages appear here once an analyst or administrator records them.'
              : 'Record cleanings, tube plugging, air in-leakage repairs and outages: cleanings restart the fouling trend, plugging changes the tube count.'
          }
        />
      ) : (
        <DataTable
          caption="Events"
          head={
            <>
              <th className={th}>Date</th>
              <th className={th}>Kind</th>
              <th className={th}>Method / notes</th>
              <th className={`${th} text-right`}>Cost</th>
              <th className={`${th} text-right`}>CF before</th>
              <th className={`${th} text-right`}>CF after</th>
              <th className={`${th} text-right`}>Plugged after</th>
              {!cannotWrite && (
                <th className={th}>
                  <span className="sr-only">Actions</span>
                </th>
              )}
            </>
          }
        >
          {list.map((e) =>
            editing === e.id ? (
              <tr key={e.id} className={`${tr} bg-tube-50/40`}>
                <td className={td} colSpan={columns}>
                  <EventForm organisationId={organisationId} unitId={unitId} currency={currency} methods={methods} event={e} onDone={() => setEditing(null)} />
                </td>
              </tr>
            ) : (
              <tr key={e.id} className={tr} data-testid="event-row">
                <td className={`${td} whitespace-nowrap`}>{dates(e)}</td>
                <td className={td}>{EVENT_KIND_LABELS[e.kind] ?? e.kind}</td>
                <td className={`${td} text-ink-soft`}>
                  {e.methodId && <span className="block text-ink">{methodName(e.methodId)}</span>}
                  {e.notes}
                </td>
                <td className={`${td} text-right tabular-nums whitespace-nowrap text-ledger-700`}>{formatMoney(e.cost, currency)}</td>
                <td className={`${td} text-right tabular-nums`}>{formatPercent(e.cleanlinessBefore, 0)}</td>
                <td className={`${td} text-right tabular-nums`}>{formatPercent(e.cleanlinessAfter, 0)}</td>
                <td className={`${td} text-right tabular-nums`}>{formatNumber(e.pluggedTubesAfter)}</td>
                {!cannotWrite && (
                  <td className={`${td} text-right`}>
                    <div className="flex items-start justify-end gap-2">
                      <Button variant="quiet" onClick={() => setEditing(e.id)} aria-label={`Change the ${EVENT_KIND_LABELS[e.kind] ?? e.kind} of ${dates(e)}`}>
                        Change
                      </Button>
                      <ConfirmAction
                        label="Delete"
                        question={`Delete this ${(EVENT_KIND_LABELS[e.kind] ?? e.kind).toLowerCase()}?${e.kind === 'cleaning' || e.kind === 'tube-plugging' ? ' The unit’s derived data is recomputed without it.' : ''}`}
                        confirmLabel="Delete event"
                        pending={remove.isPending && remove.variables === e.id}
                        onConfirm={() => remove.mutate(e.id)}
                      />
                    </div>
                  </td>
                )}
              </tr>
            ),
          )}
        </DataTable>
      )}
    </div>
  );
}
