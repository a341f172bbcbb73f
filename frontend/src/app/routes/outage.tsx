import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { NoOrganisation } from '@frontend/components/ui/not-permitted';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { casesQueryOptions } from '@frontend/features/cases/api/get-cases';
import { useOutage } from '@frontend/features/outages/api/get-outage';
import type { UnitChoice } from '@frontend/features/outages/components/outage-form';
import { OutageWorkspace } from '@frontend/features/outages/components/outage-workspace';
import { usePlants } from '@frontend/features/plants/api/get-plants';
import { useSession } from '@frontend/features/session/api/get-session';
import { usePageTitle } from '../page-title';

/** One outage: its candidate work, the proposed scope, saved scopes side by side, the approval and the report. */
export function OutagePage() {
  const { outageId = '' } = useParams();
  const { data: session } = useSession();
  const organisationId = session?.activeOrganisationId ?? '';
  const view = useOutage(organisationId, outageId);
  const plants = usePlants(organisationId);
  const planning = !!view.data?.actions.edit;
  // the approved cases are read only for people who add work
  const cases = useQuery({ ...casesQueryOptions(organisationId, { status: 'approved' }), enabled: planning });
  usePageTitle(view.data?.name);
  if (!session?.user || !organisationId) return <NoOrganisation />;
  if (view.isPending) return <LoadingState what="the outage" />;
  if (view.isError) return <ErrorState what="the outage" error={view.error} onRetry={() => view.refetch()} />;
  const units: UnitChoice[] = (plants.data ?? []).flatMap((p) => p.units.map((u) => ({ id: u.id, name: u.name, plantId: p.id, plantName: p.name })));
  return (
    <OutageWorkspace
      key={view.data.id}
      organisationId={organisationId}
      outage={view.data}
      units={units}
      approvedCases={planning ? cases.data?.map((c) => ({ id: c.id, title: c.title, unitId: c.unitId })) : undefined}
    />
  );
}
