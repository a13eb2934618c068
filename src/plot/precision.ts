import { line } from 'd3-shape';

/**
 * Decimal places kept for every pixel coordinate the sheet writes out. This is the one place the plot
 * layer rounds: path strings go through {@link pathOf}, lone numbers through {@link fixed}.
 */
export const DIGITS = 3;

const polyline = line<readonly [number, number]>().digits(DIGITS);

/**
 * Formats a pixel coordinate with at most {@link DIGITS} decimals, no trailing zeros and no "-0".
 * @example fixed(12.34567) // "12.346"
 */
export function fixed(value: number): string {
  // A large diagram writes a hundred thousand coordinates: rounded by arithmetic, which gives the very
  // number `toFixed` would (an integer count of thousandths over 1000 is the double nearest that
  // decimal) except within a rounding error of a half, left to `toFixed` with anything not finite.
  const scaled = Math.abs(value) * SCALE;
  const whole = Math.floor(scaled);
  if (scaled < 1e15 && Math.abs(scaled - whole - 0.5) > 1e-6) {
    const rounded = (scaled - whole < 0.5 ? whole : whole + 1) / SCALE;
    return String(rounded === 0 ? 0 : value < 0 ? -rounded : rounded);
  }
  const rounded = Number(value.toFixed(DIGITS));
  return String(rounded === 0 ? 0 : rounded);
}

const SCALE = 10 ** DIGITS;

/**
 * An SVG path string for a polyline given as interleaved pixel coordinates `[x0, y0, x1, y1, …]`,
 * rounded to {@link DIGITS} decimals; `closed` appends `Z`. Fewer than two points give "".
 * @example pathOf(new Float64Array([0, 0, 10, 5])) // "M0,0L10,5"
 */
export function pathOf(points: ArrayLike<number>, closed = false): string {
  if (points.length < 4) return '';
  const pairs: [number, number][] = [];
  for (let i = 0; i + 1 < points.length; i += 2) pairs.push([points[i], points[i + 1]]);
  const d = polyline(pairs) ?? '';
  return closed ? `${d}Z` : d;
}
