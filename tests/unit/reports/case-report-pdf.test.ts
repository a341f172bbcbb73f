import { describe, expect, it } from 'vitest';
import { PDFParse } from 'pdf-parse';
import { renderCasePdf } from '@backend/reports/case-report/index.js';
import { CAUTION_TEXT, GENERAL_CAUTION } from '@shared/schemas/cleaning-method.js';
import { formatCurrency, formatDay } from '@shared/text/display-format.js';
import { APPROVED, CONTEXT, SOURCES, caseViewFixture } from './case-view-fixture.js';

/** Text without any whitespace, so a phrase wrapped over two lines still matches. */
const squash = (s: string) => s.replace(/\s+/g, '');

async function pdfOf(overrides = {}) {
  const view = caseViewFixture(overrides);
  const data = await renderCasePdf(view, CONTEXT);
  const parsed = await new PDFParse({ data: new Uint8Array(data) }).getText();
  return { view, data, text: parsed.text, pages: parsed.pages.map((p) => p.text) };
}

describe('case report as a PDF', () => {
  const draft = pdfOf();
  const approved = pdfOf(APPROVED);

  it('names the case, its organisation, plant and unit, and gives the NPV and first cleaning date exactly as the case page formats them', async () => {
    const { view, text } = await draft;
    expect(view.results.cleanings.length).toBeGreaterThan(0);
    const t = squash(text);
    expect(t).toContain(squash(view.title));
    expect(t).toContain(squash(CONTEXT.organisationName));
    expect(t).toContain(squash(view.plantName));
    expect(t).toContain(squash(`NPV against the baseline ${formatCurrency(view.results.businessCase.npv, 'USD')}`));
    expect(t).toContain(squash(`first on ${formatDay(view.results.cleanings[0]?.date)} by ${view.results.cleanings[0]?.methodName}`));
    // the uncertainty figures as on screen
    expect(t).toContain(squash(formatCurrency(view.results.monteCarlo!.p10Npv, 'USD')));
    expect(t).toContain(squash(formatCurrency(view.results.monteCarlo!.p90Npv, 'USD')));
  });

  it('lists every input with where it came from and the sentence saying how', async () => {
    const { text } = await draft;
    const t = squash(text);
    for (const word of ['Measured', 'Prefilled', 'Entered']) expect(t).toContain(word);
    for (const { detail } of Object.values(SOURCES)) expect(t).toContain(squash(detail));
    for (const name of [
      'Cooling-water inlet temperature',
      'Fuel price',
      'Condenser surface',
      'Discount rate',
      'Planned outage 2',
      'Brush crew, Larkspur contract: fixed cost',
    ]) {
      expect(t).toContain(squash(name));
    }
    expect(t).toContain(squash('3.5 USD/MMBtu'));
  });

  it('carries the cautions of the chosen methods, the general caution on cleaning work and the basis of the estimates', async () => {
    const { view, text } = await draft;
    const t = squash(text);
    // the recommended method needs waterbox entry and isolation (fixture's own method)
    expect(view.results.cleanings.every((c) => c.methodId === 'larkspur-brush-crew')).toBe(true);
    for (const caution of [GENERAL_CAUTION, CAUTION_TEXT['confined-space'], CAUTION_TEXT['lockout-tagout']])
      expect(t).toContain(squash(caution.replace('₂', '2')));
    expect(t).toContain(squash('confined waterboxes, chemicals, high-pressure water — follows local codes'));
    expect(t).toContain(squash('Estimates from the data and assumptions shown.'));
    expect(t).toContain(squash(`Engine 1.0.0; built on data to ${formatDay('2026-09-30')}, unit setup version 4.`));
    expect(t).toContain(squash('Quote 2026-117 from the station’s cleaning contractor'));
  });

  it('marks a draft as not approved on every page and numbers every page', async () => {
    const { pages } = await draft;
    expect(pages.length).toBeGreaterThan(1);
    pages.forEach((p, i) => {
      expect(p).toMatch(/NOT APPROVED/);
      expect(p).toContain(`Page ${i + 1} of ${pages.length}`);
    });
  });

  it('an approved case carries no not-approved mark and names its approver', async () => {
    const { text, pages } = await approved;
    expect(text).not.toMatch(/not approved/i);
    expect(squash(text)).toContain(squash('Approved by Tobias Renwick on 6 Oct 2026'));
    pages.forEach((p, i) => expect(p).toContain(`Page ${i + 1} of ${pages.length}`));
  });

  it('a returned case is marked not approved and gives the reason', async () => {
    const { text } = await pdfOf({
      status: 'returned',
      decidedBy: { id: 'u-2', name: 'Tobias Renwick' },
      decidedAt: '2026-10-06T16:20:00.000Z',
      returnReason: 'Use the 2026 fuel contract price.',
    });
    expect(text).toMatch(/NOT APPROVED/);
    expect(squash(text)).toContain(squash('Returned because: Use the 2026 fuel contract price.'));
  });

  it('embeds only the shipped Inter fonts (no built-in PDF fonts) and draws the charts as vectors, not pictures', async () => {
    const raw = (await draft).data.toString('latin1');
    const fonts = [...raw.matchAll(/\/BaseFont\s*\/([^\s/>]+)/g)].map((m) => m[1]);
    expect(fonts.length).toBeGreaterThan(0);
    for (const f of fonts) expect(f).toMatch(/^[A-Z]{6}\+Inter/);
    expect(raw).not.toMatch(/Helvetica|Times-Roman|Courier|ZapfDingbats|\/Symbol/);
    expect(raw).toMatch(/\/FontFile2/);
    expect(raw).not.toMatch(/\/Subtype\s*\/Image/);
  });

  it('prints characters outside the shipped font in a plain form rather than as empty boxes', async () => {
    const { text } = await pdfOf({ title: 'Unit 2 — Δp check, H₂S test, 北 plan' });
    expect(text).toContain('delta p check, H2S test, ? plan');
  });
});
