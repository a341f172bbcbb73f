import type { CalcScheduleInput } from '@shared/schemas/calc-schedule';
import { ISO_DAY } from '@shared/text/day-text';
import { DayField } from '@frontend/components/ui/day-field';
import { Button } from '@frontend/components/ui/button';
import { formatDay } from '@frontend/lib/format';
import { addDays } from '@shared/domain/calendar/plant-date';
import { CaseNumberField } from './case-number-field';
import { InputGroup, SourceBadge, type InputGroupProps } from './input-group';

type Range = { from: string; to: string };

function RangeList({
  label,
  ranges,
  editable,
  onChange,
  newRange,
}: {
  label: string;
  ranges: Range[];
  editable: boolean;
  onChange: (next: Range[]) => void;
  newRange: () => Range;
}) {
  if (!editable) {
    return ranges.length === 0 ? (
      <p className="text-sm text-ink-soft">None</p>
    ) : (
      <ul className="text-sm">
        {ranges.map((r) => (
          <li key={`${r.from}-${r.to}`} className="tabular-nums">
            {formatDay(r.from)} – {formatDay(r.to)}
          </li>
        ))}
      </ul>
    );
  }
  const set = (i: number, patch: Partial<Range>) => onChange(ranges.map((r, j) => (j === i ? { ...r, ...patch } : r)));
  return (
    <div className="flex flex-col gap-2">
      {ranges.map((r, i) => (
        <div key={i} className="grid grid-cols-[1fr_1fr_auto] items-end gap-2">
          <DayField label={`${label} ${i + 1} from`} value={r.from} onChange={(v) => ISO_DAY.test(v) && set(i, { from: v })} />
          <DayField label="to" value={r.to} onChange={(v) => ISO_DAY.test(v) && set(i, { to: v })} />
          <Button variant="quiet" onClick={() => onChange(ranges.filter((_, j) => j !== i))}>
            Remove
          </Button>
        </div>
      ))}
      <Button variant="quiet" className="self-start text-xs" onClick={() => onChange([...ranges, newRange()])}>
        Add {label.toLowerCase()}
      </Button>
    </div>
  );
}

/** Planned outages (a cleaning that needs the unit off line costs no lost generation inside one) and allowed windows. */
export function OutageInputs(props: InputGroupProps) {
  const { inputs, editable, units, change } = props;
  const set = (patch: Partial<CalcScheduleInput>) => change((d) => ({ ...d, ...patch }));
  const monthIn = (): Range => ({ from: addDays(inputs.startDate, 30), to: addDays(inputs.startDate, 44) });
  return (
    <InputGroup
      title="Outages and windows"
      what="Planned outages are shaded on the schedule; windows, when given, are the only days a cleaning may start."
      testId="inputs-outages"
    >
      <SourceBadge sourceKey="plannedOutages" props={props} />
      <RangeList
        label="Outage"
        ranges={inputs.plannedOutages ?? []}
        editable={editable}
        onChange={(next) => set({ plannedOutages: next })}
        newRange={monthIn}
      />
      <SourceBadge sourceKey="windows" props={props} />
      <p className="text-sm font-medium">Cleaning windows</p>
      <RangeList
        label="Window"
        ranges={inputs.windows ?? []}
        editable={editable}
        onChange={(next) => set({ windows: next.length ? next : undefined })}
        newRange={monthIn}
      />
      <CaseNumberField
        label="Least days between cleanings"
        unit={units.days}
        value={inputs.minSpacingDays ?? 0}
        min={0}
        integer
        editable={editable}
        onValue={(v) => set({ minSpacingDays: v })}
        className="max-w-56"
      />
    </InputGroup>
  );
}
