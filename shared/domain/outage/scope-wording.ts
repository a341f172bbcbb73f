/**
 * How the outage-scope sentences write money, days and item names: money in whole units with grouped thousands and
 * the problem's currency code ("12,500 USD"), days with at most one decimal, item titles in single quotes.
 */
import { formatNumber } from '../../text/display-format.js';

export const money = (value: number, currency: string): string => `${formatNumber(value, 0)} ${currency}`;

/** Days as a count: "1 day", "12 days", "8.5 days". */
export function days(value: number): string {
  const text = dayNumber(value);
  return `${text} ${text === '1' ? 'day' : 'days'}`;
}

/** Days as an adjective: "an 8-day window" needs "8-day". */
export const dayLength = (value: number): string => `${dayNumber(value)}-day`;

/** "a" or "an" before a figure as it is read aloud: an 8, an 11, an 18, an 80, an 8,000; a 10, a 1.5. */
export function article(figure: string): string {
  const whole = figure.replace(/,/g, '').split('.')[0] ?? '';
  if (whole.startsWith('8')) return 'an';
  return [2, 5, 8].includes(whole.length) && (whole.startsWith('11') || whole.startsWith('18')) ? 'an' : 'a';
}

/** "an 8-day window", "a 10-day window". */
export function windowOf(windowDays: number): string {
  const text = dayLength(windowDays);
  return `${article(text)} ${text} window`;
}

export const quoted = (title: string): string => `'${title}'`;

function dayNumber(value: number): string {
  return formatNumber(value, Number.isInteger(Math.round(value * 10) / 10) ? 0 : 1);
}
