/** Money on a chart axis, short: "$1.2M", "€350k", "-$40k" (the tables beside the charts carry the exact figures). */
export function compactMoney(value: number, currency: string): string {
  const sign = value < 0 ? '-' : '';
  const abs = Math.abs(value);
  const symbol = currency === 'USD' ? '$' : currency === 'EUR' ? '€' : currency === 'GBP' ? '£' : `${currency} `;
  if (abs >= 1e6) return `${sign}${symbol}${(abs / 1e6).toFixed(abs >= 1e7 ? 0 : 1)}M`;
  if (abs >= 1e3) return `${sign}${symbol}${Math.round(abs / 1e3)}k`;
  return `${sign}${symbol}${Math.round(abs)}`;
}
