import type { ComponentType } from 'react';
import type { EnsureQueryDataOptions, QueryKey } from '@tanstack/react-query';
import { createBrowserRouter, Navigate, redirect, RouterProvider, type LoaderFunctionArgs } from 'react-router-dom';
import type { Permission } from '@shared/permissions';
import type { SessionResponse } from '@shared/schemas/session';
import { RouteErrorPage } from '@frontend/components/ui/error-boundary';
import { FirstLoad } from '@frontend/components/ui/query-state';
import { apiTokensQueryOptions } from '@frontend/features/api-tokens/api/get-api-tokens';
import { auditEventsQueryOptions, auditFiltersFrom } from '@frontend/features/audit/api/get-audit-events';
import { cleaningMethodsQueryOptions } from '@frontend/features/cleaning-methods/api/get-cleaning-methods';
import { notificationsQueryOptions } from '@frontend/features/notifications/api/get-notifications';
import { clientGroupsQueryOptions } from '@frontend/features/client-groups/api/get-client-groups';
import { mailboxQueryOptions } from '@frontend/features/dev-mailbox/api/get-mailbox';
import { invitationsQueryOptions } from '@frontend/features/members/api/get-invitations';
import { membersQueryOptions } from '@frontend/features/members/api/get-members';
import { plantsQueryOptions } from '@frontend/features/plants/api/get-plants';
import { portfolioQueryOptions } from '@frontend/features/portfolio/api/get-portfolio';
import { invitationLinkQueryOptions } from '@frontend/features/session/api/get-invitation-link';
import { sessionQueryOptions } from '@frontend/features/session/api/get-session';
import { unitQueryOptions } from '@frontend/features/units/api/get-unit';
import { healthQueryOptions } from '@frontend/features/health/api/get-health';
import { healthQueryFor } from '@frontend/features/health/components/health-period';
import { eventsQueryOptions } from '@frontend/features/events/api/get-events';
import { caseQueryOptions } from '@frontend/features/cases/api/get-case';
import { outageQueryOptions } from '@frontend/features/outages/api/get-outage';
import { outagesQueryOptions } from '@frontend/features/outages/api/get-outages';
import { unitImportsQueryOptions } from '@frontend/features/imports/api/get-imports';
import { signInReturningTo } from '@frontend/lib/safe-next';
import { appQueryClient } from './app-query-client';
import { AppLayout } from './routes/app-layout';
import { NotFoundPage } from './routes/not-found';
import { billingQueryOptions } from '@frontend/features/billing/api/get-billing';
import { documentTitle, routeTitle } from './page-title';

/** A page's code is fetched when its route is first visited, so the first screen loads only what it shows. */
function page<M>(load: () => Promise<M>, pick: (module: M) => ComponentType) {
  return async () => ({ Component: pick(await load()) });
}

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

/** The old upload and import-history addresses of a unit lead to its data page, keeping a running import's id. */
function toDataPage({ params, request }: LoaderFunctionArgs) {
  return redirect(`/units/${params.unitId ?? ''}/data${new URL(request.url).search}`);
}

const router = createBrowserRouter([
  {
    path: '/sign-in',
    handle: { title: 'Sign in' },
    lazy: page(
      () => import('./routes/sign-in'),
      (m) => m.SignInPage,
    ),
    errorElement: <RouteErrorPage />,
  },
  {
    path: '/sign-up',
    handle: { title: 'Create an account' },
    lazy: page(
      () => import('./routes/sign-up'),
      (m) => m.SignUpPage,
    ),
    errorElement: <RouteErrorPage />,
  },
  {
    path: '/forgot-password',
    handle: { title: 'Forgotten password' },
    lazy: page(
      () => import('./routes/forgot-password'),
      (m) => m.ForgotPasswordPage,
    ),
    errorElement: <RouteErrorPage />,
  },
  {
    path: '/reset-password',
    handle: { title: 'New password' },
    lazy: page(
      () => import('./routes/reset-password'),
      (m) => m.ResetPasswordPage,
    ),
    errorElement: <RouteErrorPage />,
  },
  {
    path: '/confirm-address',
    handle: { title: 'Confirm your address' },
    lazy: page(
      () => import('./routes/confirm-address'),
      (m) => m.ConfirmAddressPage,
    ),
    errorElement: <RouteErrorPage />,
  },
  {
    path: '/api-reference',
    handle: { title: 'API reference' },
    lazy: page(
      () => import('./routes/api-reference'),
      (m) => m.ApiReferencePage,
    ),
    errorElement: <RouteErrorPage />,
  },
  {
    path: '/invitation',
    handle: { title: 'Invitation' },
    lazy: page(
      () => import('./routes/invitation'),
      (m) => m.InvitationPage,
    ),
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <FirstLoad />,
    loader: async ({ request }) => {
      const token = new URL(request.url).searchParams.get('token');
      await Promise.all([session().catch(() => undefined), token ? prefetch(invitationLinkQueryOptions(token)) : undefined]);
      return null;
    },
  },
  {
    path: '/cases/:caseId/print',
    handle: { title: 'Case for printing' },
    lazy: page(
      () => import('./routes/case-print'),
      (m) => m.CasePrintPage,
    ),
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <FirstLoad />,
    loader: async (args) => {
      await requireSignedIn(args);
      return tenantLoader('data.read', (org, { params }) => [prefetch(caseQueryOptions(org, params.caseId ?? ''))])(args);
    },
  },
  {
    path: '/outages/:outageId/print',
    handle: { title: 'Outage for printing' },
    lazy: page(
      () => import('./routes/outage-print'),
      (m) => m.OutagePrintPage,
    ),
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <FirstLoad />,
    loader: async (args) => {
      await requireSignedIn(args);
      return tenantLoader('data.read', (org, { params }) => [prefetch(outageQueryOptions(org, params.outageId ?? ''))])(args);
    },
  },
  {
    path: '/mailbox',
    handle: { title: 'Local mailbox' },
    lazy: page(
      () => import('./routes/mailbox'),
      (m) => m.MailboxPage,
    ),
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
      {
        index: true,
        handle: { title: 'Portfolio' },
        loader: tenantLoader('data.read', (org) => [prefetch(portfolioQueryOptions(org))]),
        lazy: page(
          () => import('./routes/overview'),
          (m) => m.OverviewPage,
        ),
      },
      {
        path: 'cases',
        handle: { title: 'Cases' },
        lazy: page(
          () => import('./routes/cases'),
          (m) => m.CasesPage,
        ),
      },
      {
        path: 'cases/:caseId',
        handle: { title: 'Case' },
        lazy: page(
          () => import('./routes/case'),
          (m) => m.CasePage,
        ),
        loader: tenantLoader('data.read', (org, { params }) => [prefetch(caseQueryOptions(org, params.caseId ?? ''))]),
      },
      {
        path: 'outages',
        handle: { title: 'Outages' },
        lazy: page(
          () => import('./routes/outages'),
          (m) => m.OutagesPage,
        ),
        loader: tenantLoader('data.read', (org) => [prefetch(outagesQueryOptions(org)), prefetch(plantsQueryOptions(org))]),
      },
      {
        path: 'outages/:outageId',
        handle: { title: 'Outage' },
        lazy: page(
          () => import('./routes/outage'),
          (m) => m.OutagePage,
        ),
        loader: tenantLoader('data.read', (org, { params }) => [prefetch(outageQueryOptions(org, params.outageId ?? ''))]),
      },
      {
        path: 'plants',
        handle: { title: 'Plants' },
        lazy: page(
          () => import('./routes/plants'),
          (m) => m.PlantsPage,
        ),
        loader: tenantLoader('data.read', (org) => [prefetch(plantsQueryOptions(org)), prefetch(clientGroupsQueryOptions(org))]),
      },
      {
        path: 'plants/:plantId',
        handle: { title: 'Plant' },
        lazy: page(
          () => import('./routes/plant'),
          (m) => m.PlantPage,
        ),
        loader: tenantLoader('data.read', (org) => [prefetch(plantsQueryOptions(org))]),
      },
      {
        path: 'units/:unitId',
        handle: { title: 'Unit' },
        lazy: page(
          () => import('./routes/unit-layout'),
          (m) => m.UnitLayout,
        ),
        loader: tenantLoader('data.read', (org, { params }) => [prefetch(unitQueryOptions(org, params.unitId ?? ''))]),
        children: [
          {
            index: true,
            handle: { title: 'Condition and cost' },
            lazy: page(
              () => import('./routes/unit-overview'),
              (m) => m.UnitOverviewPage,
            ),
            // The health figures for the period in the address load alongside the page's code.
            loader: tenantLoader('data.read', (org, { params, request }) => [
              appQueryClient
                .ensureQueryData(unitQueryOptions(org, params.unitId ?? ''))
                .then((unit) =>
                  prefetch(
                    healthQueryOptions(
                      org,
                      unit.id,
                      healthQueryFor(new URL(request.url).searchParams, {
                        timeZone: unit.plant.timeZone,
                        firstSampleUtc: unit.samples.first,
                        lastSampleUtc: unit.samples.last,
                      }),
                    ),
                  ),
                )
                .catch(() => undefined),
            ]),
          },
          {
            path: 'setup',
            handle: { title: 'Setup' },
            lazy: page(
              () => import('./routes/unit-setup'),
              (m) => m.UnitSetupPage,
            ),
          },
          {
            path: 'data',
            handle: { title: 'Data files' },
            lazy: page(
              () => import('./routes/unit-data'),
              (m) => m.UnitDataPage,
            ),
            loader: tenantLoader('data.read', (org, { params }) => [prefetch(unitImportsQueryOptions(org, params.unitId ?? ''))]),
          },
          // the unit's upload and its import history were two pages once; scripts and bookmarks may still use those addresses
          { path: 'import', loader: toDataPage },
          { path: 'imports', loader: toDataPage },
          {
            path: 'events',
            handle: { title: 'Events' },
            lazy: page(
              () => import('./routes/unit-events'),
              (m) => m.UnitEventsPage,
            ),
            loader: tenantLoader('data.read', (org, { params }) => [
              prefetch(eventsQueryOptions(org, params.unitId ?? '')),
              prefetch(cleaningMethodsQueryOptions(org)),
            ]),
          },
          {
            path: 'cases',
            handle: { title: 'Cases' },
            lazy: page(
              () => import('./routes/cases-of-unit'),
              (m) => m.UnitCasesPage,
            ),
          },
        ],
      },
      {
        path: 'settings',
        handle: { title: 'Settings' },
        lazy: page(
          () => import('./routes/settings-layout'),
          (m) => m.SettingsLayout,
        ),
        children: [
          { index: true, element: <Navigate to="/settings/profile" replace /> },
          {
            path: 'profile',
            handle: { title: 'Your profile' },
            lazy: page(
              () => import('./routes/settings-profile'),
              (m) => m.ProfileSettingsPage,
            ),
          },
          {
            path: 'members',
            handle: { title: 'Members' },
            lazy: page(
              () => import('./routes/settings-members'),
              (m) => m.MembersSettingsPage,
            ),
            loader: tenantLoader('members.manage', (org) => [
              prefetch(membersQueryOptions(org)),
              prefetch(invitationsQueryOptions(org)),
              prefetch(clientGroupsQueryOptions(org)),
            ]),
          },
          {
            path: 'notifications',
            handle: { title: 'Notifications' },
            lazy: page(
              () => import('./routes/settings-notifications'),
              (m) => m.NotificationsSettingsPage,
            ),
            loader: tenantLoader('data.read', (org) => [prefetch(notificationsQueryOptions(org))]),
          },
          {
            path: 'client-groups',
            handle: { title: 'Client groups' },
            lazy: page(
              () => import('./routes/settings-client-groups'),
              (m) => m.ClientGroupsSettingsPage,
            ),
            loader: tenantLoader('data.read', (org) => [prefetch(clientGroupsQueryOptions(org))]),
          },
          {
            path: 'cleaning-methods',
            handle: { title: 'Cleaning methods' },
            lazy: page(
              () => import('./routes/settings-cleaning-methods'),
              (m) => m.CleaningMethodsSettingsPage,
            ),
            loader: tenantLoader('data.read', (org) => [prefetch(cleaningMethodsQueryOptions(org))]),
          },
          {
            path: 'api-tokens',
            handle: { title: 'API tokens' },
            lazy: page(
              () => import('./routes/settings-api-tokens'),
              (m) => m.ApiTokensSettingsPage,
            ),
            loader: tenantLoader('calc.use', (org) => [prefetch(apiTokensQueryOptions(org))]),
          },
          {
            path: 'billing',
            handle: { title: 'Billing' },
            lazy: page(
              () => import('./routes/settings-billing'),
              (m) => m.BillingSettingsPage,
            ),
            loader: tenantLoader('billing.manage', (org) => [prefetch(billingQueryOptions(org))]),
          },
          {
            path: 'audit',
            handle: { title: 'Audit log' },
            lazy: page(
              () => import('./routes/settings-audit'),
              (m) => m.AuditSettingsPage,
            ),
            loader: tenantLoader('audit.read', (org, { request }) => [
              prefetch(auditEventsQueryOptions(org, auditFiltersFrom(new URL(request.url).searchParams))),
              prefetch(auditEventsQueryOptions(org, {})),
            ]),
          },
        ],
      },
    ],
  },
  { path: '*', handle: { title: 'Page not found' }, element: <NotFoundPage /> },
]);

// Every page names itself in the browser's tab: the route's own name at once, a page with a subject adds it (usePageTitle).
document.title = documentTitle(routeTitle(router.state.matches));
router.subscribe((state) => {
  if (state.navigation.state === 'idle') document.title = documentTitle(routeTitle(state.matches));
});

export function AppRouter() {
  return <RouterProvider router={router} />;
}
