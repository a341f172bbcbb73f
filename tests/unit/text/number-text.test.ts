import { describe, expect, it } from 'vitest';
import { numberFormatOf, readNumberText, writeNumberText, type NumberFormat } from '@shared/number-text.js';

const POINT: NumberFormat = { decimal: '.' };
const COMMA: NumberFormat = { decimal: ',' };
const value = (text: string, f: NumberFormat) => {
  const r = readNumberText(text, f);
  return r.kind === 'number' ? r.value : r.kind;
};

describe('reading a number as the person writes it', () => {
  it('when the person writes a decimal comma, 1,234 is one point two three four, not 1234', () => {
    expect(value('1,234', COMMA)).toBe(1.234);
    expect(value('0,85', COMMA)).toBe(0.85);
    expect(value('1.234,5', COMMA)).toBe(1234.5);
    expect(value('164 800', COMMA)).toBe(164800);
    expect(value('1.234.567', COMMA)).toBe(1234567);
  });

  it('when the person writes a decimal point, 1,234 is a thousand two hundred and thirty-four, and says so', () => {
    const r = readNumberText('164,800', POINT);
    expect(r).toEqual({ kind: 'number', value: 164800, readAs: expect.stringMatching(/164800.*thousands/) });
    expect(value('1,234.5', POINT)).toBe(1234.5);
    expect(value('2.0625', POINT)).toBe(2.0625);
  });

  it('a mark that cannot be grouping is a decimal mark whatever the convention', () => {
    expect(value('2,5', POINT)).toBe(2.5);
    expect(value('25.4', COMMA)).toBe(25.4);
    expect(value('0.125', COMMA)).toBe(0.125);
    expect(value('1234,567', POINT)).toBe(1234.567);
  });

  it('refuses a point that could be grouping or decimal in a decimal-comma format, with a message', () => {
    const r = readNumberText('1.234', COMMA);
    expect(r.kind).toBe('ambiguous');
    if (r.kind === 'ambiguous') expect(r.message).toMatch(/1234.*1,234/);
  });

  it('blank is not given; signs, exponents and the Unicode minus are read; junk and bad grouping are invalid', () => {
    expect(readNumberText('  ', POINT).kind).toBe('blank');
    expect(value('−3.5', POINT)).toBe(-3.5);
    expect(value('-0,5', COMMA)).toBe(-0.5);
    expect(value('1.5e3', POINT)).toBe(1500);
    expect(value('1,5e3', COMMA)).toBe(1500);
    for (const junk of ['abc', '1,2,3', '12,34,567', '1.2.3', '1,234,5', '--1', '1,234.567,8']) expect(readNumberText(junk, POINT).kind, junk).toBe('invalid');
  });
});

describe('writing a number for an input', () => {
  it('uses the person’s decimal mark and no grouping, so it reads back to the same value', () => {
    for (const v of [1.234, 1234.5, 0.85, 164800, -2.5, 11.811]) {
      for (const f of [POINT, COMMA]) expect(value(writeNumberText(v, f), f)).toBe(v);
    }
    expect(writeNumberText(1.234, COMMA)).toBe('1,234');
    expect(writeNumberText(1234.5, POINT)).toBe('1234.5');
  });
});

describe('the format of a locale', () => {
  it('knows which locales write a decimal comma', () => {
    expect(numberFormatOf('en-US').decimal).toBe('.');
    expect(numberFormatOf('de-DE').decimal).toBe(',');
    expect(numberFormatOf('fr-FR').decimal).toBe(',');
    expect(numberFormatOf('not a locale').decimal).toBe('.');
  });
});
