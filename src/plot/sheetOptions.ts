import { InputError, expectedGot } from '../engine/errors.ts';

/** How a sheet is laid out: size, spacing and type. All lengths in px. */
export interface SheetOptions {
  /** Width of the whole sheet, px, at least 480. @default 960 */
  width?: number;
  /** Height of the whole sheet, px, at least 360. @default 720 */
  height?: number;
  /** Clear border on every side, px, 0–100. @default 16 */
  margin?: number;
  /** Base type size, px, 7–24; titles and notes are set relative to it. @default 11 */
  fontSize?: number;
  /** Prefix of the ids the SVG defines (hatch patterns), so several sheets can share one page. @default 'tcc' */
  idPrefix?: string;
  /**
   * How much of the study strip a sheet prints: `'full'` (title, revision, date, details, notes and the
   * caution, as every exported figure carries them) or `'brief'` (title, revision, date and details:
   * for a page that prints the caution itself, so the plot keeps the room). @default 'full'
   */
  studyDetails?: 'full' | 'brief';
  /** CSS font list, DejaVu Sans first: the face text is measured in. @default 'DejaVu Sans, Arial, Helvetica, sans-serif' */
  fontFamily?: string;
}

/** The zoom a PNG may be rendered at, in image pixels per sheet px: enough for print, small enough to fit memory. */
export const PNG_SCALE = { smallest: 0.1, largest: 10 };

/**
 * The most pixels a PNG may have: 100 million, 400 MB as the renderer holds them (4 bytes each), room
 * for the default sheet at the largest zoom (9,600 × 7,200).
 */
export const PNG_LARGEST_PIXELS = 1e8;

/** The pixels of a sheet's PNG at a zoom, the defaults filled in. @example pngPixelsOf(undefined, undefined, 2) // 2,764,800 */
export function pngPixelsOf(width = sheetDefaults.width, height = sheetDefaults.height, scale = 2): number {
  return width * scale * height * scale;
}

/** The options with every default filled in. */
export type ResolvedSheetOptions = Required<SheetOptions>;

/** The defaults of {@link SheetOptions}. */
export const sheetDefaults: ResolvedSheetOptions = {
  width: 960,
  height: 720,
  margin: 16,
  fontSize: 11,
  idPrefix: 'tcc',
  studyDetails: 'full',
  fontFamily: 'DejaVu Sans, Arial, Helvetica, sans-serif',
};

/**
 * Fills in the defaults and checks each option, throwing an `InputError` that names it
 * (`options.width: expected a width in px of at least 480, got "100"`).
 * @example resolveSheetOptions({ width: 1200 }).height // 720
 */
export function resolveSheetOptions(options: SheetOptions = {}): ResolvedSheetOptions {
  const resolved = { ...sheetDefaults, ...definedOnly(options) };
  const { width, height, margin, fontSize, idPrefix, fontFamily } = resolved;
  within('options.width', width, 480, 20_000, 'a width in px of at least 480');
  within('options.height', height, 360, 20_000, 'a height in px of at least 360');
  within('options.margin', margin, 0, 100, 'a margin in px from 0 to 100');
  within('options.fontSize', fontSize, 7, 24, 'a font size in px from 7 to 24');
  if (typeof idPrefix !== 'string' || !/^[A-Za-z][\w-]*$/.test(idPrefix))
    throw new InputError('options.idPrefix', expectedGot('a letter followed by letters, digits, "_" or "-"', idPrefix));
  if (resolved.studyDetails !== 'full' && resolved.studyDetails !== 'brief')
    throw new InputError('options.studyDetails', expectedGot('"full" or "brief"', resolved.studyDetails));
  if (typeof fontFamily !== 'string' || /[<>"&]/.test(fontFamily) || fontFamily.trim() === '')
    throw new InputError('options.fontFamily', expectedGot('a CSS font list without <, >, " or &', fontFamily));
  return resolved;
}

// Accepts a number between low and high inclusive.
function within(path: string, value: unknown, low: number, high: number, expected: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < low || value > high)
    throw new InputError(path, expectedGot(expected, value));
}

// Accepts options; the same without keys set to undefined, so they do not hide a default.
function definedOnly(options: SheetOptions): SheetOptions {
  return Object.fromEntries(Object.entries(options).filter(([, v]) => v !== undefined)) as SheetOptions;
}
