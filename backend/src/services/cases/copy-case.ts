/**
 * "Copy as new draft": the inputs a person entered are kept (still marked entered); the measured and prefilled
 * ones are refreshed from the unit's current data, setup and prices, and the results computed anew.
 */
import type { DataSource } from 'typeorm';
import { calcScheduleInput } from '@shared/schemas/calc-schedule.js';
import type { CaseView } from '@shared/schemas/cases.js';
import { AppError } from '../../http/app-error.js';
import type { TenantScope } from '../../policies/tenant-scope.js';
import { assertMay, caseInScope } from './case-access.js';
import { prefillCase } from './case-prefill.js';
import { storeNewCase } from './create-case.js';
import { carryEntered } from './input-sources.js';

export async function copyCase(ds: DataSource, scope: TenantScope, id: string): Promise<CaseView> {
  return ds.transaction(async (em) => {
    const found = await caseInScope(em, scope, id);
    assertMay('copy', found.record, scope);
    const fresh = await prefillCase(em, found.unit, found.plant);
    const merged = carryEntered(found.record, fresh);
    const checked = calcScheduleInput.safeParse(merged.inputs);
    if (!checked.success) {
      const issue = checked.error.issues[0];
      const why = issue ? ` (${issue.path.join('.')}: ${issue.message})` : '';
      throw new AppError(409, `The entered inputs no longer fit the unit’s current data${why}; start a new case instead`);
    }
    const title = `${found.record.title.slice(0, 113)} (copy)`;
    return storeNewCase(
      em,
      scope,
      found,
      {
        title,
        inputs: checked.data,
        inputSources: merged.inputSources,
        lastDataDay: fresh.lastDataDay,
        currency: fresh.currency,
        copiedFromId: found.record.id,
      },
      'case.copied',
    );
  });
}
