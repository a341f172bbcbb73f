/** The setup forms read numbers in the person's format (the browser's language) and say so beside the field. */
import { renderToStaticMarkup } from 'react-dom/server';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { QuantityField } from '@frontend/components/ui/quantity-field';
import { parseNumberText, toInputText } from '@frontend/lib/field-units';
import { DISPLAY_PRESETS } from '@shared/units';

const field = (value: string) => renderToStaticMarkup(<QuantityField label="Tube outside diameter" unit="mm" value={value} onChange={() => undefined} />);

afterEach(() => vi.unstubAllGlobals());

describe('a number typed in a setup form', () => {
  it('for a person whose browser writes a decimal comma, 1,234 is read as 1.234', () => {
    vi.stubGlobal('navigator', { languages: ['de-DE'], language: 'de-DE' });
    expect(parseNumberText('1,234')).toBe(1.234);
    expect(toInputText(1.234, { label: 'mm', toSi: (v) => v, fromSi: (v) => v, decimals: 3 })).toBe('1,234');
    expect(toInputText(480.25, DISPLAY_PRESETS.si.power)).toBe('480,25');
  });

  it('for that person, 1.234 is refused with a message beside the field', () => {
    vi.stubGlobal('navigator', { languages: ['de-DE'], language: 'de-DE' });
    expect(parseNumberText('1.234')).toBeNaN();
    expect(field('1.234')).toMatch(/could be 1234 or 1,234/);
    expect(field('1.234')).toMatch(/aria-invalid="true"/);
  });

  it('for a person whose browser writes a decimal point, 164,800 is read as 164800 and the field says how it was read', () => {
    vi.stubGlobal('navigator', { languages: ['en-US'], language: 'en-US' });
    expect(parseNumberText('164,800')).toBe(164800);
    expect(field('164,800')).toMatch(/Read as 164800/);
    expect(field('25.4')).not.toMatch(/Read as/);
  });
});
