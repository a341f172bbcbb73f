/** A new draft case on a unit, prefilled from the unit's data and setup, with its results computed. */
import type { DataSource, EntityManager } from 'typeorm';
import { ENGINE_VERSION } from '@shared/domain/decision/schedule/engine-version.js';
import type { CaseCreate, CaseView, InputSources } from '@shared/schemas/cases.js';
import type { CalcScheduleInput, CalcScheduleOutput } from '@shared/schemas/calc-schedule.js';
import { CleaningCase } from '../../entities/cleaning-case.entity.js';
import type { GeneratingUnit } from '../../entities/generating-unit.entity.js';
import type { Plant } from '../../entities/plant.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
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

/** The prefill reads and the calculation happen before the transaction that writes the case. */
export async function createCase(ds: DataSource, scope: TenantScope, unitId: string, body: CaseCreate): Promise<CaseView> {
  const found = await unitForCases(ds.manager, scope, unitId);
  const prefill = await prefillCase(ds.manager, found.unit, found.plant);
  const results = computeNewCase(prefill.inputs);
  return ds.transaction((em) => storeNewCase(em, scope, found, { title: body.title, ...prefill, copiedFromId: null }, 'case.created', results));
}
