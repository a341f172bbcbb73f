import { useState } from 'react';
import type { DisplayUnit } from '@shared/units';
import { QuantityField } from '@frontend/components/ui/quantity-field';
import { formatStored, fromInputText, toInputText } from '@frontend/lib/field-units';

interface Props {
  label: string;
  unit: DisplayUnit;
  value: number;
  onValue: (stored: number) => void;
  editable: boolean;
  /** bounds in the stored unit, checked before the value reaches the computation */
  min?: number;
  max?: number;
  /** the lower bound itself is refused (a rate that must be above 0) */
  minExclusive?: boolean;
  integer?: boolean;
  className?: string;
}

/**
 * One case input in the person's units. The typed text is kept as typed; only a number inside the bounds
 * goes on to the what-if, so the figures never show a case the server would refuse.
 */
export function CaseNumberField({ label, unit, value, onValue, editable, min, max, minExclusive, integer, className }: Props) {
  const [text, setText] = useState(() => toInputText(value, unit));
  const [error, setError] = useState<string | undefined>();
  if (!editable) {
    return (
      <div className={`flex flex-col gap-0.5 ${className ?? ''}`}>
        <span className="text-xs text-ink-soft">{label}</span>
        <span className="text-sm tabular-nums">{unit.label ? formatStored(value, unit) : formatStored(value, unit).trim()}</span>
      </div>
    );
  }
  const show = (stored: number) => `${formatStored(stored, unit)}`;
  return (
    <QuantityField
      label={label}
      unit={unit.label || undefined}
      value={text}
      className={className}
      error={error}
      onChange={(next) => {
        setText(next);
        const stored = fromInputText(next, unit);
        if (stored === undefined) return setError('Enter a number');
        if (Number.isNaN(stored)) return setError('Enter a number');
        if (integer && !Number.isInteger(Math.round(stored * 1e9) / 1e9)) return setError('Enter a whole number');
        if (min !== undefined && (minExclusive ? stored <= min : stored < min)) return setError(`${minExclusive ? 'More than' : 'At least'} ${show(min)}`);
        if (max !== undefined && stored > max) return setError(`At most ${show(max)}`);
        setError(undefined);
        onValue(integer ? Math.round(stored) : stored);
      }}
    />
  );
}
