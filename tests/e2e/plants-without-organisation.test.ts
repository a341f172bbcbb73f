/**
 * Someone signed in who belongs to no organisation (for example after signing in with Google, or after being
 * removed from their only organisation) opens Plants: the page offers to start an organisation and fires no
 * request that could only be refused. The session answer is the server's shape for such a person.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SessionResponse } from '../../shared/schemas/session.js';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

const NO_ORGANISATION: SessionResponse = {
  user: { id: '00000000-0000-4000-8000-00000000000a', email: 'newcomer@example.test', name: 'Newcomer', unitPreference: 'si' },
  activeOrganisationId: null,
  permissions: [],
  memberships: [],
  devMailbox: false,
};

describe('Plants for a person in no organisation', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: Browser;
  let page: Page;
  const apiCalls: string[] = [];
  const refusals: string[] = [];
  const consoleErrors: string[] = [];

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    page = await browser.newPage();
    await page.route('**/api/session', (route) =>
      route.request().method() === 'GET'
        ? route.fulfill({ status: 200, contentType: 'application/json', body: JSON.stringify(NO_ORGANISATION) })
        : route.continue(),
    );
    page.on('request', (r) => {
      const url = new URL(r.url());
      if (url.pathname.startsWith('/api/')) apiCalls.push(`${r.method()} ${url.pathname}`);
    });
    page.on('response', (r) => {
      if (r.status() >= 400) refusals.push(`${r.status()} ${new URL(r.url()).pathname}`);
    });
    page.on('console', (m) => {
      if (m.type() === 'error') consoleErrors.push(m.text());
    });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('shows the start-an-organisation state', async () => {
    await page.goto(`${server.url}/plants`);
    await expect.poll(() => page.getByRole('button', { name: 'Start organisation' }).isVisible()).toBe(true);
    await expect(page.getByText('You belong to no organisation yet').isVisible()).resolves.toBe(true);
  });

  it('fires no request but the session, and nothing is refused or logged as an error', async () => {
    // give any late query a moment to show itself
    await page.waitForTimeout(500);
    expect(apiCalls.filter((c) => c !== 'GET /api/session')).toEqual([]);
    expect(refusals).toEqual([]);
    expect(consoleErrors).toEqual([]);
  });
});
