import { useRef, useState, type FormEvent } from 'react';
import { turbineSetup, type TurbineSetup } from '@shared/schemas/unit-setup';
import { Button } from '@frontend/components/ui/button';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { Notice } from '@frontend/components/ui/notice';
import { FormProblems, useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import { RequiredNote } from '@frontend/components/ui/required-mark';
import { UnsavedChangesGuard } from '@frontend/components/ui/unsaved-changes';
import { useDirty } from '@frontend/lib/use-dirty';
import { QuantityField } from '@frontend/components/ui/quantity-field';
import { parseNumberText, type FieldUnits } from '@frontend/lib/field-units';
import { formMessage, serverFieldErrors, zodFieldErrorsByRow, type FieldErrors } from '@frontend/lib/form-errors';
import { useSaveSetupPart } from '../api/save-setup-part';
import { curveFromDraft, draftFromCurve, type CurveDraft } from './correction-curve-draft';
import { CorrectionCurveEditor } from './correction-curve-editor';
import { textFromStored } from './setup-fields';
import { TurbineValues } from './turbine-values';

interface Props {
  organisationId: string;
  unitId: string;
  saved: TurbineSetup | null;
  units: FieldUnits;
  cannotWrite: string | null;
}

interface DutyRow {
  loadPct: string;
  duty: string;
}

const cellInput = 'w-28 rounded border border-rule bg-paper-raised px-2 py-1 text-right text-sm tabular-nums';

/** The turbine section: the form for people who may change the unit, its saved values as text for the rest. */
export function TurbineForm(props: Props) {
  return props.cannotWrite ? <TurbineValues saved={props.saved} units={props.units} /> : <TurbineEditor {...props} />;
}

function TurbineEditor({ organisationId, unitId, saved, units }: Omit<Props, 'cannotWrite'>) {
  const save = useSaveSetupPart(organisationId, unitId, 'turbine');
  const [rating, setRating] = useState(textFromStored(saved?.ratingMw, { unit: units.powerMw }));
  const [heatRate, setHeatRate] = useState(textFromStored(saved?.designHeatRateBtuKwh, { unit: units.heatRateBtuKwh }));
  const [minimumLoad, setMinimumLoad] = useState(textFromStored(saved?.minimumLoadFraction ?? 0.4, 'percent'));
  const [duty, setDuty] = useState<DutyRow[]>(
    saved?.heatBalanceDuty.map((d) => ({ loadPct: textFromStored(d.loadFraction, 'percent'), duty: textFromStored(d.dutyMw, { unit: units.powerMw }) })) ?? [
      { loadPct: '50', duty: '' },
      { loadPct: '75', duty: '' },
      { loadPct: '100', duty: '' },
    ],
  );
  const [curve, setCurve] = useState<CurveDraft>(() => draftFromCurve(saved?.correctionCurve ?? null, units.pressureKpa));
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, fieldErrors);
  const { dirty, rebase } = useDirty({ rating, heatRate, minimumLoad, duty, curve });
  const [savedAt, setSavedAt] = useState<number | null>(null);

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const num = (t: string) => parseNumberText(t);
    const ratingMw = num(rating);
    const heatRateDisplay = num(heatRate);
    const minLoad = num(minimumLoad);
    const correctionCurve = curveFromDraft(curve, units.pressureKpa);
    const parsed = turbineSetup.safeParse({
      ratingMw,
      designHeatRateBtuKwh: heatRateDisplay === undefined || Number.isNaN(heatRateDisplay) ? heatRateDisplay : units.heatRateBtuKwh.toSi(heatRateDisplay),
      minimumLoadFraction: minLoad === undefined ? undefined : minLoad / 100,
      heatBalanceDuty: duty
        .filter((d) => d.loadPct.trim() || d.duty.trim())
        .map((d) => ({ loadFraction: (num(d.loadPct) ?? Number.NaN) / 100, dutyMw: units.powerMw.toSi(num(d.duty) ?? Number.NaN) })),
      correctionCurve,
    });
    if (!parsed.success) {
      const errors = zodFieldErrorsByRow(parsed.error, { loadFraction: 'load', dutyMw: 'duty' });
      const curveIssue = parsed.error.issues.find((i) => i.path[0] === 'correctionCurve');
      if (curveIssue && correctionCurve) {
        const load = typeof curveIssue.path[2] === 'number' ? correctionCurve.curves[curveIssue.path[2]]?.loadFraction : undefined;
        const what = curveIssue.path.at(-1) === 'backpressureKpa' ? 'a backpressure ' : curveIssue.path.at(-1) === 'changePct' ? 'a change % ' : '';
        errors.correctionCurve = `${load !== undefined ? `At ${Number.isNaN(load) ? 'a blank' : `${Number((load * 100).toFixed(1))} %`} load, ${what}` : ''}${curveIssue.message}`;
      }
      return setFieldErrors(errors);
    }
    setFieldErrors({});
    save.mutate(parsed.data, {
      onSuccess: () => {
        setSavedAt(Date.now());
        rebase();
      },
      onError: (e) => setFieldErrors(serverFieldErrors(e)),
    });
  };

  const message = formMessage(save.error);
  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate aria-label="Turbine" className="flex flex-col gap-5">
      <UnsavedChangesGuard dirty={dirty && !save.isPending} />
      <RequiredNote />
      <FormProblems errors={fieldErrors} />
      <div className="grid gap-3 sm:grid-cols-3">
        <QuantityField required label="Rating" unit={units.powerMw.label} value={rating} onChange={setRating} error={fieldErrors.ratingMw} />
        <QuantityField
          required
          label="Design heat rate"
          unit={units.heatRateBtuKwh.label}
          value={heatRate}
          onChange={setHeatRate}
          error={fieldErrors.designHeatRateBtuKwh}
        />
        <QuantityField
          required
          label="Minimum load for a valid point"
          unit="% of rating"
          value={minimumLoad}
          onChange={setMinimumLoad}
          error={fieldErrors.minimumLoadFraction}
          hint="Points below it are stored but left out"
        />
      </div>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-semibold text-ink">Condenser duty from the heat balance</legend>
        <p className="text-xs text-ink-soft">Heat rejected to the condenser at each load, from the turbine heat balance diagrams; at least two loads.</p>
        <div className="max-w-md">
          <DataTable
            caption="Heat-balance duty against load"
            head={
              <>
                <th className={`${th} text-right`}>Load (% of rating)</th>
                <th className={`${th} text-right`}>
                  Duty <span className="normal-case">({units.powerMw.label})</span>
                </th>
                <th className={th}>
                  <span className="sr-only">Remove</span>
                </th>
              </>
            }
          >
            {duty.map((d, i) => (
              <tr key={i} className={tr} data-testid="duty-row">
                <td className={`${td} text-right`}>
                  <input
                    aria-label={`Load of duty row ${i + 1}`}
                    className={cellInput}
                    inputMode="decimal"
                    value={d.loadPct}
                    onChange={(e) => setDuty(duty.map((x, k) => (k === i ? { ...x, loadPct: e.target.value } : x)))}
                  />
                </td>
                <td className={`${td} text-right`}>
                  <input
                    aria-label={`Duty at row ${i + 1}`}
                    className={cellInput}
                    inputMode="decimal"
                    value={d.duty}
                    onChange={(e) => setDuty(duty.map((x, k) => (k === i ? { ...x, duty: e.target.value } : x)))}
                  />
                </td>
                <td className={`${td} text-right`}>
                  <Button variant="quiet" aria-label={`Remove duty row ${i + 1}`} onClick={() => setDuty(duty.filter((_, k) => k !== i))}>
                    Remove
                  </Button>
                </td>
              </tr>
            ))}
          </DataTable>
        </div>
        <div>
          <Button variant="quiet" onClick={() => setDuty([...duty, { loadPct: '', duty: '' }])}>
            Add load
          </Button>
        </div>
        {fieldErrors.heatBalanceDuty && <p className="text-xs text-fault">{fieldErrors.heatBalanceDuty}</p>}
      </fieldset>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-semibold text-ink">Exhaust-pressure correction curves</legend>
        <p className="text-xs text-ink-soft">
          How heat rate (or output) changes with backpressure at each load; turns a backpressure deviation into fuel and money. Saved with the turbine.
        </p>
        <CorrectionCurveEditor draft={curve} onChange={setCurve} pressure={units.pressureKpa} error={fieldErrors.correctionCurve} />
      </fieldset>

      {message && <Notice tone="fault">{message}</Notice>}
      {savedAt && !save.isPending && !save.isError && <Notice tone="ok">Turbine saved. The unit’s derived data is being recomputed.</Notice>}
      <div>
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save turbine'}
        </Button>
      </div>
    </form>
  );
}
