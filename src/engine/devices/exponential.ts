/** 2^(j/64), j = 0…63: the table that leaves the polynomial only |r| ≤ ln 2 / 128. */
const twoToSixtyFourths = Float64Array.from({ length: 64 }, (_, j) => 2 ** (j / 64));
/** 2^m for m = −1,050…1,049, at index m + 1,050: the power of two, read rather than built from bits. */
const powersOfTwo = Float64Array.from({ length: 2100 }, (_, m) => 2 ** (m - 1050));

/**
 * `Math.exp(x)` to within about 2 ulp (relative 4e-16, tested), without a call: a batch pass that
 * interpolates a table in log-log space makes one per current and edge, and a call there both costs
 * more than the arithmetic (measured: 7.3 µs per 1,000 against 3.0) and makes the loop save and
 * restore its live numbers around it. The method is the table-driven one of Tang (ACM TOMS 15, 1989):
 * x = (64m + j) · ln 2 / 64 + r, so e^x = 2^m · 2^(j/64) · e^r, with e^r by its Taylor series to r⁶
 * (the first term left out, r⁷/7!, is below 3e-20). Beyond |x| ≥ 700, and for NaN, `Math.exp` itself.
 * The scalar and batch forms of a table both take their power from here, so they give the same doubles.
 *
 * @example exponential(Math.log(300)) // 300.00000000000006 or 300 (within 2 ulp)
 */
export function exponential(x: number): number {
  // Literal bounds and constants: a module constant would be read from the module's context per call.
  if (!(x > -700 && x < 700)) return Math.exp(x);
  // Round x · 64 / ln 2 to an integer by adding and taking away 1.5 · 2^52 (exact for |x| < 2^50).
  const k = x * 92.33248261689366 + 6755399441055744 - 6755399441055744;
  // r = x − k · ln 2 / 64 with ln 2 / 64 split in two (Cody and Waite), so the product is exact.
  const r = x - k * 0.01083042469326756 - k * 2.9815858269852933e-12;
  const er = 1 + r * (1 + r * (1 / 2 + r * (1 / 6 + r * (1 / 24 + r * (1 / 120 + r * (1 / 720))))));
  const n = k | 0;
  return powersOfTwo[(n >> 6) + 1050] * twoToSixtyFourths[n & 63] * er;
}
