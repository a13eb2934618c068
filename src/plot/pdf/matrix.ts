import { pdfNumber } from './pdfSyntax.ts';

/** An affine transform `[a b c d e f]` as PDF writes it: x' = a·x + c·y + e, y' = b·x + d·y + f. */
export type Matrix = [number, number, number, number, number, number];

/**
 * A matrix as six PDF operands: the linear part to six decimals (a scale of 0.7 on a 1000 px drawing
 * must not drift by a point), the translation to three.
 * @example matrixOperands([1, 0, 0, -1, 36, 576]) // "1 0 0 -1 36 576"
 */
export function matrixOperands(m: Matrix): string {
  return m.map((v, i) => pdfNumber(v, i < 4 ? 6 : 3)).join(' ');
}

/**
 * The matrix that applies `first` and then `second` (PDF's order: `first × second`).
 * @example multiplyMatrix([2, 0, 0, 2, 0, 0], [1, 0, 0, 1, 5, 0]) // [2, 0, 0, 2, 5, 0]
 */
export function multiplyMatrix(first: Matrix, second: Matrix): Matrix {
  const [a, b, c, d, e, f] = first;
  const [a2, b2, c2, d2, e2, f2] = second;
  return [
    a * a2 + b * c2,
    a * b2 + b * d2,
    c * a2 + d * c2,
    c * b2 + d * d2,
    e * a2 + f * c2 + e2,
    e * b2 + f * d2 + f2,
  ];
}
