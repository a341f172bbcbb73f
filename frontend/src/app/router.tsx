import type { EnsureQueryDataOptions, QueryKey } from '@tanstack/react-query';
import { createBrowserRouter, Navigate, redirect, RouterProvider, type LoaderFunctionArgs } from 'react-router-dom';
import type { Permission } from '@shared/permissions';
import type { SessionResponse } from '@shared/schemas/session';
import { RouteErrorPage } from '@frontend/components/ui/error-boundary';
import { FirstLoad } from '@frontend/components/ui/query-state';
import { apiTokensQueryOptions } from '@frontend/features/api-tokens/api/get-api-tokens';
import { auditEventsQueryOptions } from '@frontend/features/audit/api/get-audit-events';
import { cleaningMethodsQueryOptions } from '@frontend/features/cleaning-methods/api/get-cleaning-methods';
import { clientGroupsQueryOptions } from '@frontend/features/client-groups/api/get-client-groups';
import { mailboxQueryOptions } from '@frontend/features/dev-mailbox/api/get-mailbox';
import { invitationsQueryOptions } from '@frontend/features/members/api/get-invitations';
import { membersQueryOptions } from '@frontend/features/members/api/get-members';
import { plantsQueryOptions } from '@frontend/features/plants/api/get-plants';
import { invitationLinkQueryOptions } from '@frontend/features/session/api/get-invitation-link';
import { sessionQueryOptions } from '@frontend/features/session/api/get-session';
import { unitQueryOptions } from '@frontend/features/units/api/get-unit';
import { eventsQueryOptions } from '@frontend/features/events/api/get-events';
import { unitImportsQueryOptions } from '@frontend/features/imports/api/get-imports';
import { signInReturningTo } from '@frontend/lib/safe-next';
import { appQueryClient } from './app-query-client';
import { AppLayout } from './routes/app-layout';
import { ForgotPasswordPage } from './routes/forgot-password';
import { InvitationPage } from './routes/invitation';
import { MailboxPage } from './routes/mailbox';
import { NotFoundPage } from './routes/not-found';
import { OverviewPage } from './routes/overview';
import { PlantsPage } from './routes/plants';
import { ResetPasswordPage } from './routes/reset-password';
import { ApiTokensSettingsPage } from './routes/settings-api-tokens';
import { AuditSettingsPage, auditFiltersFrom } from './routes/settings-audit';
import { CleaningMethodsSettingsPage } from './routes/settings-cleaning-methods';
import { ClientGroupsSettingsPage } from './routes/settings-client-groups';
import { SettingsLayout } from './routes/settings-layout';
import { MembersSettingsPage } from './routes/settings-members';
import { ProfileSettingsPage } from './routes/settings-profile';
import { SignInPage } from './routes/sign-in';
import { SignUpPage } from './routes/sign-up';
import { UnitEventsPage } from './routes/unit-events';
import { UnitImportPage } from './routes/unit-import';
import { UnitImportsPage } from './routes/unit-imports';
import { UnitLayout } from './routes/unit-layout';
import { UnitOverviewPage } from './routes/unit-overview';
import { UnitSetupPage } from './routes/unit-setup';

const session = () => appQueryClient.ensureQueryData(sessionQueryOptions());

async function requireSignedIn({ request }: LoaderFunctionArgs) {
  const current = await session();
  if (!current.user) {
    const url = new URL(request.url);
    throw redirect(url.pathname === '/' ? '/sign-in' : signInReturningTo(`${url.pathname}${url.search}`));
  }
  return null;
}

/**
 * Warms the cache before the page renders. Failures are left to the page, which shows them in place
 * (with a retry) instead of replacing the whole screen.
 */
function prefetch<T, K extends QueryKey>(options: EnsureQueryDataOptions<T, Error, T, K>) {
  return appQueryClient.ensureQueryData(options).catch(() => undefined);
}

/** A loader for an organisation page: prefetches only what the active role may read. */
function tenantLoader(needs: Permission, load: (organisationId: string, args: LoaderFunctionArgs) => Promise<unknown>[]) {
  return async (args: LoaderFunctionArgs) => {
    const current: SessionResponse = await session();
    if (current.activeOrganisationId && current.permissions.includes(needs)) await Promise.all(load(current.activeOrganisationId, args));
    return null;
  };
}

const router = createBrowserRouter([
  { path: '/sign-in', element: <SignInPage />, errorElement: <RouteErrorPage /> },
  { path: '/sign-up', element: <SignUpPage />, errorElement: <RouteErrorPage /> },
  { path: '/forgot-password', element: <ForgotPasswordPage />, errorElement: <RouteErrorPage /> },
  { path: '/reset-password', element: <ResetPasswordPage />, errorElement: <RouteErrorPage /> },
  {
    path: '/invitation',
    element: <InvitationPage />,
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <FirstLoad />,
    loader: async ({ request }) => {
      const token = new URL(request.url).searchParams.get('token');
      await Promise.all([session().catch(() => undefined), token ? prefetch(invitationLinkQueryOptions(token)) : undefined]);
      return null;
    },
  },
  {
    path: '/mailbox',
    element: <MailboxPage />,
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <FirstLoad />,
    loader: async () => {
      const current = await session().catch(() => undefined);
      if (current?.devMailbox) await prefetch(mailboxQueryOptions());
      return null;
    },
  },
  {
    path: '/',
    element: <AppLayout />,
    loader: requireSignedIn,
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <FirstLoad />,
    children: [
      { index: true, element: <OverviewPage /> },
      {
        path: 'plants',
        element: <PlantsPage />,
        loader: tenantLoader('data.read', (org) => [prefetch(plantsQueryOptions(org)), prefetch(clientGroupsQueryOptions(org))]),
      },
      {
        path: 'units/:unitId',
        element: <UnitLayout />,
        loader: tenantLoader('data.read', (org, { params }) => [prefetch(unitQueryOptions(org, params.unitId ?? ''))]),
        children: [
          { index: true, element: <UnitOverviewPage /> },
          { path: 'setup', element: <UnitSetupPage /> },
          { path: 'import', element: <UnitImportPage /> },
          { path: 'imports', element: <UnitImportsPage />, loader: tenantLoader('data.read', (org, { params }) => [prefetch(unitImportsQueryOptions(org, params.unitId ?? ''))]) },
          { path: 'events', element: <UnitEventsPage />, loader: tenantLoader('data.read', (org, { params }) => [prefetch(eventsQueryOptions(org, params.unitId ?? '')), prefetch(cleaningMethodsQueryOptions(org))]) },
        ],
      },
      {
        path: 'settings',
        element: <SettingsLayout />,
        children: [
          { index: true, element: <Navigate to="/settings/profile" replace /> },
          { path: 'profile', element: <ProfileSettingsPage /> },
          {
            path: 'members',
            element: <MembersSettingsPage />,
            loader: tenantLoader('members.manage', (org) => [
              prefetch(membersQueryOptions(org)),
              prefetch(invitationsQueryOptions(org)),
              prefetch(clientGroupsQueryOptions(org)),
            ]),
          },
          { path: 'client-groups', element: <ClientGroupsSettingsPage />, loader: tenantLoader('data.read', (org) => [prefetch(clientGroupsQueryOptions(org))]) },
          {
            path: 'cleaning-methods',
            element: <CleaningMethodsSettingsPage />,
            loader: tenantLoader('data.read', (org) => [prefetch(cleaningMethodsQueryOptions(org))]),
          },
          { path: 'api-tokens', element: <ApiTokensSettingsPage />, loader: tenantLoader('calc.use', (org) => [prefetch(apiTokensQueryOptions(org))]) },
          {
            path: 'audit',
            element: <AuditSettingsPage />,
            loader: tenantLoader('audit.read', (org, { request }) => [
              prefetch(auditEventsQueryOptions(org, auditFiltersFrom(new URL(request.url).searchParams))),
              prefetch(auditEventsQueryOptions(org, {})),
            ]),
          },
        ],
      },
    ],
  },
  { path: '*', element: <NotFoundPage /> },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
