/**
 * The isolation matrix: every route in the app's registry × every kind of caller, with the status each must
 * get. A route without an entry here fails the suite, so no endpoint ships without its access decided.
 * Callers: anonymous; admin, analyst, approver, viewer of tenant A; the admin of tenant B ("other tenant");
 * an admin of tenant A limited to client group Two ("other group", for records in group One).
 */
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CALC_COMMANDS } from '../../backend/src/cli/command-registry.js';
import { createApiToken } from '../../backend/src/services/api-token.service.js';
import { createMethod } from '../../backend/src/services/cleaning-method.service.js';
import { TYPICAL_CLEANING_METHODS } from '../../shared/schemas/cleaning-method.js';
import type { Role } from '../../shared/permissions.js';
import {
  addMember,
  createClientGroup,
  createInvitation,
  createTenant,
  createUser,
  CSRF,
  signedInAgent,
  type TenantFixture,
  uniqueEmail,
} from '../factories/accounts.js';
import { startGoogleFake, type GoogleFake } from '../../scripts/lib/local-services.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import type { GeneratingUnit } from '../../backend/src/entities/generating-unit.entity.js';
import type { Plant } from '../../backend/src/entities/plant.entity.js';
import { OutageScope } from '../../backend/src/entities/outage-scope.entity.js';
import { createCaseRecord } from '../factories/cases.js';
import { createOutageRecord } from '../factories/outages.js';
import { createEvent, createPendingImport, createPlant, createUnit, TEST_CONDENSER, TEST_ECONOMICS, TEST_TURBINE } from '../factories/units.js';

type Caller = 'anonymous' | Role | 'otherTenant' | 'otherGroup';
const CALLERS: Caller[] = ['anonymous', 'admin', 'analyst', 'approver', 'viewer', 'otherTenant', 'otherGroup'];

interface Fixture {
  a: TenantFixture;
  /** A plant in client group One of tenant A, with one unit. */
  plant: Plant;
  unit: GeneratingUnit;
  b: TenantFixture;
  groupLimitedAdminEmail: string;
  emails: Record<Exclude<Caller, 'anonymous'>, string>;
}

interface Entry {
  /** Path with ids filled in; called once per request, so it can create a fresh target record. */
  path?: (fx: Fixture) => Promise<string> | string;
  body?: (fx: Fixture) => unknown;
  /** The call changes the caller's session (sign-out, new account, switch): use a throwaway agent. */
  changesSession?: boolean;
  expect: Record<Caller, number>;
}

const all = (status: number): Record<Caller, number> => Object.fromEntries(CALLERS.map((c) => [c, status])) as Record<Caller, number>;
const members = (ok: number, extra: Partial<Record<Caller, number>> = {}): Record<Caller, number> => ({ ...all(ok), anonymous: 401, ...extra });
const adminsOnly = (ok: number, extra: Partial<Record<Caller, number>> = {}) => members(ok, { analyst: 403, approver: 403, viewer: 403, ...extra });

const groupOne = (fx: Fixture) => fx.a.groups[0].id;
/** Writers are admins and analysts; a record of tenant A in group One is out of scope for the other two callers. */
const writers = (ok: number, extra: Partial<Record<Caller, number>> = {}) =>
  members(ok, { approver: 403, viewer: 403, otherTenant: 404, otherGroup: 404, ...extra });
const readers = (ok: number) => members(ok, { otherTenant: 404, otherGroup: 404 });
const freshPlant = async (fx: Fixture) => createPlant(ds(), fx.a.organisation.id, groupOne(fx));
const freshUnit = async (fx: Fixture) => createUnit(ds(), await freshPlant(fx));
const freshCase = (fx: Fixture, status: 'draft' | 'submitted' | 'approved' = 'draft') => createCaseRecord(ds(), fx.unit, fx.a.users.analyst.id, status);
const deciders = (ok: number) => members(ok, { analyst: 403, viewer: 403, otherTenant: 404, otherGroup: 404 });
const freshMethod = (fx: Fixture) =>
  createMethod(
    ds(),
    { organisationId: fx.a.organisation.id, userId: fx.a.users.admin.id, role: 'admin', clientGroupIds: null },
    { ...TYPICAL_CLEANING_METHODS[2]!, id: `m-${Math.random().toString(36).slice(2, 10)}` },
  );
const freshOutage = async (fx: Fixture, status: 'draft' | 'approved' = 'draft') =>
  createOutageRecord(ds(), [fx.unit], fx.a.users.analyst.id, {
    status,
    items: [{ title: 'Plug leaking tubes', cost: 20_000, durationDays: 3, lane: 'Waterbox A', benefit: 60_000 }],
  });
/** Planners are admins, analysts and approvers; an outage on a unit in group One is out of scope for the other two callers. */
const planners = (ok: number, extra: Partial<Record<Caller, number>> = {}) => members(ok, { viewer: 403, otherTenant: 404, otherGroup: 404, ...extra });
const plantBody = (fx: Fixture) => ({ name: `Plant ${Math.random().toString(36).slice(2)}`, timeZone: 'Europe/Berlin', clientGroupId: groupOne(fx) });

const MATRIX: Record<string, Entry> = {
  'GET /api/health': { expect: all(200) },
  'GET /api/openapi.json': { expect: all(200) },
  'GET /api/session': { expect: all(200) },
  'POST /api/session': { body: () => ({ email: 'nobody@example.test', password: 'wrong password here' }), expect: all(401) },
  'DELETE /api/session': { changesSession: true, expect: members(204) },
  'POST /api/session/organisation': {
    changesSession: true,
    body: (fx) => ({ organisationId: fx.a.organisation.id }),
    expect: members(200, { otherTenant: 404 }),
  },
  'POST /api/sign-up': {
    changesSession: true,
    body: () => ({ name: 'New Person', email: uniqueEmail('signup'), password: 'a long and unusual passphrase', organisationName: 'New Utility' }),
    expect: all(201),
  },
  'POST /api/organisations': { changesSession: true, body: () => ({ name: 'Another Organisation' }), expect: members(201) },
  'PATCH /api/profile': { body: () => ({ unitPreference: 'si' }), expect: members(200) },
  'POST /api/profile/password': { body: () => ({ currentPassword: 'not my password', newPassword: 'a long and unusual passphrase' }), expect: members(400) },
  'POST /api/password-reset': { body: () => ({ email: uniqueEmail('reset') }), expect: all(202) },
  'POST /api/password-reset/confirm': { body: () => ({ token: 'not-a-real-reset-token', password: 'a long and unusual passphrase' }), expect: all(400) },
  'POST /api/address-confirmations': { body: () => ({ token: 'not-a-real-confirmation-token' }), expect: all(400) },
  'GET /api/invitations': { expect: adminsOnly(200) },
  // Without a client-group limit: an administrator limited to groups may not invite someone wider than themselves.
  'POST /api/invitations': { body: () => ({ email: uniqueEmail('invited'), role: 'viewer' }), expect: adminsOnly(201, { otherGroup: 403 }) },
  'DELETE /api/invitations/:id': {
    path: async (fx) => `/api/invitations/${(await createInvitation(ds(), fx.a.organisation.id)).invitation.id}`,
    expect: adminsOnly(204, { otherTenant: 404, otherGroup: 404 }),
  },
  'GET /api/invitation-links/:token': {
    path: async (fx) => `/api/invitation-links/${(await createInvitation(ds(), fx.a.organisation.id)).token}`,
    expect: all(200),
  },
  'POST /api/invitation-links/:token/accept': {
    changesSession: true,
    path: async (fx) => `/api/invitation-links/${(await createInvitation(ds(), fx.a.organisation.id)).token}/accept`,
    body: () => ({ name: 'Invited Person', password: 'a long and unusual passphrase' }),
    // Signed in as someone else, an invitation for a new address cannot be taken.
    expect: { ...all(403), anonymous: 200 },
  },
  'GET /api/members': { expect: adminsOnly(200) },
  'PATCH /api/members/:id': {
    path: async (fx) => `/api/members/${(await addMember(ds(), fx.a.organisation.id, await createUser(ds(), 'target'), 'viewer')).id}`,
    body: () => ({ role: 'analyst' }),
    // The target has no client-group limit: outside the scope of an administrator limited to groups.
    expect: adminsOnly(204, { otherTenant: 404, otherGroup: 404 }),
  },
  'DELETE /api/members/:id': {
    path: async (fx) => `/api/members/${(await addMember(ds(), fx.a.organisation.id, await createUser(ds(), 'target'), 'viewer')).id}`,
    expect: adminsOnly(204, { otherTenant: 404, otherGroup: 404 }),
  },
  'GET /api/client-groups': { expect: members(200) },
  'GET /api/client-groups/:id': { path: (fx) => `/api/client-groups/${groupOne(fx)}`, expect: members(200, { otherTenant: 404, otherGroup: 404 }) },
  'POST /api/client-groups': { body: () => ({ name: `Group ${Math.random().toString(36).slice(2)}` }), expect: adminsOnly(201) },
  'PATCH /api/client-groups/:id': {
    path: async (fx) => `/api/client-groups/${(await createClientGroup(ds(), fx.a.organisation.id)).id}`,
    body: () => ({ name: `Renamed ${Math.random().toString(36).slice(2)}` }),
    expect: adminsOnly(200, { otherTenant: 404, otherGroup: 404 }),
  },
  'DELETE /api/client-groups/:id': {
    path: async (fx) => `/api/client-groups/${(await createClientGroup(ds(), fx.a.organisation.id)).id}`,
    expect: adminsOnly(204, { otherTenant: 404, otherGroup: 404 }),
  },
  'GET /api/api-tokens': { expect: members(200) },
  'POST /api/api-tokens': { body: () => ({ name: 'batch runs' }), expect: members(201) },
  'DELETE /api/api-tokens/:id': {
    // A token belongs to one person: nobody else may revoke it, not even an administrator.
    path: async (fx) => {
      const t = await createApiToken(ds(), { organisationId: fx.a.organisation.id, userId: fx.a.users.admin.id, role: 'admin', clientGroupIds: null }, 'x');
      return `/api/api-tokens/${t.id}`;
    },
    expect: members(404, { admin: 204 }),
  },
  'GET /api/audit-events': { expect: members(200, { analyst: 403, viewer: 403, otherGroup: 403 }) },
  'GET /api/calc': { expect: members(200) },
  'POST /api/calc/saturation': { body: () => ({ pressureKpa: 8 }), expect: members(200) },
  // Every other command: an empty input is refused in place (422) for members, never run for anyone else.
  ...Object.fromEntries(
    Object.keys(CALC_COMMANDS)
      .filter((name) => name !== 'saturation')
      .map((name) => [`POST /api/calc/${name}`, { body: () => ({}), expect: members(422) }]),
  ),
  'GET /api/auth/google': { expect: all(302) },
  'GET /api/auth/google/callback': { expect: all(302) },
  'GET /api/dev/mailbox': { expect: members(200) },
  'GET /api/plants': { expect: members(200) },
  'GET /api/cleaning-methods': { expect: members(200) },
  'POST /api/cleaning-methods': {
    body: () => ({ ...TYPICAL_CLEANING_METHODS[0], id: `m-${Math.random().toString(36).slice(2, 10)}` }),
    expect: members(201, { approver: 403, viewer: 403 }),
  },
  'PUT /api/cleaning-methods/:id': {
    path: async (fx) => `/api/cleaning-methods/${(await freshMethod(fx)).recordId}`,
    body: () => ({ ...TYPICAL_CLEANING_METHODS[1], id: `m-${Math.random().toString(36).slice(2, 10)}`, typical: false }),
    expect: members(200, { approver: 403, viewer: 403, otherTenant: 404 }),
  },
  'DELETE /api/cleaning-methods/:id': {
    path: async (fx) => `/api/cleaning-methods/${(await freshMethod(fx)).recordId}`,
    expect: members(204, { approver: 403, viewer: 403, otherTenant: 404 }),
  },
  'POST /api/plants': {
    // With no client group: a member limited to groups may not create a plant they could not see.
    body: () => ({ name: `Plant ${Math.random().toString(36).slice(2)}`, timeZone: 'America/Chicago', clientGroupId: null }),
    expect: members(201, { approver: 403, viewer: 403, otherGroup: 400 }),
  },
  'GET /api/plants/:id': { path: (fx) => `/api/plants/${fx.plant.id}`, expect: readers(200) },
  'PUT /api/plants/:id': { path: async (fx) => `/api/plants/${(await freshPlant(fx)).id}`, body: plantBody, expect: writers(200) },
  'DELETE /api/plants/:id': { path: async (fx) => `/api/plants/${(await freshPlant(fx)).id}`, expect: writers(204) },
  'POST /api/plants/:id/units': {
    path: (fx) => `/api/plants/${fx.plant.id}/units`,
    body: () => ({ name: `Unit ${Math.random().toString(36).slice(2)}` }),
    expect: writers(201),
  },
  'GET /api/units/:id': { path: (fx) => `/api/units/${fx.unit.id}`, expect: readers(200) },
  'PATCH /api/units/:id': { path: async (fx) => `/api/units/${(await freshUnit(fx)).id}`, body: () => ({ name: 'Renamed unit' }), expect: writers(200) },
  'DELETE /api/units/:id': { path: async (fx) => `/api/units/${(await freshUnit(fx)).id}`, expect: writers(204) },
  'PUT /api/units/:id/condenser': { path: (fx) => `/api/units/${fx.unit.id}/condenser`, body: () => TEST_CONDENSER, expect: writers(200) },
  'PUT /api/units/:id/turbine': { path: (fx) => `/api/units/${fx.unit.id}/turbine`, body: () => TEST_TURBINE, expect: writers(200) },
  'PUT /api/units/:id/economics': { path: (fx) => `/api/units/${fx.unit.id}/economics`, body: () => TEST_ECONOMICS, expect: writers(200) },
  'GET /api/units/:id/daily': { path: (fx) => `/api/units/${fx.unit.id}/daily`, expect: readers(200) },
  'GET /api/units/:id/events': { path: (fx) => `/api/units/${fx.unit.id}/events`, expect: readers(200) },
  'POST /api/units/:id/events': {
    path: (fx) => `/api/units/${fx.unit.id}/events`,
    body: () => ({ kind: 'other', startDate: '2026-02-01', notes: 'walkdown' }),
    expect: writers(201),
  },
  'PUT /api/events/:id': {
    path: async (fx) => `/api/events/${(await createEvent(ds(), fx.unit)).id}`,
    body: () => ({ kind: 'air-leak-repair', startDate: '2026-02-02' }),
    expect: writers(200),
  },
  'DELETE /api/events/:id': { path: async (fx) => `/api/events/${(await createEvent(ds(), fx.unit)).id}`, expect: writers(204) },
  // No file attached: writers are told to choose one; outside the scope the unit is not found first.
  'POST /api/units/:id/uploads': { path: (fx) => `/api/units/${fx.unit.id}/uploads`, expect: writers(400) },
  'GET /api/organisation/historian-status-words': { expect: members(200) },
  'PUT /api/organisation/historian-status-words': { body: () => ({ words: ['Scan Off'] }), expect: adminsOnly(200) },
  'GET /api/units/:id/health': { path: (fx) => `/api/units/${fx.unit.id}/health`, expect: readers(200) },
  'GET /api/portfolio': { expect: members(200) },
  'GET /api/notifications': { expect: members(200) },
  // Your own choices; naming a unit outside your scope (another tenant's, another client group's) is 404 and nothing is saved.
  'PUT /api/notifications': {
    body: (fx) => ({ weeklyDigest: true, allUnits: null, units: [{ unitId: fx.unit.id, kinds: ['data-stopped'], dataStoppedDays: 5 }] }),
    expect: readers(200),
  },
  'GET /api/units/:id/samples': { path: (fx) => `/api/units/${fx.unit.id}/samples?from=2026-01-01&to=2026-01-31`, expect: readers(200) },
  'GET /api/units/:id/export': { path: (fx) => `/api/units/${fx.unit.id}/export?dataset=daily&format=csv`, expect: readers(200) },
  'GET /api/units/:id/imports': { path: (fx) => `/api/units/${fx.unit.id}/imports`, expect: readers(200) },
  'GET /api/imports/:id': { path: async (fx) => `/api/imports/${(await createPendingImport(ds(), fx.unit)).id}`, expect: readers(200) },
  // An empty mapping is refused with the fields it lacks.
  // A CSV upload has no sheets: writers are told so; outside the scope the import is not found.
  'POST /api/imports/:id/sheet': {
    path: async (fx) => `/api/imports/${(await createPendingImport(ds(), fx.unit)).id}/sheet`,
    body: () => ({ sheet: 'Data' }),
    expect: writers(400),
  },
  'POST /api/imports/:id/start': {
    path: async (fx) => `/api/imports/${(await createPendingImport(ds(), fx.unit)).id}/start`,
    body: () => ({ mapping: {} }),
    expect: writers(400),
  },
  'GET /api/imports/:id/errors.csv': { path: async (fx) => `/api/imports/${(await createPendingImport(ds(), fx.unit)).id}/errors.csv`, expect: readers(200) },
  'DELETE /api/imports/:id': { path: async (fx) => `/api/imports/${(await createPendingImport(ds(), fx.unit)).id}`, expect: writers(200) },
  // Cleaning cases: the fixture unit has setup but no history, so a case cannot be built on it (409); cases are written directly.
  'GET /api/cases': { expect: members(200) },
  'GET /api/units/:id/cases': { path: (fx) => `/api/units/${fx.unit.id}/cases`, expect: readers(200) },
  'POST /api/units/:id/cases': { path: (fx) => `/api/units/${fx.unit.id}/cases`, body: () => ({ title: 'Spring cleaning' }), expect: writers(409) },
  // A draft: viewers see approved cases only.
  'GET /api/cases/:id': {
    path: async (fx) => `/api/cases/${(await freshCase(fx)).id}`,
    expect: members(200, { viewer: 404, otherTenant: 404, otherGroup: 404 }),
  },
  'PATCH /api/cases/:id': { path: async (fx) => `/api/cases/${(await freshCase(fx)).id}`, body: () => ({ title: 'Renamed case' }), expect: writers(200) },
  'POST /api/cases/:id/submit': { path: async (fx) => `/api/cases/${(await freshCase(fx)).id}/submit`, expect: writers(200) },
  // Written by the analyst: approvers and administrators decide; the analyst's role cannot.
  'POST /api/cases/:id/approve': { path: async (fx) => `/api/cases/${(await freshCase(fx, 'submitted')).id}/approve`, expect: deciders(200) },
  'POST /api/cases/:id/return': {
    path: async (fx) => `/api/cases/${(await freshCase(fx, 'submitted')).id}/return`,
    body: () => ({ reason: 'Price it again' }),
    expect: deciders(200),
  },
  'POST /api/cases/:id/archive': { path: async (fx) => `/api/cases/${(await freshCase(fx)).id}/archive`, expect: writers(200) },
  'POST /api/cases/:id/copy': { path: async (fx) => `/api/cases/${(await freshCase(fx)).id}/copy`, expect: writers(409) },
  'GET /api/cases/:id/comments': {
    path: async (fx) => `/api/cases/${(await freshCase(fx)).id}/comments`,
    expect: members(200, { viewer: 404, otherTenant: 404, otherGroup: 404 }),
  },
  'GET /api/cases/:id/report.pdf': { path: async (fx) => `/api/cases/${(await freshCase(fx, 'approved')).id}/report.pdf`, expect: readers(200) },
  'GET /api/cases/:id/export.xlsx': { path: async (fx) => `/api/cases/${(await freshCase(fx, 'approved')).id}/export.xlsx`, expect: readers(200) },
  // Billing: administrators without a client-group limit; tenant A is on its trial (no subscription to change or cancel).
  'GET /api/billing': { expect: adminsOnly(200, { otherGroup: 403 }) },
  'GET /api/billing/notice': { expect: members(200) },
  'POST /api/billing/checkout': { body: () => ({ price: 'cleancase_consultancy_month' }), expect: adminsOnly(200, { otherGroup: 403 }) },
  'POST /api/billing/portal': { expect: adminsOnly(200, { otherGroup: 403 }) },
  'POST /api/billing/change': { body: () => ({ price: 'cleancase_fleet_month' }), expect: adminsOnly(409, { otherGroup: 403 }) },
  'POST /api/billing/cancel': { expect: adminsOnly(409, { otherGroup: 403 }) },
  'POST /api/billing/resume': { expect: adminsOnly(409, { otherGroup: 403 }) },
  // Public, without session or CSRF header; an unsigned body is refused for everyone.
  'POST /api/billing/webhook': { body: () => ({ type: 'invoice.paid' }), expect: all(400) },
  // Outages: planned by admins, analysts and approvers; approved by approvers and admins; deleted by admins; viewers read approved ones only.
  'GET /api/outages': { expect: members(200) },
  'POST /api/outages': {
    body: (fx) => ({ name: 'Autumn outage', unitIds: [fx.unit.id], startDate: '2026-10-05', endDate: '2026-10-18', budget: 250_000 }),
    // the unit lies outside the other tenant's and the other group's scope: refused on its field
    expect: members(201, { viewer: 403, otherTenant: 400, otherGroup: 400 }),
  },
  'GET /api/outages/:id': {
    path: async (fx) => `/api/outages/${(await freshOutage(fx)).outage.id}`,
    expect: members(200, { viewer: 404, otherTenant: 404, otherGroup: 404 }),
  },
  'PATCH /api/outages/:id': {
    path: async (fx) => `/api/outages/${(await freshOutage(fx)).outage.id}`,
    body: () => ({ budget: 300_000 }),
    expect: planners(200),
  },
  'DELETE /api/outages/:id': {
    path: async (fx) => `/api/outages/${(await freshOutage(fx, 'approved')).outage.id}`,
    expect: members(204, { analyst: 403, approver: 403, viewer: 403, otherTenant: 404, otherGroup: 404 }),
  },
  'POST /api/outages/:id/items': {
    path: async (fx) => `/api/outages/${(await freshOutage(fx)).outage.id}/items`,
    body: (fx) => ({
      unitId: fx.unit.id,
      kind: 'waterbox-repair',
      title: 'Reline the inlet waterbox',
      cost: 45_000,
      durationDays: 4,
      lane: 'Waterbox B',
      benefit: 30_000,
    }),
    expect: planners(201),
  },
  'PATCH /api/outage-items/:id': {
    path: async (fx) => `/api/outage-items/${(await freshOutage(fx)).items[0]!.id}`,
    body: () => ({ forced: 'in' }),
    expect: planners(200),
  },
  'DELETE /api/outage-items/:id': { path: async (fx) => `/api/outage-items/${(await freshOutage(fx)).items[0]!.id}`, expect: planners(200) },
  'POST /api/outages/:id/optimise': { path: async (fx) => `/api/outages/${(await freshOutage(fx)).outage.id}/optimise`, expect: planners(200) },
  'POST /api/outages/:id/scopes': {
    path: async (fx) => `/api/outages/${(await freshOutage(fx)).outage.id}/scopes`,
    body: () => ({ name: 'Nothing this time', itemIds: [] }),
    expect: planners(201),
  },
  'DELETE /api/outages/:id/scopes/:scopeId': {
    path: async (fx) => {
      const { outage } = await freshOutage(fx);
      const saved = await ds().getRepository(OutageScope).save({ outageId: outage.id, name: 'Spare scope', itemIds: [], createdById: fx.a.users.analyst.id });
      return `/api/outages/${outage.id}/scopes/${saved.id}`;
    },
    expect: planners(200),
  },
  // No proposal yet: deciders are told to run the optimiser first.
  'POST /api/outages/:id/approve': { path: async (fx) => `/api/outages/${(await freshOutage(fx)).outage.id}/approve`, expect: deciders(409) },
  'GET /api/outages/:id/report.pdf': { path: async (fx) => `/api/outages/${(await freshOutage(fx, 'approved')).outage.id}/report.pdf`, expect: readers(200) },
  'GET /api/outages/:id/export.xlsx': { path: async (fx) => `/api/outages/${(await freshOutage(fx, 'approved')).outage.id}/export.xlsx`, expect: readers(200) },
  'POST /api/cases/:id/comments': {
    path: async (fx) => `/api/cases/${(await freshCase(fx)).id}/comments`,
    body: () => ({ text: 'Checked the outage plan' }),
    expect: members(201, { viewer: 404, otherTenant: 404, otherGroup: 404 }),
  },
};

let t: TestApp;
let google: GoogleFake;
const ds = () => t.dataSource;

describe('isolation matrix over every registered route', () => {
  let fx: Fixture;
  const agents = new Map<Caller, TestAgent>();

  const agentFor = async (caller: Caller, fresh: boolean): Promise<TestAgent> => {
    if (caller === 'anonymous') return request.agent(t.app);
    if (!fresh && agents.has(caller)) return agents.get(caller)!;
    const agent = await signedInAgent(t.app, fx.emails[caller]);
    if (!fresh) agents.set(caller, agent);
    return agent;
  };

  beforeAll(async () => {
    google = await startGoogleFake(0);
    t = await createTestApp({ GOOGLE_AUTH_URL: google.authUrl, GOOGLE_TOKEN_URL: google.tokenUrl, GOOGLE_USERINFO_URL: google.userInfoUrl });
    const a = await createTenant(t.dataSource, 'alpha');
    const b = await createTenant(t.dataSource, 'beta');
    const limited = await createUser(t.dataSource, 'alpha-limited-admin');
    await addMember(t.dataSource, a.organisation.id, limited, 'admin', [a.groups[1].id]);
    const plant = await createPlant(t.dataSource, a.organisation.id, a.groups[0].id);
    const unit = await createUnit(t.dataSource, plant);
    fx = {
      a,
      plant,
      unit,
      b,
      groupLimitedAdminEmail: limited.email,
      emails: {
        admin: a.users.admin.email,
        analyst: a.users.analyst.email,
        approver: a.users.approver.email,
        viewer: a.users.viewer.email,
        otherTenant: b.users.admin.email,
        otherGroup: limited.email,
      },
    };
  });
  afterAll(async () => {
    await t?.close();
    await google?.stop();
  });

  it('has an entry for every registered route, and no entry for a route that does not exist', () => {
    const registered = t.app.locals.routes.map((r) => `${r.method.toUpperCase()} ${r.path}`).sort();
    expect(Object.keys(MATRIX).sort()).toEqual(registered);
  });

  it('marks every tenant-scoped route as needing a signed-in member', () => {
    for (const route of t.app.locals.routes.filter((r) => r.tenantScoped)) {
      expect(['public', 'signed-in'], `${route.method} ${route.path}`).not.toContain(route.access);
    }
  });

  for (const [key, entry] of Object.entries(MATRIX)) {
    it(`${key} answers each caller as decided`, async () => {
      const [method, pattern] = key.split(' ') as [string, string];
      const got: Partial<Record<Caller, number>> = {};
      for (const caller of CALLERS) {
        const agent = await agentFor(caller, !!entry.changesSession);
        const path = entry.path ? await entry.path(fx) : pattern;
        let req = agent[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](path);
        if (method !== 'GET') req = req.set(CSRF);
        const body = entry.body?.(fx);
        const res = await (body === undefined ? req : req.send(body as object));
        got[caller] = res.status;
      }
      expect(got).toEqual(entry.expect);
    });
  }
});
