import type { Band } from '../band.ts';
import { uniqueAscending } from './composite.ts';
import { tableElement, tableTimesAt, type TableShape } from './pointTable.ts';
import type { Fuse } from './fuseSchema.ts';

/**
 * The band of a fuse: `minTime` is the minimum-melting curve, `maxTime` the total-clearing curve,
 * each interpolated linearly in log-log space between its points (common practice for digitised curves).
 * - Below a table's first current its edge is `Infinity` (the fuse does not melt / may never clear).
 * - Beyond a table's last current its edge holds the last tabulated time; the curves are not
 *   extrapolated, and `maxAmps` is the last tabulated current of the two tables.
 * Breakpoints are every tabulated current.
 *
 * @example fuseBand(fuse).minTime(100) // Infinity below the first minimum-melting point
 */
export function fuseBand(fuse: Fuse): Band {
  const melting = tableElement(fuse.minimumMelting);
  const clearing = tableElement(fuse.totalClearing);
  const diagnostics: string[] = [];
  if (fuse.illustrative) diagnostics.push('illustrative curve, not a product: no selectivity claim may rest on it');
  const meltingTime = melting.time;
  const clearingTime = clearing.time;
  const meltingTable = melting.shape as TableShape;
  const clearingTable = clearing.shape as TableShape;
  return {
    minTime: meltingTime,
    // The schema lets total clearing sit within a relative 1e-12 of minimum melting (the round trip
    // through logarithms), so between points the two interpolations can cross by rounding: a fuse
    // never clears before it melts, so the clearing edge is never below the melting one.
    maxTime: (amps) => {
      const clears = clearingTime(amps);
      const melts = meltingTime(amps);
      return clears >= melts ? clears : melts;
    },
    evaluateInto: (amps, minTimes, maxTimes) => fuseTimesInto(meltingTable, clearingTable, amps, minTimes, maxTimes),
    breakpoints: Float64Array.from(uniqueAscending([...fuse.minimumMelting, ...fuse.totalClearing].map(([a]) => a))),
    minAmps: melting.pickup,
    maxAmps: Math.max(melting.lastAmps, clearing.lastAmps),
    currentLimitingFrom: fuse.currentLimitingFrom ?? Infinity,
    diagnostics,
  };
}

/** Scratch for `fuseTimesInto`, grown as needed: bands are evaluated one at a time, so one set serves every fuse. */
let scratch = scratchOf(0);

function scratchOf(n: number) {
  const column = () => new Float64Array(n);
  return { at: new Int32Array(n), logs: column(), melts: column(), clears: column(), exponents: column() };
}

/**
 * Both edges of a fuse band at every current, the arithmetic of `tableElement`'s `time` (see
 * `tableTimesAt`): one logarithm per current for the two tables, in a loop of its own; total clearing
 * held at or above melting.
 */
function fuseTimesInto(
  melting: TableShape,
  clearing: TableShape,
  amps: Float64Array,
  minTimes: Float64Array,
  maxTimes: Float64Array,
): void {
  const n = amps.length;
  if (scratch.at.length < n) scratch = scratchOf(n);
  const { at, logs, melts, clears, exponents } = scratch;
  // Below both tables' first currents (or NaN) the fuse neither melts nor clears: no logarithm there.
  const from = Math.min(melting.first, clearing.first);
  let count = 0;
  for (let i = 0; i < n; i++) if (amps[i] >= from) at[count++] = i;
  for (let j = 0; j < count; j++) logs[j] = Math.log(amps[at[j]]);
  tableTimesAt(melting, amps, at, count, logs, melts, exponents);
  tableTimesAt(clearing, amps, at, count, logs, clears, exponents);
  for (let i = 0; i < n; i++) {
    // Assigned in a branch, not chosen by `?:` against Infinity, which V8 compiles to a much slower loop.
    let melt = Infinity;
    let clear = Infinity;
    if (amps[i] >= from) {
      melt = melts[i];
      clear = clears[i];
    }
    minTimes[i] = melt;
    maxTimes[i] = clear >= melt ? clear : melt;
  }
}
