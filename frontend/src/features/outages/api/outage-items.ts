import type { OutageItemCreate, OutageItemPatch } from '@shared/schemas/outages';
import { useOutageChange } from './outage-change';

/** Adds a candidate item: a case's cleaning (benefit from the case) or work entered by hand. */
export const useAddOutageItem = (organisationId: string, outageId: string) =>
  useOutageChange<OutageItemCreate>(organisationId, (body) => ({ path: `/api/outages/${outageId}/items`, method: 'POST', body }));

/** Changes an item's title, cost, duration, lane, benefit, needs or forced choice. */
export const useUpdateOutageItem = (organisationId: string) =>
  useOutageChange<{ id: string; patch: OutageItemPatch }>(organisationId, ({ id, patch }) => ({
    path: `/api/outage-items/${id}`,
    method: 'PATCH',
    body: patch,
  }));

/** Removes an item (saved scopes keep naming it, shown as missing). */
export const useDeleteOutageItem = (organisationId: string) =>
  useOutageChange<string>(organisationId, (id) => ({ path: `/api/outage-items/${id}`, method: 'DELETE' }));
