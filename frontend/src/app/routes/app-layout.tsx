import { Link, NavLink, Outlet, useLocation, useNavigate, useNavigation } from 'react-router-dom';
import { useSession } from '@frontend/features/session/api/get-session';
import { useSignOut } from '@frontend/features/session/api/sign-out';
import { OrganisationSwitcher } from '@frontend/features/session/components/organisation-switcher';
import { PersonMenu } from '../components/person-menu';
import { BillingBanner } from '@frontend/features/billing/components/billing-banner';

const navClass = ({ isActive }: { isActive: boolean }) =>
  `rounded px-2.5 py-1 text-sm ${isActive ? 'bg-tube-50 text-tube-700 font-medium' : 'text-ink-soft hover:text-ink'}`;

export function AppLayout() {
  const { data: session } = useSession();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const navigation = useNavigation();
  // a unit's pages belong under Plants in the main navigation
  const onUnitPage = useLocation().pathname.startsWith('/units/');
  return (
    <div className="min-h-screen">
      <header className="border-b border-rule bg-paper-raised">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-gutter py-2">
          <Link to="/" className="text-base font-semibold tracking-tight text-ink">
            Clean<span className="text-tube-600">case</span>
          </Link>
          <nav aria-label="Main" className="flex gap-1">
            <NavLink to="/" end className={navClass}>
              Portfolio
            </NavLink>
            <NavLink to="/plants" className={({ isActive }) => navClass({ isActive: isActive || onUnitPage })}>
              Plants
            </NavLink>
            <NavLink to="/cases" className={navClass}>
              Cases
            </NavLink>
            <NavLink to="/outages" className={navClass}>
              Outages
            </NavLink>
            <NavLink to="/settings" className={navClass}>
              Settings
            </NavLink>
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm">
            {session?.user && <OrganisationSwitcher session={session} onSwitched={() => navigate('/')} />}
            {session?.user && <PersonMenu session={session} onSignOut={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in') })} />}
          </div>
        </div>
        <div className={`h-0.5 ${navigation.state === 'loading' ? 'animate-pulse bg-tube-500' : 'bg-transparent'}`} role="presentation" />
      </header>
      <main className="mx-auto max-w-7xl px-gutter py-6">
        {session?.user && <BillingBanner organisationId={session.activeOrganisationId} canManage={session.permissions.includes('billing.manage')} />}
        <Outlet />
      </main>
    </div>
  );
}
