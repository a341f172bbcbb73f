import { organisationKey } from '@frontend/lib/query-keys';
import type { CaseListQuery } from '@shared/schemas/cases';

/**
 * Every cleaning case of an organisation sits under one key, so a change to a case (a save, a transition, a
 * comment) refreshes its page and every list it appears in at once.
 */
export const casesKey = (organisationId: string) => [...organisationKey(organisationId), 'cases'] as const;
export const caseListKey = (organisationId: string, filters: CaseListQuery) => [...casesKey(organisationId), 'list', filters] as const;
export const caseKey = (organisationId: string, caseId: string) => [...casesKey(organisationId), 'case', caseId] as const;
