import { useRef, useState, type FormEvent } from 'react';
import { UNIT_CONDITION_KINDS, type UnitConditionKind } from '@shared/domain/portfolio/unit-conditions';
import {
  CONDITION_EXPLAINED,
  notificationSettingsBody,
  type NotificationSettingsBody,
  type NotificationSettingsResponse,
  type NotificationUnit,
} from '@shared/schemas/notifications';
import { Button } from '@frontend/components/ui/button';
import { FormProblems, useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import { Notice } from '@frontend/components/ui/notice';
import { RequiredMark } from '@frontend/components/ui/required-mark';
import { UnsavedChangesGuard } from '@frontend/components/ui/unsaved-changes';
import { ApiError } from '@frontend/lib/api-client';
import { formMessage, type FieldErrors } from '@frontend/lib/form-errors';
import { useDirty } from '@frontend/lib/use-dirty';
import { useSaveNotifications } from '../api/save-notifications';

interface RowDraft {
  kinds: UnitConditionKind[];
  days: string;
}
interface Draft {
  weeklyDigest: boolean;
  all: RowDraft;
  units: Record<string, RowDraft>;
}

const ALL = 'all';

function draftOf(s: NotificationSettingsResponse): Draft {
  const fallback = String(s.dataStoppedDays.default);
  return {
    weeklyDigest: s.weeklyDigest,
    all: { kinds: s.allUnits?.kinds ?? [], days: String(s.allUnits?.dataStoppedDays ?? fallback) },
    units: Object.fromEntries(
      s.available.map((u) => {
        const own = s.units.find((x) => x.unitId === u.unitId);
        return [u.unitId, { kinds: own?.kinds ?? [], days: String(own?.dataStoppedDays ?? fallback) }];
      }),
    ),
  };
}

/** Days as typed; an empty or unreadable entry stays NaN so the schema names the problem. Unused days keep the default. */
const daysOf = (row: RowDraft, fallback: number) => (row.kinds.includes('data-stopped') ? (row.days.trim() === '' ? NaN : Number(row.days)) : fallback);

/** What is sent, and for each sent unit row the unit it stands for (to put a problem beside the right field). */
function bodyOf(d: Draft, units: NotificationUnit[], fallback: number): { body: NotificationSettingsBody; rowUnits: string[] } {
  const rows = units.filter((u) => (d.units[u.unitId]?.kinds.length ?? 0) > 0);
  return {
    body: {
      weeklyDigest: d.weeklyDigest,
      allUnits: d.all.kinds.length > 0 ? { kinds: d.all.kinds, dataStoppedDays: daysOf(d.all, fallback) } : null,
      units: rows.map((u) => ({ unitId: u.unitId, kinds: d.units[u.unitId]!.kinds, dataStoppedDays: daysOf(d.units[u.unitId]!, fallback) })),
    },
    rowUnits: rows.map((u) => u.unitId),
  };
}

/** Problems keyed by row (ALL or a unit id), from a path like ["units", 2, "dataStoppedDays"] or "allUnits.dataStoppedDays". */
function rowErrors(issues: { path: (string | number)[]; message: string }[], rowUnits: string[]): FieldErrors {
  const out: FieldErrors = {};
  for (const { path, message } of issues) {
    const key = path[0] === 'allUnits' ? ALL : path[0] === 'units' && typeof path[1] === 'number' ? (rowUnits[path[1]] ?? 'form') : 'form';
    out[key] ??= message;
  }
  return out;
}

/** Units by client group, then plant, in the order the server lists them. */
function grouped(units: NotificationUnit[]) {
  const groups = new Map<string, { name: string; plants: Map<string, { name: string; units: NotificationUnit[] }> }>();
  for (const u of units) {
    const gKey = u.clientGroup?.id ?? '';
    const g = groups.get(gKey) ?? { name: u.clientGroup?.name ?? 'Not in a client group', plants: new Map() };
    const p = g.plants.get(u.plantId) ?? { name: u.plantName, units: [] };
    p.units.push(u);
    g.plants.set(u.plantId, p);
    groups.set(gKey, g);
  }
  return [...groups.values()];
}

function ConditionRow({
  id,
  label,
  name = label,
  row,
  error,
  limits,
  onChange,
}: {
  id: string;
  label: string;
  /** the row's accessible name: the unit with its plant (unit names repeat across plants) */
  name?: string;
  row: RowDraft;
  error?: string;
  limits: { min: number; max: number };
  onChange: (row: RowDraft) => void;
}) {
  const toggle = (kind: UnitConditionKind, on: boolean) =>
    onChange({ ...row, kinds: UNIT_CONDITION_KINDS.filter((k) => (k === kind ? on : row.kinds.includes(k))) });
  const daysOn = row.kinds.includes('data-stopped');
  return (
    <fieldset
      className="flex flex-col gap-2 border-t border-rule py-3 sm:flex-row sm:flex-wrap sm:items-center sm:gap-x-5"
      aria-label={name}
      data-testid={id === 'all-units' ? 'all-units-row' : 'unit-alert-row'}
    >
      <legend className="sr-only">{name}</legend>
      <span className="text-sm font-medium text-ink sm:w-48">{label}</span>
      {UNIT_CONDITION_KINDS.map((kind) => (
        <label key={kind} className="flex min-h-8 items-center gap-2 text-sm">
          <input
            type="checkbox"
            checked={row.kinds.includes(kind)}
            onChange={(e) => toggle(kind, e.target.checked)}
            aria-label={`${CONDITION_EXPLAINED[kind].title}: ${name}`}
          />
          {CONDITION_EXPLAINED[kind].title}
        </label>
      ))}
      <div className="flex flex-col gap-1">
        <div className="flex items-center gap-2 text-sm">
          <label htmlFor={`${id}-days`}>after</label>
          <input
            id={`${id}-days`}
            inputMode="numeric"
            className={`w-16 rounded border bg-paper-raised px-2 py-1 text-sm ${error ? 'border-fault' : 'border-rule'}`}
            value={row.days}
            disabled={!daysOn}
            required={daysOn}
            aria-required={daysOn || undefined}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-error` : undefined}
            aria-label={`Days without data before "data stopped": ${name}`}
            onChange={(e) => onChange({ ...row, days: e.target.value })}
          />
          <span className="text-ink-soft">
            days without data ({limits.min}–{limits.max}){daysOn && <RequiredMark />}
          </span>
        </div>
        {error && (
          <p id={`${id}-error`} className="text-xs text-fault">
            {error}
          </p>
        )}
      </div>
    </fieldset>
  );
}

export function NotificationsForm({ organisationId, settings }: { organisationId: string; settings: NotificationSettingsResponse }) {
  const save = useSaveNotifications(organisationId);
  const [draft, setDraft] = useState<Draft>(() => draftOf(settings));
  const { dirty, rebase } = useDirty(draft);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [savedAt, setSavedAt] = useState<number | null>(null);
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, errors);
  const limits = settings.dataStoppedDays;

  const setUnit = (unitId: string) => (row: RowDraft) => setDraft((d) => ({ ...d, units: { ...d.units, [unitId]: row } }));

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    setSavedAt(null);
    const { body, rowUnits } = bodyOf(draft, settings.available, limits.default);
    const parsed = notificationSettingsBody.safeParse(body);
    if (!parsed.success)
      return setErrors(
        rowErrors(
          parsed.error.issues.map((i) => ({ path: i.path as (string | number)[], message: i.message })),
          rowUnits,
        ),
      );
    setErrors({});
    save.mutate(parsed.data, {
      onSuccess: () => {
        setSavedAt(Date.now());
        rebase();
      },
      onError: (e) => {
        const issues =
          e instanceof ApiError
            ? (e.details?.fieldErrors ?? []).map((f) => ({
                path: String(f.path)
                  .split('.')
                  .map((p) => (/^\d+$/.test(p) ? Number(p) : p)),
                message: f.message,
              }))
            : [];
        setErrors(rowErrors(issues, rowUnits));
      },
    });
  };

  const message = formMessage(save.error);
  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate aria-label="Notifications" className="flex flex-col gap-5">
      <UnsavedChangesGuard dirty={dirty && !save.isPending} />
      <FormProblems errors={errors} />

      <section className="flex flex-col gap-2">
        <h2 className="text-base">What each condition means</h2>
        <dl className="grid gap-2 text-sm sm:grid-cols-3">
          {UNIT_CONDITION_KINDS.map((kind) => (
            <div key={kind} className="rounded border border-rule bg-paper-raised p-3">
              <dt className="font-medium text-ink">{CONDITION_EXPLAINED[kind].title}</dt>
              <dd className="mt-1 text-ink-soft">{CONDITION_EXPLAINED[kind].sentence}</dd>
            </div>
          ))}
        </dl>
        <p className="text-xs text-ink-soft">One mail per unit and condition when it is raised; no more until it clears and comes back.</p>
      </section>

      <label className="flex items-start gap-2 text-sm">
        <input type="checkbox" className="mt-1" checked={draft.weeklyDigest} onChange={(e) => setDraft((d) => ({ ...d, weeklyDigest: e.target.checked }))} />
        <span>
          <span className="font-medium text-ink">Weekly digest</span>
          <span className="block text-ink-soft">
            Once a week, a summary of your units: their conditions, fouling cost a day, next cleaning and the alerts open to you.
          </span>
        </span>
      </label>

      <section className="flex flex-col">
        <h2 className="text-base">Every unit</h2>
        <p className="text-xs text-ink-soft">Applies to every unit you see, units added later too, unless a unit below has its own ticks.</p>
        <ConditionRow
          id="all-units"
          label="Every unit you see"
          row={draft.all}
          error={errors[ALL]}
          limits={limits}
          onChange={(row) => setDraft((d) => ({ ...d, all: row }))}
        />
      </section>

      {grouped(settings.available).map((g) => (
        <section key={g.name} className="flex flex-col">
          <h2 className="text-base">{g.name}</h2>
          {[...g.plants.entries()].map(([plantId, p]) => (
            <div key={plantId} className="mt-2">
              <h3 className="text-sm text-ink-soft">{p.name}</h3>
              {p.units.map((u) => (
                <ConditionRow
                  key={u.unitId}
                  id={`unit-${u.unitId}`}
                  label={u.unitName}
                  name={`${u.unitName}, ${p.name}`}
                  row={draft.units[u.unitId] ?? { kinds: [], days: String(limits.default) }}
                  error={errors[u.unitId]}
                  limits={limits}
                  onChange={setUnit(u.unitId)}
                />
              ))}
            </div>
          ))}
        </section>
      ))}
      {settings.available.length === 0 && <p className="text-sm text-ink-soft">You see no units yet: the choice for every unit applies once you do.</p>}

      {errors.form && <Notice tone="fault">{errors.form}</Notice>}
      {message && <Notice tone="fault">{message}</Notice>}
      {savedAt && !dirty && <Notice tone="ok">Saved. Alerts follow these choices from the next check.</Notice>}
      <div>
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save notifications'}
        </Button>
      </div>
    </form>
  );
}
