import { useState } from 'react';
import type { Permission } from '@shared/permissions';
import type { CalcScheduleInput, CalcScheduleOutput } from '@shared/schemas/calc-schedule';
import type { CaseView } from '@shared/schemas/cases';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { UnsavedChangesGuard } from '@frontend/components/ui/unsaved-changes';
import type { UnitSystem } from '@frontend/lib/field-units';
import { formatNumber } from '@frontend/lib/format';
import { useUpdateCase } from '../api/update-case';
import { useWhatIf } from '../what-if/use-what-if';
import { ApprovalBar } from './approval-bar';
import { CaseInputs } from './case-inputs';
import { CaseResults } from './case-results';
import { caseUnits } from './case-units';

interface Props {
  organisationId: string;
  view: CaseView;
  system: UnitSystem;
  me: { id: string; permissions: readonly Permission[] };
  narrow: boolean;
}

type Uncertainty = Pick<CalcScheduleOutput, 'sensitivity' | 'monteCarlo'>;

/**
 * The case's inputs beside its figures. An edit recomputes in the browser (a worker) at once; the page says
 * "Unsaved changes" until the draft is saved, and then shows the figures the server computed and stored.
 */
export function CaseWorkspace({ organisationId, view, system, me, narrow }: Props) {
  const [draft, setDraft] = useState<CalcScheduleInput | null>(null);
  // a new key remounts the fields, so after a save or a discard they show the stored values again
  const [fieldsKey, setFieldsKey] = useState(0);
  const whatIf = useWhatIf(draft, view.actions.edit ? view.inputs : null);
  const update = useUpdateCase(organisationId, view.id);
  // while the uncertainty of the newest edit is computed, the last one computed stays on screen, faded
  const previousUncertainty: Uncertainty | null = draft && !draft.uncertainty ? null : (whatIf.full ?? view.results);

  const inputs = draft ?? view.inputs;
  const shown = draft ? ((whatIf.computingUncertainty ? whatIf.figures : (whatIf.full ?? whatIf.figures)) ?? view.results) : view.results;
  const units = caseUnits(system, view.currency);
  const reset = () => {
    setDraft(null);
    setFieldsKey((k) => k + 1);
  };
  return (
    <div className="flex flex-col gap-4">
      <UnsavedChangesGuard dirty={draft !== null && !update.isPending} />
      <ApprovalBar organisationId={organisationId} view={view} me={me} unsaved={draft !== null} />
      {draft && (
        <div
          className="sticky top-0 z-10 flex flex-wrap items-center gap-3 rounded border border-ledger-600/40 bg-ledger-50 px-3 py-2 text-sm print:hidden"
          data-testid="case-unsaved"
        >
          <span className="font-medium text-ledger-700">Unsaved changes</span>
          <span
            className="text-xs text-ink-soft"
            data-testid="case-what-if-timing"
            data-ms={whatIf.figuresMs === null ? '' : whatIf.figuresMs.toFixed(0)}
            data-compute-ms={whatIf.figuresComputeMs === null ? '' : whatIf.figuresComputeMs.toFixed(0)}
          >
            {whatIf.computingFigures ? 'computing here…' : whatIf.figuresMs !== null ? `figures computed here in ${formatNumber(whatIf.figuresMs)} ms` : ''}
            {whatIf.computingUncertainty
              ? ' · uncertainty updating…'
              : whatIf.uncertaintyMs !== null
                ? ` · uncertainty in ${formatNumber(whatIf.uncertaintyMs)} ms`
                : ''}
          </span>
          <span className="ml-auto flex gap-2">
            <Button variant="quiet" onClick={reset} disabled={update.isPending}>
              Discard
            </Button>
            <Button disabled={update.isPending || whatIf.error !== null} onClick={() => update.mutate({ inputs: draft }, { onSuccess: reset })}>
              {update.isPending ? 'Saving…' : 'Save'}
            </Button>
          </span>
        </div>
      )}
      {whatIf.error && <Notice tone="fault">These inputs cannot be computed: {whatIf.error}</Notice>}
      {update.isError && <Notice tone="fault">Not saved: {update.error.message}</Notice>}
      <div className="grid gap-4 lg:grid-cols-[minmax(0,5fr)_minmax(0,7fr)]">
        <section aria-label="Inputs" className="flex flex-col gap-2">
          <h2 className="text-base font-semibold">Inputs</h2>
          {!view.actions.edit && (
            <p className="text-xs text-ink-soft">
              {view.status === 'draft' || view.status === 'returned'
                ? 'Only the author, analysts and administrators change the inputs.'
                : 'The inputs are fixed once the case is submitted; copy it as a new draft to change them.'}
            </p>
          )}
          <CaseInputs
            key={fieldsKey}
            inputs={inputs}
            saved={view.inputs}
            sources={view.inputSources}
            editable={view.actions.edit}
            units={units}
            change={(edit) => setDraft((d) => edit(d ?? view.inputs))}
          />
        </section>
        {/* on a narrow screen the figures come first: most readers decide from them */}
        <section aria-label="Results" className="order-first flex flex-col gap-2 lg:order-none">
          <h2 className="text-base font-semibold">Results {draft && <span className="text-xs font-normal text-ledger-700">for the unsaved changes</span>}</h2>
          <CaseResults
            results={shown}
            inputs={inputs}
            currency={view.currency}
            uncertaintyUpdating={draft !== null && whatIf.computingUncertainty}
            previousUncertainty={previousUncertainty}
            narrow={narrow}
            caseWarnings={draft ? [] : view.caseWarnings}
          />
        </section>
      </div>
    </div>
  );
}
