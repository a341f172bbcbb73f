import { Button } from './button';

/** A quiet placeholder while data loads; announced to screen readers. */
export function LoadingState({ what }: { what: string }) {
  return (
    <p role="status" className="rounded border border-rule bg-paper-raised px-4 py-6 text-sm text-ink-soft">
      <span className="mr-2 inline-block h-2 w-2 animate-pulse rounded-full bg-tube-500 align-middle" aria-hidden />
      Loading {what}…
    </p>
  );
}

/** What failed, that nothing changed, and a way to try again. */
export function ErrorState({ what, error, onRetry }: { what: string; error: unknown; onRetry?: () => void }) {
  const message = error instanceof Error ? error.message : 'Unknown error';
  return (
    <div role="alert" className="rounded border border-fault/40 bg-paper-raised px-4 py-4 text-sm">
      <p className="font-medium text-fault">Could not load {what}</p>
      <p className="mt-1 text-ink-soft">{message}</p>
      {onRetry && (
        <Button variant="quiet" className="mt-3" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}

/** Shown on the very first load while route loaders fetch the session and the page's data. */
export function FirstLoad() {
  return (
    <main className="flex min-h-screen items-center justify-center p-4">
      <LoadingState what="Cleancase" />
    </main>
  );
}
