import { Link, NavLink, Outlet, useOutletContext, useParams } from 'react-router-dom';
import { whyNot } from '@shared/permissions';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { useSession } from '@frontend/features/session/api/get-session';
import { useUnit, type UnitDetail } from '@frontend/features/units/api/get-unit';
import { fieldUnits, type FieldUnits, type UnitSystem } from '@frontend/lib/field-units';
import { usePageTitle, useRouteTitle } from '../page-title';

export interface UnitPageContext {
  organisationId: string;
  unit: UnitDetail;
  system: UnitSystem;
  units: FieldUnits;
  /** null when the person may change the unit; otherwise the reason shown beside disabled actions. */
  cannotWrite: string | null;
}

export const useUnitPage = () => useOutletContext<UnitPageContext>();

const tabClass = ({ isActive }: { isActive: boolean }) =>
  `-mb-px border-b-2 px-3 py-1.5 text-sm ${isActive ? 'border-tube-600 font-medium text-tube-700' : 'border-transparent text-ink-soft hover:text-ink'}`;

/** The frame of every unit page: where the unit sits, and its sub-pages. */
export function UnitLayout() {
  const { unitId = '' } = useParams();
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId ?? '';
  const unit = useUnit(organisationId, unitId);
  const tab = useRouteTitle();
  usePageTitle(unit.data ? `${tab ?? 'Unit'} — ${unit.data.name}, ${unit.data.plant.name}` : tab);
  if (!session?.user || !organisationId) return <NoOrganisation />;
  if (unit.isPending) return <LoadingState what="the unit" />;
  if (unit.isError) return <ErrorState what="the unit" error={unit.error} onRetry={() => unit.refetch()} />;
  const system: UnitSystem = session.user.unitPreference;
  const context: UnitPageContext = {
    organisationId,
    unit: unit.data,
    system,
    units: fieldUnits(system),
    cannotWrite: session.permissions.includes('data.write') ? null : whyNot('data.write'),
  };
  const base = `/units/${unit.data.id}`;
  return (
    <div className="flex flex-col gap-4">
      <div>
        <p className="text-xs text-ink-soft">
          <Link to="/plants" className="hover:text-ink hover:underline">
            Plants
          </Link>{' '}
          ›{' '}
          <Link to={`/plants/${unit.data.plant.id}`} className="hover:text-ink hover:underline">
            {unit.data.plant.name}
          </Link>
        </p>
        <h1>
          {unit.data.plant.name} — {unit.data.name}
        </h1>
      </div>
      <nav aria-label="Unit" className="flex flex-wrap gap-1 border-b border-rule">
        <NavLink to={base} end className={tabClass}>
          Condition and cost
        </NavLink>
        <NavLink to={`${base}/setup`} className={tabClass}>
          Setup
        </NavLink>
        <NavLink to={`${base}/data`} className={tabClass}>
          Data files
        </NavLink>
        <NavLink to={`${base}/events`} className={tabClass}>
          Events
        </NavLink>
        <NavLink to={`${base}/cases`} className={tabClass}>
          Cases
        </NavLink>
      </nav>
      <Outlet context={context} />
    </div>
  );
}
