import { useRef, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { unitInput } from '@shared/schemas/unit-setup';
import { Button } from '@frontend/components/ui/button';
import type { GroupOption } from '@frontend/components/ui/client-group-picker';
import { ConfirmAction } from '@frontend/components/ui/confirm-action';
import { DataTable, td, th, tr } from '@frontend/components/ui/data-table';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { useFocusFirstProblem } from '@frontend/components/ui/form-problems';
import { Notice } from '@frontend/components/ui/notice';
import { linkClass } from '@frontend/components/ui/public-page';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { ReadOnlyReason } from '@frontend/components/ui/read-only';
import { RenameRow } from '@frontend/components/ui/rename-row';
import { TextField } from '@frontend/components/ui/text-field';
import { formatNumber } from '@frontend/lib/format';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useCreateUnit } from '../api/create-unit';
import { useDeletePlant } from '../api/delete-plant';
import { useDeleteUnit } from '../api/delete-unit';
import { usePlants, type PlantView, type UnitListItem } from '../api/get-plants';
import { useRenameUnit } from '../api/rename-unit';
import { PlantForm } from './plant-form';

interface Props {
  organisationId: string;
  groups: GroupOption[];
  /** null when the person may change plants; otherwise the reason shown beside the disabled actions. */
  cannotWrite: string | null;
}

export function PlantsList({ organisationId, groups, cannotWrite }: Props) {
  const plants = usePlants(organisationId);

  if (plants.isPending) return <LoadingState what="plants" />;
  if (plants.isError) return <ErrorState what="plants" error={plants.error} onRetry={() => plants.refetch()} />;

  // Plants are shown under their client group when the organisation has groups; the rest last.
  const sections: { key: string; title: string | null; plants: PlantView[] }[] = [];
  if (groups.length > 0) {
    for (const g of groups) {
      const inGroup = plants.data.filter((p) => p.clientGroupId === g.id);
      if (inGroup.length) sections.push({ key: g.id, title: g.name, plants: inGroup });
    }
    const rest = plants.data.filter((p) => !p.clientGroupId || !groups.some((g) => g.id === p.clientGroupId));
    if (rest.length) sections.push({ key: 'none', title: 'No client group', plants: rest });
  } else if (plants.data.length) {
    sections.push({ key: 'all', title: null, plants: plants.data });
  }

  return (
    <div className="flex flex-col gap-6">
      {cannotWrite ? (
        <ReadOnlyReason reason={cannotWrite} action="create, change and delete plants and units" />
      ) : (
        <NewPlant organisationId={organisationId} groups={groups} />
      )}
      {sections.length === 0 ? (
        <EmptyState
          title="No plants yet"
          next={
            cannotWrite
              ? 'An analyst or administrator sets up plants and their units.'
              : 'Start with New plant above, then add its generating units and set up each condenser.'
          }
        />
      ) : (
        sections.map((s) => (
          <section key={s.key} className="flex flex-col gap-3" aria-label={s.title ?? 'Plants'}>
            {s.title && <h2 className="text-base text-ink-soft">{s.title}</h2>}
            {s.plants.map((p) => (
              <PlantCard key={p.id} plant={p} organisationId={organisationId} groups={groups} cannotWrite={cannotWrite} />
            ))}
          </section>
        ))
      )}
    </div>
  );
}

function PlantCard({
  plant,
  organisationId,
  groups,
  cannotWrite,
}: {
  plant: PlantView;
  organisationId: string;
  groups: GroupOption[];
  cannotWrite: string | null;
}) {
  const [editing, setEditing] = useState(false);
  const [renamingUnit, setRenamingUnit] = useState<string | null>(null);
  const remove = useDeletePlant(organisationId);
  const removeUnit = useDeleteUnit(organisationId);
  if (editing) return <PlantForm organisationId={organisationId} groups={groups} plant={plant} onDone={() => setEditing(false)} />;
  return (
    <article className="flex flex-col gap-3 rounded border border-rule bg-paper-raised p-4" data-testid="plant-card" aria-label={plant.name}>
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h3 className="text-base font-semibold">
            <Link className={linkClass} to={`/plants/${plant.id}`} title={`${plant.name}: its units and their condition`}>
              {plant.name}
            </Link>
          </h3>
          <p className="text-xs text-ink-soft">Local time: {plant.timeZone.replace(/_/g, ' ')}</p>
        </div>
        {!cannotWrite && (
          <div className="flex items-start gap-2">
            <Button variant="quiet" onClick={() => setEditing(true)} aria-label={`Change ${plant.name}`}>
              Change
            </Button>
            <ConfirmAction
              label="Delete plant"
              question={`Delete “${plant.name}” with its ${plant.units.length} unit${plant.units.length === 1 ? '' : 's'} and all their data, imports and events? This cannot be undone.`}
              confirmLabel="Delete plant and data"
              pending={remove.isPending}
              onConfirm={() => remove.mutate(plant.id)}
            />
          </div>
        )}
      </div>
      {remove.isError && <Notice tone="fault">{remove.error.message}</Notice>}
      {removeUnit.isError && <Notice tone="fault">{removeUnit.error.message}</Notice>}
      {plant.units.length === 0 ? (
        <p className="text-sm text-ink-soft">No units yet{cannotWrite ? '.' : ': add the first generating unit below.'}</p>
      ) : (
        <DataTable
          caption={`Units of ${plant.name}`}
          head={
            <>
              <th className={th}>Unit</th>
              <th className={`${th} text-right`}>Rating</th>
              <th className={th}>Setup</th>
              {!cannotWrite && (
                <th className={th}>
                  <span className="sr-only">Actions</span>
                </th>
              )}
            </>
          }
        >
          {plant.units.map((u) =>
            renamingUnit === u.id ? (
              <RenameUnitRow key={u.id} unit={u} organisationId={organisationId} onDone={() => setRenamingUnit(null)} />
            ) : (
              <tr key={u.id} className={tr} data-testid="unit-row">
                <td className={`${td} font-medium`}>
                  <Link className={linkClass} to={`/units/${u.id}`}>
                    {u.name}
                  </Link>
                </td>
                <td className={`${td} text-right tabular-nums whitespace-nowrap`}>{u.ratingMw === null ? '—' : `${formatNumber(u.ratingMw, 0)} MW`}</td>
                <td className={td}>
                  {u.setupComplete ? (
                    <span className="text-ok">Complete</span>
                  ) : cannotWrite ? (
                    <span className="text-warn">Not complete</span>
                  ) : (
                    <Link className={linkClass} to={`/units/${u.id}/setup`}>
                      Needs setup
                    </Link>
                  )}
                </td>
                {!cannotWrite && (
                  <td className={`${td} text-right`}>
                    <div className="flex items-start justify-end gap-2">
                      <Button variant="quiet" onClick={() => setRenamingUnit(u.id)} aria-label={`Rename ${u.name}`}>
                        Rename
                      </Button>
                      <ConfirmAction
                        label="Delete"
                        question={`Delete ${u.name} with its setup, imported data, events and derived figures? This cannot be undone.`}
                        confirmLabel="Delete unit and data"
                        pending={removeUnit.isPending && removeUnit.variables === u.id}
                        onConfirm={() => removeUnit.mutate(u.id)}
                      />
                    </div>
                  </td>
                )}
              </tr>
            ),
          )}
        </DataTable>
      )}
      {!cannotWrite && <AddUnitForm plant={plant} organisationId={organisationId} />}
    </article>
  );
}

/** The new-plant form opens from its button and closes again when the plant is created or the person cancels. */
function NewPlant({ organisationId, groups }: { organisationId: string; groups: GroupOption[] }) {
  const [open, setOpen] = useState(false);
  if (!open) {
    return (
      <div>
        <Button onClick={() => setOpen(true)}>New plant</Button>
      </div>
    );
  }
  return <PlantForm organisationId={organisationId} groups={groups} onDone={() => setOpen(false)} onCancel={() => setOpen(false)} />;
}

function AddUnitForm({ plant, organisationId }: { plant: PlantView; organisationId: string }) {
  const create = useCreateUnit(organisationId);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const formRef = useRef<HTMLFormElement>(null);
  useFocusFirstProblem(formRef, fieldErrors);
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const parsed = unitInput.safeParse(formText(form, 'name'));
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    create.mutate({ plantId: plant.id, ...parsed.data }, { onSuccess: () => form.reset(), onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };
  const message = formMessage(create.error);
  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate className="flex flex-wrap items-start gap-3" aria-label={`Add a unit to ${plant.name}`}>
      <div className="min-w-56">
        <TextField label="New unit" name="name" placeholder="e.g. Unit 3" required error={fieldErrors.name ?? message ?? undefined} />
      </div>
      <Button type="submit" variant="quiet" className="mt-6" disabled={create.isPending}>
        {create.isPending ? 'Adding…' : 'Add unit'}
      </Button>
    </form>
  );
}

function RenameUnitRow({ unit, organisationId, onDone }: { unit: UnitListItem; organisationId: string; onDone: () => void }) {
  const rename = useRenameUnit(organisationId);
  return (
    <RenameRow
      currentName={unit.name}
      colSpan={4}
      schema={unitInput}
      pending={rename.isPending}
      error={rename.error}
      onSave={(name, callbacks) => rename.mutate({ id: unit.id, name }, callbacks)}
      onDone={onDone}
    />
  );
}
