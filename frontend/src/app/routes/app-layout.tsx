import { NavLink, Outlet, useNavigate } from 'react-router-dom';
import { Button } from '@frontend/components/ui/button';
import { useSession } from '@frontend/features/session/api/get-session';
import { useSignOut } from '@frontend/features/session/api/sign-out';

const navItems = [{ to: '/', label: 'Overview', end: true }];

export function AppLayout() {
  const { data: session } = useSession();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const active = session?.memberships.find((m) => m.organisationId === session.activeOrganisationId);
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-paper-raised">
        <div className="mx-auto flex max-w-7xl items-center gap-6 px-gutter py-2">
          <span className="text-base font-semibold tracking-tight">
            Clean<span className="text-tube-600">case</span>
          </span>
          <nav aria-label="Main" className="flex gap-1">
            {navItems.map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                end={item.end}
                className={({ isActive }) => `rounded px-2.5 py-1 text-sm ${isActive ? 'bg-tube-50 text-tube-700 font-medium' : 'text-ink-soft hover:text-ink'}`}
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm">
            {active && (
              <span className="text-ink-soft" data-testid="active-organisation">
                {active.organisationName} · <span className="capitalize">{active.role}</span>
              </span>
            )}
            <span>{session?.user?.name}</span>
            <Button variant="quiet" onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in') })}>
              Sign out
            </Button>
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-7xl px-gutter py-6">
        <Outlet />
      </main>
    </div>
  );
}
