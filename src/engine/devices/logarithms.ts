/** Scratch for `logarithmsOf`, grown as needed (bands are evaluated one at a time). */
let scratchLogs = new Float64Array(256);

/**
 * `Math.log(amps[i] * factor)` for every current, in a scratch array the next call overwrites. A batch
 * pass takes its logarithms here, in a loop of their own, so that its own loop makes no call, around
 * which it would save and restore its many live numbers for every current (measured: P1 several µs
 * faster per 1,000 currents).
 *
 * @example const logs = logarithmsOf(amps, 1 / pickup) // logs[i] = ln(amps[i] / pickup)
 */
export function logarithmsOf(amps: Float64Array, factor: number): Float64Array {
  if (scratchLogs.length < amps.length) scratchLogs = new Float64Array(2 * amps.length);
  const logs = scratchLogs;
  for (let i = 0, n = amps.length; i < n; i++) logs[i] = Math.log(amps[i] * factor);
  return logs;
}
