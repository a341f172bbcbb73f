/**
 * The API reference page, for people who script against Cleancase: readable without signing in, built from
 * the server's own description, each endpoint with who may call it and the fields it takes and answers.
 */
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from '../helpers/browser.js';
import { startTestServer } from '../helpers/test-server.js';

describe('the API reference page', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: Browser;
  let page: Page;
  const consoleErrors: string[] = [];

  beforeAll(async () => {
    server = await startTestServer();
    browser = await launchBrowser();
    page = await browser.newPage();
    page.on('console', (m) => {
      if (m.type() === 'error') consoleErrors.push(m.text());
    });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  it('lists the endpoints by group without signing in', async () => {
    await page.goto(`${server.url}/api-reference`);
    await expect.poll(() => page.getByRole('heading', { name: 'API reference' }).isVisible()).toBe(true);
    await expect.poll(() => page.getByRole('heading', { name: 'plants' }).isVisible()).toBe(true);
    expect(await page.locator('summary', { hasText: '/api/plants/{id}/units' }).count()).toBe(1);
  });

  it('opens an endpoint to show who may call it, its request fields and its answer', async () => {
    const card = page.locator('details', { has: page.locator('summary', { hasText: 'Create a plant' }) });
    await card.locator('summary').click();
    await expect.poll(() => card.getByText('Request body (JSON)').isVisible()).toBe(true);
    const text = await card.innerText();
    expect(text).toContain('whose role has the permission “data.write”');
    expect(text).toMatch(/timeZone: string/);
    expect(text).toMatch(/Answer 201 \(JSON\)/i);
    expect(text).toMatch(/units: array of object/);
    expect(text).toContain('401');
    expect(consoleErrors).toEqual([]);
  });
});
