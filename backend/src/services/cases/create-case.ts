/** A new draft case on a unit, prefilled from the unit's data and setup, with its results computed. */
import type { DataSource, EntityManager } from 'typeorm';
import { ENGINE_VERSION } from '@shared/domain/decision/schedule/engine-version.js';
import type { CaseCreate, CaseView, InputSources } from '@shared/schemas/cases.js';
import type { CalcScheduleInput, CalcScheduleOutput } from '@shared/schemas/calc-schedule.js';
import { CleaningCase } from '../../entities/cleaning-case.entity.js';
import type { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import type { Plant } from '../../entities/plant.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { AppError } from '../../http/app-error.js';
import { recordAudit } from '../audit.service.js';
import { unitForCases } from './case-access.js';
import { prefillCase } from './case-prefill.js';
import { caseViewOf } from './case-view.js';
import { calculateCase } from './calculate-case.js';

export interface NewCase {
  title: string;
  inputs: CalcScheduleInput;
  inputSources: InputSources;
  lastDataDay: string;
  currency: string;
  copiedFromId: string | null;
}

const computeNewCase = (inputs: CalcScheduleInput) => calculateCase(inputs, 409, 'The case cannot be calculated from the unit’s data');

/**
 * Stores a new draft; the audit entry goes in the same transaction. Pass `results` computed before the
 * transaction opened (the calculation may take seconds); without them they are computed here.
 */
export async function storeNewCase(
  em: EntityManager,
  scope: TenantScope,
  found: { unit: GeneratingUnit; plant: Plant },
  c: NewCase,
  action: string,
  computed?: CalcScheduleOutput,
): Promise<CaseView> {
  const results = computed ?? computeNewCase(c.inputs);
  await refuseSecondClick(em, scope, found.unit.id, c.title);
  const now = new Date();
  const record = await em.getRepository(CleaningCase).save(
    em.getRepository(CleaningCase).create({
      organisationId: scope.organisationId,
      unitId: found.unit.id,
      title: c.title,
      status: 'draft',
      authorId: scope.userId,
      inputs: c.inputs,
      inputSources: c.inputSources,
      results,
      engineVersion: ENGINE_VERSION,
      currency: c.currency,
      lastDataDay: c.lastDataDay,
      setupVersion: found.unit.setupVersion,
      copiedFromId: c.copiedFromId,
      updatedAt: now,
      submittedAt: null,
      decidedAt: null,
      archivedAt: null,
      decidedById: null,
      returnReason: null,
      lastEditedById: null,
      editorIdsSinceDecision: [],
      submittedById: null,
      unitNameAtSubmit: null,
      plantNameAtSubmit: null,
    }),
  );
  await recordAudit(em, {
    organisationId: scope.organisationId,
    userId: scope.userId,
    action,
    entityType: 'cleaning-case',
    entityId: record.id,
    details: { title: c.title, unitId: found.unit.id, npv: results.businessCase.npv, ...(c.copiedFromId ? { copiedFromId: c.copiedFromId } : {}) },
  });
  return caseViewOf(em, scope, { unit: found.unit, plant: found.plant, record });
}

/** How long a case of the same title by the same person on the same unit counts as the same form sent twice. */
const SECOND_CLICK_SECONDS = 10;

/**
 * The same form sent twice at once (a double click) makes one case: the unit's row is locked for the rest of the
 * transaction, so a second request waits here and then sees the first one's case.
 */
async function refuseSecondClick(em: EntityManager, scope: TenantScope, unitId: string, title: string): Promise<void> {
  await em.query('SELECT id FROM generating_unit WHERE id = ? FOR UPDATE', [unitId]);
  const twin: unknown[] = await em.query(
    `SELECT id FROM cleaning_case WHERE unitId = ? AND authorId = ? AND title = ? AND createdAt >= NOW(3) - INTERVAL ${SECOND_CLICK_SECONDS} SECOND LIMIT 1`,
    [unitId, scope.userId, title],
  );
  if (twin.length > 0)
    throw new AppError(409, `You created the case “${title}” on this unit moments ago; open it from the list (this request changed nothing)`);
}

/** The prefill reads and the calculation happen before the transaction that writes the case. */
export async function createCase(ds: DataSource, scope: TenantScope, unitId: string, body: CaseCreate): Promise<CaseView> {
  const found = await unitForCases(ds.manager, scope, unitId);
  const prefill = await prefillCase(ds.manager, found.unit, found.plant);
  const results = computeNewCase(prefill.inputs);
  return ds.transaction((em) => storeNewCase(em, scope, found, { title: body.title, ...prefill, copiedFromId: null }, 'case.created', results));
}
