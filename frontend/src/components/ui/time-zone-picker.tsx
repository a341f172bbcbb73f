import { useId, useMemo, useState } from 'react';

const ALL_ZONES: string[] = (() => {
  try {
    return ['UTC', ...Intl.supportedValuesOf('timeZone').filter((z) => z !== 'UTC')];
  } catch {
    return ['UTC'];
  }
})();

/** The browser's own zone, a sensible first choice for a new plant. */
export const browserTimeZone = (): string => Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC';

interface Props {
  label: string;
  value: string;
  onChange: (zone: string) => void;
  error?: string;
  hint?: string;
}

/** An IANA time zone: a search box narrows a native select (keyboard-friendly, no custom popup). */
export function TimeZonePicker({ label, value, onChange, error, hint }: Props) {
  const id = useId();
  const [search, setSearch] = useState('');
  const options = useMemo(() => {
    const words = search.trim().toLowerCase().replace(/\s+/g, '_');
    const found = words ? ALL_ZONES.filter((z) => z.toLowerCase().includes(words)) : ALL_ZONES;
    // the chosen zone stays selectable even when the search hides it
    return found.includes(value) || !value ? found : [value, ...found];
  }, [search, value]);
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(' ') || undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-ink">
        {label}
      </label>
      <div className="flex gap-2">
        <input
          type="search"
          aria-label={`Search ${label.toLowerCase()}`}
          placeholder="Search, e.g. Chicago"
          value={search}
          onChange={(e) => {
            setSearch(e.target.value);
            const words = e.target.value.trim().toLowerCase().replace(/\s+/g, '_');
            const first = words ? ALL_ZONES.find((z) => z.toLowerCase().includes(words)) : undefined;
            if (first) onChange(first);
          }}
          className="w-36 rounded border border-rule bg-paper-raised px-2 py-1.5 text-sm"
        />
        <select
          id={id}
          value={value}
          onChange={(e) => onChange(e.target.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          className={`min-w-0 flex-1 rounded border bg-paper-raised px-2 py-1.5 text-sm ${error ? 'border-fault' : 'border-rule'}`}
        >
          {options.map((z) => (
            <option key={z} value={z}>
              {z.replace(/_/g, ' ')}
            </option>
          ))}
        </select>
      </div>
      {hint && !error && (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint}
        </p>
      )}
      {error && (
        <p id={`${id}-error`} className="text-xs text-fault">
          {error}
        </p>
      )}
    </div>
  );
}
