import type { ReactNode } from 'react';
import type { CalcScheduleInput } from '@shared/schemas/calc-schedule';
import type { InputSource, InputSources } from '@shared/schemas/cases';
import type { CaseUnits } from './case-units';

/** What every input group is given: the draft, the saved inputs (to tell what changed), and how to change it. */
export interface InputGroupProps {
  inputs: CalcScheduleInput;
  saved: CalcScheduleInput;
  sources: InputSources;
  editable: boolean;
  units: CaseUnits;
  change: (update: (draft: CalcScheduleInput) => CalcScheduleInput) => void;
}

const BADGE: Record<InputSource, string> = {
  measured: 'border-tube-600/40 bg-tube-50 text-tube-700',
  prefilled: 'border-rule bg-paper-sunk text-ink-soft',
  entered: 'border-ledger-600/40 bg-ledger-50 text-ledger-700',
};

const valueAt = (inputs: CalcScheduleInput, key: string): unknown =>
  key.split('.').reduce<unknown>((v, k) => (v && typeof v === 'object' ? (v as Record<string, unknown>)[k] : undefined), inputs);

/** Where one input came from; an input changed here and not yet saved reads "entered" with that said. */
export function SourceBadge({ sourceKey, props }: { sourceKey: string; props: InputGroupProps }) {
  const changed = JSON.stringify(valueAt(props.inputs, sourceKey)) !== JSON.stringify(valueAt(props.saved, sourceKey));
  const entry = changed ? { source: 'entered' as const, detail: 'changed here, not saved yet' } : props.sources[sourceKey];
  if (!entry) return null;
  return (
    <p className="flex flex-wrap items-baseline gap-x-2 gap-y-0.5 text-xs" data-testid={`source-${sourceKey}`}>
      <span className={`rounded border px-1.5 py-px text-2xs font-medium uppercase tracking-wide ${BADGE[entry.source]}`}>{entry.source}</span>
      <span className="text-ink-faint">{entry.detail}</span>
    </p>
  );
}

/** One group of inputs, a fieldset with its heading and a line on what it is for. */
export function InputGroup({ title, what, children, testId }: { title: string; what: string; children: ReactNode; testId: string }) {
  return (
    <fieldset className="flex flex-col gap-3 rounded border border-rule bg-paper-raised p-3" data-testid={testId}>
      <legend className="px-1 text-sm font-semibold">{title}</legend>
      <p className="-mt-1 text-xs text-ink-soft">{what}</p>
      {children}
    </fieldset>
  );
}
