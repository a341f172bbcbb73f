import { lazy, Suspense, useEffect, useId, useRef, useState } from 'react';
import type { SessionResponse } from '@shared/schemas/session';
import { ROLE_LABELS } from '@frontend/lib/format';
import { useSwitchOrganisation } from '../api/switch-organisation';

// The form (and the validation it carries) is fetched only when someone starts an organisation.
const StartOrganisationForm = lazy(() => import('./start-organisation-form'));

/**
 * The active organisation in the header; opens a list of the person's organisations and a way to start
 * another. After a switch every cached answer is dropped (see replaceSession) and `onSwitched` runs.
 */
export function OrganisationSwitcher({ session, onSwitched }: { session: SessionResponse; onSwitched: () => void }) {
  const [open, setOpen] = useState(false);
  const [starting, setStarting] = useState(false);
  const panelId = useId();
  const rootRef = useRef<HTMLDivElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);
  const switchOrg = useSwitchOrganisation();
  const active = session.memberships.find((m) => m.organisationId === session.activeOrganisationId);

  useEffect(() => {
    if (!open) return;
    const onPointer = (e: PointerEvent) => {
      if (!rootRef.current?.contains(e.target as Node)) setOpen(false);
    };
    // Escape closes the list from anywhere inside it and gives focus back to its button.
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== 'Escape' || !rootRef.current?.contains(document.activeElement)) return;
      setOpen(false);
      setStarting(false);
      buttonRef.current?.focus();
    };
    document.addEventListener('pointerdown', onPointer);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('pointerdown', onPointer);
      document.removeEventListener('keydown', onKey);
    };
  }, [open]);

  const close = () => {
    setOpen(false);
    setStarting(false);
    buttonRef.current?.focus();
  };
  const done = () => {
    setOpen(false);
    setStarting(false);
    onSwitched();
  };

  return (
    <div ref={rootRef} className="relative">
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((o) => !o)}
        className="flex items-center gap-2 rounded border border-rule bg-paper px-2.5 py-1 text-sm hover:bg-paper-sunk"
      >
        <span className="sr-only">Organisation: </span>
        <span data-testid="active-organisation">
          {active ? (
            <>
              <span className="font-medium">{active.organisationName}</span>
              <span className="text-ink-soft"> · {ROLE_LABELS[active.role]}</span>
            </>
          ) : (
            <span className="text-ink-soft">No organisation</span>
          )}
        </span>
        <span aria-hidden className="text-ink-faint">
          ▾
        </span>
      </button>
      {open && (
        <div id={panelId} className="absolute right-0 z-20 mt-1 w-80 rounded border border-rule bg-paper-raised p-2 shadow-lg">
          <p className="px-2 pb-1 text-2xs font-medium uppercase tracking-wide text-ink-faint">Your organisations</p>
          <ul className="flex flex-col" aria-label="Your organisations">
            {session.memberships.map((m) => {
              const isActive = m.organisationId === session.activeOrganisationId;
              return (
                <li key={m.organisationId}>
                  <button
                    type="button"
                    aria-current={isActive ? 'true' : undefined}
                    disabled={switchOrg.isPending}
                    onClick={() => (isActive ? close() : switchOrg.mutate(m.organisationId, { onSuccess: done }))}
                    className={`flex w-full items-baseline justify-between gap-3 rounded px-2 py-1.5 text-left text-sm hover:bg-paper-sunk ${isActive ? 'bg-tube-50' : ''}`}
                  >
                    <span className={isActive ? 'font-medium text-tube-700' : ''}>{m.organisationName}</span>
                    <span className="shrink-0 text-xs text-ink-soft">
                      {ROLE_LABELS[m.role]}
                      {m.limitedToClientGroups ? ' · some plants' : ''}
                    </span>
                  </button>
                </li>
              );
            })}
          </ul>
          {switchOrg.isError && (
            <p role="alert" className="px-2 py-1 text-xs text-fault">
              {switchOrg.error.message}
            </p>
          )}
          <div className="mt-2 border-t border-rule pt-2">
            {starting ? (
              <Suspense fallback={<p className="px-2 py-1.5 text-sm text-ink-soft">Loading…</p>}>
                <StartOrganisationForm onCreated={done} onCancel={() => setStarting(false)} />
              </Suspense>
            ) : (
              <button
                type="button"
                className="w-full rounded px-2 py-1.5 text-left text-sm text-tube-700 hover:bg-paper-sunk"
                onClick={() => setStarting(true)}
              >
                Start another organisation…
              </button>
            )}
          </div>
        </div>
      )}
    </div>
  );
}
