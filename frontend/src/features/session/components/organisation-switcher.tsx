import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import { createOrganisationRequest } from '@shared/schemas/accounts';
import type { SessionResponse } from '@shared/schemas/session';
import { Button } from '@frontend/components/ui/button';
import { TextField } from '@frontend/components/ui/text-field';
import { ROLE_LABELS } from '@frontend/lib/format';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useCreateOrganisation } from '../api/create-organisation';
import { useSwitchOrganisation } from '../api/switch-organisation';

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
    document.addEventListener('pointerdown', onPointer);
    return () => document.removeEventListener('pointerdown', onPointer);
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
    <div ref={rootRef} className="relative" onKeyDown={(e) => e.key === 'Escape' && open && close()}>
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
              <StartOrganisationForm onCreated={done} onCancel={() => setStarting(false)} />
            ) : (
              <button type="button" className="w-full rounded px-2 py-1.5 text-left text-sm text-tube-700 hover:bg-paper-sunk" onClick={() => setStarting(true)}>
                Start another organisation…
              </button>
            )}
          </div>
        </div>
      )}
    </div>
  );
}

function StartOrganisationForm({ onCreated, onCancel }: { onCreated: () => void; onCancel: () => void }) {
  const create = useCreateOrganisation();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = createOrganisationRequest.safeParse(formText(event.currentTarget, 'name'));
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    create.mutate(parsed.data, { onSuccess: onCreated, onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };
  const message = formMessage(create.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-2 px-2 pb-1">
      <TextField label="New organisation’s name" name="name" autoFocus error={fieldErrors.name} hint="Starts a 30-day trial with you as administrator." />
      {message && (
        <p role="alert" className="text-xs text-fault">
          {message}
        </p>
      )}
      <div className="flex justify-end gap-2">
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" disabled={create.isPending}>
          {create.isPending ? 'Starting…' : 'Start'}
        </Button>
      </div>
    </form>
  );
}
