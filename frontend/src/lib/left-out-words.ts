/**
 * What the two "left out" counts count, so a person who sees different numbers on the data files tab and on the
 * condition-and-cost view reads why: the import counts rows per file when the file was checked, over the whole
 * file; the view counts points left out of its calculations over the period it shows, including those the model
 * refused when the unit was recomputed. Pure, so the wording is tested without a browser.
 */
import { formatDay, formatNumber } from '@shared/text/display-format';

/** Beside the import history's "Left out" column. */
export const IMPORT_LEFT_OUT_NOTE =
  '“Left out” counts the rows each file’s check set aside when it was imported (not steady, load too low, an instrument status word), over the whole file; they stay stored with their reason. The Condition and cost tab counts the points left out of its calculations over the period it shows (the last 365 days of data unless another period is chosen), including points the model refused when the unit was recomputed, so its number differs.';

/** Under the health view's count of points left out, naming its period and the model's share. */
export function healthLeftOutNote(period: { from: string | null; to: string | null }, droppedByReason: Record<string, number>): string {
  const span = period.from && period.to ? `${formatDay(period.from)} – ${formatDay(period.to)}` : 'all data';
  const byModel = Object.entries(droppedByReason)
    .filter(([code]) => code.startsWith('model:'))
    .reduce((a, [, n]) => a + n, 0);
  const model =
    byModel > 0
      ? `, ${formatNumber(byModel)} of them refused by the model when the unit was recomputed`
      : '; none were refused by the model when the unit was recomputed';
  return `Counted over the period shown (${span}): the hourly points left out of the calculations, both rows set aside when their file was checked and points the model refused${model}. The Data files tab counts rows per file when each file was checked, over the whole file, so its number differs.`;
}
