/** Options for {@link stepValue}. */
export interface StepOptions {
  /** +1 steps up, −1 steps down. */
  direction: 1 | -1;
  /** Coarse steps move the first significant digit instead of the second (Shift + arrow). @default false */
  coarse?: boolean;
  /** The value never steps below this (in the value's own unit). @default 0 */
  min?: number;
}

const NUMBER_WITH_UNIT = /^\s*([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?)(\s*)(.*)$/;

/**
 * Steps a setting as typed, keeping its unit text: `"500 A"` → `"510 A"`, `0.3` → `0.31`,
 * `"12 cycles"` → `"13 cycles"`. A fine step is one unit of the second significant digit, a coarse
 * step one of the first, so a value moves by 1–10 % or 10–100 % whatever its size. Returns
 * `undefined` for text that does not start with a number (the caller leaves it alone).
 *
 * @example stepValue('800 A', { direction: 1 }) // '810 A'
 */
export function stepValue(value: unknown, options: StepOptions): number | string | undefined {
  const { direction, coarse = false, min = 0 } = options;
  if (typeof value === 'number') return Number.isFinite(value) ? stepNumber(value, direction, coarse, min) : undefined;
  if (typeof value !== 'string') return undefined;
  const match = NUMBER_WITH_UNIT.exec(value);
  if (!match) return undefined;
  const [, number, space, unit] = match;
  const stepped = stepNumber(Number(number), direction, coarse, min);
  return `${stepped}${unit ? space || ' ' : ''}${unit}`;
}

// Accepts any finite number; returns it moved by one step and rounded clear of binary noise.
function stepNumber(value: number, direction: 1 | -1, coarse: boolean, min: number): number {
  const magnitude = Math.abs(value);
  // Step down from a power of ten by the finer step below it, so 1 → 0.99 rather than 1 → 0.9 → 0.
  const basis = direction < 0 && magnitude > 0 && isPowerOfTen(magnitude) ? magnitude / 10 : magnitude;
  const exponent = basis > 0 ? Math.floor(Math.log10(basis) + 1e-12) : 0;
  const step = 10 ** (exponent - (coarse ? 0 : 1));
  const next = Number((value + direction * step).toPrecision(12));
  return next < min ? min : next;
}

function isPowerOfTen(value: number): boolean {
  const exponent = Math.round(Math.log10(value));
  return Math.abs(value - 10 ** exponent) < 1e-12 * value;
}

/**
 * Multiplies a setting as typed by `factor`, keeping its unit text and rounding to `digits`
 * significant figures (a drag on the sheet moves settings by ratios): `"0.4 s"` × 1.5 → `"0.6 s"`.
 * Returns `undefined` for text that does not start with a number.
 *
 * @example scaleValue('5 cycles', 2) // '10 cycles'
 */
export function scaleValue(value: unknown, factor: number, digits = 3): number | string | undefined {
  const scale = (x: number) => Number((x * factor).toPrecision(digits));
  if (typeof value === 'number') return Number.isFinite(value) ? scale(value) : undefined;
  if (typeof value !== 'string') return undefined;
  const match = NUMBER_WITH_UNIT.exec(value);
  if (!match) return undefined;
  const [, number, space, unit] = match;
  return `${scale(Number(number))}${unit ? space || ' ' : ''}${unit}`;
}
