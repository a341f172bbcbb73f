import { useEffect, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { Button } from './button';

interface Props {
  /** The button that starts it, e.g. "Remove". */
  label: string;
  /** What will happen, said plainly, shown before the second click. */
  question: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  pending?: boolean;
  disabled?: boolean;
  disabledReason?: string;
}

/** A destructive action in two steps, inline, with the consequence spelled out; Escape or "Keep" backs out. */
export function ConfirmAction({ label, question, confirmLabel, onConfirm, pending, disabled, disabledReason }: Props) {
  const [asking, setAsking] = useState(false);
  const keepRef = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    if (asking) keepRef.current?.focus();
  }, [asking]);
  const backOut = (e: KeyboardEvent) => e.key === 'Escape' && setAsking(false);
  if (!asking) {
    return (
      <Button variant="quiet" disabled={disabled || pending} title={disabled ? disabledReason : undefined} onClick={() => setAsking(true)}>
        {label}
      </Button>
    );
  }
  return (
    <div role="group" aria-label={label} className="flex flex-col items-end gap-2 text-left">
      <p className="max-w-xs text-xs text-ink-soft">{question}</p>
      <div className="flex gap-2">
        <Button ref={keepRef} variant="quiet" onClick={() => setAsking(false)} onKeyDown={backOut}>
          Keep
        </Button>
        <Button
          variant="danger"
          disabled={pending}
          onKeyDown={backOut}
          onClick={() => {
            onConfirm();
            setAsking(false);
          }}
        >
          {pending ? 'Working…' : confirmLabel}
        </Button>
      </div>
    </div>
  );
}
