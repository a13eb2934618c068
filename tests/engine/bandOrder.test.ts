import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bandOf, type Band } from '../../src/engine/band.ts';
import { characteristicSchema } from '../../src/engine/devices/characteristic.ts';
import { characteristicArbitraries } from './characteristicArbitraries.ts';

/** How far apart two times may be and still count as ordered: a relative 1e-12 (rounding where formulas meet). */
const RELATIVE = 1e-12;

/** Every ordering problem of a band at the given currents and around its breakpoints, as text (empty when none). */
function orderProblems(band: Band, currents: readonly number[]): string[] {
  const around = [...band.breakpoints].flatMap((b) => [b * (1 - 1e-9), b, b * (1 + 1e-9)]);
  const probe = [...currents, ...around].filter((a) => a >= 0).sort((a, b) => a - b);
  const problems: string[] = [];
  let previous = { min: Infinity, max: Infinity };
  for (const amps of probe) {
    const min = band.minTime(amps);
    const max = band.maxTime(amps);
    if (Number.isNaN(min) || Number.isNaN(max)) problems.push(`NaN at ${amps} A`);
    if (min > max * (1 + RELATIVE)) problems.push(`minTime ${min} > maxTime ${max} at ${amps} A`);
    if (min > previous.min * (1 + RELATIVE)) problems.push(`minTime rises to ${min} at ${amps} A`);
    if (max > previous.max * (1 + RELATIVE)) problems.push(`maxTime rises to ${max} at ${amps} A`);
    previous = { min, max };
  }
  return problems;
}

/** Log-spaced currents from 1 A to 1 MA plus arbitrary ones. */
const currents = fc.array(fc.double({ min: 1e-3, max: 1e7, noNaN: true }), { maxLength: 60 });

describe('every family keeps its band ordered', () => {
  for (const [family, characteristic] of Object.entries(characteristicArbitraries)) {
    it(`${family}: minTime ≤ maxTime and both edges non-increasing, within a relative 1e-12`, () => {
      fc.assert(
        fc.property(characteristic, currents, (input, amps) => {
          const band = bandOf(characteristicSchema.parse(input));
          expect(orderProblems(band, amps)).toEqual([]);
        }),
        { numRuns: 300 },
      );
    });
  }

  it('a fuse whose total clearing is one ulp slower than melting never clears before it melts', () => {
    // Between points the two log-log interpolations used to cross by rounding (25.8966026521816 s against
    // 25.89660265218164 s at 383.425 A).
    const mm: Array<[number, number]> = [
      [103.55088365184075, 494.3615540691857],
      [202.4588525902761, 316.5753179089813],
      [252.55216181689082, 123.91990070097906],
      [272.1657489136657, 54.14307342550412],
      [398.73897170263496, 23.803630792282593],
    ];
    const tc = mm.map(([amps, seconds]) => [amps, seconds * (1 + Number.EPSILON)]);
    const band = bandOf(characteristicSchema.parse({ kind: 'fuse', minimumMelting: mm, totalClearing: tc }));
    expect(band.minTime(383.42502423924634)).toBeLessThanOrEqual(band.maxTime(383.42502423924634));
    expect(orderProblems(band, [383.42502423924634])).toEqual([]);
  });
});
