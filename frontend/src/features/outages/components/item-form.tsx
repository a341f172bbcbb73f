import { useRef, useState, type FormEvent } from 'react';
import {
  BENEFIT_HORIZON_DAYS_RANGE,
  cleanlinessBenefit,
  itemBenefit,
  OUTAGE_ITEM_KIND_WORDS,
  OUTAGE_ITEM_KINDS,
  outageItemCreate,
  outageItemPatch,
  type OutageItemKind,
  type OutageItemView,
  type OutageView,
} from '@shared/schemas/outages';
import { FormActions } from '@frontend/components/ui/form-actions';
import { FormProblems, useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import { Notice } from '@frontend/components/ui/notice';
import { QuantityField } from '@frontend/components/ui/quantity-field';
import { RequiredMark, RequiredNote } from '@frontend/components/ui/required-mark';
import { SelectField } from '@frontend/components/ui/select-field';
import { TextField } from '@frontend/components/ui/text-field';
import { UnsavedChangesGuard } from '@frontend/components/ui/unsaved-changes';
import { parseNumberText } from '@frontend/lib/field-units';
import { formMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useAddOutageItem, useUpdateOutageItem } from '../api/outage-items';

/** An approved cleaning case the item form offers for a unit. */
export interface ApprovedCaseChoice {
  id: string;
  title: string;
  unitId: string;
}

type BenefitWay = 'money' | 'cleanliness';
type Forced = '' | 'in' | 'out';

interface Props {
  organisationId: string;
  outage: OutageView;
  /** the organisation's approved cases (undefined while they load) */
  approvedCases?: ApprovedCaseChoice[];
  /** the item being changed; none: a new item */
  item?: OutageItemView;
  onDone?: () => void;
}

const [moneyBenefit] = itemBenefit.options;

export const FORCED_WORDS: Record<Forced, string> = { '': 'The optimiser decides', in: 'Always in', out: 'Always out' };

const numText = (v: number | null | undefined) => (v === null || v === undefined ? '' : String(v));
const pointsText = (fraction: number) => String(Number((fraction * 100).toFixed(2)));

/**
 * Add or change one candidate item. A case's cleaning is picked from the unit's approved cases and takes its
 * benefit from the case; other work is entered by hand with its benefit as money, or as a cleanliness recovered
 * that the server prices with the unit's model over a horizon.
 */
export function ItemForm({ organisationId, outage, approvedCases, item, onDone }: Props) {
  const add = useAddOutageItem(organisationId, outage.id);
  const update = useUpdateOutageItem(organisationId);
  const mutation = item ? update : add;
  const entered = item?.benefitEntered;
  const initial = {
    unitId: item?.unitId ?? (outage.units.length === 1 ? (outage.units[0]?.id ?? '') : ''),
    kind: (item?.kind ?? 'case-cleaning') as OutageItemKind,
    caseId: item?.caseId ?? '',
    title: item?.title ?? '',
    cost: numText(item?.cost),
    duration: numText(item?.durationDays),
    lane: item?.lane ?? '',
    way: (typeof entered === 'object' && entered !== null ? 'cleanliness' : 'money') as BenefitWay,
    money: typeof entered === 'number' ? String(entered) : '',
    points: typeof entered === 'object' && entered !== null ? pointsText(entered.cleanlinessRecovered) : '',
    horizon: typeof entered === 'object' && entered !== null ? String(entered.horizonDays) : '365',
    needs: item?.needs ?? [],
    forced: (item?.forced ?? '') as Forced,
  };
  const [base, setBase] = useState(initial);
  const [v, setV] = useState(initial);
  const set =
    <K extends keyof typeof initial>(key: K) =>
    (value: (typeof initial)[K]) =>
      setV((s) => ({ ...s, [key]: value }));
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [added, setAdded] = useState<string | null>(null);
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, fieldErrors);
  const dirty = !mutation.isPending && JSON.stringify(v) !== JSON.stringify(base);

  const fromCase = v.kind === 'case-cleaning';
  const casesOfUnit = (approvedCases ?? []).filter((c) => c.unitId === v.unitId);
  const lanes = [...new Set(outage.items.map((i) => i.lane))];
  const others = outage.items.filter((i) => i.id !== item?.id);

  /** The benefit's own problems, in the form's words, beside its fields (the schema's union speaks of the API's shapes). */
  const benefitProblems = (): FieldErrors => {
    if (fromCase) return {};
    if (v.way === 'money') {
      const r = moneyBenefit.safeParse(parseNumberText(v.money));
      return r.success ? {} : { benefit: r.error.issues[0]?.message ?? 'Enter the benefit' };
    }
    const r = cleanlinessBenefit.safeParse(benefit());
    if (r.success) return {};
    const out: FieldErrors = {};
    for (const issue of r.error.issues) out[issue.path[0] === 'horizonDays' ? 'horizon' : 'benefit'] ??= issue.message;
    return out;
  };
  const refuse = (errors: FieldErrors) => setFieldErrors({ ...errors, ...benefitProblems() });

  const benefit = () => {
    if (v.way === 'money') return parseNumberText(v.money);
    const points = parseNumberText(v.points);
    return { cleanlinessRecovered: points === undefined || Number.isNaN(points) ? points : points / 100, horizonDays: parseNumberText(v.horizon) };
  };
  const optionalNumber = (text: string) => (text.trim() === '' ? undefined : parseNumberText(text));

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const onError = (e: Error) => setFieldErrors(serverFieldErrors(e));
    if (item) {
      const next = {
        title: v.title.trim(),
        cost: parseNumberText(v.cost),
        durationDays: parseNumberText(v.duration),
        lane: v.lane,
        benefit: fromCase ? undefined : benefit(),
        needs: v.needs,
        forced: v.forced || null,
      };
      const before = {
        title: item.title,
        cost: item.cost,
        durationDays: item.durationDays,
        lane: item.lane,
        benefit: fromCase ? undefined : (item.benefitEntered ?? undefined),
        needs: item.needs,
        forced: item.forced,
      };
      const changed = Object.fromEntries(Object.entries(next).filter(([k, x]) => JSON.stringify(x) !== JSON.stringify(before[k as keyof typeof before])));
      const parsed = outageItemPatch.safeParse(changed);
      if (!parsed.success || Object.keys(benefitProblems()).length) return refuse(parsed.success ? {} : zodFieldErrors(parsed.error));
      setFieldErrors({});
      update.mutate({ id: item.id, patch: parsed.data }, { onSuccess: () => onDone?.(), onError });
      return;
    }
    const parsed = outageItemCreate.safeParse({
      unitId: v.unitId,
      kind: v.kind,
      caseId: fromCase ? v.caseId || undefined : undefined,
      title: v.title.trim() === '' && fromCase ? undefined : v.title,
      cost: fromCase ? optionalNumber(v.cost) : parseNumberText(v.cost),
      durationDays: fromCase ? optionalNumber(v.duration) : parseNumberText(v.duration),
      lane: v.lane,
      benefit: fromCase ? undefined : benefit(),
      needs: v.needs.length ? v.needs : undefined,
      forced: v.forced || undefined,
    });
    if (!parsed.success || Object.keys(benefitProblems()).length) return refuse(parsed.success ? {} : zodFieldErrors(parsed.error));
    setFieldErrors({});
    setAdded(null);
    add.mutate(parsed.data, {
      onSuccess: () => {
        setAdded(parsed.data.title ?? 'The case’s cleaning');
        // the next item starts on the same unit and lane, and leaving now asks nothing
        const next = { ...initial, unitId: v.unitId, lane: v.lane };
        setBase(next);
        setV(next);
      },
      onError,
    });
  };

  const message = formMessage(mutation.error);
  const benefitError = fieldErrors.benefit;
  return (
    <form
      ref={formRef}
      onSubmit={onSubmit}
      noValidate
      aria-label={item ? `Change ${item.title}` : 'Add work'}
      className="flex flex-col gap-3 rounded border border-rule bg-paper-raised p-4"
      onKeyDown={(e) => e.key === 'Escape' && item && onDone?.()}
      data-testid="outage-item-form"
    >
      <UnsavedChangesGuard dirty={dirty} />
      {!item && <h3 className="text-base font-semibold">Add work</h3>}
      <RequiredNote />
      <FormProblems errors={fieldErrors} />
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <SelectField
          required
          label="Unit"
          value={v.unitId}
          disabled={!!item}
          onChange={(e) => setV((s) => ({ ...s, unitId: e.target.value, caseId: '' }))}
          error={fieldErrors.unitId}
          hint={item ? 'To move work to another unit, remove it and add it there' : undefined}
        >
          <option value="">Choose…</option>
          {outage.units.map((u) => (
            <option key={u.id} value={u.id}>
              {u.plantName} — {u.name}
            </option>
          ))}
        </SelectField>
        <SelectField
          required
          label="Kind of work"
          value={v.kind}
          disabled={!!item}
          onChange={(e) => set('kind')(e.target.value as OutageItemKind)}
          error={fieldErrors.kind}
        >
          {OUTAGE_ITEM_KINDS.map((k) => (
            <option key={k} value={k}>
              {OUTAGE_ITEM_KIND_WORDS[k]}
            </option>
          ))}
        </SelectField>
        {fromCase && !item && (
          <div className="sm:col-span-2">
            <SelectField
              required
              label="Approved case"
              value={v.caseId}
              onChange={(e) => set('caseId')(e.target.value)}
              error={fieldErrors.caseId}
              hint={
                !v.unitId
                  ? 'Choose the unit first'
                  : approvedCases === undefined
                    ? 'Reading the approved cases…'
                    : casesOfUnit.length === 0
                      ? 'This unit has no approved case: approve one first, or enter the work by hand'
                      : 'Its first cleaning, priced against the case’s own baseline'
              }
            >
              <option value="">Choose…</option>
              {casesOfUnit.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.title}
                </option>
              ))}
            </SelectField>
          </div>
        )}
      </div>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <div className="sm:col-span-2">
          <TextField
            required={!fromCase}
            label={fromCase && !item ? 'Title (optional)' : 'Title'}
            value={v.title}
            maxLength={120}
            onChange={(e) => set('title')(e.target.value)}
            error={fieldErrors.title}
            placeholder={fromCase ? 'From the case’s cleaning' : 'e.g. Plug leaking tubes, waterbox B'}
          />
        </div>
        <QuantityField
          required={!fromCase}
          label={fromCase && !item ? 'Cost (optional)' : 'Cost'}
          unit={outage.currency}
          value={v.cost}
          onChange={set('cost')}
          error={fieldErrors.cost}
          placeholder={fromCase && !item ? 'from the case' : undefined}
        />
        <QuantityField
          required={!fromCase}
          label={fromCase && !item ? 'Duration (optional)' : 'Duration'}
          unit="days"
          value={v.duration}
          onChange={set('duration')}
          error={fieldErrors.durationDays}
          placeholder={fromCase && !item ? 'from the case' : undefined}
        />
      </div>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <div>
          <TextField
            required
            label="Crew lane"
            value={v.lane}
            maxLength={40}
            list="outage-lanes"
            onChange={(e) => set('lane')(e.target.value)}
            error={fieldErrors.lane}
            hint="Work in one lane runs one job after another; lanes run side by side"
            placeholder="e.g. Waterbox crew"
          />
          <datalist id="outage-lanes">
            {lanes.map((l) => (
              <option key={l} value={l} />
            ))}
          </datalist>
        </div>
        <SelectField label="Optimiser" value={v.forced} onChange={(e) => set('forced')(e.target.value as Forced)} error={fieldErrors.forced}>
          {(['', 'in', 'out'] as const).map((f) => (
            <option key={f} value={f}>
              {FORCED_WORDS[f]}
            </option>
          ))}
        </SelectField>
      </div>
      {fromCase ? (
        <p className="text-xs text-ink-soft">The benefit comes from the case: the saving of doing its cleaning in this outage against the case’s baseline.</p>
      ) : (
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-1 text-sm font-medium text-ink">
            Benefit
            <RequiredMark />
          </legend>
          <div className="flex flex-wrap gap-4 text-sm">
            <label className="flex items-center gap-2">
              <input type="radio" name="benefit-way" checked={v.way === 'money'} onChange={() => set('way')('money')} />
              As money
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" name="benefit-way" checked={v.way === 'cleanliness'} onChange={() => set('way')('cleanliness')} />
              As cleanliness recovered, priced with the unit’s model
            </label>
          </div>
          <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
            {v.way === 'money' ? (
              <QuantityField required label="Benefit" unit={outage.currency} value={v.money} onChange={set('money')} error={benefitError} />
            ) : (
              <>
                <QuantityField
                  required
                  label="Cleanliness recovered"
                  unit="points"
                  value={v.points}
                  onChange={set('points')}
                  error={benefitError}
                  hint="Points of cleanliness factor, e.g. 4 for 78 % → 82 %"
                />
                <QuantityField
                  required
                  label="Horizon"
                  unit="days"
                  value={v.horizon}
                  onChange={set('horizon')}
                  error={fieldErrors.horizon}
                  hint={`How long the gain lasts, ${BENEFIT_HORIZON_DAYS_RANGE.min} to ${BENEFIT_HORIZON_DAYS_RANGE.max} days`}
                />
              </>
            )}
          </div>
        </fieldset>
      )}
      {others.length > 0 && (
        <fieldset className="flex flex-col gap-1" aria-describedby={fieldErrors.needs ? 'item-needs-error' : undefined}>
          <legend className="mb-1 text-sm font-medium text-ink">Needs (chosen only together with)</legend>
          <div className="grid gap-x-4 gap-y-1 sm:grid-cols-2">
            {others.map((o) => (
              <label key={o.id} className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  checked={v.needs.includes(o.id)}
                  onChange={(e) => set('needs')(e.target.checked ? [...v.needs, o.id] : v.needs.filter((x) => x !== o.id))}
                />
                {o.title} <span className="text-xs text-ink-faint">({o.unitName})</span>
              </label>
            ))}
          </div>
          {fieldErrors.needs && (
            <p id="item-needs-error" className="text-xs text-fault">
              {fieldErrors.needs}
            </p>
          )}
        </fieldset>
      )}
      {fieldErrors.form && <Notice tone="fault">{fieldErrors.form}</Notice>}
      {message && <Notice tone="fault">{message}</Notice>}
      {added && !item && <Notice tone="ok">Added: {added}. Propose a scope again to include it.</Notice>}
      <FormActions editing={!!item} cancellable={!!onDone} pending={mutation.isPending} addLabel="Add work" saveLabel="Save work" onCancel={onDone} />
    </form>
  );
}
