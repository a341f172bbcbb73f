import { describe, expect, it } from 'vitest';
import { healthLeftOutNote, IMPORT_LEFT_OUT_NOTE } from '@frontend/lib/left-out-words';

describe('the two “left out” counts say what they count and why they differ', () => {
  it('the health view names its period, how many the model refused, and what the data files tab counts instead', () => {
    const note = healthLeftOutNote({ from: '2025-01-01', to: '2025-12-31' }, { unsteady: 500, 'model:implausible-velocity': 35, 'low-load': 100 });
    expect(note).toContain('Counted over the period shown (1 Jan 2025 – 31 Dec 2025)');
    expect(note).toContain('35 of them refused by the model when the unit was recomputed');
    expect(note).toContain('The Data files tab counts rows per file when each file was checked, over the whole file, so its number differs.');
  });

  it('says none were refused by the model when none were, and “all data” without a period', () => {
    const note = healthLeftOutNote({ from: null, to: null }, { unsteady: 1_938 });
    expect(note).toContain('(all data)');
    expect(note).toContain('none were refused by the model');
  });

  it('the import history says it counts per file at import time, and what the condition-and-cost view counts', () => {
    expect(IMPORT_LEFT_OUT_NOTE).toMatch(/when it was imported .* over the whole file/);
    expect(IMPORT_LEFT_OUT_NOTE).toContain('over the period it shows (the last 365 days of data unless another period is chosen)');
  });
});
