/**
 * Numbers as people type them. The decimal mark follows the person's format (a point, or a comma as in much of
 * Europe); a mark that can only be one thing is read as that thing whatever the format, and a lone point
 * followed by three digits, which a decimal-comma writer may mean as thousands, is refused rather than guessed.
 * Pure: the browser supplies the format (see frontend/src/lib/number-format.ts).
 */

export interface NumberFormat {
  decimal: '.' | ',';
}

export type NumberText =
  | { kind: 'blank' }
  /** `readAs` says how a text that depends on the format was read, e.g. "Read as 164800 (the comma separates thousands)". */
  | { kind: 'number'; value: number; readAs?: string }
  /** Could be two numbers: refused with a message for beside the field. */
  | { kind: 'ambiguous'; message: string }
  /** Not a number: the field's own "Enter …" message applies. */
  | { kind: 'invalid' };

/** Spaces of every width and apostrophes group thousands (1 234, 1’234); never decimals. */
const GROUP_SPACES = /[\s\u00a0\u2009\u202f'’]/g;

const grouped = (digits: string, mark: string) => new RegExp(`^\\d{1,3}(\\${mark}\\d{3})+$`).test(digits);

export function readNumberText(text: string, format: NumberFormat): NumberText {
  let t = text.trim().replace(/\u2212/g, '-');
  if (t === '') return { kind: 'blank' };
  t = t.replace(GROUP_SPACES, '');
  const sign = /^[-+]/.test(t) ? t[0] : '';
  const body = sign ? t.slice(1) : t;
  const number = (digits: string, readAs?: string): NumberText => ({ kind: 'number', value: Number(`${sign}${digits}`), ...(readAs ? { readAs } : {}) });

  if (/^(\d+([.,]\d*)?|[.,]\d+)[eE][-+]?\d+$/.test(body)) return number(body.replace(',', '.'));
  if (!/^[\d.,]+$/.test(body) || !/\d/.test(body)) return { kind: 'invalid' };

  const commas = body.split(',').length - 1;
  const points = body.split('.').length - 1;
  if (commas > 0 && points > 0) {
    const decimal = body.lastIndexOf(',') > body.lastIndexOf('.') ? ',' : '.';
    const group = decimal === ',' ? '.' : ',';
    const [whole = '', fraction = ''] = body.split(decimal);
    if (body.split(decimal).length !== 2 || !grouped(whole, group) || !/^\d*$/.test(fraction)) return { kind: 'invalid' };
    return number(`${whole.split(group).join('')}.${fraction}`);
  }
  if (commas + points === 0) return number(body);
  const mark = commas > 0 ? ',' : '.';
  if (commas + points > 1) return grouped(body, mark) ? number(body.split(mark).join('')) : { kind: 'invalid' };

  const [whole = '', fraction = ''] = body.split(mark); // exactly one mark here: both parts exist
  const couldBeThousands = /^[1-9]\d{0,2}$/.test(whole) && /^\d{3}$/.test(fraction);
  if (!couldBeThousands || mark === format.decimal) return number(`${whole || '0'}.${fraction || '0'}`);
  if (mark === ',') return number(`${whole}${fraction}`, `Read as ${whole}${fraction} (the comma separates thousands)`);
  return {
    kind: 'ambiguous',
    message: `“${text.trim()}” could be ${whole}${fraction} or ${whole},${fraction}: write ${whole}${fraction} for the whole number, or ${whole},${fraction} with a decimal comma`,
  };
}

/** A number for an input: the person's decimal mark, no grouping, so it reads back to the same value. */
export function writeNumberText(value: number, format: NumberFormat): string {
  const plain = String(value);
  return format.decimal === ',' ? plain.replace('.', ',') : plain;
}

/** Digits of a whole part grouped in threes (SI practice: a narrow no-break space, from five digits on). */
const GROUP_MARK = '\u202f';

/**
 * A number for an input with its thousands grouped by a narrow no-break space, which reads back silently whatever
 * the decimal mark (readNumberText drops spaces); four-digit whole parts stay as they are (9400).
 */
export function groupedNumberText(value: number, format: NumberFormat): string {
  const plain = writeNumberText(value, format);
  const match = /^(-?)(\d+)(.*)$/.exec(plain);
  if (!match || match[2]!.length < 5) return plain;
  return `${match[1]}${match[2]!.replace(/\B(?=(\d{3})+$)/g, GROUP_MARK)}${match[3]}`;
}

/** The decimal mark of a locale (BCP 47 tag); a point when the locale is unknown. */
export function numberFormatOf(locale: string): NumberFormat {
  try {
    const decimal = new Intl.NumberFormat(locale).formatToParts(1.5).find((p) => p.type === 'decimal')?.value;
    return { decimal: decimal === ',' ? ',' : '.' };
  } catch {
    return { decimal: '.' };
  }
}
