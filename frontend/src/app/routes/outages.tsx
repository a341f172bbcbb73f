import { useCallback, useState } from 'react';
import { useQueries } from '@tanstack/react-query';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { can, whyNot } from '@shared/permissions';
import { OUTAGE_STATUSES, outageListQuery, type OutageListQuery } from '@shared/schemas/outages';
import type { SessionResponse } from '@shared/schemas/session';
import { Button } from '@frontend/components/ui/button';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { SelectField } from '@frontend/components/ui/select-field';
import { useOutages } from '@frontend/features/outages/api/get-outages';
import { OutageForm, type UnitChoice } from '@frontend/features/outages/components/outage-form';
import { OUTAGE_STATUS_WORDS } from '@frontend/features/outages/components/outage-status-badge';
import { OutagesTable } from '@frontend/features/outages/components/outages-table';
import { usePlants } from '@frontend/features/plants/api/get-plants';
import { useSession } from '@frontend/features/session/api/get-session';
import { unitQueryOptions } from '@frontend/features/units/api/get-unit';

/** The filters in the address, so a filtered list can be shared; anything unreadable is left out. */
export function outageFiltersFrom(params: URLSearchParams): OutageListQuery {
  const raw = { status: params.get('status') ?? undefined, unitId: params.get('unitId') ?? undefined };
  const checked = outageListQuery.safeParse(raw);
  return checked.success ? checked.data : {};
}

/** The active role, read from the memberships (the permission list of the session names only the older permissions). */
export function activeRole(session: SessionResponse) {
  return session.memberships.find((m) => m.organisationId === session.activeOrganisationId)?.role ?? null;
}

/** The units' currency, read from the units chosen in the form: an outage adds money in one currency. */
function useUnitsCurrency(organisationId: string, unitIds: string[]): { currency: string | null; note?: string } {
  const units = useQueries({ queries: unitIds.map((id) => unitQueryOptions(organisationId, id)) });
  if (unitIds.length === 0) return { currency: null };
  if (units.some((u) => u.isPending)) return { currency: null, note: 'Reading the units’ currency…' };
  const currencies = [...new Set(units.map((u) => u.data?.economics?.currency ?? 'USD'))];
  if (currencies.length > 1) return { currency: null, note: `These units count money in different currencies (${currencies.join(', ')}): choose units in one` };
  const [currency = 'USD'] = currencies;
  return { currency, note: `In ${currency}, the units’ currency` };
}

function NewOutage({ organisationId, units, onClose }: { organisationId: string; units: UnitChoice[]; onClose: () => void }) {
  const navigate = useNavigate();
  const [chosen, setChosen] = useState<string[]>([]);
  const onUnitsChange = useCallback((ids: string[]) => setChosen(ids), []);
  const { currency, note } = useUnitsCurrency(organisationId, chosen);
  return (
    <OutageForm
      organisationId={organisationId}
      units={units}
      currency={currency}
      currencyNote={note}
      onUnitsChange={onUnitsChange}
      onDone={(id) => navigate(`/outages/${id}`)}
      onCancel={onClose}
    />
  );
}

export function OutagesPage() {
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId ?? '';
  const [params, setParams] = useSearchParams();
  const filters = outageFiltersFrom(params);
  const outages = useOutages(organisationId, filters);
  const plants = usePlants(organisationId);
  const [creating, setCreating] = useState(false);
  if (!session?.user || !organisationId) return <NoOrganisation />;
  const role = activeRole(session);
  const mayPlan = can(role, 'outages.plan');
  const setFilter = (key: keyof OutageListQuery, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };
  const units: UnitChoice[] = (plants.data ?? []).flatMap((p) => p.units.map((u) => ({ id: u.id, name: u.name, plantId: p.id, plantName: p.name })));
  const filtered = !!(filters.status || filters.unitId);
  return (
    <section className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1>Outages</h1>
          <p className="mt-1 text-sm text-ink-soft">
            The condenser work picked for each outage within its budget and window: approved cases’ cleanings and other work, the proposed scope and its
            approval.
            {role === 'viewer' && ' Viewers see outages whose scope is approved.'}
          </p>
        </div>
        {mayPlan && !creating && <Button onClick={() => setCreating(true)}>New outage</Button>}
      </div>
      {!mayPlan && <ReadOnlyReason reason={whyNot('outages.plan')} action="plan outages" />}
      {creating && <NewOutage organisationId={organisationId} units={units} onClose={() => setCreating(false)} />}
      <div className="flex flex-wrap gap-3">
        <SelectField label="Status" value={filters.status ?? ''} onChange={(e) => setFilter('status', e.target.value)}>
          <option value="">Any status</option>
          {OUTAGE_STATUSES.map((s) => (
            <option key={s} value={s}>
              {OUTAGE_STATUS_WORDS[s]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Unit" value={filters.unitId ?? ''} onChange={(e) => setFilter('unitId', e.target.value)}>
          <option value="">Every unit</option>
          {units.map((u) => (
            <option key={u.id} value={u.id}>
              {u.plantName} — {u.name}
            </option>
          ))}
        </SelectField>
      </div>
      {outages.isPending && <LoadingState what="the outages" />}
      {outages.isError && <ErrorState what="the outages" error={outages.error} onRetry={() => outages.refetch()} />}
      {outages.data?.length === 0 && (
        <EmptyState
          title={filtered ? 'No outage matches these filters' : 'No outages yet'}
          next={
            filtered
              ? 'Change or clear the filters above.'
              : mayPlan
                ? 'Start one with New outage: name, units, window and budget.'
                : 'Planners start outages here.'
          }
        />
      )}
      {outages.data && outages.data.length > 0 && <OutagesTable outages={outages.data} />}
    </section>
  );
}
