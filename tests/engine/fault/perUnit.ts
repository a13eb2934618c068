/**
 * A hand per-unit calculator for reference tests, written apart from the engine: complex numbers as
 * [re, im], impedances from a magnitude and X/R, per-unit bases (IEEE 141 / IEEE 399 per-unit method).
 * The tests build each expected value from these by the textbook sequence-network formulas.
 */
export type C = [number, number];

export const add = (...zs: C[]): C => zs.reduce<C>((s, z) => [s[0] + z[0], s[1] + z[1]], [0, 0]);
export const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
export const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
export const abs = (z: C): number => Math.hypot(z[0], z[1]);
export const scale = (z: C, k: number): C => [z[0] * k, z[1] * k];
export const par = (a: C, b: C): C => div(mul(a, b), add(a, b));

/** An impedance of magnitude `m` at the angle of X/R `xr` (all reactance for Infinity). */
export const polar = (m: number, xr: number): C =>
  xr === Infinity ? [0, m] : [m / Math.sqrt(1 + xr * xr), (m * xr) / Math.sqrt(1 + xr * xr)];

/** Three-phase base current `S / (√3 · V)`. */
export const baseAmps3 = (va: number, volts: number) => va / (Math.sqrt(3) * volts);
/** Base impedance `V² / S`. */
export const baseOhms = (va: number, volts: number) => (volts * volts) / va;
