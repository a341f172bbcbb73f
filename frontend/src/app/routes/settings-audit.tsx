import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { whyNot } from '@shared/permissions';
import { NoOrganisation, NotPermitted } from '@frontend/components/ui/not-permitted';
import { auditFiltersFrom } from '@frontend/features/audit/api/get-audit-events';
import { AuditLog } from '@frontend/features/audit/components/audit-log';
import { clientGroupsQueryOptions } from '@frontend/features/client-groups/api/get-client-groups';
import { plantsQueryOptions } from '@frontend/features/plants/api/get-plants';
import { limitedToClientGroups, useSession } from '@frontend/features/session/api/get-session';

export function AuditSettingsPage() {
  const { data: session } = useSession();
  const [params, setParams] = useSearchParams();
  const organisationId = session?.activeOrganisationId;
  // the log keeps ids of units and client groups; their names come from the lists the person can read anyway
  const readable = !!organisationId && !!session?.permissions.includes('audit.read') && !limitedToClientGroups(session);
  const plants = useQuery({ ...plantsQueryOptions(organisationId ?? ''), enabled: readable });
  const groups = useQuery({ ...clientGroupsQueryOptions(organisationId ?? ''), enabled: readable });
  const names = useMemo(
    () => ({
      units: new Map((plants.data ?? []).flatMap((p) => p.units.map((u) => [u.id, `${p.name} — ${u.name}`] as const))),
      groups: new Map((groups.data ?? []).map((g) => [g.id, g.name] as const)),
    }),
    [plants.data, groups.data],
  );
  if (!session?.user || !organisationId) return <NoOrganisation />;
  if (!session.permissions.includes('audit.read')) return <NotPermitted what="The audit log" reason={whyNot('audit.read')} />;
  if (limitedToClientGroups(session))
    return (
      <NotPermitted what="The audit log" reason="It names plants and people in every client group, so only members who see every client group can read it." />
    );
  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1>Audit log</h1>
        <p className="mt-1 text-sm text-ink-soft">Who changed what in this organisation, newest first.</p>
      </div>
      <AuditLog
        organisationId={organisationId}
        filters={auditFiltersFrom(params)}
        onFiltersChange={(f) => setParams(f as Record<string, string>)}
        names={names}
      />
    </section>
  );
}
