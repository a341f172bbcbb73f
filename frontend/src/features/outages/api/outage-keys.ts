import { organisationKey } from '@frontend/lib/query-keys';
import type { OutageListQuery } from '@shared/schemas/outages';

/**
 * Every outage of an organisation sits under one key, so a change to an outage (its window, an item, a proposal,
 * a saved scope, the approval) refreshes its page and every list it appears in at once.
 */
export const outagesKey = (organisationId: string) => [...organisationKey(organisationId), 'outages'] as const;
export const outageListKey = (organisationId: string, filters: OutageListQuery) => [...outagesKey(organisationId), 'list', filters] as const;
export const outageKey = (organisationId: string, outageId: string) => [...outagesKey(organisationId), 'outage', outageId] as const;
