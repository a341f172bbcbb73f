/**
 * A person's or organisation's name as it may appear in an e-mail we send: plain text on one line, no markup,
 * nothing a mail program would turn into a link, and bounded in length. Names are typed by anyone who signs up,
 * so without this an invitation could carry an attacker's link under our sender address.
 */
export const MAIL_NAME_MAX = 80;

const TAG = /<[^>]*>/g;
const URL_WITH_SCHEME = /\b[a-z][a-z0-9+.-]*:\/\/\S*/giu;
const EMAIL_LIKE = /\S*@\S+/gu;
const WWW = /\bwww\.\S*/giu;
/** A word.word… ending in two or more letters, as mail programs auto-link (evil.example, x.co.uk/path). */
const DOMAIN_LIKE = /[\p{L}\p{N}_-]+(?:\.[\p{L}\p{N}_-]+)*\.\p{L}{2,}\b\S*/gu;

export function plainName(value: string, fallback: string, max = MAIL_NAME_MAX): string {
  const cleaned = value
    .normalize('NFC')
    .replace(/[\p{Cc}\p{Cf}\p{Zl}\p{Zp}]+/gu, ' ')
    .replace(TAG, ' ')
    .replace(/[<>]/g, ' ')
    .replace(URL_WITH_SCHEME, ' ')
    .replace(EMAIL_LIKE, ' ')
    .replace(WWW, ' ')
    .replace(DOMAIN_LIKE, ' ')
    .replace(/\s+/g, ' ')
    .trim();
  if (!cleaned) return fallback;
  const chars = Array.from(cleaned);
  return chars.length <= max
    ? cleaned
    : `${chars
        .slice(0, max - 1)
        .join('')
        .trimEnd()}…`;
}
