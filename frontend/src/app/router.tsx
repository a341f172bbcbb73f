import { createBrowserRouter, redirect, RouterProvider } from 'react-router-dom';
import { RouteErrorPage } from '@frontend/components/ui/error-boundary';
import { sessionQueryOptions } from '@frontend/features/session/api/get-session';
import { appQueryClient } from './app-query-client';
import { AppLayout } from './routes/app-layout';
import { NotFoundPage } from './routes/not-found';
import { OverviewPage } from './routes/overview';
import { SignInPage } from './routes/sign-in';

async function requireSignedIn() {
  const session = await appQueryClient.ensureQueryData(sessionQueryOptions());
  if (!session.user) throw redirect('/sign-in');
  return session;
}

const router = createBrowserRouter([
  { path: '/sign-in', element: <SignInPage />, errorElement: <RouteErrorPage /> },
  {
    path: '/',
    element: <AppLayout />,
    loader: requireSignedIn,
    errorElement: <RouteErrorPage />,
    children: [{ index: true, element: <OverviewPage /> }],
  },
  { path: '*', element: <NotFoundPage /> },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
