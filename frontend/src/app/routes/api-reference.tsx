import { Link } from 'react-router-dom';
import { linkClass } from '@frontend/components/ui/public-page';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { useOpenApi } from '@frontend/features/api-reference/api/get-openapi';
import { ApiOperations } from '@frontend/features/api-reference/components/api-operations';

/** For people who script against Cleancase: every endpoint, who may call it, what it takes and answers. */
export function ApiReferencePage() {
  const doc = useOpenApi();
  return (
    <main className="mx-auto flex max-w-4xl flex-col gap-4 px-gutter py-6">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <div>
          <Link to="/" className="text-base font-semibold tracking-tight text-ink">
            Clean<span className="text-tube-600">case</span>
          </Link>
          <h1 className="mt-2">API reference</h1>
          <p className="mt-1 max-w-prose text-sm text-ink-soft">
            Every endpoint of this server, built from the same schemas the server checks requests against. A browser session signs in with{' '}
            <code>POST /api/session</code> and sends the header <code>x-cleancase-request: 1</code> on every change; a personal API token (
            <code>Authorization: Bearer …</code>) calls only the calculation API. The machine-readable description (OpenAPI 3.1) is at{' '}
            <a className={linkClass} href="/api/openapi.json">
              /api/openapi.json
            </a>
            .
          </p>
        </div>
        <Link className={`${linkClass} text-sm`} to="/settings/api-tokens">
          Your API tokens
        </Link>
      </div>
      {doc.isPending ? (
        <LoadingState what="the API reference" />
      ) : doc.isError ? (
        <ErrorState what="the API reference" error={doc.error} onRetry={() => void doc.refetch()} />
      ) : (
        <ApiOperations doc={doc.data} />
      )}
    </main>
  );
}
