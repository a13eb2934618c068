import type { Band } from '../../src/engine/band.ts';
import type { StartingCurve, WithstandCurve } from '../../src/engine/withstand/withstand.ts';
import type { SheetInput } from '../../src/plot/sheetInput.ts';

/** IEEE C37.112 very inverse, TD × (19.61 / (M² − 1) + 0.491) s (IEEE C37.112, constants confirmed). */
export function veryInverse(multiple: number, timeDial: number): number {
  return multiple <= 1 ? Infinity : timeDial * (19.61 / (multiple * multiple - 1) + 0.491);
}

/**
 * A relay band built by hand (invented settings): IEEE VI, pickup 400 A ± 5 %, TD 1, breaker
 * 5 cycles (0.0833 s) on the clearing edge, instantaneous 8000 A ± 5 % at 0.016 s / 0.05 s.
 */
export function relayBand(): Band {
  const minTime = (amps: number) => (amps >= 7600 ? 0.016 : amps > 380 ? veryInverse(amps / 380, 1) : Infinity);
  const maxTime = (amps: number) =>
    amps >= 8400 ? 0.05 + 0.0833 : amps > 420 ? veryInverse(amps / 420, 1) + 0.0833 : Infinity;
  return {
    minTime,
    maxTime,
    breakpoints: new Float64Array([380, 420, 7600, 8400]),
    minAmps: 380,
    maxAmps: Infinity,
    currentLimitingFrom: Infinity,
    diagnostics: [],
  };
}

/**
 * An LV breaker band built by hand (invented): long-time I²t line 8·(6000/I)² s from 1000 A and
 * 12·(6000/I)² s from 1100 A, instantaneous 9000 A at 0.005 s (below the half-cycle line) and
 * 11 000 A at 0.03 s, interrupting rating 65 kA.
 */
export function breakerBand(): Band {
  const minTime = (amps: number) => (amps >= 9000 ? 0.005 : amps >= 1000 ? 8 * (6000 / amps) ** 2 : Infinity);
  const maxTime = (amps: number) => (amps >= 11000 ? 0.03 : amps >= 1100 ? 12 * (6000 / amps) ** 2 : Infinity);
  return {
    minTime,
    maxTime,
    breakpoints: new Float64Array([1000, 1100, 9000, 11000]),
    minAmps: 1000,
    maxAmps: 65000,
    currentLimitingFrom: Infinity,
    diagnostics: [],
  };
}

/** A band whose edges are one curve: IEEE VI, pickup 150 A, TD 2 (a relay drawn as a single line). */
export function singleLineBand(): Band {
  const time = (amps: number) => veryInverse(amps / 150, 2);
  return {
    minTime: time,
    maxTime: time,
    breakpoints: new Float64Array([150]),
    minAmps: 150,
    maxAmps: Infinity,
    currentLimitingFrom: Infinity,
    diagnostics: [],
  };
}

/**
 * C57.109 Category II thermal points of the 2500 kVA, 480 V example (hand-worked IEEE C57.109 Category II case, computed):
 * FLA 3007.03 A; 2, 3, 4.75, 6.3, 11.18 pu at 1800, 300, 60, 30, 10 s; the curve ends at 17.39 pu, 2 s.
 */
export function transformerCurve(): WithstandCurve {
  const fla = 3007.03;
  const pu = [2, 3, 4.75, 6.3, 11.1803, 17.3913];
  const seconds = new Float64Array([1800, 300, 60, 30, 10, 2]);
  const amps = new Float64Array(pu.map((p) => p * fla));
  return {
    elementId: 'TX1',
    kind: 'transformer',
    label: 'C57.109 Category II, frequent faults',
    volts: 480,
    amps,
    seconds,
    timeAt: (a) =>
      a < amps[0]
        ? Infinity
        : seconds[
            Math.min(
              seconds.length - 1,
              amps.findLastIndex((x) => x <= a),
            )
          ],
    notes: [],
  };
}

/** 100 hp, 460 V motor (hand-worked NFPA 70 Table 430.7(B) case): FLC 124 A, LRA 789.46 A to 5 s, 1.6 × LRA = 1263.1 A first cycle. */
export function motorStart(): StartingCurve {
  return {
    elementId: 'M1',
    label: 'Compressor 1 starting',
    volts: 480,
    amps: new Float64Array([1263.1, 789.46, 789.46, 124, 124]),
    seconds: new Float64Array([0.01, 0.1, 5, 5, 1000]),
    notes: [],
  };
}

/** A realistic 480 V sheet built from the hand-made bands and curves above. */
export function fixtureInput(overrides: Partial<SheetInput> = {}): SheetInput {
  return {
    study: 'Harrowmere Cold Store (invented)',
    view: 'fixture',
    title: 'Relay over LV breaker, 480 V base',
    preparedBy: 'Test author',
    date: '2026-12-01',
    notes: 'Hand-built bands: IEEE C37.112 VI relay and an I²t breaker line.',
    referenceVolts: 480,
    bands: [
      { id: 'R1', label: 'Relay R1 (VI, TD 1)', band: relayBand(), ownVolts: 480 },
      { id: 'CB1', label: 'Breaker CB1', band: breakerBand(), ownVolts: 480 },
      { id: 'R2', label: 'Relay R2 single line', band: singleLineBand(), ownVolts: 480 },
    ],
    withstand: [{ id: 'TX1', label: 'TX1 through-fault', curve: transformerCurve(), scale: 1 }],
    markers: [
      {
        kind: 'inrush',
        label: 'TX1 inrush 12 × FLA',
        volts: 480,
        amps: 21650.6,
        seconds: 0.1,
        elementId: 'TX1',
        scale: 1,
      },
    ],
    starting: [{ id: 'M1', label: 'Compressor 1 starting', curve: motorStart(), scale: 1 }],
    faultLines: [
      { busId: 'SWBD', label: 'SWBD', amps: 28421.1, ownVolts: 480, ownAmps: 28421.1, kind: 'max' },
      { busId: 'SWBD', label: 'SWBD', amps: 21000, ownVolts: 480, ownAmps: 21000, kind: 'min' },
    ],
    regions: [
      { fromAmps: 3200, toAmps: 12000, status: 'overlap', label: 'R1 over CB1', findingId: 'coordination:R1/CB1:1' },
    ],
    caution: 'For review by a qualified engineer. Manufacturers’ published curves govern over generic curves.',
    ...overrides,
  };
}
