import { describe, expect, it } from 'vitest';
import type { AuditEventView } from '@shared/schemas/accounts';
import { auditSentence, type AuditNames } from '@frontend/features/audit/components/audit-words';

const entry = (action: string, details: Record<string, unknown> | null, more: Partial<AuditEventView> = {}): AuditEventView => ({
  id: 'a1',
  createdAt: '2026-01-05T10:00:00.000Z',
  userId: 'u1',
  userName: 'Priya Ramanathan',
  action,
  entityType: action.split('.')[0] ?? action,
  entityId: '6f1c2d3e-0000-4000-8000-000000000001',
  details,
  ...more,
});

const names: AuditNames = {
  units: new Map([['6f1c2d3e-0000-4000-8000-000000000001', 'Larchmoor Station — Unit 2']]),
  groups: new Map([['g1', 'Calder Valley Energy']]),
};

// every code the server writes today (grep recordAudit in backend/src), with the details it writes
const WRITTEN: [string, Record<string, unknown> | null][] = [
  ['organisation.created', null],
  ['plant.created', { name: 'Larchmoor Station' }],
  [
    'plant.updated',
    {
      from: { name: 'Larchmoor', timeZone: 'America/Chicago', clientGroupId: null },
      to: { name: 'Larchmoor Station', timeZone: 'America/Chicago', clientGroupId: 'g1' },
    },
  ],
  ['plant.deleted', { name: 'Larchmoor Station' }],
  ['unit.created', { name: 'Unit 2', plant: 'Larchmoor Station' }],
  ['unit.renamed', { from: 'Unit 2', to: 'Unit 2A' }],
  ['unit.deleted', { name: 'Unit 2' }],
  ['unit.condenser-saved', { from: null, to: {} }],
  ['unit.turbine-saved', { from: null, to: {} }],
  ['unit.economics-saved', { from: null, to: {} }],
  ['import.started', { fileName: 'june-2025.csv' }],
  ['import.undone', { fileName: 'june-2025.csv' }],
  ['event.added', { kind: 'cleaning', startDate: '2025-06-05' }],
  ['event.updated', { kind: 'tube-plugging' }],
  ['event.deleted', { kind: 'outage', startDate: '2025-04-01' }],
  ['cleaning-method.created', { name: 'Sponge balls' }],
  ['cleaning-method.updated', { from: { name: 'Sponge balls' }, to: { name: 'Sponge balls, weekly' } }],
  ['cleaning-method.deleted', { name: 'Sponge balls' }],
  ['client-group.created', { name: 'Calder Valley Energy' }],
  ['client-group.renamed', { from: 'Calder', to: 'Calder Valley Energy' }],
  ['client-group.deleted', { name: 'Calder Valley Energy' }],
  ['invitation.sent', { email: 'new@northmere.example', role: 'viewer' }],
  ['invitation.revoked', { email: 'new@northmere.example' }],
  ['invitation.accepted', { email: 'new@northmere.example', role: 'viewer' }],
  ['member.updated', { from: { role: 'viewer', clientGroupIds: null }, to: { role: 'analyst', clientGroupIds: ['g1'] } }],
  ['member.removed', { userId: 'u9', role: 'analyst' }],
  ['api-token.created', { name: 'historian script' }],
  ['api-token.revoked', { name: 'historian script' }],
  ['case.created', { title: 'Spring outage 2026', unitId: 'x', npv: 1 }],
  ['case.copied', { title: 'Spring outage 2026 (copy)', unitId: 'x', npv: 1, copiedFromId: 'c0' }],
  ['case.updated', { changed: ['inputs'], title: 'Spring outage 2026', npv: 1 }],
  ['case.commented', { commentId: 'k1' }],
  ['case.submitted', { title: 'Spring outage 2026', from: 'draft', to: 'submitted' }],
  ['case.approved', { title: 'Spring outage 2026', from: 'submitted', to: 'approved' }],
  ['case.returned', { title: 'Spring outage 2026', from: 'submitted', to: 'returned', reason: 'Use the 2025 fuel price' }],
  ['case.archived', { title: 'Spring outage 2026', from: 'approved', to: 'archived' }],
  ['organisation.status-words-changed', { words: ['Bad', 'Scan Off'] }],
  [
    'outage.created',
    { name: 'Spring 2027', units: ['Larchmoor Station Unit 2'], startDate: '2027-04-05', endDate: '2027-04-18', budget: '150000.00', currency: 'USD' },
  ],
  ['outage.changed', { name: 'Spring 2027', changes: { budget: { from: '150000.00', to: '160000.00' } } }],
  ['outage.deleted', { name: 'Spring 2027', status: 'approved', units: [], items: [] }],
  ['outage.item-added', { outage: 'Spring 2027', itemId: 'i1', title: 'Plug flagged tubes', kind: 'tube-plugging', cost: '18000.00', lane: 'Waterbox crew' }],
  ['outage.item-changed', { outage: 'Spring 2027', itemId: 'i1', title: 'Plug flagged tubes', changes: { cost: { from: 1, to: 2 } } }],
  ['outage.item-removed', { outage: 'Spring 2027', itemId: 'i1', title: 'Plug flagged tubes', noLongerNeededBy: [] }],
  ['outage.optimised', { name: 'Spring 2027', items: 4, chosen: ['Plug flagged tubes'], totalBenefit: 35000, totalCost: 18000, feasible: true }],
  ['outage.scope-saved', { outage: 'Spring 2027', scope: 'Tubes only', replaced: false, items: ['Plug flagged tubes'] }],
  ['outage.scope-removed', { outage: 'Spring 2027', scope: 'Tubes only' }],
  ['outage.approved', { name: 'Spring 2027', scope: 'Tubes only', items: ['Plug flagged tubes'], totalBenefit: 35000, totalCost: 18000, currency: 'USD' }],
  [
    'outage.unit-removed',
    { outage: 'Spring 2027', reason: 'unit deleted', units: [{ id: 'u2', name: 'Unit 2' }], itemsRemoved: [{ id: 'i1', title: 'Plug flagged tubes' }] },
  ],
];

describe('audit log entries as sentences', () => {
  it('when a file is imported, the entry names the person and the file instead of the code', () => {
    expect(auditSentence(entry('import.started', { fileName: 'june-2025.csv' }), names)).toBe('Priya Ramanathan imported the file “june-2025.csv”.');
  });

  it('when a unit’s setup is saved, the entry names the plant and unit instead of its id', () => {
    expect(auditSentence(entry('unit.condenser-saved', { from: null, to: {} }), names)).toBe(
      'Priya Ramanathan saved the condenser setup of Larchmoor Station — Unit 2.',
    );
  });

  it('when the unit has since been deleted, the entry says so rather than showing an id', () => {
    expect(auditSentence(entry('unit.turbine-saved', {}), { units: new Map(), groups: new Map() })).toBe(
      'Priya Ramanathan saved the turbine setup of a unit since deleted.',
    );
  });

  it('when a member’s access changes, the roles and client groups are in words', () => {
    const s = auditSentence(
      entry('member.updated', { from: { role: 'viewer', clientGroupIds: null }, to: { role: 'analyst', clientGroupIds: ['g1'] } }),
      names,
    );
    expect(s).toBe('Priya Ramanathan changed a member’s access (role viewer → analyst; plants all → only Calder Valley Energy).');
  });

  it('a cleaning event is told with its kind and plant day', () => {
    expect(auditSentence(entry('event.added', { kind: 'cleaning', startDate: '2025-06-05' }), names)).toBe(
      'Priya Ramanathan recorded a cleaning on 5 Jun 2025.',
    );
  });

  it('no entry the server writes shows a code, an id or raw JSON', () => {
    for (const [action, details] of WRITTEN) {
      const s = auditSentence(entry(action, details), names);
      expect(s, action).not.toContain(action);
      expect(s, action).not.toMatch(/[0-9a-f]{8}-[0-9a-f]{4}|[{}[\]]|undefined|null/);
      expect(s, action).toMatch(/^Priya Ramanathan [a-z].*\.$/);
    }
  });

  it('outage entries name the outage and what was done to it, never a vague "changed something"', () => {
    for (const [action, details] of WRITTEN.filter(([a]) => a.startsWith('outage.'))) {
      const s = auditSentence(entry(action, details), names);
      expect(s, action).toContain('“Spring 2027”');
      expect(s, action).not.toMatch(/changed something/);
    }
    expect(auditSentence(entry('outage.approved', WRITTEN.find(([a]) => a === 'outage.approved')![1]), names)).toBe(
      'Priya Ramanathan approved the scope “Tubes only” of the outage “Spring 2027”: 1 item, cost $18,000, benefit $35,000.',
    );
    expect(auditSentence(entry('organisation.status-words-changed', { words: ['Bad', 'Scan Off'] }), names)).toBe(
      'Priya Ramanathan set the organisation’s historian status words to “Bad”, “Scan Off”.',
    );
  });

  it('an entry without a person is told as the product’s own doing, and a person since removed is not left blank', () => {
    expect(auditSentence(entry('plant.created', { name: 'X' }, { userId: null, userName: null }), names)).toMatch(/^Cleancase added/);
    expect(auditSentence(entry('plant.created', { name: 'X' }, { userName: null }), names)).toMatch(/^A former member added/);
  });
});
