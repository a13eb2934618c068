// mathjs exports the factories of its custom builds (https://mathjs.org/docs/custom_bundling.html)
// without declaring them all in its types; these are the three the unit library builds from.
export {};

declare module 'mathjs' {
  /** Builds mathjs's `Unit` class from the dependencies it names. */
  export function createUnitClass(dependencies: Record<string, unknown>): unknown;
  /** Builds mathjs's `Complex` class (complex.js). */
  export function createComplexClass(dependencies: Record<string, unknown>): unknown;
  /** Builds mathjs's `Fraction` class (fraction.js). */
  export function createFractionClass(dependencies: Record<string, unknown>): unknown;
}
