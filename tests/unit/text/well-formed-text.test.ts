import { describe, expect, it } from 'vitest';
import { findIllFormedText, findTextProblem, isWellFormedText } from '@shared/well-formed-text.js';

describe('well-formed text', () => {
  it('accepts ordinary text, accents, CJK and emoji (a surrogate pair)', () => {
    for (const s of ['Unit 2', 'Kraftwerk Süd', '発電所', 'Condenser 🔧', '']) expect(isWellFormedText(s)).toBe(true);
  });

  it('refuses a lone high or low surrogate, and a pair written in the wrong order', () => {
    for (const s of ['\ud800', 'a\ud800b', 'x\udc00', '\udc00\ud800', 'end\ud83d']) expect(isWellFormedText(s)).toBe(false);
  });

  it('names where in a request body the broken text is, keys included', () => {
    expect(findIllFormedText({ name: 'ok', nested: [{ a: 1 }, { b: 'bad\ud800' }] })).toBe('nested.1.b');
    expect(findIllFormedText({ ['k\udc00']: 'v' })).toBe('k\ufffd');
    expect(findIllFormedText({ name: 'fine', list: [1, null, true, 'x'] })).toBeNull();
    expect(findIllFormedText('\ud800')).toBe('');
  });

  it('refuses control characters other than tab and line breaks, and says which problem it found', () => {
    expect(findTextProblem({ name: 'Plant\u0000B' })).toEqual({ path: 'name', problem: 'control' });
    expect(findTextProblem({ notes: 'bell\u0007' })).toEqual({ path: 'notes', problem: 'control' });
    expect(findTextProblem({ notes: 'del\u007f' })).toEqual({ path: 'notes', problem: 'control' });
    expect(findTextProblem({ notes: 'line one\n\tline two\r\n' })).toBeNull();
    expect(findTextProblem({ name: 'x\ud800' })).toEqual({ path: 'name', problem: 'surrogate' });
  });

  it('walks a deeply nested body without running out of stack', () => {
    let deep: unknown = 'bad\ud800';
    for (let i = 0; i < 200_000; i++) deep = [deep];
    expect(findIllFormedText(deep)).not.toBeNull();
  });
});
