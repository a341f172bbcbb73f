import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startGoogleFake, type GoogleFake } from '../../scripts/lib/local-services.js';
import { addMember, createTenant, createUser, CSRF, signedInAgent, TEST_PASSWORD, uniqueEmail } from '../factories/accounts.js';
import { createApp } from '../../backend/src/app.js';
import { publicUrl } from '../../backend/src/config.js';
import { createLogger } from '../../backend/src/logger.js';
import type { Mailer } from '../../backend/src/mail/mailer.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

/** Delivers the outbox and returns the newest message the SMTP sink holds for `to`. */
async function mailTo(t: TestApp, to: string) {
  const [mail] = await t.mailTo(to);
  if (!mail) throw new Error(`no mail to ${to}`);
  return mail;
}

/** The token of the link in the newest message to `to`. */
async function linkMailedTo(t: TestApp, to: string, pathPart: string): Promise<string> {
  const mail = await mailTo(t, to);
  const token = mail.text.match(new RegExp(`https?://\\S+${pathPart}\\?token=([A-Za-z0-9_%-]+)`))?.[1];
  if (!token) throw new Error(`no ${pathPart} link in: ${mail.text}`);
  return decodeURIComponent(token);
}

/** Where a redirect answer points. */
function redirectTarget(res: request.Response): URL {
  const to = res.headers.location;
  if (!to) throw new Error(`no Location header on the ${res.status} answer`);
  return new URL(to);
}

describe('account flows', () => {
  let t: TestApp;
  let google: GoogleFake;
  beforeAll(async () => {
    google = await startGoogleFake(0);
    t = await createTestApp({ GOOGLE_AUTH_URL: google.authUrl, GOOGLE_TOKEN_URL: google.tokenUrl, GOOGLE_USERINFO_URL: google.userInfoUrl });
  });
  afterAll(async () => {
    await t?.close();
    await google?.stop();
  });

  it('sign-up creates a person and an organisation on a 14-day trial with them as administrator; they can sign in at once', async () => {
    const email = uniqueEmail('founder');
    const res = await request(t.app)
      .post('/api/sign-up')
      .set(CSRF)
      .send({ name: 'Ada Founder', email, password: 'tube bundles need cleaning', organisationName: 'Lakeside Generating' });
    expect(res.status).toBe(201);
    const agent = await signedInAgent(t.app, email, 'tube bundles need cleaning');
    const session = (await agent.get('/api/session').expect(200)).body;
    expect(session.user.email).toBe(email);
    expect(session.memberships).toEqual([expect.objectContaining({ organisationName: 'Lakeside Generating', role: 'admin' })]);
    expect(session.permissions).toContain('members.manage');
    const [org] = await t.dataSource.query('SELECT subscriptionStatus, trialEndsAt FROM organisation WHERE id = ?', [session.activeOrganisationId]);
    expect(org.subscriptionStatus).toBe('trialing');
    const days = (new Date(org.trialEndsAt).getTime() - Date.now()) / 86_400_000;
    expect(days).toBeGreaterThan(13.9);
    expect(days).toBeLessThan(14.1);
  });

  it('sign-up answers the same whether or not the address has an account; an existing address gets a notice, not a second account', async () => {
    const existing = await createUser(t.dataSource, 'taken');
    const body = (email: string) => ({ name: 'Someone', email, password: 'tube bundles need cleaning', organisationName: 'Some Utility' });
    const fresh = await request(t.app)
      .post('/api/sign-up')
      .set(CSRF)
      .send(body(uniqueEmail('fresh')));
    const taken = await request(t.app).post('/api/sign-up').set(CSRF).send(body(existing.email));
    expect(taken.status).toBe(fresh.status);
    expect(taken.status).toBe(201);
    expect(taken.body).toEqual(fresh.body);
    expect(taken.headers['set-cookie']).toBeUndefined();
    expect(fresh.headers['set-cookie']).toBeUndefined();

    const [count] = await t.dataSource.query('SELECT COUNT(*) AS n FROM user WHERE email = ?', [existing.email]);
    expect(Number(count.n)).toBe(1);
    // The existing password still works, the one typed at sign-up does not.
    await signedInAgent(t.app, existing.email);
    await request(t.app).post('/api/session').set(CSRF).send({ email: existing.email, password: 'tube bundles need cleaning' }).expect(401);
    const notice = await mailTo(t, existing.email);
    expect(notice.subject).toBe('Your Cleancase account already exists');
    expect(notice.text).toContain(`${publicUrl(t.config)}/forgot-password`);
  });

  it('refuses short and common passwords, and accepts a long passphrase (OWASP ASVS 2.1)', async () => {
    const base = { name: 'P', organisationName: 'Org P' };
    const short = await request(t.app)
      .post('/api/sign-up')
      .set(CSRF)
      .send({ ...base, email: uniqueEmail('p'), password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.details.fieldErrors[0]).toEqual({ path: 'password', message: 'Use at least 8 characters' });
    const common = await request(t.app)
      .post('/api/sign-up')
      .set(CSRF)
      .send({ ...base, email: uniqueEmail('p'), password: 'password1' });
    expect(common.status).toBe(400);
    expect(common.body.details.fieldErrors[0].message).toMatch(/most common/);
    const long = await request(t.app)
      .post('/api/sign-up')
      .set(CSRF)
      .send({ ...base, email: uniqueEmail('p'), password: 'x'.repeat(3) + ' a very long passphrase '.repeat(20) });
    expect(long.status).toBe(201);
  });

  it('an invitation arrives by e-mail; accepting it creates the account with the invited role', async () => {
    const tenant = await createTenant(t.dataSource, 'invite');
    const admin = await signedInAgent(t.app, tenant.users.admin.email);
    const email = uniqueEmail('colleague');
    await admin
      .post('/api/invitations')
      .set(CSRF)
      .send({ email, role: 'approver', clientGroupIds: [tenant.groups[0].id] })
      .expect(201);
    const token = await linkMailedTo(t, email, '/invitation');

    const offer = await request(t.app).get(`/api/invitation-links/${token}`).expect(200);
    expect(offer.body).toMatchObject({ email, role: 'approver', organisationName: tenant.organisation.name, accountExists: false });

    const colleague = request.agent(t.app);
    const accepted = await colleague.post(`/api/invitation-links/${token}/accept`).set(CSRF).send({ name: 'Col League', password: 'condenser tubes are long' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user.email).toBe(email);
    expect(accepted.body.memberships).toEqual([
      expect.objectContaining({ organisationId: tenant.organisation.id, role: 'approver', limitedToClientGroups: true }),
    ]);
    const groups = await colleague.get('/api/client-groups').expect(200);
    expect(groups.body.clientGroups.map((g: { id: string }) => g.id)).toEqual([tenant.groups[0].id]);

    await request(t.app).post(`/api/invitation-links/${token}/accept`).set(CSRF).send({ name: 'Again', password: 'condenser tubes are long' }).expect(404);
    const audit = await admin.get('/api/audit-events?action=invitation').expect(200);
    expect(audit.body.events.map((e: { action: string }) => e.action)).toEqual(['invitation.accepted', 'invitation.sent']);
  });

  it('an invitation for an existing account links it after that person signs in', async () => {
    const tenant = await createTenant(t.dataSource, 'link');
    const outsider = await createUser(t.dataSource, 'outsider');
    const admin = await signedInAgent(t.app, tenant.users.admin.email);
    await admin.post('/api/invitations').set(CSRF).send({ email: outsider.email, role: 'viewer' }).expect(201);
    const token = await linkMailedTo(t, outsider.email, '/invitation');
    await request(t.app).post(`/api/invitation-links/${token}/accept`).set(CSRF).send({}).expect(401);
    const agent = await signedInAgent(t.app, outsider.email);
    const res = await agent.post(`/api/invitation-links/${token}/accept`).set(CSRF).send({}).expect(200);
    expect(res.body.activeOrganisationId).toBe(tenant.organisation.id);
    expect(res.body.memberships.map((m: { role: string }) => m.role)).toEqual(['viewer']);
  });

  it('password reset by e-mail: the link sets a new password once, and the old one stops working', async () => {
    const user = await createUser(t.dataSource, 'forgetful');
    const before = await signedInAgent(t.app, user.email);
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email: user.email }).expect(202);
    const token = await linkMailedTo(t, user.email, '/reset-password');
    await request(t.app).post('/api/password-reset/confirm').set(CSRF).send({ token, password: 'a fresh start for the pumps' }).expect(204);
    await request(t.app).post('/api/password-reset/confirm').set(CSRF).send({ token, password: 'another try at this one' }).expect(400);
    expect((await before.get('/api/session')).body.user).toBeNull();
    await request(t.app).post('/api/session').set(CSRF).send({ email: user.email, password: TEST_PASSWORD }).expect(401);
    await request(t.app).post('/api/session').set(CSRF).send({ email: user.email, password: 'a fresh start for the pumps' }).expect(200);
  });

  it('a reset link is built from the configured public address, never from the request’s Host header', async () => {
    const user = await createUser(t.dataSource, 'hosted');
    await request(t.app).post('/api/password-reset').set(CSRF).set('Host', 'evil.example').send({ email: user.email }).expect(202);
    const mail = await mailTo(t, user.email);
    expect(mail.text).not.toContain('evil.example');
    expect(mail.text).toContain(`${publicUrl(t.config)}/reset-password?token=`);
  });

  it('a reset for an unknown address answers exactly like one for a known address and sends nothing', async () => {
    const known = await createUser(t.dataSource, 'known');
    const forKnown = await request(t.app).post('/api/password-reset').set(CSRF).send({ email: known.email });
    const forUnknown = await request(t.app).post('/api/password-reset').set(CSRF).send({ email: 'ghost@example.test' });
    expect(forUnknown.status).toBe(202);
    expect(forUnknown.status).toBe(forKnown.status);
    expect(forUnknown.body).toEqual({ message: 'If an account uses this e-mail, a reset link is on its way.' });
    expect(forUnknown.body).toEqual(forKnown.body);
    expect(await t.mailTo('ghost@example.test')).toEqual([]);
    expect(await t.mailTo(known.email)).toHaveLength(1);
  });

  it('the reset answer goes out before the mail: the mail is sent afterwards, from the outbox', async () => {
    const user = await createUser(t.dataSource, 'later');
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email: user.email }).expect(202);
    // Answered, and nothing has been handed to SMTP yet: the request only queued the mail.
    const [queued] = await t.dataSource.query('SELECT COUNT(*) AS n FROM mail_outbox WHERE recipient = ?', [user.email]);
    expect(Number(queued.n)).toBe(1);
    const [sunk] = await t.dataSource.query('SELECT COUNT(*) AS n FROM sink_message WHERE recipient = ?', [user.email]);
    expect(Number(sunk.n)).toBe(0);
    expect(await t.deliverMail()).toBeGreaterThanOrEqual(1);
    expect((await t.mailTo(user.email))[0]?.subject).toBe('Reset your Cleancase password');
  });

  it('a mail server that never answers does not hold up the reset answer', async () => {
    const hung: Mailer = { send: () => new Promise<void>(() => {}) };
    const app = createApp({ config: t.config, dataSource: t.dataSource, logger: createLogger('silent'), mailer: hung, devMailbox: true });
    try {
      const user = await createUser(t.dataSource, 'hung');
      const res = await request(app).post('/api/password-reset').set(CSRF).send({ email: user.email }).timeout(5_000);
      expect(res.status).toBe(202);
    } finally {
      await app.locals.close();
    }
  });

  it('Google sign-in end to end against the local fake: new person, then the same person again', async () => {
    const email = uniqueEmail('googler');
    google.setNextUser({ sub: `g-${email}`, email, name: 'Gail Googler' });
    const agent = request.agent(t.app);
    const start = await agent.get('/api/auth/google').expect(302);
    const authorize = redirectTarget(start);
    expect(authorize.origin + authorize.pathname).toBe(google.authUrl);
    expect(authorize.searchParams.get('client_id')).toBe(t.config.GOOGLE_CLIENT_ID);
    const consent = await request(authorize.origin)
      .get(authorize.pathname + authorize.search)
      .redirects(0);
    expect(consent.status).toBe(302);
    const back = redirectTarget(consent);
    expect(back.pathname).toBe('/api/auth/google/callback');
    expect(back.searchParams.get('state')).toBe(authorize.searchParams.get('state'));
    const done = await agent.get(back.pathname + back.search).expect(302);
    expect(done.headers.location).toBe('/');
    const session = await agent.get('/api/session').expect(200);
    expect(session.body.user).toMatchObject({ email, name: 'Gail Googler' });
    expect(session.body.memberships).toEqual([]);
    const [row] = await t.dataSource.query('SELECT googleSub FROM user WHERE email = ?', [email]);
    expect(row.googleSub).toBe(`g-${email}`);
    // Google verified the address: the local mailbox shows the person their mail from now on.
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email }).expect(202);
    await t.deliverMail();
    const mailbox = (await agent.get('/api/dev/mailbox').expect(200)).body;
    expect(mailbox.addressConfirmed).toBe(true);
    expect(mailbox.messages.map((m: { subject: string }) => m.subject)).toEqual(['Reset your Cleancase password']);
  });

  it('Google sign-in with a forged state is refused and signs nobody in', async () => {
    const agent = request.agent(t.app);
    await agent.get('/api/auth/google').expect(302);
    const res = await agent.get('/api/auth/google/callback?code=forged&state=not-the-state').expect(302);
    expect(res.headers.location).toBe('/sign-in?google=failed');
    expect((await agent.get('/api/session')).body.user).toBeNull();
  });

  it('a consultant switches tenant and then sees only that tenant’s records', async () => {
    const a = await createTenant(t.dataSource, 'client-a');
    const b = await createTenant(t.dataSource, 'client-b');
    const consultant = await createUser(t.dataSource, 'consultant');
    await addMember(t.dataSource, a.organisation.id, consultant, 'analyst');
    await addMember(t.dataSource, b.organisation.id, consultant, 'analyst');
    const agent = await signedInAgent(t.app, consultant.email);
    const switched = await agent.post('/api/session/organisation').set(CSRF).send({ organisationId: b.organisation.id }).expect(200);
    expect(switched.body.activeOrganisationId).toBe(b.organisation.id);
    const groups = (await agent.get('/api/client-groups')).body.clientGroups.map((g: { id: string }) => g.id).sort();
    expect(groups).toEqual(b.groups.map((g) => g.id).sort());
    await agent.get(`/api/client-groups/${a.groups[0].id}`).expect(404);
    const outsider = await createTenant(t.dataSource, 'not-mine');
    await agent.post('/api/session/organisation').set(CSRF).send({ organisationId: outsider.organisation.id }).expect(404);
  });

  it('keeps one unrestricted administrator: the last one cannot be demoted, limited or removed', async () => {
    const tenant = await createTenant(t.dataSource, 'lastadmin');
    const admin = await signedInAgent(t.app, tenant.users.admin.email);
    const adminMembership = tenant.memberships.admin.id;
    const demote = await admin.patch(`/api/members/${adminMembership}`).set(CSRF).send({ role: 'viewer' });
    expect(demote.status).toBe(409);
    await admin
      .patch(`/api/members/${adminMembership}`)
      .set(CSRF)
      .send({ clientGroupIds: [tenant.groups[0].id] })
      .expect(409);
    await admin.delete(`/api/members/${adminMembership}`).set(CSRF).expect(409);
    await admin.patch(`/api/members/${tenant.memberships.viewer.id}`).set(CSRF).send({ role: 'admin' }).expect(204);
    await admin.patch(`/api/members/${adminMembership}`).set(CSRF).send({ role: 'analyst' }).expect(204);
    const members = await signedInAgent(t.app, tenant.users.viewer.email).then((a) => a.get('/api/members'));
    expect(members.body.members.find((m: { membershipId: string }) => m.membershipId === adminMembership).role).toBe('analyst');
  });

  it('a personal API token calls the calculation API without a session or CSRF header, and nothing else', async () => {
    const tenant = await createTenant(t.dataSource, 'tokens');
    const analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    const created = await analyst.post('/api/api-tokens').set(CSRF).send({ name: 'nightly batch' }).expect(201);
    const token: string = created.body.token;
    expect(token).toMatch(/^cct_/);
    const [stored] = await t.dataSource.query('SELECT tokenHash FROM api_token WHERE id = ?', [created.body.id]);
    expect(stored.tokenHash).not.toContain(token.slice(4));

    const calc = await request(t.app)
      .post('/api/calc/saturation')
      .set('Authorization', `Bearer ${token}`)
      .send([{ pressureKpa: 8 }, { pressureKpa: -1 }]);
    expect(calc.status).toBe(422);
    expect(calc.body[0].temperatureC).toBeCloseTo(41.51, 2); // IF97 region 4 at 8 kPa: Tsat = 41.51 °C (from memory; checked in tests/reference)
    expect(calc.body[1].error).toBeTruthy();
    await request(t.app).get('/api/members').set('Authorization', `Bearer ${token}`).expect(403);
    await request(t.app).get('/api/calc').set('Authorization', 'Bearer cct_not-a-token').expect(401);

    await analyst.delete(`/api/api-tokens/${created.body.id}`).set(CSRF).expect(204);
    await request(t.app).get('/api/calc').set('Authorization', `Bearer ${token}`).expect(401);
  });

  it('a password change or reset revokes every API token of the person', async () => {
    const tenant = await createTenant(t.dataSource, 'revoke');
    const analyst = await signedInAgent(t.app, tenant.users.analyst.email);
    const first = (await analyst.post('/api/api-tokens').set(CSRF).send({ name: 'before the change' }).expect(201)).body.token as string;
    await request(t.app).get('/api/calc').set('Authorization', `Bearer ${first}`).expect(200);
    await analyst
      .post('/api/profile/password')
      .set(CSRF)
      .send({ currentPassword: TEST_PASSWORD, newPassword: 'a changed passphrase for the pumps' })
      .expect(200);
    await request(t.app).get('/api/calc').set('Authorization', `Bearer ${first}`).expect(401);
    expect((await analyst.get('/api/api-tokens').expect(200)).body.apiTokens).toEqual([]);

    const second = (await analyst.post('/api/api-tokens').set(CSRF).send({ name: 'before the reset' }).expect(201)).body.token as string;
    await request(t.app).post('/api/password-reset').set(CSRF).send({ email: tenant.users.analyst.email }).expect(202);
    const reset = await linkMailedTo(t, tenant.users.analyst.email, '/reset-password');
    await request(t.app).post('/api/password-reset/confirm').set(CSRF).send({ token: reset, password: 'a reset passphrase for the pumps' }).expect(204);
    await request(t.app).get('/api/calc').set('Authorization', `Bearer ${second}`).expect(401);
  });

  it('a member limited to one client group sees only that group, and a group they are not in answers 404', async () => {
    const tenant = await createTenant(t.dataSource, 'limited');
    const limitedUser = await createUser(t.dataSource, 'limited-viewer');
    await addMember(t.dataSource, tenant.organisation.id, limitedUser, 'viewer', [tenant.groups[1].id]);
    const agent = await signedInAgent(t.app, limitedUser.email);
    const list = await agent.get('/api/client-groups').expect(200);
    expect(list.body.clientGroups.map((g: { name: string }) => g.name)).toEqual(['Group Two']);
    await agent.get(`/api/client-groups/${tenant.groups[0].id}`).expect(404);
    await agent.get(`/api/client-groups/${tenant.groups[1].id}`).expect(200);
  });

  it('the audit log filters by action, person and record type, newest first, within the tenant only', async () => {
    const tenant = await createTenant(t.dataSource, 'audit');
    const other = await createTenant(t.dataSource, 'audit-other');
    const admin = await signedInAgent(t.app, tenant.users.admin.email);
    const otherAdmin = await signedInAgent(t.app, other.users.admin.email);
    await admin.post('/api/client-groups').set(CSRF).send({ name: 'Ridge Clients' }).expect(201);
    await otherAdmin.post('/api/client-groups').set(CSRF).send({ name: 'Secret Clients' }).expect(201);
    await admin.patch(`/api/members/${tenant.memberships.viewer.id}`).set(CSRF).send({ role: 'analyst' }).expect(204);
    const all = (await admin.get('/api/audit-events').expect(200)).body.events;
    expect(all.map((e: { action: string }) => e.action)).toEqual(['member.updated', 'client-group.created']);
    expect(JSON.stringify(all)).not.toContain('Secret Clients');
    const groupsOnly = (await admin.get('/api/audit-events?entityType=client-group').expect(200)).body.events;
    expect(groupsOnly).toHaveLength(1);
    expect(groupsOnly[0]).toMatchObject({ userName: tenant.users.admin.name, details: { name: 'Ridge Clients' } });
    const byPerson = (await admin.get(`/api/audit-events?userId=${tenant.users.viewer.id}`).expect(200)).body.events;
    expect(byPerson).toEqual([]);
    await admin.get('/api/audit-events?from=not-a-date').expect(400);
  });
});
