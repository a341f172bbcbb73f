/**
 * Sign-in limits count failed sign-ins per account and per address, never successful ones, and keep their
 * counters in MariaDB: a guesser cannot reset them by rotating X-Forwarded-For, the e-mail, the client
 * address or the app process. X-Forwarded-For names the client only when TRUST_PROXY names the proxy.
 */
import { randomBytes } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, type CleancaseApp } from '../../backend/src/app.js';
import { loadConfig } from '../../backend/src/config.js';
import { buildDataSource } from '../../backend/src/data-source.js';
import { createLogger } from '../../backend/src/logger.js';
import type { Mailer } from '../../backend/src/mail/mailer.js';
import { createTenant, createUser, CSRF, TEST_PASSWORD, type TenantFixture } from '../factories/accounts.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';

const WRONG = 'not the right passphrase';
/** Rate limits as set in backend/src/http/rate-limits.ts. */
const ACCOUNT_FAILURES = 10;
const ADDRESS_FAILURES = 30;

let n = 0;
/** A different documentation address (RFC 5737 TEST-NET-3) for every call. */
const nextForwardedFor = () => `203.0.113.${(n++ % 250) + 1}`;

const signIn = (app: CleancaseApp, email: string, password: string, forwardedFor?: string) => {
  const req = request(app).post('/api/session').set(CSRF);
  return (forwardedFor ? req.set('X-Forwarded-For', forwardedFor) : req).send({ email, password });
};

/** Sign-in over a real socket from the given loopback address (the whole 127/8 reaches the loopback interface). */
function signInFrom(port: number, localAddress: string, email: string, password: string): Promise<number> {
  const body = JSON.stringify({ email, password });
  return new Promise((resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port,
        localAddress,
        method: 'POST',
        path: '/api/session',
        headers: { ...CSRF, 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) },
      },
      (res) => {
        res.resume();
        res.on('end', () => resolve(res.statusCode ?? 0));
      },
    );
    req.on('error', reject);
    req.end(body);
  });
}

describe('sign-in limits without a configured proxy', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t?.close());

  it('failures with a different X-Forwarded-For each time still lock the account', async () => {
    const victim = (await createUser(t.dataSource, 'xff-victim')).email;
    for (let i = 0; i < ACCOUNT_FAILURES; i++) await signIn(t.app, victim, WRONG, nextForwardedFor()).expect(401);
    const locked = await signIn(t.app, victim, TEST_PASSWORD, nextForwardedFor());
    expect(locked.status).toBe(429);
    expect(Number(locked.headers['retry-after'])).toBeGreaterThan(0);
    expect(locked.body.error).toMatch(/try again in/);
  });

  it('failures from a different client address each time still lock the account', async () => {
    const victim = (await createUser(t.dataSource, 'address-victim')).email;
    const server = http.createServer(t.app).listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    try {
      const port = (server.address() as AddressInfo).port;
      for (let i = 0; i < ACCOUNT_FAILURES; i++) expect(await signInFrom(port, `127.0.0.${i + 2}`, victim, WRONG)).toBe(401);
      expect(await signInFrom(port, '127.0.0.99', victim, TEST_PASSWORD)).toBe(429);
    } finally {
      await new Promise((resolve) => server.close(resolve));
    }
  });
});

/** The token of the reset link in the newest mail to `to`. */
async function resetTokenMailedTo(t: TestApp, to: string): Promise<string> {
  const [mail] = await t.mailTo(to);
  const token = mail?.text.match(/\/reset-password\?token=([A-Za-z0-9_%-]+)/)?.[1];
  if (!token) throw new Error(`no reset link mailed to ${to}`);
  return decodeURIComponent(token);
}

describe('an account locked by someone else’s failed sign-ins', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t?.close());

  it('opens again for its owner once they reset the password through the mailed link', async () => {
    const victim = (await createUser(t.dataSource, 'lock-victim')).email;
    for (let i = 0; i < ACCOUNT_FAILURES; i++) await signIn(t.app, victim, WRONG, nextForwardedFor()).expect(401);
    await signIn(t.app, victim, TEST_PASSWORD).expect(429);

    await request(t.app).post('/api/password-reset').set(CSRF).send({ email: victim }).expect(202);
    const token = await resetTokenMailedTo(t, victim);
    const newPassword = 'a fresh passphrase after the lock';
    await request(t.app).post('/api/password-reset/confirm').set(CSRF).send({ token, password: newPassword }).expect(204);
    await signIn(t.app, victim, newPassword).expect(200);
  });
});

describe('sign-in limits per address without a configured proxy', () => {
  let t: TestApp;
  let tenant: TenantFixture;
  beforeAll(async () => {
    t = await createTestApp();
    tenant = await createTenant(t.dataSource, 'spray');
  });
  afterAll(async () => t?.close());

  it('failures against many accounts from one address, whatever X-Forwarded-For says, stop that address', async () => {
    for (let i = 0; i < ADDRESS_FAILURES; i++) {
      await signIn(t.app, `guess-${i}-${randomBytes(3).toString('hex')}@example.test`, WRONG, nextForwardedFor()).expect(401);
    }
    await signIn(t.app, tenant.users.viewer.email, TEST_PASSWORD, nextForwardedFor()).expect(429);
  }, 180_000);
});

describe('successful sign-ins', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t?.close());

  it('do not count: many in a row all succeed, and the failures allowed afterwards are the full number', async () => {
    const email = (await createUser(t.dataSource, 'often')).email;
    for (let i = 0; i < ACCOUNT_FAILURES + 5; i++) await signIn(t.app, email, TEST_PASSWORD).expect(200);
    for (let i = 0; i < ACCOUNT_FAILURES - 1; i++) await signIn(t.app, email, WRONG).expect(401);
    await signIn(t.app, email, TEST_PASSWORD).expect(200);
    await signIn(t.app, email, WRONG).expect(401);
    await signIn(t.app, email, TEST_PASSWORD).expect(429);
  }, 180_000);
});

describe('sign-in limits behind a configured proxy', () => {
  let t: TestApp;
  beforeAll(async () => {
    // A proxy in front means other machines reach the app: real SMTP only (the test still delivers to its private sink).
    t = await createTestApp({ TRUST_PROXY: 'loopback', SMTP_URL: 'smtp://127.0.0.1:1' });
  });
  afterAll(async () => t?.close());

  it('failures forwarded for different client addresses still lock the account', async () => {
    const victim = (await createUser(t.dataSource, 'proxied-victim')).email;
    for (let i = 0; i < ACCOUNT_FAILURES; i++) await signIn(t.app, victim, WRONG, nextForwardedFor()).expect(401);
    await signIn(t.app, victim, TEST_PASSWORD, nextForwardedFor()).expect(429);
  });

  it('the forwarded client address is the one counted: one client’s failures do not stop another client', async () => {
    const stopped = '198.51.100.7';
    for (let i = 0; i < ADDRESS_FAILURES; i++) await signIn(t.app, `spray-${i}-${randomBytes(3).toString('hex')}@example.test`, WRONG, stopped).expect(401);
    const someone = (await createUser(t.dataSource, 'someone')).email;
    await signIn(t.app, someone, TEST_PASSWORD, stopped).expect(429);
    await signIn(t.app, someone, TEST_PASSWORD, '198.51.100.8').expect(200);
  }, 180_000);
});

describe('rate-limit counters in MariaDB', () => {
  let t: TestApp;
  const others: { app: CleancaseApp; dataSource: DataSource }[] = [];
  const noMail: Mailer = { send: async () => {} };

  /** Another app process on the same database (its own connection pool), as after a restart or beside the first. */
  const anotherApp = async () => {
    const dataSource = buildDataSource({
      host: t.config.DB_HOST,
      port: t.config.DB_PORT,
      database: t.config.DB_NAME,
      user: t.config.DB_USER,
      password: t.config.DB_PASSWORD,
    });
    await dataSource.initialize();
    const app = createApp({ config: t.config, dataSource, logger: createLogger('silent'), mailer: noMail });
    others.push({ app, dataSource });
    return { app, dataSource };
  };

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    for (const o of others) {
      await o.app.locals.close();
      if (o.dataSource.isInitialized) await o.dataSource.destroy();
    }
    await t?.close();
  });

  it('two app instances on one database share the failure count, and a restarted instance keeps it', async () => {
    const email = (await createUser(t.dataSource, 'shared')).email;
    const second = await anotherApp();
    for (let i = 0; i < ACCOUNT_FAILURES / 2; i++) {
      await signIn(t.app, email, WRONG).expect(401);
      await signIn(second.app, email, WRONG).expect(401);
    }
    await signIn(t.app, email, TEST_PASSWORD).expect(429);
    await signIn(second.app, email, TEST_PASSWORD).expect(429);
    await second.app.locals.close();
    await second.dataSource.destroy();
    const restarted = await anotherApp();
    await signIn(restarted.app, email, TEST_PASSWORD).expect(429);
    const rows = await t.dataSource.query('SELECT COUNT(*) AS n FROM rate_limit_counter');
    expect(Number(rows[0].n)).toBeGreaterThan(0);
  });

  it('the table holds no e-mail address in clear', async () => {
    const email = (await createUser(t.dataSource, 'hashed')).email;
    await signIn(t.app, email, WRONG).expect(401);
    const keys = (await t.dataSource.query('SELECT `key` FROM rate_limit_counter')) as { key: string }[];
    expect(keys.length).toBeGreaterThan(0);
    expect(keys.some((k) => k.key.includes(email) || k.key.includes('example.test'))).toBe(false);
  });
});

describe('TRUST_PROXY setting', () => {
  const base = { NODE_ENV: 'test', SMTP_URL: 'smtp://127.0.0.1:1' };
  it('is off unless set, and takes a hop count or proxy addresses', () => {
    expect(loadConfig(base).TRUST_PROXY).toBe('off');
    expect(loadConfig({ ...base, TRUST_PROXY: '1' }).TRUST_PROXY).toBe('1');
    expect(loadConfig({ ...base, TRUST_PROXY: 'loopback, 10.0.0.0/8' }).TRUST_PROXY).toBe('loopback, 10.0.0.0/8');
  });

  it('refuses trusting every address, which would let any client choose the address it is counted under', () => {
    expect(() => loadConfig({ ...base, TRUST_PROXY: 'true' })).toThrow(/TRUST_PROXY/);
  });
});
