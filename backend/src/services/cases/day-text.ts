const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/** A plant-local date for a sentence: 2026-03-14 → "14 Mar 2026". */
export function dayText(isoDate: string): string {
  const [y, m = 1, d] = isoDate.split('-').map(Number);
  return `${d} ${MONTHS[m - 1]} ${y}`;
}
