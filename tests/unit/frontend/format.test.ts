/** The screens' formatters: one currency format (the reports' own), no "-$0", file sizes that are right. */
import { describe, expect, it } from 'vitest';
import { formatBytes, formatCurrency, formatMoney } from '@frontend/lib/format';
import { formatCurrency as reportCurrency } from '@shared/text/display-format';

describe('display formats on the screens', () => {
  it('shows money one way: the currency’s own sign, the same as the case report', () => {
    expect(formatMoney(185_000, 'USD')).toBe('$185,000');
    expect(formatMoney(185_000, 'USD')).toBe(formatCurrency(185_000, 'USD'));
    expect(formatCurrency(-1250.4, 'EUR')).toBe(reportCurrency(-1250.4, 'EUR'));
  });

  it('never shows a minus sign on a cost that rounds to zero', () => {
    expect(formatCurrency(-0.3, 'USD')).toBe('$0');
  });

  it('gives a small file its size in bytes, not "1 KB", and larger files in KB and MB', () => {
    expect(formatBytes(312)).toBe('312 bytes');
    expect(formatBytes(500_000)).toBe('488 KB');
    expect(formatBytes(3 * 1024 * 1024)).toBe('3.0 MB');
  });
});

describe('months', () => {
  it('writes every month with three letters, September too, in days and moments alike', async () => {
    const { formatDay, formatDateTime, formatMonth } = await import('@frontend/lib/format');
    expect(formatDay('2025-09-14')).toBe('14 Sep 2025');
    expect(formatDateTime('2025-09-14T12:00:00Z', 'UTC')).toBe('14 Sep 2025, 12:00 UTC');
    expect(formatMonth('2025-09')).toBe('Sep 2025');
  });
});
