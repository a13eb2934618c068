/**
 * Asymmetry multipliers at one half-cycle for a fault at voltage zero (textbook
 * results for an R-L circuit; IEEE C37.010 / C37.13 use closely related factors). For instantaneous settings
 * and interrupting checks only, never for TCC coordination, which uses symmetrical RMS currents.
 *
 * - RMS: `I_asym / I_sym = √(1 + 2·e^(−2π/(X/R)))`
 * - peak: `i_peak / I_sym = √2 · (1 + e^(−π/(X/R)))`
 *
 * With no resistance (`X/R = Infinity`) the factors reach their limits √3 and 2√2.
 *
 * @example asymmetryOf(6.3004).rms // 1.31825
 */
export function asymmetryOf(xr: number): { rms: number; peak: number } {
  if (!(xr > 0)) throw new RangeError(`expected an X/R ratio greater than 0, got "${xr}"`);
  const rms = Math.sqrt(1 + 2 * Math.exp((-2 * Math.PI) / xr));
  const peak = Math.SQRT2 * (1 + Math.exp(-Math.PI / xr));
  return { rms, peak };
}
