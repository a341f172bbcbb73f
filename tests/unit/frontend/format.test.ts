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
