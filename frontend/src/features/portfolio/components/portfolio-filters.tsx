import { UNIT_CONDITION_KINDS } from '@shared/domain/portfolio/unit-conditions';
import type { PortfolioGroup } from '@shared/schemas/portfolio';
import { SelectField } from '@frontend/components/ui/select-field';
import { NO_FILTER, type PortfolioFilter } from './portfolio-order';
import { CONDITION_WORDS } from './portfolio-words';

export function PortfolioFilters({
  filter,
  onChange,
  groups,
  staleAfterDays,
}: {
  filter: PortfolioFilter;
  onChange: (f: PortfolioFilter) => void;
  groups: PortfolioGroup[];
  staleAfterDays: number;
}) {
  const set = (patch: Partial<PortfolioFilter>) => onChange({ ...filter, ...patch });
  return (
    <form role="search" aria-label="Filter the units" className="flex flex-wrap items-end gap-3" onSubmit={(e) => e.preventDefault()}>
      <div className="flex flex-col gap-1">
        <label htmlFor="portfolio-text" className="text-sm font-medium text-ink">
          Plant or unit
        </label>
        <input
          id="portfolio-text"
          type="search"
          value={filter.text}
          onChange={(e) => set({ text: e.target.value })}
          className="rounded border border-rule bg-paper-raised px-2 py-1.5 text-sm"
        />
      </div>
      {groups.length > 0 && (
        <SelectField label="Client group" value={filter.group} onChange={(e) => set({ group: e.target.value })}>
          <option value="">Every group</option>
          {groups.map((g) => (
            <option key={g.id ?? 'none'} value={g.id ?? 'none'}>
              {g.name}
            </option>
          ))}
        </SelectField>
      )}
      <SelectField label="Condition" value={filter.condition} onChange={(e) => set({ condition: e.target.value as PortfolioFilter['condition'] })}>
        <option value="">Any</option>
        <option value="attention">Needs attention</option>
        <option value="clear">Nothing now</option>
        {UNIT_CONDITION_KINDS.map((k) => (
          <option key={k} value={k}>
            {CONDITION_WORDS[k]}
          </option>
        ))}
      </SelectField>
      <label className="flex items-center gap-2 pb-1.5 text-sm">
        <input type="checkbox" checked={filter.staleOnly} onChange={(e) => set({ staleOnly: e.target.checked })} />
        Only stale data (no data for more than {staleAfterDays} days)
      </label>
      {JSON.stringify(filter) !== JSON.stringify(NO_FILTER) && (
        <button type="button" className="pb-1.5 text-sm text-tube-700 underline" onClick={() => onChange(NO_FILTER)}>
          Clear filters
        </button>
      )}
    </form>
  );
}
