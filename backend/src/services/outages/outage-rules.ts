/**
 * Who may do what with an outage, and in which status: one table read by every write and by the view's `actions`.
 * Viewers see approved outages only (as they see approved cases only). Analysts, approvers and administrators plan
 * (create, edit, add items, optimise, save scopes); approvers and administrators approve, the outage's author
 * included (approving a scope is the manager's own decision, unlike a case's second pair of eyes); administrators
 * delete, approved or not. An approved outage is a frozen snapshot: every change answers 409.
 */
import { can, type Role } from '@shared/permissions.js';
import type { OutageActions, OutageItemKind, OutageStatus } from '@shared/schemas/outages.js';

export type OutageAction = keyof OutageActions;

export interface Refusal {
  status: 403 | 409;
  message: string;
}

export const APPROVED_IS_FROZEN = 'This outage is approved and kept as decided: its scope, items and window no longer change (an administrator may delete it)';

export function outageVisibleTo(role: Role, status: OutageStatus): boolean {
  return role !== 'viewer' || status === 'approved';
}

export function outageRefusal(action: OutageAction, status: OutageStatus, role: Role): Refusal | null {
  switch (action) {
    case 'edit':
    case 'optimise':
    case 'saveScope':
      if (!can(role, 'outages.plan')) return { status: 403, message: 'Only administrators, analysts and approvers plan an outage' };
      if (status === 'approved') return { status: 409, message: APPROVED_IS_FROZEN };
      return null;
    case 'approve':
      if (!can(role, 'cases.approve')) return { status: 403, message: 'Only approvers and administrators approve an outage’s scope' };
      if (status === 'approved') return { status: 409, message: 'This outage is approved already' };
      return null;
    case 'delete':
      return can(role, 'outages.delete') ? null : { status: 403, message: 'Only administrators delete an outage' };
  }
}

export function outageActionsFor(status: OutageStatus, role: Role): OutageActions {
  const ok = (a: OutageAction) => outageRefusal(a, status, role) === null;
  return { edit: ok('edit'), optimise: ok('optimise'), saveScope: ok('saveScope'), approve: ok('approve'), delete: ok('delete') };
}

/** Our own wording of the cautions for each kind of condenser work; the report and the view list those of the kinds chosen. */
const LOCKOUT =
  'Lock out and tag out the circulating-water pumps, valves and the unit’s affected systems, and prove them isolated and drained, before anyone opens a waterbox.';
const CONFINED =
  'A waterbox is a permit-required confined space: test the atmosphere, ventilate, keep an attendant outside and a rescue plan ready for every entry.';
const JETTING =
  'High-pressure water jetting injures through skin and eyes: trained operators only, dead-man controls, barriers and the protective equipment the jetting contractor specifies.';
const CHEMICALS =
  'Cleaning chemicals and deposits can be corrosive or toxic: follow the product’s safety data sheet, neutralise and dispose of the spent solution as the permit requires.';
const TUBES =
  'Tube plugs and tube work change the condenser’s surface and flow: follow the condenser maker’s instructions for plug type, pressure tests and limits on plugged tubes.';
const INSPECTION =
  'Probes and cleaning tools inside tubes need the waterbox isolated and ventilated as for any entry; keep electrical equipment rated for wet, confined spaces.';
const AIR = 'Work on the vacuum side (joints, expansion joints, valves, turbine glands) needs the unit off line or the work isolated from the vacuum.';

export const CAUTIONS_BY_KIND: Record<OutageItemKind, string[]> = {
  'case-cleaning': [LOCKOUT, CONFINED, JETTING, CHEMICALS],
  'tube-plugging': [LOCKOUT, CONFINED, TUBES],
  'air-in-leakage-repair': [LOCKOUT, AIR],
  'waterbox-repair': [LOCKOUT, CONFINED],
  'partial-retubing': [LOCKOUT, CONFINED, TUBES],
  'eddy-current-inspection': [LOCKOUT, CONFINED, INSPECTION],
  other: [LOCKOUT, CONFINED],
};

export const DEFER_TO_PRACTICE =
  'These notes are reminders, not a work method: local codes and permits, the equipment maker’s instructions and licensed engineering practice govern the work. Figures are estimates from the data and assumptions shown.';

/** The cautions for the kinds of work listed (each once, in a fixed order), ending with whom to defer to. */
export function cautionsFor(kinds: readonly OutageItemKind[]): string[] {
  const seen = new Set<string>();
  for (const k of kinds) for (const c of CAUTIONS_BY_KIND[k]) seen.add(c);
  return [...seen, DEFER_TO_PRACTICE];
}
