import { describe, expect, it } from 'vitest';
import { parseStudy } from '../../../src/engine/study/index.ts';
import { adjustableSettingsOf } from '../../../src/engine/window/index.ts';
import { workedStudy } from './fixtures.ts';

/** The worked study's 2000 A main, with `characteristic` merged into its own. */
function mainWith(characteristic: Record<string, unknown>) {
  const input = workedStudy();
  const main = input.devices![1];
  input.devices![1] = { ...main, characteristic: { ...main.characteristic, ...characteristic } } as typeof main;
  return parseStudy(input).devices[1];
}

describe('adjustableSettingsOf', () => {
  it('has the expected defaults: the generic trip-unit ranges and steps, the present value among them', () => {
    const specs = adjustableSettingsOf(mainWith({}));
    expect(specs.map((s) => s.key)).toEqual([
      'shortTime.delay',
      'shortTime.pickup',
      'longTime.delay',
      'longTime.pickup',
    ]);
    const delay = specs.find((s) => s.key === 'shortTime.delay')!;
    expect(delay.values).toEqual([0.05, 0.1, 0.15, 0.2, 0.25, 0.3, 0.35, 0.4, 0.45, 0.5]);
    expect(delay).toMatchObject({
      min: 0.05,
      max: 0.5,
      current: 0.3,
      rangeSource: expect.stringMatching(/common practice/),
    });
    expect(specs.find((s) => s.key === 'longTime.pickup')!.values).toHaveLength(13);
  });

  // A dial from 1.5 to 12 in whole steps (the generic step) stops at 11.5: 12.5 would be a setting the
  // device does not have. The present value stays offered.
  it('a range given in the study never offers a value above its maximum or below its minimum', () => {
    const main = mainWith({ instantaneous: { pickup: 12 } });
    const specs = adjustableSettingsOf(main, {
      overrides: {
        'instantaneous.pickup': { min: 1.5, max: 12 },
        'longTime.pickup': { min: 0.5, max: 1, step: 0.2 },
        'longTime.delay': { min: 2, max: 24, step: 2.5 },
      },
    });
    const of = (key: string) => specs.find((s) => s.key === key)!;
    expect(of('instantaneous.pickup').values).toEqual([1.5, 2.5, 3.5, 4.5, 5.5, 6.5, 7.5, 8.5, 9.5, 10.5, 11.5, 12]);
    expect(of('instantaneous.pickup')).toMatchObject({ min: 1.5, max: 12 });
    expect(of('longTime.pickup').values).toEqual([0.5, 0.7, 0.9, 1]);
    expect(of('longTime.delay').values).toEqual([2, 4, 4.5, 7, 9.5, 12, 14.5, 17, 19.5, 22]);
    for (const spec of specs) {
      if (spec.rangeSource !== 'range given in the study') continue;
      for (const v of spec.values!) expect(v, spec.key).toBeLessThanOrEqual(Math.max(spec.max, spec.current));
    }
  });

  // The trip-unit schema wants each delay above the band drawn below it (delay − shortTimeBelow > 0);
  // a delay at or below that band is not a setting the study can hold.
  it('offers short-time and ground-fault delays only from the first step above the band below them', () => {
    const main = mainWith({
      ground: { pickup: 0.6, delay: 0.3 },
      tolerance: { shortTimeBelow: 0.1 },
    });
    const specs = adjustableSettingsOf(main);
    const shortTime = specs.find((s) => s.key === 'shortTime.delay')!;
    const ground = specs.find((s) => s.key === 'ground.delay')!;
    expect(shortTime.values![0]).toBe(0.15);
    expect(shortTime.min).toBe(0.15);
    expect(ground.values![0]).toBe(0.15);
    expect(ground.min).toBe(0.15);
    // With no band below (the default), the generic range is offered whole.
    expect(adjustableSettingsOf(mainWith({ ground: { pickup: 0.6, delay: 0.3 } })).map((s) => s.min)).toContain(0.05);
  });
});
