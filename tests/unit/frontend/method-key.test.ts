import { describe, expect, it } from 'vitest';
import { cleaningMethodSchema } from '@shared/schemas/cleaning-method';
import { methodKeyFrom } from '@frontend/features/cleaning-methods/components/method-key';

const keyRule = cleaningMethodSchema.shape.id;

describe('the cleaning method key made from its name', () => {
  it('when a name has capitals, spaces and punctuation, the key is lower-case words joined by dashes', () => {
    expect(methodKeyFrom('High-Pressure Water Lancing (outage)', [])).toBe('high-pressure-water-lancing-outage');
  });

  it('when a name has accents, they are dropped rather than the letters', () => {
    expect(methodKeyFrom('Nettoyage à l’eau sous pression', [])).toBe('nettoyage-a-l-eau-sous-pression');
  });

  it('when the key is taken in the library, the next free number is added', () => {
    expect(methodKeyFrom('Sponge balls', ['sponge-balls'])).toBe('sponge-balls-2');
    expect(methodKeyFrom('Sponge balls', ['sponge-balls', 'sponge-balls-2'])).toBe('sponge-balls-3');
  });

  it('when a name has no letter or digit to keep, the key is still one the server accepts', () => {
    expect(methodKeyFrom('—', [])).toBe('method');
    expect(methodKeyFrom('  ', ['method'])).toBe('method-2');
  });

  it('every key made, however long or odd the name, passes the server’s key rule', () => {
    const names = ['A'.repeat(200), '-- leading dashes', 'ß straße', '90-10 CuNi brush', `${'x '.repeat(40)}end`, 'Ω'];
    for (const name of names) {
      const key = methodKeyFrom(name, [methodKeyFrom(name, [])]);
      expect(keyRule.safeParse(key).success, `${name} → ${key}`).toBe(true);
    }
  });
});
