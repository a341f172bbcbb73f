/** The fictional demo cast: invented organisations and people, one sign-in per role. */
import type { Role } from '../entities/membership.entity.js';

export const DEMO_PASSWORD = 'tubesheet-demo-2026';

export const DEMO_ORGANISATIONS = [
  { key: 'utility', name: 'Northmere Power Cooperative', kind: 'utility' as const, clientGroups: [] as string[] },
  {
    key: 'consultancy',
    name: 'Tidewater Performance Partners',
    kind: 'consultancy' as const,
    clientGroups: ['Calder Valley Energy', 'Brightwater Municipal Utility'],
  },
];

export interface DemoPerson {
  email: string;
  name: string;
  memberships: { organisation: string; role: Role; clientGroups?: string[] }[];
}

export const DEMO_PEOPLE: DemoPerson[] = [
  { email: 'admin@northmere.example', name: 'Ingrid Halvorsen', memberships: [{ organisation: 'utility', role: 'admin' }] },
  { email: 'analyst@northmere.example', name: 'Priya Ramanathan', memberships: [{ organisation: 'utility', role: 'analyst' }] },
  { email: 'approver@northmere.example', name: 'Tomasz Wierzbicki', memberships: [{ organisation: 'utility', role: 'approver' }] },
  { email: 'viewer@northmere.example', name: 'Dolores Achterberg', memberships: [{ organisation: 'utility', role: 'viewer' }] },
  {
    email: 'consultant@tidewater.example',
    name: 'Marcus Okonkwo-Reyes',
    memberships: [
      { organisation: 'consultancy', role: 'analyst' },
      { organisation: 'utility', role: 'analyst' },
    ],
  },
  { email: 'admin@tidewater.example', name: 'Saoirse Callaghan', memberships: [{ organisation: 'consultancy', role: 'admin' }] },
  {
    email: 'viewer@caldervalley.example',
    name: 'Henrike Vogelsang',
    memberships: [{ organisation: 'consultancy', role: 'viewer', clientGroups: ['Calder Valley Energy'] }],
  },
];
