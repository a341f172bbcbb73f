import { useEffect, useId, useRef, useState, type KeyboardEvent as ReactKeyboardEvent } from 'react';
import { Link } from 'react-router-dom';
import type { SessionResponse } from '@shared/schemas/session';

const itemClass = 'block rounded px-3 py-1.5 text-sm text-ink hover:bg-paper-sunk focus:bg-paper-sunk';

/**
 * The signed-in person's own things: profile, the local mailbox (only where this server keeps one, in local runs) and
 * signing out. Opens as a small list under the person's name; the arrow keys (and Home, End) move between its
 * entries, Escape or a click elsewhere closes it.
 */
export function PersonMenu({ session, onSignOut }: { session: SessionResponse; onSignOut: () => void }) {
  const [open, setOpen] = useState(false);
  const listId = useId();
  const rootRef = useRef<HTMLDivElement>(null);
  const buttonRef = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    if (!open) return;
    const onPointer = (e: PointerEvent) => {
      if (!rootRef.current?.contains(e.target as Node)) setOpen(false);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key !== 'Escape' || !rootRef.current?.contains(document.activeElement)) return;
      setOpen(false);
      buttonRef.current?.focus();
    };
    document.addEventListener('pointerdown', onPointer);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('pointerdown', onPointer);
      document.removeEventListener('keydown', onKey);
    };
  }, [open]);

  const close = () => setOpen(false);
  const listRef = useRef<HTMLDivElement>(null);
  /** Focus moves among the list's entries with the arrow keys; from the button, Arrow Down opens the list at its first entry. */
  const onKeyDown = (e: ReactKeyboardEvent) => {
    if (!['ArrowDown', 'ArrowUp', 'Home', 'End'].includes(e.key)) return;
    e.preventDefault();
    if (!open) {
      if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
        setOpen(true);
        requestAnimationFrame(() => listRef.current?.querySelector<HTMLElement>('a, button')?.focus());
      }
      return;
    }
    const items = [...(listRef.current?.querySelectorAll<HTMLElement>('a, button') ?? [])];
    if (items.length === 0) return;
    const at = items.indexOf(document.activeElement as HTMLElement);
    const next =
      e.key === 'Home' ? 0 : e.key === 'End' ? items.length - 1 : e.key === 'ArrowDown' ? (at + 1) % items.length : (at - 1 + items.length) % items.length;
    items[next]?.focus();
  };
  return (
    // eslint-disable-next-line jsx-a11y/no-static-element-interactions -- the keys only move focus between the list's own links and buttons
    <div ref={rootRef} className="relative" onKeyDown={onKeyDown}>
      <button
        ref={buttonRef}
        type="button"
        aria-expanded={open}
        aria-controls={listId}
        onClick={() => setOpen((o) => !o)}
        className="flex items-center gap-1 rounded px-2 py-1 text-sm text-ink-soft hover:text-ink"
      >
        <span className="max-w-40 truncate">{session.user?.name ?? 'You'}</span>
        <span aria-hidden="true">▾</span>
      </button>
      {open && (
        <div
          ref={listRef}
          id={listId}
          className="absolute right-0 z-20 mt-1 flex w-52 flex-col gap-0.5 rounded border border-rule bg-paper-raised p-1 shadow-md"
        >
          <p className="truncate px-3 pb-1 pt-1.5 text-xs text-ink-faint">{session.user?.email}</p>
          <Link to="/settings/profile" className={itemClass} onClick={close}>
            Your profile
          </Link>
          {session.devMailbox && (
            <Link to="/mailbox" className={itemClass} onClick={close} title="Mail this local server sent you">
              Local mailbox
            </Link>
          )}
          <button
            type="button"
            className={`${itemClass} text-left`}
            onClick={() => {
              close();
              onSignOut();
            }}
          >
            Sign out
          </button>
        </div>
      )}
    </div>
  );
}
