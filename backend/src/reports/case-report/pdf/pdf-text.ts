/**
 * Text for the PDF in characters the shipped font draws. A character outside it is written as its plain form
 * (H₂S as H2S, é kept, ł as l where a plain letter exists), a few symbols as words, anything else as "?", so a
 * title or comment in another script never prints as empty boxes.
 */
import { coveredCodePoints } from './fonts.js';

const SPELLED: Record<string, string> = { '→': '->', '←': '<-', '≥': '>=', '≤': '<=', '≈': '~', Δ: 'delta ', '₀': '0', ł: 'l', Ł: 'L' };

function drawable(cp: number): boolean {
  return coveredCodePoints().some(([from, to]) => cp >= from && cp <= to);
}

export function pdfText(text: string): string {
  let out = '';
  for (const ch of text) {
    if (drawable(ch.codePointAt(0)!)) {
      out += ch;
      continue;
    }
    if (SPELLED[ch] !== undefined) {
      out += SPELLED[ch];
      continue;
    }
    const plain = ch.normalize('NFKD').replace(/\p{M}/gu, '');
    out += plain !== '' && [...plain].every((c) => drawable(c.codePointAt(0)!)) ? plain : '?';
  }
  return out;
}
