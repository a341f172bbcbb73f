import type { OutagePatch } from '@shared/schemas/outages';
import { useOutageChange } from './outage-change';

/** Changes a draft outage's name, units, window or budget (naming the version read, so a stale edit is refused). */
export const useUpdateOutage = (organisationId: string, outageId: string) =>
  useOutageChange<OutagePatch>(organisationId, (body) => ({ path: `/api/outages/${outageId}`, method: 'PATCH', body }));
