import { useEffect, useRef } from 'react';
import { useBlocker } from 'react-router-dom';
import { Button } from './button';

/**
 * While a form holds changes not yet saved, leaving the page asks first: inside the app with a small dialog, when
 * the tab is closed or reloaded with the browser's own question.
 */
export function UnsavedChangesGuard({ dirty }: { dirty: boolean }) {
  // The router keeps one blocker at a time: a page with several forms (the unit's setup) registers only the changed one's.
  return dirty ? <AskBeforeLeaving /> : null;
}

function AskBeforeLeaving() {
  const blocker = useBlocker(({ currentLocation, nextLocation }) => currentLocation.pathname !== nextLocation.pathname);
  const stayRef = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    const ask = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', ask);
    return () => window.removeEventListener('beforeunload', ask);
  }, []);

  useEffect(() => {
    if (blocker.state !== 'blocked') return;
    stayRef.current?.focus();
    // Escape stays, like the Stay button
    const onKey = (e: KeyboardEvent) => e.key === 'Escape' && blocker.reset();
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [blocker]);

  if (blocker.state !== 'blocked') return null;
  return (
    <div className="fixed inset-0 z-40 flex items-center justify-center bg-ink/30 p-4">
      <div
        role="alertdialog"
        aria-modal="true"
        aria-labelledby="unsaved-changes-title"
        className="flex max-w-sm flex-col gap-3 rounded border border-rule bg-paper-raised p-4 shadow-lg"
      >
        <h2 id="unsaved-changes-title" className="text-base">
          Leave without saving?
        </h2>
        <p className="text-sm text-ink-soft">This form has changes that are not saved yet. Leaving the page drops them.</p>
        <div className="flex justify-end gap-2">
          <Button ref={stayRef} variant="quiet" onClick={() => blocker.reset()}>
            Stay and keep editing
          </Button>
          <Button variant="danger" onClick={() => blocker.proceed()}>
            Leave and drop changes
          </Button>
        </div>
      </div>
    </div>
  );
}
