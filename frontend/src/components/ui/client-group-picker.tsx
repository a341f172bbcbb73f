import { useId } from 'react';

export interface GroupOption {
  id: string;
  name: string;
}

interface Props {
  groups: GroupOption[];
  /** null: every plant of the organisation; an array: only plants in these client groups. */
  value: string[] | null;
  onChange: (value: string[] | null) => void;
  legend?: string;
  error?: string;
  /** false for someone limited to client groups: they can grant only groups they see, never all plants. */
  mayChooseAll?: boolean;
}

/** "All plants" or a chosen set of client groups, as a radio pair and checkboxes (keyboard-friendly). */
export function ClientGroupPicker({ groups, value, onChange, legend = 'Plants they can see', error, mayChooseAll = true }: Props) {
  const id = useId();
  const limited = value !== null || !mayChooseAll;
  const chosen = value ?? [];
  return (
    <fieldset className="flex flex-col gap-1.5" aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="mb-1 text-sm font-medium text-ink">{legend}</legend>
      {mayChooseAll ? (
        <>
          <label className="flex items-center gap-2 text-sm">
            <input type="radio" name={`${id}-scope`} checked={!limited} onChange={() => onChange(null)} />
            All plants
          </label>
          <label className={`flex items-center gap-2 text-sm ${groups.length === 0 ? 'text-ink-faint' : ''}`}>
            <input type="radio" name={`${id}-scope`} checked={limited} disabled={groups.length === 0} onChange={() => onChange([])} />
            Only plants in these client groups
          </label>
        </>
      ) : (
        <p className="text-xs text-ink-soft">Your own access is limited to client groups, so you can grant only those groups.</p>
      )}
      {groups.length === 0 && <p className="ml-6 text-xs text-ink-faint">No client groups yet: create them under Client groups to limit access.</p>}
      {limited && (
        <div className="ml-6 flex flex-col gap-1">
          {groups.map((g) => (
            <label key={g.id} className="flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                checked={chosen.includes(g.id)}
                onChange={(e) => onChange(e.target.checked ? [...chosen, g.id] : chosen.filter((x) => x !== g.id))}
              />
              {g.name}
            </label>
          ))}
        </div>
      )}
      {error && (
        <p id={`${id}-error`} className="text-xs text-fault">
          {error}
        </p>
      )}
    </fieldset>
  );
}

/** How a client-group limit reads in a table cell. */
export function describeGroupLimit(groupIds: string[] | null, groups: GroupOption[]): string {
  if (groupIds === null) return 'All plants';
  if (groupIds.length === 0) return 'No plants';
  return groupIds.map((id) => groups.find((g) => g.id === id)?.name ?? 'removed group').join(', ');
}
