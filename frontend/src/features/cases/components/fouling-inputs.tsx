import type { CalcScheduleInput } from '@shared/schemas/calc-schedule';
import { CaseNumberField } from './case-number-field';
import { InputGroup, SourceBadge, type InputGroupProps } from './input-group';

type Fouling = CalcScheduleInput['fouling'];

const MODEL_WORDS: Record<Fouling['model'], string> = {
  linear: 'straight line: the fouling index grows by the same amount each day',
  asymptotic: 'levels off: growth slows towards a ceiling',
  'falling-rate': 'falling rate: growth slows as a power of time',
};

/** How fast the tubes foul (as the fouling index 1/CF − 1/CF₀) and where the current cycle stands. */
export function FoulingInputs(props: InputGroupProps) {
  const { inputs, editable, units, change } = props;
  const f = inputs.fouling;
  const setFouling = (next: Fouling) => change((d) => ({ ...d, fouling: next }));
  const setInitial = (patch: Partial<CalcScheduleInput['initial']>) => change((d) => ({ ...d, initial: { ...d.initial, ...patch } }));
  return (
    <InputGroup title="Fouling" what={`Trend of the fouling index 1/CF − 1/CF₀, ${MODEL_WORDS[f.model]}.`} testId="inputs-fouling">
      <SourceBadge sourceKey="fouling" props={props} />
      <div className="grid grid-cols-2 gap-3">
        {f.model === 'linear' && (
          <CaseNumberField
            label="Index growth"
            unit={units.perDay}
            value={f.ratePerDay}
            min={0}
            editable={editable}
            onValue={(v) => setFouling({ ...f, ratePerDay: v })}
          />
        )}
        {f.model === 'asymptotic' && (
          <>
            <CaseNumberField
              label="Ceiling of the index"
              unit={units.index}
              value={f.maxIndex}
              min={0}
              editable={editable}
              onValue={(v) => setFouling({ ...f, maxIndex: v })}
            />
            <CaseNumberField
              label="Time constant"
              unit={units.days}
              value={f.timeConstantDays}
              min={0}
              minExclusive
              editable={editable}
              onValue={(v) => setFouling({ ...f, timeConstantDays: v })}
            />
          </>
        )}
        {f.model === 'falling-rate' && (
          <>
            <CaseNumberField
              label="Coefficient"
              unit={units.index}
              value={f.coefficient}
              min={0}
              editable={editable}
              onValue={(v) => setFouling({ ...f, coefficient: v })}
            />
            <CaseNumberField
              label="Exponent"
              unit={units.index}
              value={f.exponent}
              min={0}
              minExclusive
              max={1}
              editable={editable}
              onValue={(v) => setFouling({ ...f, exponent: v })}
            />
          </>
        )}
      </div>
      <SourceBadge sourceKey="initial" props={props} />
      <div className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        <CaseNumberField
          label="Days since the last cleaning"
          unit={units.days}
          value={inputs.initial.daysSinceCleaning}
          min={0}
          integer
          editable={editable}
          onValue={(v) => setInitial({ daysSinceCleaning: v })}
        />
        <CaseNumberField
          label="Cleanliness after that cleaning"
          unit={units.cleanliness}
          value={inputs.initial.cleanlinessAfterCleaning}
          min={0}
          minExclusive
          max={1.2}
          editable={editable}
          onValue={(v) => setInitial({ cleanlinessAfterCleaning: v })}
        />
        <CaseNumberField
          label="Fouling rate multiplier"
          unit={units.factor}
          value={inputs.initial.foulingRateMultiplier ?? 1}
          min={0}
          minExclusive
          max={10}
          editable={editable}
          onValue={(v) => setInitial({ foulingRateMultiplier: v })}
        />
      </div>
    </InputGroup>
  );
}
