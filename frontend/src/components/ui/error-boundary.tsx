import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';

/** Shown when a page fails to render or load. */
export function RouteErrorPage() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : 'Unknown error';
  return (
    <main className="mx-auto max-w-xl p-8">
      <h1>This page could not be shown</h1>
      <p className="mt-2 text-sm text-ink-soft">{message}</p>
      <p className="mt-4 text-sm">
        Nothing was changed.{' '}
        <Link className="text-tube-700 underline" to="/">
          Go to the overview
        </Link>{' '}
        or reload the page.
      </p>
    </main>
  );
}
