import { describe, expect, it } from 'vitest';
import { checkPointValidity, REJECTION_REASONS } from '@shared/domain/validity/index.js';

const good = { backpressureKpa: 7, cwInletC: 22, cwOutletC: 31, cwFlowM3s: 15, loadMw: 480 };
const ctx = { ratingMw: 500 };

describe('data-point validity', () => {
  it('accepts a steady, physical point', () => {
    expect(
      checkPointValidity(good, {
        ...ctx,
        neighbours: [
          { minutesFromPoint: -30, loadMw: 478 },
          { minutesFromPoint: 25, loadMw: 485 },
        ],
      }),
    ).toEqual({ valid: true });
  });

  it.each([
    ['non-finite', { ...good, cwInletC: Number.NaN }],
    ['out-of-range', { ...good, cwFlowM3s: 500 }],
    ['rise-not-positive', { ...good, cwOutletC: 22 }],
    ['ttd-not-positive', { ...good, cwOutletC: 40 }],
    ['low-load', { ...good, loadMw: 150 }],
  ] as const)('rejects with the code %s', (reason, point) => {
    const r = checkPointValidity(point, ctx);
    expect(r.valid).toBe(false);
    if (!r.valid) {
      expect(r.reason).toBe(reason);
      expect(r.message.startsWith(REJECTION_REASONS[reason])).toBe(true);
    }
  });

  it('names the field that is out of range', () => {
    const r = checkPointValidity({ ...good, backpressureKpa: 80 }, ctx);
    expect(r).toMatchObject({ valid: false, reason: 'out-of-range', field: 'backpressureKpa' });
  });

  it('rejects a load that moved more than 2 % of rating within ±30 min [common practice]', () => {
    const r = checkPointValidity(good, { ...ctx, neighbours: [{ minutesFromPoint: -20, loadMw: 468 }] });
    expect(r).toMatchObject({ valid: false, reason: 'unsteady-load' });
  });

  it('ignores neighbours outside the window and accepts a change of exactly 2 %', () => {
    expect(checkPointValidity(good, { ...ctx, neighbours: [{ minutesFromPoint: -45, loadMw: 300 }] }).valid).toBe(true);
    expect(checkPointValidity(good, { ...ctx, neighbours: [{ minutesFromPoint: 10, loadMw: 490 }] }).valid).toBe(true);
  });

  it('uses a minimum load of 40 % of rating by default, editable', () => {
    expect(checkPointValidity({ ...good, loadMw: 199 }, ctx).valid).toBe(false);
    expect(checkPointValidity({ ...good, loadMw: 200 }, ctx).valid).toBe(true);
    expect(checkPointValidity({ ...good, loadMw: 199 }, { ...ctx, minLoadFraction: 0.3 }).valid).toBe(true);
  });

  it('rejects a point with a CW pump change in the window', () => {
    expect(checkPointValidity(good, { ...ctx, cwPumpChangeInWindow: true })).toMatchObject({ valid: false, reason: 'cw-pump-change' });
  });
});
