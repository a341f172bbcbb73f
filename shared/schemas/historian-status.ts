/**
 * Status words a plant historian writes into a number cell instead of a value ("Bad", "No Data", "I/O Timeout"…).
 * A cell whose whole text (trimmed, case-insensitive) is one of them is a missing value marked by the instrument
 * system, not a broken file: the row is stored with the reason `instrument-status`. Each organisation may add the
 * words its own historian writes; the defaults always apply.
 */
import { z } from 'zod';

/** Status words recognised for every organisation (typical historian wording, common practice). */
export const DEFAULT_STATUS_WORDS = ['Bad', 'Bad Quality', 'No Data', 'Not Available', 'Timeout', 'Comm Failure', 'Shutdown', 'Out of Range', 'Error'] as const;

export const MAX_OWN_STATUS_WORDS = 40;
export const MAX_STATUS_WORD_CHARS = 40;

const NUMBER_LIKE = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;

/** The key a cell's text is compared by: trimmed, inner spaces collapsed, lower case. */
export const statusWordKey = (text: string): string => text.trim().replace(/\s+/g, ' ').toLowerCase();

const statusWord = z
  .string()
  .trim()
  .min(1, 'a status word cannot be empty')
  .max(MAX_STATUS_WORD_CHARS, `a status word is at most ${MAX_STATUS_WORD_CHARS} characters`)
  .refine((w) => !NUMBER_LIKE.test(w), 'a status word cannot be a number: numbers in a cell are readings')
  .refine((w) => !/[\u0000-\u001f]/.test(w), 'a status word cannot hold control characters');

/** The organisation's own words, besides the defaults. */
export const statusWordsBody = z
  .object({
    words: z
      .array(statusWord)
      .max(MAX_OWN_STATUS_WORDS, `at most ${MAX_OWN_STATUS_WORDS} words of your own`)
      .superRefine((words, ctx) => {
        const seen = new Set<string>();
        const defaults = new Set(DEFAULT_STATUS_WORDS.map(statusWordKey));
        words.forEach((w, i) => {
          const key = statusWordKey(w);
          if (defaults.has(key)) ctx.addIssue({ code: 'custom', path: [i], message: `"${w}" is already a default status word` });
          else if (seen.has(key)) ctx.addIssue({ code: 'custom', path: [i], message: `"${w}" is in the list twice` });
          seen.add(key);
        });
      }),
  })
  .strict();
export type StatusWordsBody = z.infer<typeof statusWordsBody>;

export const statusWordsResponse = z
  .object({
    defaults: z.array(z.string()),
    /** the organisation's own words */
    words: z.array(z.string()),
    /** whether the caller may change them (administrators) */
    mayEdit: z.boolean(),
  })
  .strict();
export type StatusWordsResponse = z.infer<typeof statusWordsResponse>;

/** Every word recognised for an organisation: the defaults then its own (stored ones read through the schema). */
export function statusWordsOf(own: unknown): string[] {
  const parsed = statusWordsBody.shape.words.safeParse(own ?? []);
  return [...DEFAULT_STATUS_WORDS, ...(parsed.success ? parsed.data : [])];
}
