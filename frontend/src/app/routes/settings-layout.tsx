import { NavLink, Outlet } from 'react-router-dom';
import { whyNot, type Permission } from '@shared/permissions';
import { limitedToClientGroups, useSession } from '@frontend/features/session/api/get-session';

interface Item {
  to: string;
  label: string;
  needs?: Permission;
  /** Only for members without a client-group limit (the page names records beyond any one group). */
  wholeOrganisation?: boolean;
}

const items: Item[] = [
  { to: '/settings/profile', label: 'Your profile' },
  { to: '/settings/notifications', label: 'Notifications', needs: 'data.read' },
  { to: '/settings/api-tokens', label: 'API tokens', needs: 'calc.use' },
  { to: '/settings/members', label: 'People and roles', needs: 'members.manage' },
  { to: '/settings/client-groups', label: 'Client groups', needs: 'data.read' },
  { to: '/settings/cleaning-methods', label: 'Cleaning methods', needs: 'data.read' },
  { to: '/settings/audit', label: 'Audit log', needs: 'audit.read', wholeOrganisation: true },
  { to: '/settings/billing', label: 'Billing', needs: 'billing.manage', wholeOrganisation: true },
];

/** Settings pages share a small side list; pages the role cannot open stay listed, greyed, with the reason. */
export function SettingsLayout() {
  const { data: session } = useSession();
  const permissions = new Set(session?.permissions ?? []);
  const limited = limitedToClientGroups(session);
  const blockedBy = (item: Item): string | null =>
    item.needs && !permissions.has(item.needs) ? whyNot(item.needs) : item.wholeOrganisation && limited ? 'Only for members who see every client group' : null;
  return (
    <div className="flex flex-col gap-6 md:flex-row">
      <nav aria-label="Settings" className="md:w-52 md:shrink-0">
        <p className="mb-2 px-2.5 text-2xs font-medium uppercase tracking-wide text-ink-faint">Settings</p>
        <ul className="flex flex-wrap gap-1 md:flex-col">
          {items.map((item) =>
            blockedBy(item) === null ? (
              <li key={item.to}>
                <NavLink
                  to={item.to}
                  className={({ isActive }) =>
                    `block rounded px-2.5 py-1.5 text-sm ${isActive ? 'bg-tube-50 font-medium text-tube-700' : 'text-ink-soft hover:bg-paper-sunk hover:text-ink'}`
                  }
                >
                  {item.label}
                </NavLink>
              </li>
            ) : (
              <li key={item.to} className="px-2.5 py-1.5 text-sm text-ink-faint">
                <span className="block">{item.label}</span>
                <span className="block text-2xs">{blockedBy(item)}</span>
              </li>
            ),
          )}
        </ul>
      </nav>
      <div className="min-w-0 flex-1">
        <Outlet />
      </div>
    </div>
  );
}
