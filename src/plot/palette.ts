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
 * The order curves take their colours in: the published order without yellow, which has too little
 * contrast on white to read as a 1.5 px line or as label text (about 1.3:1).
 */
export const CURVE_COLOURS: readonly string[] = [
  OKABE_ITO.black,
  OKABE_ITO.orange,
  OKABE_ITO.skyBlue,
  OKABE_ITO.bluishGreen,
  OKABE_ITO.blue,
  OKABE_ITO.vermillion,
  OKABE_ITO.reddishPurple,
];

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
 * The colour of the `index`-th curve on a sheet (bands first, then withstand and starting curves),
 * cycling through {@link CURVE_COLOURS}.
 * @example curveColour(1) // '#E69F00' (orange)
 */
export function curveColour(index: number): string {
  const n = CURVE_COLOURS.length;
  return CURVE_COLOURS[((index % n) + n) % n];
}
