/**
 * The report's fonts: Inter shipped with the app (@fontsource/inter), never a system or built-in PDF font. The
 * `.woff` files are registered: pdfkit's font reader fails on `.woff2` when the document ends.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

export const FONT = { regular: 'Inter', semibold: 'Inter-SemiBold', bold: 'Inter-Bold' } as const;

const WEIGHTS: Record<keyof typeof FONT, number> = { regular: 400, semibold: 600, bold: 700 };

const fontPath = (weight: number): string => require.resolve(`@fontsource/inter/files/inter-latin-${weight}-normal.woff`);

/** The regular face's file, given to the document as its first font so no built-in font is ever loaded. */
export const regularFontPath = (): string => fontPath(WEIGHTS.regular);

export function registerFonts(doc: PDFKit.PDFDocument): void {
  for (const key of Object.keys(FONT) as (keyof typeof FONT)[]) doc.registerFont(FONT[key], fontPath(WEIGHTS[key]));
}

let covered: [number, number][] | null = null;

/** Code points the shipped subset draws, read from the font package's own list ("U+0000-00FF,U+0131,…"). */
export function coveredCodePoints(): [number, number][] {
  if (covered) return covered;
  const list = JSON.parse(readFileSync(require.resolve('@fontsource/inter/unicode.json'), 'utf8')) as Record<string, string>;
  const latin = list.latin;
  if (!latin) throw new Error('@fontsource/inter/unicode.json lists no latin subset');
  covered = latin.split(',').map((part) => {
    const [from = '', to] = part.trim().replace(/^U\+/, '').split('-');
    return [parseInt(from, 16), parseInt(to ?? from, 16)];
  });
  return covered;
}
