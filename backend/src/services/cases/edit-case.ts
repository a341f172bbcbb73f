/** Changing a draft or returned case: a new title, or a new input set recomputed with changed inputs marked entered. */
import type { DataSource } from 'typeorm';
import { ENGINE_VERSION } from '@shared/domain/decision/schedule/engine-version.js';
import type { CasePatch, CaseView } from '@shared/schemas/cases.js';
import { CleaningCase } from '../../entities/cleaning-case.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { recordAudit } from '../audit.service.js';
import { assertMay, caseInScope } from './case-access.js';
import { caseViewOf, namesOf } from './case-view.js';
import { calculateCase } from './calculate-case.js';
import { alignInitialToStart, canonical, markEntered } from './input-sources.js';
import { dayText } from './day-text.js';

/**
 * The calculation runs first, outside any transaction (it may take seconds); the transaction then locks the row,
 * checks again that the case may still be changed (409 when it was submitted meanwhile) and writes.
 */
export async function editCase(ds: DataSource, scope: TenantScope, id: string, patch: CasePatch): Promise<CaseView> {
  const before = await caseInScope(ds.manager, scope, id);
  assertMay('edit', before.record, scope);
  // A moved start moves the measured days since the cleaning with it (unless the initial condition was entered).
  const aligned = patch.inputs !== undefined ? alignInitialToStart(patch.inputs, before.record.inputs, before.record.inputSources) : undefined;
  const newInputs = aligned !== undefined && canonical(aligned) !== canonical(before.record.inputs) ? aligned : undefined;
  const results = newInputs ? calculateCase(newInputs, 400, 'These inputs cannot be calculated') : undefined;
  return ds.transaction(async (em) => {
    const found = await caseInScope(em, scope, id, true);
    const { record } = found;
    assertMay('edit', record, scope);
    const changed: string[] = [];
    if (patch.title !== undefined && patch.title !== record.title) {
      record.title = patch.title;
      changed.push('title');
    }
    if (newInputs && results && canonical(newInputs) !== canonical(record.inputs)) {
      const name = (await namesOf(em, [scope.userId])).get(scope.userId) ?? 'a member';
      const sources = markEntered(record.inputs, newInputs, record.inputSources, `entered by ${name} on ${dayText(new Date().toISOString().slice(0, 10))}`);
      const previousInitial = record.inputSources.initial;
      if (patch.inputs && canonical(newInputs.initial) !== canonical(patch.inputs.initial) && previousInitial) {
        sources.initial = { ...previousInitial, detail: `${previousInitial.detail}; moved with the start` };
      }
      record.inputSources = sources;
      record.inputs = newInputs;
      record.results = results;
      record.engineVersion = ENGINE_VERSION;
      changed.push('inputs');
    }
    if (changed.length) {
      record.updatedAt = new Date();
      record.lastEditedById = scope.userId;
      record.editorIdsSinceDecision = [...new Set([...(record.editorIdsSinceDecision ?? []), scope.userId])];
      await em.getRepository(CleaningCase).save(record);
      await recordAudit(em, {
        organisationId: scope.organisationId,
        userId: scope.userId,
        action: 'case.updated',
        entityType: 'cleaning-case',
        entityId: record.id,
        details: { changed, title: record.title, npv: record.results.businessCase.npv },
      });
    }
    return caseViewOf(em, scope, found);
  });
}
