import type { CalcScheduleInput } from '@shared/schemas/calc-schedule';
import { ISO_DAY } from '@shared/text/day-text';
import { DayField } from '@frontend/components/ui/day-field';
import { SelectField } from '@frontend/components/ui/select-field';
import { formatDay } from '@frontend/lib/format';
import { addDays } from '@shared/domain/calendar/plant-date';
import { CaseNumberField } from './case-number-field';
import { InputGroup, SourceBadge, type InputGroupProps } from './input-group';
import { resolveMethod } from './method-inputs';

type Baseline = CalcScheduleInput['baseline'];

const BASELINES: { kind: Baseline['kind']; label: string }[] = [
  { kind: 'never', label: 'Never clean' },
  { kind: 'next-planned-outage', label: 'Clean at the next planned outage' },
  { kind: 'every-planned-outage', label: 'Clean at every planned outage' },
];

/** The money side: horizon, discount rate, what the schedule is compared with, and the unit's output and heat rate. */
export function EconomicsInputs(props: InputGroupProps) {
  const { inputs, editable, units, change } = props;
  const set = (patch: Partial<CalcScheduleInput>) => change((d) => ({ ...d, ...patch }));
  const setUnit = (patch: Partial<CalcScheduleInput['unit']>) => change((d) => ({ ...d, unit: { ...d.unit, ...patch } }));
  const firstMethod = inputs.methods.map(resolveMethod).find((m) => m !== null)?.id ?? '';
  const b = inputs.baseline ?? { kind: 'never' };
  return (
    <InputGroup
      title="Economics"
      what="The horizon and discount rate of the business case, the plan it is compared with, and what a lost megawatt-hour costs the unit."
      testId="inputs-economics"
    >
      <SourceBadge sourceKey="startDate" props={props} />
      <div className="grid grid-cols-2 gap-3">
        {editable ? (
          <DayField label="Horizon starts" value={inputs.startDate} onChange={(v) => ISO_DAY.test(v) && set({ startDate: v })} />
        ) : (
          <div className="flex flex-col gap-0.5">
            <span className="text-xs text-ink-soft">Horizon</span>
            <span className="text-sm">
              {formatDay(inputs.startDate)} – {formatDay(addDays(inputs.startDate, inputs.horizonDays - 1))}
            </span>
          </div>
        )}
        <CaseNumberField
          label="Horizon length"
          unit={units.days}
          value={inputs.horizonDays}
          min={1}
          max={1830}
          integer
          editable={editable}
          onValue={(v) => set({ horizonDays: v })}
        />
        <CaseNumberField
          label="Discount rate"
          unit={units.rate}
          value={inputs.discountRate}
          min={-1}
          minExclusive
          max={1}
          editable={editable}
          onValue={(v) => set({ discountRate: v })}
        />
        <CaseNumberField
          label="Up-front cost"
          unit={units.money}
          value={inputs.upfrontCost ?? 0}
          min={0}
          editable={editable}
          onValue={(v) => set({ upfrontCost: v })}
        />
      </div>
      <SourceBadge sourceKey="baseline" props={props} />
      {editable && b.kind !== 'fixed' ? (
        <SelectField
          label="Compared with"
          value={b.kind}
          onChange={(e) => {
            const kind = e.target.value as Baseline['kind'];
            set({ baseline: kind === 'never' ? { kind } : { kind: kind as 'next-planned-outage', methodId: 'methodId' in b ? b.methodId : firstMethod } });
          }}
        >
          {BASELINES.map((o) => (
            <option key={o.kind} value={o.kind}>
              {o.label}
            </option>
          ))}
        </SelectField>
      ) : (
        <p className="text-sm">
          Compared with: {b.kind === 'fixed' ? `${b.cleanings.length} fixed cleanings` : BASELINES.find((o) => o.kind === b.kind)?.label}
        </p>
      )}
      <SourceBadge sourceKey="unit" props={props} />
      <div className="grid grid-cols-2 gap-3">
        <CaseNumberField
          label="Rating"
          unit={units.ratingMw}
          value={inputs.unit.ratingMw}
          min={0}
          minExclusive
          editable={editable}
          onValue={(v) => setUnit({ ratingMw: v })}
        />
        <CaseNumberField
          label="Heat rate"
          unit={units.heatRateBtuKwh}
          value={inputs.unit.heatRateBtuKwh}
          min={0}
          minExclusive
          editable={editable}
          onValue={(v) => setUnit({ heatRateBtuKwh: v })}
        />
        <CaseNumberField
          label="CO₂ per fuel energy"
          unit={units.co2KgPerMmbtu}
          value={inputs.unit.co2KgPerMmbtu ?? 0}
          min={0}
          editable={editable}
          onValue={(v) => setUnit({ co2KgPerMmbtu: v })}
        />
        <CaseNumberField
          label="Hours limited by capacity"
          unit={units.share}
          value={inputs.unit.capacityLimitedShare ?? 0}
          min={0}
          max={1}
          editable={editable}
          onValue={(v) => setUnit({ capacityLimitedShare: v })}
        />
      </div>
    </InputGroup>
  );
}
