import { describe, expect, it } from 'vitest';
import { bandOf, evaluateBand, fastestOf, groundFaultBandOf, scaleBand, type Band } from '../../src/engine/band.ts';
import { characteristicSchema, type Characteristic } from '../../src/engine/devices/characteristic.ts';
import { INVERSE_CURVE_NAMES } from '../../src/engine/devices/inverseCurves.ts';
import { curveTemplates } from '../../src/engine/templates/index.ts';
import { shippedCharacteristics } from './shippedCharacteristics.ts';

// The batch form of a band (`evaluateInto`) runs the same arithmetic as its two edges, a column at a time;
// these checks hold it to the very same doubles (Object.is), the property that lets drawing use it.

/** Every curve template, every device of the demo studies, and each relay curve with tolerance, cap and delay. */
function characteristics(): Array<[string, Characteristic]> {
  const found = shippedCharacteristics();
  for (const curve of INVERSE_CURVE_NAMES) {
    const dial = curve.startsWith('ieee') ? { timeDial: 3 } : { timeMultiplier: 0.3, definiteTimeFrom: 20 };
    found.push([
      `relay ${curve}`,
      characteristicSchema.parse({
        kind: 'relay',
        ct: '400:5',
        timeOvercurrent: { curve, pickup: 4, ...dial },
        instantaneous: { pickup: 40, delay: 0.05 },
        tolerance: { pickup: 7, time: 7 },
      }),
    ]);
  }
  found.push([
    'trip unit, ramp ending at the short-time pickup',
    characteristicSchema.parse({
      kind: 'trip-unit',
      sensor: 1600,
      longTime: { pickup: 0.8, delay: 20 },
      shortTime: { pickup: 2, delay: 0.3, i2t: true },
      instantaneous: { pickup: 12 },
      ground: { pickup: 0.3, delay: 0.2, i2t: true },
      longTimeRamp: 'ends-at-short-time-pickup',
    }),
  ]);
  return found;
}

/** The next double above (`step` 1) or below (`step` -1) a positive `value`. */
function adjacent(value: number, step: 1 | -1): number {
  const bits = new BigInt64Array(Float64Array.of(value).buffer);
  bits[0] += BigInt(step);
  return new Float64Array(bits.buffer)[0];
}

/** Seeded log-spread currents around the band, every breakpoint with its neighbouring doubles, and odd inputs. */
function currentsFor(band: Band, seed: number): number[] {
  let state = seed;
  const random = () => (state = (state * 1103515245 + 12345) % 2147483648) / 2147483648;
  const low = band.minAmps / 100;
  const high = (Number.isFinite(band.maxAmps) ? band.maxAmps : band.minAmps * 1e4) * 100;
  const amps: number[] = [];
  for (let i = 0; i < 2000; i++) amps.push(low * (high / low) ** random());
  for (const breakpoint of [...band.breakpoints, band.minAmps]) {
    amps.push(breakpoint, adjacent(breakpoint, 1), adjacent(breakpoint, -1), breakpoint * (1 - 1e-9));
  }
  amps.push(0, -1, NaN, Infinity);
  // Shuffled, so a table's cursor has to move both ways.
  for (let i = amps.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [amps[i], amps[j]] = [amps[j], amps[i]];
  }
  return amps;
}

/**
 * The first current where `evaluateBand`, or the batch form asked for one edge alone (as the overlap
 * finder asks), differs from the band's own edges, or undefined.
 */
function firstDifference(band: Band, amps: number[]): string | undefined {
  const currents = Float64Array.from(amps);
  const { minTimes, maxTimes } = evaluateBand(band, currents);
  const minAlone = new Float64Array(currents.length).fill(-1);
  const maxAlone = new Float64Array(currents.length).fill(-1);
  band.evaluateInto?.(currents, minAlone, undefined);
  band.evaluateInto?.(currents, undefined, maxAlone);
  for (let i = 0; i < currents.length; i++) {
    const [min, max] = [band.minTime(currents[i]), band.maxTime(currents[i])];
    if (!Object.is(minTimes[i], min) || !Object.is(maxTimes[i], max)) {
      return `at ${currents[i]} A: ${minTimes[i]} / ${maxTimes[i]} s against ${min} / ${max} s`;
    }
    if (band.evaluateInto && (!Object.is(minAlone[i], min) || !Object.is(maxAlone[i], max))) {
      return `at ${currents[i]} A, one edge at a time: ${minAlone[i]} / ${maxAlone[i]} s against ${min} / ${max} s`;
    }
  }
  return undefined;
}

describe('evaluateBand', () => {
  it('evaluateBand gives exactly minTime and maxTime for every template, demo device and relay curve', () => {
    const all = characteristics();
    expect(all.length).toBeGreaterThan(40);
    let batched = 0;
    for (const [name, characteristic] of all) {
      const band = bandOf(characteristic);
      if (band.evaluateInto) batched++;
      const amps = currentsFor(band, name.length);
      expect(firstDifference(band, amps), name).toBeUndefined();
      expect(
        firstDifference(
          band,
          [...amps].sort((a, b) => a - b),
        ),
        `${name}, ascending`,
      ).toBeUndefined();
      expect(
        firstDifference(
          band,
          [...amps].sort((a, b) => b - a),
        ),
        `${name}, descending`,
      ).toBeUndefined();
      const scaled = scaleBand(band, 480 / 12470);
      expect(firstDifference(scaled, currentsFor(scaled, 7)), `${name}, scaled`).toBeUndefined();
      const ground = groundFaultBandOf(characteristic);
      if (ground) {
        expect(firstDifference(ground, currentsFor(ground, 11)), `${name}, ground`).toBeUndefined();
        const both = fastestOf([band, ground]);
        expect(both.evaluateInto, `${name}, fastest has a batch form`).toBeDefined();
        expect(firstDifference(both, currentsFor(both, 13)), `${name}, fastest`).toBeUndefined();
      }
    }
    // Every family in the demo has the batch form.
    expect(batched).toBe(all.length);
  });

  it('evaluateBand writes only as many results as there are currents', () => {
    const band = bandOf(curveTemplates.find((template) => template.characteristic.kind === 'fuse')!.characteristic);
    const minTimes = new Float64Array(5).fill(-1);
    const maxTimes = new Float64Array(5).fill(-1);
    evaluateBand(band, Float64Array.of(band.minAmps, band.minAmps * 10), minTimes, maxTimes);
    expect([...minTimes.subarray(2)]).toEqual([-1, -1, -1]);
    expect([...maxTimes.subarray(2)]).toEqual([-1, -1, -1]);
    expect(minTimes[0]).toBe(band.minTime(band.minAmps));
  });
});
