/**
 * A complex impedance `r + jx`, in ohms (or per unit, when a calculation says so). Radial series
 * elements add as complex numbers, never as magnitudes (IEEE 141 / IEEE 399 per-unit method).
 *
 * @example const z: Impedance = { r: 0.0047178, x: 0.0206405 } // Ω at 480 V
 */
export interface Impedance {
  /** Resistance (Ω or pu). */
  r: number;
  /** Reactance (Ω or pu). */
  x: number;
}

/** The zero impedance: an infinite bus. */
export const ZERO_IMPEDANCE: Impedance = Object.freeze({ r: 0, x: 0 });

/** Series sum `Σr + jΣx`. @example addImpedance({ r: 1, x: 2 }, { r: 0.5, x: 1 }) // { r: 1.5, x: 3 } */
export function addImpedance(...terms: Impedance[]): Impedance {
  let r = 0;
  let x = 0;
  for (const term of terms) {
    r += term.r;
    x += term.x;
  }
  return { r, x };
}

/** Multiplies by a real factor, e.g. the square of a voltage ratio. @example scaleImpedance({ r: 1, x: 2 }, 0.5) */
export function scaleImpedance(z: Impedance, factor: number): Impedance {
  return { r: z.r * factor, x: z.x * factor };
}

/** `|z| = √(r² + x²)`. @example magnitudeOf({ r: 3, x: 4 }) // 5 */
export function magnitudeOf(z: Impedance): number {
  return Math.hypot(z.r, z.x);
}

/** X/R ratio `x / r`; `Infinity` when there is no resistance. @example xrOf({ r: 1, x: 6.3 }) // 6.3 */
export function xrOf(z: Impedance): number {
  return z.r === 0 ? Infinity : z.x / z.r;
}

/**
 * Splits a magnitude by an X/R ratio: `r = |Z| / √(1 + (X/R)²)`, `x = r · X/R` (IEEE 141 / IEEE 399 per-unit method).
 * With `xr` omitted (or `Infinity`) the impedance is all reactance.
 *
 * @example impedanceOfMagnitude(0.003, 15) // { r: 0.00019956, x: 0.00299336 }
 */
export function impedanceOfMagnitude(magnitude: number, xr?: number): Impedance {
  if (xr === undefined || xr === Infinity) return { r: 0, x: magnitude };
  const r = magnitude / Math.sqrt(1 + xr * xr);
  return { r, x: r * xr };
}

/** Admittance `1 / z` as a complex number `g + jb` stored in `{ r: g, x: b }` (per ohm). @example invertImpedance({ r: 0, x: 2 }) // { r: 0, x: -0.5 } */
export function invertImpedance(z: Impedance): Impedance {
  const d = z.r * z.r + z.x * z.x;
  if (d === 0) return { r: Infinity, x: Infinity };
  return { r: z.r / d, x: -z.x / d };
}

/**
 * Parallel combination `1 / Σ(1/zᵢ)`. `undefined` terms are open circuits and are skipped; with no
 * terms left the result is `undefined` (nothing connected). A zero impedance makes the result zero.
 *
 * @example parallelImpedance({ r: 0, x: 2 }, { r: 0, x: 2 }) // { r: 0, x: 1 }
 */
export function parallelImpedance(...terms: (Impedance | undefined)[]): Impedance | undefined {
  const sum = new ParallelSum();
  for (const term of terms) sum.add(term);
  return sum.impedance();
}

/**
 * Impedances in parallel, `1 / Σ(1/zᵢ)`, given one term at a time (no list of terms is gathered):
 * `undefined` terms are open circuits and are skipped; a zero impedance makes the result zero; with no
 * terms the result is `undefined`. `clear` starts a new sum.
 *
 * @example const sum = new ParallelSum(); sum.add({ r: 0, x: 2 }); sum.add({ r: 0, x: 2 }); sum.impedance() // { r: 0, x: 1 }
 */
export class ParallelSum {
  #g = 0;
  #b = 0;
  #any = false;
  #zero = false;

  clear(): void {
    this.#g = 0;
    this.#b = 0;
    this.#any = false;
    this.#zero = false;
  }

  /** Adds a term; `undefined` is an open circuit, skipped. */
  add(term: Impedance | undefined): void {
    if (!term || this.#zero) return;
    if (term.r === 0 && term.x === 0) {
      this.#zero = true;
      return;
    }
    // As `invertImpedance`, which gives an infinite admittance where r² + x² underflows to zero.
    const d = term.r * term.r + term.x * term.x;
    this.#g += d === 0 ? Infinity : term.r / d;
    this.#b += d === 0 ? Infinity : -term.x / d;
    this.#any = true;
  }

  /** The terms in parallel; zero if one is zero, `undefined` with none. */
  impedance(): Impedance | undefined {
    if (this.#zero) return ZERO_IMPEDANCE;
    return this.#any ? invertImpedance({ r: this.#g, x: this.#b }) : undefined;
  }
}

/** Renders `r + jx` for work steps, six significant figures. @example formatImpedance({ r: 0.00995121, x: 0.0626969 }) // "0.00995121 + j0.0626969" */
export function formatImpedance(z: Impedance, digits = 6): string {
  const part = (v: number) => String(Number(v.toPrecision(digits)));
  return `${part(z.r)} ${z.x < 0 ? '−' : '+'} j${part(Math.abs(z.x))}`;
}

/** Complex product `a · b` (impedance or current phasors as `{ r, x }`). @example multiplyComplex({ r: 0, x: 1 }, { r: 0, x: 1 }) // { r: -1, x: 0 } */
export function multiplyComplex(a: Impedance, b: Impedance): Impedance {
  return { r: a.r * b.r - a.x * b.x, x: a.r * b.x + a.x * b.r };
}

/** Complex quotient `a / b`. @example divideComplex({ r: 1, x: 0 }, { r: 0, x: 2 }) // { r: 0, x: -0.5 } */
export function divideComplex(a: Impedance, b: Impedance): Impedance {
  return multiplyComplex(a, invertImpedance(b));
}
