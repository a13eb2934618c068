import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../asserts.ts';
import { bandOf, evaluateBand, HALF_CYCLE_SECONDS, scaleBand } from '../../src/engine/band.ts';
import { characteristicSchema } from '../../src/engine/devices/characteristic.ts';
import { fuseBand } from '../../src/engine/devices/fuse.ts';
import { relayBand } from '../../src/engine/devices/relay.ts';
import { thermalMagneticBand } from '../../src/engine/devices/thermalMagnetic.ts';
import { tripUnitBand } from '../../src/engine/devices/tripUnit.ts';

const inputs = {
  relay: { kind: 'relay', ct: '600:5', timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 5, timeDial: 2 } },
  'trip-unit': { kind: 'trip-unit', sensor: 800, longTime: { pickup: 1, delay: 10 } },
  'thermal-magnetic': {
    kind: 'thermal-magnetic',
    rating: 100,
    thermal: {
      minimum: [
        [1.05, 3600],
        [10, 1],
      ],
      maximum: [
        [1.35, 3600],
        [10, 5],
      ],
    },
    magnetic: { pickup: 10 },
  },
  fuse: {
    kind: 'fuse',
    minimumMelting: [
      [200, 100],
      [4000, 0.01],
    ],
    totalClearing: [
      [200, 120],
      [4000, 0.02],
    ],
  },
} as const;

const families = {
  relay: relayBand,
  'trip-unit': tripUnitBand,
  'thermal-magnetic': thermalMagneticBand,
  fuse: fuseBand,
};

describe('band', () => {
  it('has the expected defaults', () => {
    expect(HALF_CYCLE_SECONDS).toBe(0.01);
  });

  it('bandOf dispatches each kind to its family band', () => {
    for (const [kind, input] of Object.entries(inputs)) {
      const characteristic = characteristicSchema.parse(input);
      const band = bandOf(characteristic);
      const direct = (families[kind as keyof typeof families] as (c: typeof characteristic) => typeof band)(
        characteristic,
      );
      for (const amps of [150, 700, 1500, 6000, 50000]) {
        expect(band.minTime(amps), `${kind} at ${amps} A`).toBe(direct.minTime(amps));
        expect(band.maxTime(amps), `${kind} at ${amps} A`).toBe(direct.maxTime(amps));
      }
      expect([...band.breakpoints]).toEqual([...direct.breakpoints]);
    }
  });

  it('bandOf(relay) at 6000 A is the hand-worked IEEE C37.112 relay times IEEE VI TD 2 time plus the 5-cycle breaker (computed)', () => {
    const band = bandOf(characteristicSchema.parse(inputs.relay));
    assertInDelta(band.minTime(6000), 1.37816, 1e-5);
    assertInDelta(band.maxTime(6000), 1.37816 + 5 / 60, 1e-5);
  });

  it('evaluateBand fills both edges at every current, Infinity kept', () => {
    const band = bandOf(characteristicSchema.parse(inputs.fuse));
    const { minTimes, maxTimes } = evaluateBand(band, new Float64Array([100, 200, 4000]));
    expect([...minTimes]).toEqual([Infinity, 100, 0.01]);
    expect([...maxTimes]).toEqual([Infinity, 120, 0.02]);
  });

  it('scaleBand moves a bandOf result to another voltage base (voltage-ratio reflection, IEEE 242)', () => {
    const band = bandOf(characteristicSchema.parse(inputs['trip-unit']));
    const onPrimary = scaleBand(band, 480 / 12470);
    assertInDelta(onPrimary.minTime(1200 * (480 / 12470)), band.minTime(1200), 1e-12);
    assertInDelta(onPrimary.minAmps, band.minAmps * (480 / 12470), 1e-12);
    // One scaled band per band and factor, so what is drawn or checked of it can be kept.
    expect(scaleBand(band, 480 / 12470)).toBe(onPrimary);
    expect(scaleBand(band, 480 / 4160)).not.toBe(onPrimary);
    expect(scaleBand(band, 1)).toBe(band);
  });
});
