import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../../asserts.ts';
import { tableElement, upperBelowLower } from '../../../src/engine/devices/pointTable.ts';
import { pointTableSchema } from '../../../src/engine/devices/pointTableSchema.ts';

describe('pointTable', () => {
  it('has the expected defaults', () => {
    const element = tableElement([
      [200, 300],
      [2000, 0.1],
    ]);
    expect(element.pickup).toBe(200);
    expect(element.lastAmps).toBe(2000);
    expect(element.joins).toEqual([2000]);
    expect(element.levels).toEqual([0.1]);
  });

  it('tableElement scales currents and interpolates in log-log space (common practice for digitised curves)', () => {
    const element = tableElement(
      [
        [2, 300],
        [20, 0.1],
      ],
      100,
    );
    assertInDelta(element.time(Math.sqrt(200 * 2000)), Math.sqrt(300 * 0.1), 1e-12);
    expect(element.time(199)).toBe(Infinity);
    expect(element.time(5000)).toBe(0.1);
  });

  it('tableElement.reach inverts the interpolation and is Infinity outside the table times', () => {
    const element = tableElement([
      [200, 300],
      [400, 10],
      [2000, 0.1],
    ]);
    for (const amps of [250, 400, 999, 1999]) assertInDelta(element.reach!(element.time(amps)), amps, 1e-9);
    expect(element.reach!(1000)).toBe(Infinity);
    expect(element.reach!(0.01)).toBe(Infinity);
  });

  it('upperBelowLower finds where a slow edge is faster than the fast one', () => {
    const lower: Array<[number, number]> = [
      [100, 10],
      [1000, 0.01],
    ];
    expect(
      upperBelowLower(lower, [
        [100, 12],
        [1000, 0.02],
      ]),
    ).toBeUndefined();
    expect(
      upperBelowLower(lower, [
        [100, 12],
        [500, 0.01],
      ])?.amps,
    ).toBe(500);
  });

  it('upperBelowLower reads each table as its element does, at every tabulated current', () => {
    // Seeded random tables, often sharing currents and crossing: the answer, with its times, must be
    // what the two built elements give at the merged currents.
    let state = 97;
    const random = () => (state = (state * 1103515245 + 12345) % 2147483648) / 2147483648;
    const tableOf = (): Array<[number, number]> => {
      const points: Array<[number, number]> = [];
      let amps = 50 + Math.round(random() * 4) * 25;
      let seconds = 100 + random() * 900;
      for (let k = 0, n = 2 + Math.floor(random() * 8); k < n; k++) {
        points.push([amps, seconds]);
        amps *= random() < 0.3 ? 2 : 1 + random() * 3;
        seconds /= 1.5 + random() * 20;
      }
      return points;
    };
    const byElements = (lower: Array<[number, number]>, upper: Array<[number, number]>) => {
      const low = tableElement(lower);
      const high = tableElement(upper);
      if (high.pickup < low.pickup)
        return { amps: high.pickup, lowerSeconds: Infinity, upperSeconds: high.time(high.pickup) };
      const currents = [...lower, ...upper].map(([amps]) => amps).sort((a, b) => a - b);
      for (const amps of currents) {
        const lowerSeconds = low.time(amps);
        const upperSeconds = high.time(amps);
        if (upperSeconds < lowerSeconds * (1 - 1e-12)) return { amps, lowerSeconds, upperSeconds };
      }
      return undefined;
    };
    let found = 0;
    for (let trial = 0; trial < 2000; trial++) {
      const lower = tableOf();
      const upper =
        random() < 0.3 ? lower.map(([amps, seconds]): [number, number] => [amps, seconds * 1.2]) : tableOf();
      const expected = byElements(lower, upper);
      if (expected) found++;
      expect(upperBelowLower(lower, upper), `trial ${trial}`).toEqual(expected);
    }
    expect(found).toBeGreaterThan(100);
    expect(found).toBeLessThan(1900);
  });

  it('pointTableSchema reads as the trade writes tables', () => {
    const schema = pointTableSchema({ current: 'a current in amperes', unit: ' A' });
    expect(schema.safeParse([[1, 2]]).error?.issues[0].message).toMatch(/^expected at least 2 points, got 1$/);
  });
});
