/**
 * Every JSON answer the front end reads, on the demo data, fits its shared schema exactly: the schemas are
 * strict, so a field the server adds or drops without the schema fails here.
 */
import { writeFile } from 'node:fs/promises';
import type TestAgent from 'supertest/lib/agent.js';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ZodType } from 'zod';
import { uploadResponse } from '../../shared/schemas/imports.js';
import type { RouteSpec } from '../../backend/src/http/route-registry.js';
import { seedDemoIfEmpty } from '../../backend/src/seed/demo-seed.js';
import { DEMO_PASSWORD } from '../../backend/src/seed/demo-people.js';
import { CSRF, signedInAgent } from '../factories/accounts.js';
import { makeTempDir } from '../helpers/historian-files.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

describe('API answers on the demo data', () => {
  let t: TestApp;
  let tmp: Awaited<ReturnType<typeof makeTempDir>>;
  let admin: TestAgent;
  /** Registered path → the URL that reads it on the demo data. */
  let urls: Record<string, string[]>;

  beforeAll(async () => {
    tmp = await makeTempDir();
    t = await createTestApp({ UPLOAD_DIR: tmp.file('uploads') });
    // One unit on a fixed day keeps the seed short; the other demo units are made the same way.
    expect(await seedDemoIfEmpty(t.dataSource, () => {}, true, { today: '2026-12-02', units: ['saltmarsh-point-1'] })).toBe(true);
    admin = await signedInAgent(t.app, 'admin@tidewater.example', DEMO_PASSWORD);
    const plants = (await admin.get('/api/plants').expect(200)).body.plants as { id: string; units: { id: string }[] }[];
    const plant = plants.find((p) => p.units.length > 0)!;
    const unitId = plant.units[0]!.id;
    const imports = (await admin.get(`/api/units/${unitId}/imports`).expect(200)).body.imports as { id: string }[];
    const groups = (await admin.get('/api/client-groups').expect(200)).body.clientGroups as { id: string }[];
    expect(imports.length, 'the demo unit has imports').toBeGreaterThan(0);
    expect(groups.length, 'the demo organisation has client groups').toBeGreaterThan(0);
    const invitee = 'new.analyst@example.test';
    await admin.post('/api/invitations').set(CSRF).send({ email: invitee, role: 'analyst' }).expect(201);
    const [mail] = await t.mailTo(invitee);
    const token = mail!.text.match(/\/invitation\?token=([A-Za-z0-9_%-]+)/)![1]!;
    const built = (await admin.post(`/api/units/${unitId}/cases`).set(CSRF).send({ title: 'Schema check' }).expect(201)).body as { id: string };
    await admin.post(`/api/cases/${built.id}/comments`).set(CSRF).send({ text: 'Read back by the schema test' }).expect(201);
    const outage = (
      await admin
        .post('/api/outages')
        .set(CSRF)
        .send({ name: 'Schema check outage', unitIds: [unitId], startDate: '2027-03-01', endDate: '2027-03-14', budget: 90_000 })
        .expect(201)
    ).body as { id: string };
    await admin
      .post(`/api/outages/${outage.id}/items`)
      .set(CSRF)
      .send({ unitId, kind: 'tube-plugging', title: 'Plug tubes', cost: 20_000, durationDays: 3, lane: 'A', benefit: 40_000 })
      .expect(201);
    await admin
      .post(`/api/outages/${outage.id}/items`)
      .set(CSRF)
      .send({
        unitId,
        kind: 'air-in-leakage-repair',
        title: 'Seal a joint',
        cost: 10_000,
        durationDays: 2,
        lane: 'B',
        benefit: { cleanlinessRecovered: 0.02, horizonDays: 180 },
      })
      .expect(201);
    await admin.post(`/api/outages/${outage.id}/optimise`).set(CSRF).expect(200);
    await admin.post(`/api/outages/${outage.id}/scopes`).set(CSRF).send({ name: 'As proposed' }).expect(201);
    urls = {
      '/api/health': ['/api/health'],
      '/api/openapi.json': ['/api/openapi.json'],
      '/api/session': ['/api/session'],
      '/api/plants': ['/api/plants'],
      '/api/plants/:id': [`/api/plants/${plant.id}`],
      '/api/units/:id': [`/api/units/${unitId}`],
      '/api/units/:id/health': [`/api/units/${unitId}/health`, `/api/units/${unitId}/health?breakdownBy=week&from=2026-01-01&to=2026-06-30`],
      '/api/units/:id/samples': [
        `/api/units/${unitId}/samples?from=2026-11-25&to=2026-12-01`,
        `/api/units/${unitId}/samples?from=2026-11-25&to=2026-12-01&quantity=cleanliness`,
      ],
      '/api/units/:id/events': [`/api/units/${unitId}/events`],
      '/api/portfolio': ['/api/portfolio'],
      '/api/notifications': ['/api/notifications'],
      '/api/units/:id/daily': [`/api/units/${unitId}/daily`, `/api/units/${unitId}/daily?from=2026-11-01&to=2026-11-30`],
      '/api/units/:id/imports': [`/api/units/${unitId}/imports`],
      '/api/imports/:id': [`/api/imports/${imports[0]!.id}`],
      '/api/cleaning-methods': ['/api/cleaning-methods'],
      '/api/members': ['/api/members'],
      '/api/invitations': ['/api/invitations'],
      '/api/client-groups': ['/api/client-groups'],
      '/api/organisation/historian-status-words': ['/api/organisation/historian-status-words'],
      '/api/client-groups/:id': [`/api/client-groups/${groups[0]!.id}`],
      '/api/api-tokens': ['/api/api-tokens'],
      '/api/audit-events': ['/api/audit-events'],
      '/api/dev/mailbox': ['/api/dev/mailbox'],
      '/api/calc': ['/api/calc'],
      '/api/invitation-links/:token': [`/api/invitation-links/${token}`],
      '/api/cases': ['/api/cases', `/api/cases?status=draft&unitId=${unitId}`],
      '/api/units/:id/cases': [`/api/units/${unitId}/cases`],
      '/api/cases/:id': [`/api/cases/${built.id}`],
      '/api/cases/:id/comments': [`/api/cases/${built.id}/comments`],
      '/api/outages': ['/api/outages', '/api/outages?status=draft'],
      '/api/outages/:id': [`/api/outages/${outage.id}`],
      '/api/billing': ['/api/billing'],
      '/api/billing/notice': ['/api/billing/notice'],
    };
  }, 300_000);
  afterAll(async () => {
    await t?.close();
    await tmp?.cleanup();
  });

  const jsonGets = () =>
    t.app.locals.routes.filter(
      (r): r is RouteSpec & { response: ZodType } => r.method === 'get' && !!r.response && typeof r.response === 'object' && !('file' in r.response),
    );

  it('reads every GET route that declares a JSON schema (a new one must be added here)', () => {
    const declared = jsonGets().map((r) => r.path);
    expect(declared.filter((p) => !urls[p])).toEqual([]);
  });

  it('each answer fits its schema exactly', async () => {
    const checked: string[] = [];
    for (const route of jsonGets()) {
      for (const url of urls[route.path] ?? []) {
        const res = await admin.get(url);
        expect(res.status, `${url}: ${JSON.stringify(res.body).slice(0, 300)}`).toBe(200);
        const parsed = route.response.safeParse(res.body);
        expect(parsed.success ? [] : parsed.error.issues.slice(0, 5), url).toEqual([]);
        checked.push(url);
      }
    }
    expect(checked.length).toBeGreaterThanOrEqual(20);
  });

  it('the health view of the demo unit carries a fitted trend and a cleaning outlook read from the stored analysis', async () => {
    const unitId = urls['/api/units/:id']![0]!.split('/').at(-1)!;
    const health = (await admin.get(`/api/units/${unitId}/health`).expect(200)).body;
    expect(health.warnings.filter((w: string) => w.includes('older version'))).toEqual([]);
    expect(health.trend?.status).toBe('fitted');
    expect(health.headline.nextCleaning?.status).toMatch(/planned|none-needed|not-available/);
  });

  it('an upload answers its columns, first rows and proposed mapping in the shape of its schema', async () => {
    const unitId = urls['/api/units/:id']![0]!.split('/').at(-1)!;
    const file = tmp.file('small.csv');
    await writeFile(file, 'Timestamp,Gross load MW,Backpressure inHg\n2026-11-30 00:00,410,2.1\n2026-11-30 01:00,405,2.0\n');
    const up = await admin.post(`/api/units/${unitId}/uploads`).set(CSRF).attach('file', file).expect(201);
    const parsed = uploadResponse.safeParse(up.body);
    expect(parsed.success ? [] : parsed.error.issues.slice(0, 5)).toEqual([]);
  });

  it('a stored analysis that does not fit its schema (an older version wrote it) is read as none, and the view says to recompute', async () => {
    const unitId = urls['/api/units/:id']![0]!.split('/').at(-1)!;
    const [{ analysis }] = await t.dataSource.query('SELECT analysis FROM generating_unit WHERE id = ?', [unitId]);
    await t.dataSource.query('UPDATE generating_unit SET analysis = ? WHERE id = ?', [JSON.stringify({ cycles: [{ status: 'fitted' }] }), unitId]);
    try {
      const health = (await admin.get(`/api/units/${unitId}/health`).expect(200)).body;
      expect(health.trend).toBeNull();
      expect(health.headline.nextCleaning).toBeNull();
      expect(health.warnings).toContain('The stored trend and cleaning outlook are from an older version and cannot be read; recompute the unit.');
    } finally {
      await t.dataSource.query('UPDATE generating_unit SET analysis = ? WHERE id = ?', [
        typeof analysis === 'string' ? analysis : JSON.stringify(analysis),
        unitId,
      ]);
    }
  });

  it('a strict schema refuses an answer with a field too many or one missing', async () => {
    const route = jsonGets().find((r) => r.path === '/api/units/:id')!;
    const body = (await admin.get(urls['/api/units/:id']![0]!).expect(200)).body;
    expect(route.response.safeParse({ ...body, extra: 1 }).success).toBe(false);
    const { samples: _dropped, ...missing } = body;
    expect(route.response.safeParse(missing).success).toBe(false);
  });
});
