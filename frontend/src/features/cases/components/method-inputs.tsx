import type { CalcScheduleInput } from '@shared/schemas/calc-schedule';
import { cautionsFor, TYPICAL_CLEANING_METHODS, type CleaningMethod } from '@shared/schemas/cleaning-method';
import { SafetyCautions } from '@frontend/components/ui/safety-cautions';
import { formatNumber, formatPercent } from '@frontend/lib/format';
import { CaseNumberField } from './case-number-field';
import { InputGroup, SourceBadge, type InputGroupProps } from './input-group';

type MethodInput = CalcScheduleInput['methods'][number];

/** A method given by its id is a method of the typical library; the others are given in full. */
export function resolveMethod(m: MethodInput): CleaningMethod | null {
  return typeof m === 'string' ? (TYPICAL_CLEANING_METHODS.find((t) => t.id === m) ?? null) : m;
}
const idOf = (m: MethodInput) => (typeof m === 'string' ? m : m.id);

const DURING: Record<CleaningMethod['unitDuringCleaning'], string> = { outage: 'unit off line', derate: 'unit derated', online: 'unit on line' };

/** The cleaning methods the schedule may choose from, with their costs and cautions. */
export function MethodInputs(props: InputGroupProps) {
  const { inputs, saved, editable, units, change } = props;
  // the methods of the saved case stay listed when unticked, so they can be ticked again
  const known = [...inputs.methods, ...saved.methods.filter((s) => !inputs.methods.some((m) => idOf(m) === idOf(s)))];
  const included = (id: string) => inputs.methods.some((m) => idOf(m) === id);
  const toggle = (m: MethodInput) => change((d) => ({ ...d, methods: included(idOf(m)) ? d.methods.filter((x) => idOf(x) !== idOf(m)) : [...d.methods, m] }));
  const edit = (id: string, patch: Partial<CleaningMethod>) =>
    change((d) => ({ ...d, methods: d.methods.map((m) => (idOf(m) === id ? { ...resolveMethod(m)!, ...patch, typical: false } : m)) }));
  return (
    <InputGroup
      title="Cleaning methods"
      what="The methods the schedule may choose from. Costs are per cleaning, plus per tube in service."
      testId="inputs-methods"
    >
      <SourceBadge sourceKey="methods" props={props} />
      <ul className="flex flex-col gap-3">
        {known.map((m) => {
          const method = resolveMethod(m);
          const id = idOf(m);
          if (!method)
            return (
              <li key={id} className="text-sm text-fault">
                Method “{id}” is not in the typical library
              </li>
            );
          const on = included(id);
          return (
            <li key={id} className={`flex flex-col gap-2 rounded border border-rule p-2 ${on ? '' : 'opacity-60'}`}>
              <label className="flex items-start gap-2 text-sm">
                <input
                  type="checkbox"
                  className="mt-1"
                  checked={on}
                  disabled={!editable || (on && inputs.methods.length === 1)}
                  title={on && inputs.methods.length === 1 ? 'The schedule needs at least one method' : undefined}
                  onChange={() => toggle(m)}
                />
                <span>
                  <span className="font-medium">{method.name}</span>
                  <span className="block text-xs text-ink-soft">
                    {method.durationDays} day{method.durationDays === 1 ? '' : 's'}, {DURING[method.unitDuringCleaning]}
                    {method.unitDuringCleaning === 'derate' ? ` by ${formatNumber(method.deratePct, 0)} %` : ''}; cleanliness after:{' '}
                    {formatPercent(method.recoveredCleanliness)}
                    {method.typical ? ' · typical values, not plant data' : ''}
                  </span>
                </span>
              </label>
              {on && (
                <div className="grid grid-cols-2 gap-2">
                  <CaseNumberField
                    label="Cost per cleaning"
                    unit={units.money}
                    value={method.fixedCost}
                    min={0}
                    max={1e9}
                    editable={editable}
                    onValue={(v) => edit(id, { fixedCost: v })}
                  />
                  <CaseNumberField
                    label="Cost per tube"
                    unit={units.moneyPerTube}
                    value={method.costPerTube}
                    min={0}
                    max={10_000}
                    editable={editable}
                    onValue={(v) => edit(id, { costPerTube: v })}
                  />
                </div>
              )}
              {on && (
                <details className="text-xs print:open">
                  <summary className="cursor-pointer text-warn">Safety cautions for this method ({cautionsFor(method).length})</summary>
                  <SafetyCautions texts={cautionsFor(method)} className="mt-1" />
                </details>
              )}
            </li>
          );
        })}
      </ul>
    </InputGroup>
  );
}
