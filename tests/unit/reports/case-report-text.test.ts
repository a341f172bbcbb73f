import { describe, expect, it } from 'vitest';
import { recommendationText } from '@backend/reports/case-report/recommendation.js';
import { yearlyRows } from '@backend/reports/case-report/yearly-rows.js';
import { inputRows } from '@backend/reports/case-report/input-rows.js';
import { decisionLine, notApprovedMark } from '@backend/reports/case-report/approval-mark.js';
import { formatCurrency, formatDay, formatNumber, formatPercent, formatYears } from '@shared/text/display-format.js';
import type { CaseView } from '@shared/schemas/cases.js';
import { APPROVED, RAW_INPUT, caseViewFixture } from './case-view-fixture.js';

describe('figures as the case page and the report show them', () => {
  it('money in whole currency units with the currency’s sign, never "-$0"', () => {
    expect(formatCurrency(466_727.6, 'USD')).toBe('$466,728');
    expect(formatCurrency(-12_000, 'USD')).toBe('-$12,000');
    expect(formatCurrency(-0, 'USD')).toBe('$0');
    expect(formatCurrency(-0.4, 'USD')).toBe('$0');
    expect(formatCurrency(1250.5, 'EUR', 2)).toBe('€1,250.50');
    expect(formatNumber(-0.001, 2)).toBe('0.00');
  });

  it('days, percentages and years in one format', () => {
    expect(formatDay('2026-03-14')).toBe('14 Mar 2026');
    expect(formatPercent(0.08)).toBe('8.0 %');
    expect(formatYears(1)).toBe('1.0 year');
    expect(formatYears(1.44)).toBe('1.4 years');
    expect(formatYears(null)).toBe('—');
  });
});

describe('what the case report says', () => {
  it('when no cleaning pays for itself, the recommendation says so instead of naming a date', () => {
    const brushCrew = RAW_INPUT.methods[2] as object;
    const view = caseViewFixture({}, { ...RAW_INPUT, methods: [{ ...brushCrew, fixedCost: 1e9 }], baseline: { kind: 'never' }, uncertainty: undefined });
    expect(view.results.cleanings).toHaveLength(0);
    const text = recommendationText(view);
    expect(text).toMatch(/^No cleaning pays for itself in the horizon of 730 days \(1 Jan 2027 – 30 Dec 2028\)/);
    expect(text).toContain('Against the baseline of not cleaning at all in the horizon');
  });

  it('the recommendation gives the first cleaning, the number of cleanings, the NPV and the payback', () => {
    const view = caseViewFixture();
    const bc = view.results.businessCase;
    const text = recommendationText(view);
    expect(text).toContain(`first on ${formatDay(view.results.cleanings[0]?.date)} by Brush crew, Larkspur contract (4 days, inside a planned outage)`);
    expect(text).toContain(`It is the first of ${view.results.cleanings.length} cleanings`);
    expect(text).toContain(`net present value is ${formatCurrency(bc.npv, 'USD')} at a discount rate of 8.0 %`);
    expect(bc.paybackYears).toBe(0);
    expect(text).toContain('it pays back at once');
  });

  it('yearly rows run from the start’s anniversaries to the end of the horizon, with a running sum of the cash flows', () => {
    const view = caseViewFixture();
    const rows = yearlyRows(view);
    expect(rows.map((r) => [r.label, r.from, r.to])).toEqual([
      ['Start', '2027-01-01', '2027-01-01'],
      ['Year 1', '2027-01-01', '2027-12-31'],
      // 730 days from 1 Jan 2027 end on 30 Dec 2028 (2028 is a leap year)
      ['Year 2', '2028-01-01', '2028-12-30'],
    ]);
    const cf = view.results.businessCase.cashflows;
    expect(rows[2]?.cumulative).toBeCloseTo(cf[0]! + cf[1]! + cf[2]!, 2);
    expect(rows[1]?.planCosts).toEqual(view.results.yearly[0]);
  });

  it('an input without its own source entry takes the source of the input it belongs to', () => {
    const rows = inputRows(caseViewFixture());
    const surface = rows.find((r) => r.name === 'Condenser surface')!;
    expect(surface).toMatchObject({ value: 17000, unit: 'm²', sourceKey: 'unit', source: 'prefilled', detail: 'from the unit’s setup, version 4' });
    const reference = rows.find((r) => r.name === 'Reference cleanliness')!;
    expect(reference.source).toBeNull();
  });

  it('only an approved case goes without the not-approved mark; the decision names the approver', () => {
    const draft = caseViewFixture();
    const as = (o: Partial<CaseView>): CaseView => ({ ...draft, ...o });
    expect(notApprovedMark(draft)).toMatch(/^NOT APPROVED — DRAFT/);
    expect(notApprovedMark(as({ status: 'submitted' }))).toMatch(/^NOT APPROVED — SUBMITTED/);
    expect(notApprovedMark(as(APPROVED))).toBeNull();
    expect(notApprovedMark(as({ ...APPROVED, status: 'archived', archivedAt: '2027-02-01T00:00:00.000Z' }))).toBeNull();
    expect(notApprovedMark(as({ status: 'archived', archivedAt: '2027-02-01T00:00:00.000Z' }))).toMatch(/^NOT APPROVED — ARCHIVED/);
    // 16:20 UTC on 6 Oct is 11:20 in Chicago, the same day
    expect(decisionLine(as(APPROVED))).toBe('Approved by Tobias Renwick on 6 Oct 2026');
  });
});
