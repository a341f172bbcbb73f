import { describe, expect, it } from 'vitest';
import { median, medianAbsoluteDeviation } from '@shared/domain/statistics.js';

describe('median', () => {
  it('is the middle value of an odd count and the mean of the two middle ones of an even count', () => {
    expect(median([5, 1, 3])).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([7])).toBe(7);
  });

  it('of no values is null (nothing to report), and leaves its input in order', () => {
    expect(median([])).toBeNull();
    const values = [3, 1, 2];
    median(values);
    expect(values).toEqual([3, 1, 2]);
  });

  it('the median absolute deviation of no values is refused', () => {
    expect(medianAbsoluteDeviation([1, 2, 4, 8])).toBe(1.5);
    expect(() => medianAbsoluteDeviation([])).toThrow(/no values/);
  });
});
