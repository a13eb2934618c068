/**
 * `Math.expm1(v)` to within about an ulp (relative 1e-15), without a call where |v| ≤ 0.05: there by its
 * Taylor series. That is the power `M^p − 1 = expm1(p · ln M)` of the small exponent p = 0.02 (IEEE
 * moderately inverse, IEC standard inverse) for multiples up to e^2.5 ≈ 12, where a band spends most of
 * its time; `Math.expm1` beyond. Every inverse-time formula takes its power from here, so an edge and its
 * batch form give the same doubles.
 *
 * @example expm1(0.02 * Math.log(10)) // 0.047128548050899…
 */
export function expm1(v: number): number {
  // Literal bounds: a module constant would be read from the module's context on every call.
  if (!(v >= -0.05 && v <= 0.05)) return Math.expm1(v);
  // v + v² · (1/2! + v/3! + … + v⁶/8!): the first term left out, v⁹/9!, is at most 1.1e-16 of v. The powers
  // of v taken in pairs (Estrin's scheme) keep the chain of dependent operations short.
  const v2 = v * v;
  const v4 = v2 * v2;
  const tail = 1 / 2 + v * (1 / 6) + v2 * (1 / 24 + v * (1 / 120)) + v4 * (1 / 720 + v * (1 / 5040) + v2 * (1 / 40320));
  return v + v2 * tail;
}
