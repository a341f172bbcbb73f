import type { CalcScheduleInput } from '@shared/schemas/calc-schedule';
import { typicalRanges, UNCERTAIN_INPUTS, type UncertainInput } from '@shared/domain/decision/uncertainty/schedule-uncertainty';
import { Button } from '@frontend/components/ui/button';
import { CaseNumberField } from './case-number-field';
import type { CaseUnits } from './case-units';
import { InputGroup, SourceBadge, type InputGroupProps } from './input-group';

const LABELS: Record<UncertainInput, string> = {
  foulingRate: 'Fouling rate (multiplier)',
  fuelPrice: 'Fuel price (multiplier)',
  replacementPrice: 'Replacement power price (multiplier)',
  cleaningCost: 'Cleaning cost (multiplier)',
  recoveredCleanliness: 'Cleanliness after cleaning (shift)',
  discountRate: 'Discount rate',
};

const unitOf = (k: UncertainInput, units: CaseUnits) => (k === 'discountRate' || k === 'recoveredCleanliness' ? units.rate : units.factor);

/** The spreads the sensitivity and Monte Carlo use; without its own ranges the case uses typical spreads. */
export function UncertaintyInputs(props: InputGroupProps) {
  const { inputs, editable, units, change } = props;
  const u = inputs.uncertainty;
  const setU = (next: CalcScheduleInput['uncertainty']) => change((d) => ({ ...d, uncertainty: next }));
  if (!u) {
    return (
      <InputGroup title="Uncertainty" what="Sensitivity and Monte Carlo are off for this case." testId="inputs-uncertainty">
        <SourceBadge sourceKey="uncertainty" props={props} />
        {editable && (
          <Button variant="quiet" className="self-start" onClick={() => setU({ trials: 5000, seed: 1 })}>
            Add sensitivity and Monte Carlo
          </Button>
        )}
      </InputGroup>
    );
  }
  const ranges = u.ranges;
  const setRange = (k: UncertainInput, part: 'low' | 'base' | 'high', v: number) => {
    const all = { ...typicalRanges(inputs.discountRate), ...ranges };
    setU({ ...u, ranges: { ...all, [k]: { ...all[k], [part]: v } } });
  };
  const typical = typicalRanges(inputs.discountRate);
  return (
    <InputGroup
      title="Uncertainty"
      what={`Low, base and high of each uncertain input: the sensitivity moves one at a time, the Monte Carlo draws all together (${u.trials ?? 5000} trials).`}
      testId="inputs-uncertainty"
    >
      <SourceBadge sourceKey="uncertainty" props={props} />
      {!ranges && <p className="text-xs text-ink-soft">Typical spreads (common practice), not plant data: change any value to enter the case’s own.</p>}
      <div className="grid grid-cols-2 gap-3">
        <CaseNumberField
          label="Trials"
          unit={units.count}
          value={u.trials ?? 5000}
          min={1000}
          max={20_000}
          integer
          editable={editable}
          onValue={(v) => setU({ ...u, trials: v })}
        />
        <CaseNumberField
          label="Random seed"
          unit={units.count}
          value={u.seed ?? 1}
          min={0}
          max={4_294_967_295}
          integer
          editable={editable}
          onValue={(v) => setU({ ...u, seed: v })}
        />
      </div>
      {UNCERTAIN_INPUTS.map((k) => {
        const r = ranges?.[k] ?? typical[k];
        return (
          <div key={k} className="flex flex-col gap-1">
            <p className="text-sm font-medium">{LABELS[k]}</p>
            <div className="grid grid-cols-3 gap-2">
              {(['low', 'base', 'high'] as const).map((part) => (
                <CaseNumberField key={part} label={part} unit={unitOf(k, units)} value={r[part]} editable={editable} onValue={(v) => setRange(k, part, v)} />
              ))}
            </div>
          </div>
        );
      })}
      {editable && (
        <Button variant="quiet" className="self-start text-xs" onClick={() => setU(undefined)}>
          Leave out sensitivity and Monte Carlo
        </Button>
      )}
    </InputGroup>
  );
}
