/** Changing a draft or returned case: a new title, or a new input set recomputed with changed inputs marked entered. */
import type { DataSource } from 'typeorm';
import type { CasePatch, CaseView } from '@shared/schemas/cases.js';
import { CleaningCase } from '../../entities/cleaning-case.entity.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { recordAudit } from '../audit.service.js';
import { assertMay, caseInScope } from './case-access.js';
import { caseViewOf, namesOf } from './case-view.js';
import { calculateCase } from './calculate-case.js';
import { canonical, markEntered } from './input-sources.js';
import { dayText } from './day-text.js';

export async function editCase(ds: DataSource, scope: TenantScope, id: string, patch: CasePatch): Promise<CaseView> {
  return ds.transaction(async (em) => {
    const found = await caseInScope(em, scope, id, true);
    const { record } = found;
    assertMay('edit', record, scope);
    const changed: string[] = [];
    if (patch.title !== undefined && patch.title !== record.title) {
      record.title = patch.title;
      changed.push('title');
    }
    if (patch.inputs !== undefined && canonical(patch.inputs) !== canonical(record.inputs)) {
      const results = calculateCase(patch.inputs, 400, 'These inputs cannot be calculated');
      const name = (await namesOf(em, [scope.userId])).get(scope.userId) ?? 'a member';
      record.inputSources = markEntered(
        record.inputs,
        patch.inputs,
        record.inputSources,
        `entered by ${name} on ${dayText(new Date().toISOString().slice(0, 10))}`,
      );
      record.inputs = patch.inputs;
      record.results = results;
      changed.push('inputs');
    }
    if (changed.length) {
      record.updatedAt = new Date();
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
