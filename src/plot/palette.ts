/**
 * The Okabe–Ito colour-blind-safe palette in its published order (Okabe & Ito, "Color Universal
 * Design", 2002/2008). Colour is never the only code on a sheet: every curve also has a label and
 * a dash pattern by kind.
 */
export const OKABE_ITO = {
  black: '#000000',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
} as const;

/**
 * The order curves take their colours in: the published order without yellow (too little contrast
 * on white for a 1.5 px line or label text, about 1.3:1) and without vermillion, which only the
 * overlap hatch wears, so a hatched region never reads as a curve.
 */
export const CURVE_COLOURS: readonly string[] = [
  OKABE_ITO.black,
  OKABE_ITO.orange,
  OKABE_ITO.skyBlue,
  OKABE_ITO.bluishGreen,
  OKABE_ITO.blue,
  OKABE_ITO.reddishPurple,
];

/**
 * The colours of the hatched regions, one per status and none a curve's: vermillion for an
 * overlap, yellow (drawn in heavier lines, where its low contrast does not matter for an area) for a
 * thin margin, and a neutral grey for a range curves cannot prove.
 */
export const REGION_COLOURS = {
  overlap: OKABE_ITO.vermillion,
  'thin margin': OKABE_ITO.yellow,
  'not provable from curves': '#8c8c8c',
} as const;

/** Colours of the sheet itself (grid, text, fault lines), kept neutral so they never read as a curve. */
export const SHEET_COLOURS = {
  text: '#1a1a1a',
  mutedText: '#4d4d4d',
  gridMajor: '#9a9a9a',
  gridMinor: '#d9d9d9',
  frame: '#333333',
  faultLine: '#4d4d4d',
  halo: '#ffffff',
  panel: '#ffffff',
} as const;

/**
 * Every colour a curve may take, in order: {@link CURVE_COLOURS}, then the five colours after black
 * darkened by 45 % towards black, so up to eleven curves on one sheet each get their own colour.
 */
export const ALL_CURVE_COLOURS: readonly string[] = [
  ...CURVE_COLOURS,
  ...CURVE_COLOURS.slice(1).map((c) => darken(c, 0.45)),
];

/**
 * The colour of the `index`-th curve on a sheet (bands first, then withstand and starting curves),
 * from {@link ALL_CURVE_COLOURS}; beyond eleven the cycle repeats (each band also has its own dash
 * pattern and a label, so colour is never the only code).
 * @example curveColour(1) // '#E69F00' (orange)
 */
export function curveColour(index: number): string {
  const n = ALL_CURVE_COLOURS.length;
  return ALL_CURVE_COLOURS[((index % n) + n) % n];
}

// Accepts a #rrggbb colour and a fraction; the colour that much nearer black.
function darken(hex: string, by: number): string {
  const channel = (k: number) =>
    Math.round(parseInt(hex.slice(1 + 2 * k, 3 + 2 * k), 16) * (1 - by))
      .toString(16)
      .padStart(2, '0');
  return `#${channel(0)}${channel(1)}${channel(2)}`.toUpperCase();
}
