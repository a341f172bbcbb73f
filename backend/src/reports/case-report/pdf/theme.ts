/** Page geometry and colours of the case report (A4, points). */
export const PAGE = { size: 'A4', width: 595.28, height: 841.89, marginX: 48, marginTop: 64, marginBottom: 62 } as const;
export const CONTENT_WIDTH = PAGE.width - 2 * PAGE.marginX;

export const COLOR = {
  ink: '#1f2933',
  muted: '#5f6b7a',
  rule: '#cfd6de',
  zebra: '#f3f5f7',
  accent: '#0f6e68',
  accentLight: '#b8dcd8',
  positive: '#2f7d4f',
  negative: '#b42318',
  shade: '#e3e8ee',
  markBand: '#fde8e8',
  markInk: '#9b1c1c',
} as const;

export const SIZE = { title: 20, heading: 13, subheading: 10.5, body: 9.5, small: 8, tiny: 7 } as const;
