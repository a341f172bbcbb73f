import type { OptimiseResponse, OutageApprove, ScopeSave } from '@shared/schemas/outages';
import { useOutageChange } from './outage-change';

/** Runs the optimiser on the outage as it is now; the answer is also kept on the outage as its latest proposal. */
export const useOptimiseOutage = (organisationId: string, outageId: string) =>
  useOutageChange<void, OptimiseResponse>(organisationId, () => ({ path: `/api/outages/${outageId}/optimise`, method: 'POST', body: {} }));

/** Saves a named scope (by default the latest proposal's selection), to compare side by side. */
export const useSaveScope = (organisationId: string, outageId: string) =>
  useOutageChange<ScopeSave>(organisationId, (body) => ({ path: `/api/outages/${outageId}/scopes`, method: 'POST', body }));

/** Removes a saved scope of a draft outage, freeing its place for another. */
export const useRemoveScope = (organisationId: string, outageId: string) =>
  useOutageChange<string>(organisationId, (scopeId) => ({ path: `/api/outages/${outageId}/scopes/${scopeId}`, method: 'DELETE' }));

/** Approves the latest proposal, or a saved scope; the outage is frozen as a snapshot. */
export const useApproveOutage = (organisationId: string, outageId: string) =>
  useOutageChange<OutageApprove>(organisationId, (body) => ({ path: `/api/outages/${outageId}/approve`, method: 'POST', body }));
