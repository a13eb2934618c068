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

  it('pointTableSchema reads as the trade writes tables', () => {
    const schema = pointTableSchema({ current: 'a current in amperes', unit: ' A' });
    expect(schema.safeParse([[1, 2]]).error?.issues[0].message).toMatch(/^expected at least 2 points, got 1$/);
  });
});
