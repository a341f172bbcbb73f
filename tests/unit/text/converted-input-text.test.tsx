import { afterEach, describe, expect, it, vi } from 'vitest';
import { fieldUnits, fromInputText, parseNumberText, toInputText } from '@frontend/lib/field-units';
import { groupedNumberText, readNumberText } from '@shared/number-text';
import { m3sToGpm, DISPLAY_PRESETS } from '@shared/units';

afterEach(() => vi.unstubAllGlobals());
const NNBSP = '\u202f';

describe('a setup value converted into the other unit system, as the form fills it in', () => {
  it('keeps six significant digits and groups thousands: a CW flow of 10.4 m³/s reads "164 843" gpm, not "164843.4"', () => {
    vi.stubGlobal('navigator', { languages: ['en-US'], language: 'en-US' });
    const us = fieldUnits('us');
    expect(m3sToGpm(10.4)).toBeCloseTo(164_843.4, 1); // the value the form used to show
    expect(toInputText(10.4, us.flowM3s)).toBe(`164${NNBSP}843`);
  });

  it('reads back what it wrote, within 5 parts per million, and a second round trip writes the same text', () => {
    vi.stubGlobal('navigator', { languages: ['en-US'], language: 'en-US' });
    const us = fieldUnits('us');
    const text = toInputText(10.4, us.flowM3s);
    const back = fromInputText(text, us.flowM3s)!;
    expect(Math.abs(back - 10.4) / 10.4).toBeLessThan(5e-6);
    expect(toInputText(back, us.flowM3s)).toBe(text);
    expect(parseNumberText(text)).toBe(164_843);
  });

  it('small values keep one decimal more than the display, without trailing zeros: 8.466 kPa is "2.5" inHgA, not "2.500"', () => {
    vi.stubGlobal('navigator', { languages: ['en-US'], language: 'en-US' });
    expect(toInputText(8.4659, DISPLAY_PRESETS.us.pressure)).toBe('2.5'); // 8.4659 kPa / 3.38638 kPa per inHg = 2.49999
    expect(toInputText(2.54, fieldUnits('us').tubeLengthM)).toBe('8.333'); // 2.54 m = 8.3333 ft: 2 display decimals + 1
  });

  it('groups with a narrow no-break space, which reads back silently in either decimal format', () => {
    vi.stubGlobal('navigator', { languages: ['de-DE'], language: 'de-DE' });
    expect(toInputText(10.4 / 3600, DISPLAY_PRESETS.si.flow)).toBe('10,4'); // 10.4 m³/h: comma decimal, nothing to group
    expect(toInputText(37.44, DISPLAY_PRESETS.si.flow)).toBe(`134${NNBSP}784`); // 37.44 m³/s = 134,784 m³/h
    for (const decimal of ['.', ','] as const) expect(readNumberText(`134${NNBSP}784`, { decimal })).toEqual({ kind: 'number', value: 134_784 });
  });

  it('numbers below 10,000 are not grouped (a four-digit heat rate reads 9400)', () => {
    expect(groupedNumberText(9400, { decimal: '.' })).toBe('9400');
    expect(groupedNumberText(25_000.25, { decimal: ',' })).toBe(`25${NNBSP}000,25`);
    expect(groupedNumberText(-1_234_567, { decimal: '.' })).toBe(`-1${NNBSP}234${NNBSP}567`);
  });
});
