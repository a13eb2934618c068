import { describe, expect, it } from 'vitest';
import { bandOf, evaluateBand, groundFaultBandOf, type Band } from '../../src/engine/band.ts';
import { characteristicSchema, type Characteristic } from '../../src/engine/devices/characteristic.ts';
import { INVERSE_CURVES, INVERSE_CURVE_NAMES } from '../../src/engine/devices/inverseCurves.ts';
import { curveTemplates } from '../../src/engine/templates/index.ts';
import { shippedCharacteristics } from './shippedCharacteristics.ts';

// Each band against a reference written here the plain way, one current at a time, straight from the
// formulas the families document: IEEE C37.112 / IEC 60255-151 inverse curves, the trip-unit I²t and
// definite-time functions (IEEE 1015 application practice), log-log interpolation of digitised curves
// (common practice). The engine's edges and its batch form may differ from it only by rounding.

type Edges = { min: (amps: number) => number; max: (amps: number) => number };

/** The fastest of some element times, never below `floor`, plus `add` (a composite edge). */
function fastest(times: number[], floor: number, add = 0): number {
  return Math.max(Math.min(Infinity, ...times), floor) + add;
}

/** A digitised curve, log-log interpolated, Infinity below its first point, held beyond its last. */
function interpolated(points: Array<[number, number]>, scale = 1) {
  return (amps: number): number => {
    const current = points.map(([a]) => a * scale);
    if (!(amps >= current[0])) return Infinity;
    if (amps >= current[current.length - 1]) return points[points.length - 1][1];
    let k = 0;
    while (current[k + 1] <= amps) k++;
    const [t0, t1] = [points[k][1], points[k + 1][1]];
    const share = Math.log(amps / current[k]) / Math.log(current[k + 1] / current[k]);
    return Math.exp(Math.log(t0) + share * Math.log(t1 / t0));
  };
}

function relayEdges(relay: Extract<Characteristic, { kind: 'relay' }>): Edges {
  const ratio = relay.ct.primary / relay.ct.secondary;
  const edge = (side: -1 | 1) => (amps: number) => {
    const pickupFactor = 1 + (side * relay.tolerance.pickup) / 100;
    const timeFactor = 1 + (side * relay.tolerance.time) / 100;
    const times: number[] = [];
    const element = relay.timeOvercurrent;
    if (element) {
      const pickup = element.pickup * ratio * pickupFactor;
      if (element.curve === 'definite-time') {
        if (amps >= pickup) times.push((element.delay ?? 0) * timeFactor);
      } else {
        const { a, b, p } = INVERSE_CURVES[element.curve];
        const dial = (element.timeDial ?? element.timeMultiplier ?? 1) * timeFactor;
        // t = dial · (a / (M^p − 1) + b), held from the multiple G_D (IEEE C37.112 eq. 1; IEC 60255-151 eq. 1).
        const curve = (m: number) => dial * (a / Math.expm1(p * Math.log(m)) + b);
        const multiple = Math.min(amps / pickup, element.definiteTimeFrom ?? Infinity);
        if (multiple > 1) times.push(curve(multiple));
      }
    }
    const instantaneous = relay.instantaneous;
    if (instantaneous && amps >= instantaneous.pickup * ratio * pickupFactor) {
      times.push(instantaneous.delay * timeFactor);
    }
    return fastest(times, relay.operatingTime, side < 0 ? 0 : relay.breakerTime);
  };
  return { min: edge(-1), max: edge(1) };
}

function tripUnitEdges(unit: Extract<Characteristic, { kind: 'trip-unit' }>, ground = false): Edges {
  const { sensor, longTime, shortTime, instantaneous, tolerance } = unit;
  const rated = longTime.pickup * sensor;
  const delayed = (
    element: { pickup: number; delay: number; i2t: boolean; i2tThrough: number },
    base: number,
    pickup: number,
    side: -1 | 1,
    amps: number,
  ): number => {
    if (!(amps >= pickup)) return Infinity;
    const delay = side < 0 ? element.delay - tolerance.shortTimeBelow : element.delay + tolerance.shortTimeAbove;
    const through = element.i2tThrough * base;
    // I²t in: the delay at the reference current, rising as 1/I² below it.
    return element.i2t && amps < through ? (delay * through * through) / (amps * amps) : delay;
  };
  const edge = (side: -1 | 1) => (amps: number) => {
    const floor = side < 0 ? unit.openingTime : unit.clearingTime;
    if (ground) {
      const pickup = unit.ground!.pickup * sensor * (1 + (side * tolerance.groundPickup) / 100);
      return fastest([delayed(unit.ground!, sensor, pickup, side, amps)], floor);
    }
    const pickupFactor = 1 + (side * tolerance.pickup) / 100;
    const times: number[] = [];
    const longSeconds =
      longTime.delay * (side < 0 ? 1 - tolerance.longTimeBelow / 100 : 1 + tolerance.longTimeAbove / 100);
    const through = longTime.delayAt * rated;
    if (amps >= rated * pickupFactor) times.push((longSeconds * through * through) / (amps * amps));
    if (shortTime) times.push(delayed(shortTime, rated, shortTime.pickup * rated * pickupFactor, side, amps));
    if (instantaneous && amps >= instantaneous.pickup * sensor * pickupFactor) times.push(floor);
    return fastest(times, floor);
  };
  return { min: edge(-1), max: edge(1) };
}

function thermalMagneticEdges(breaker: Extract<Characteristic, { kind: 'thermal-magnetic' }>): Edges {
  const { rating, thermal, magnetic, openingTime, clearingTime } = breaker;
  const magneticAmps = magnetic.pickupAmps ?? (magnetic.pickup ?? 10) * rating;
  const minimum = interpolated(thermal.minimum, rating);
  const maximum = interpolated(thermal.maximum, rating);
  const edge = (thermalTime: (amps: number) => number, pickup: number, seconds: number) => (amps: number) =>
    fastest([thermalTime(amps), amps >= pickup ? seconds : Infinity], seconds);
  // Past the minimum table's last point the fast edge takes the magnetic trip, if that is higher.
  const minimumEnd = thermal.minimum[thermal.minimum.length - 1][0] * rating;
  return {
    min: edge(minimum, Math.min(magneticAmps * (1 - magnetic.tolerance / 100), minimumEnd), openingTime),
    max: edge(maximum, magneticAmps * (1 + magnetic.tolerance / 100), clearingTime),
  };
}

function fuseEdges(fuse: Extract<Characteristic, { kind: 'fuse' }>): Edges {
  const table = interpolated(fuse.minimumMelting);
  // Past its last point the melting edge is the half-cycle (0.01 s), unless already below it.
  const [lastAmps, lastSeconds] = fuse.minimumMelting[fuse.minimumMelting.length - 1];
  const melting = (amps: number) => (amps > lastAmps ? Math.min(lastSeconds, 0.01) : table(amps));
  const clearing = interpolated(fuse.totalClearing);
  // A fuse never clears before it melts.
  return { min: melting, max: (amps) => Math.max(clearing(amps), melting(amps)) };
}

function referenceEdges(characteristic: Characteristic): Edges {
  switch (characteristic.kind) {
    case 'relay':
      return relayEdges(characteristic);
    case 'trip-unit':
      return tripUnitEdges(characteristic);
    case 'thermal-magnetic':
      return thermalMagneticEdges(characteristic);
    case 'fuse':
      return fuseEdges(characteristic);
  }
}

/** Every curve template, every device of the demo studies, and each relay curve with tolerance and cap. */
function characteristics(): Array<[string, Characteristic]> {
  const found = shippedCharacteristics();
  for (const curve of INVERSE_CURVE_NAMES) {
    const dial = curve.startsWith('ieee') ? { timeDial: 3 } : { timeMultiplier: 0.3, definiteTimeFrom: 20 };
    found.push([
      `relay ${curve}`,
      characteristicSchema.parse({
        kind: 'relay',
        ct: '600:5',
        timeOvercurrent: { curve, pickup: 5, ...dial },
        instantaneous: { pickup: 50 },
        tolerance: { pickup: 5, time: 5 },
      }),
    ]);
  }
  return found;
}

/** Seeded log-spread currents around the band, and each breakpoint with currents just either side. */
function currentsFor(band: Band, seed: number): number[] {
  let state = seed;
  const random = () => (state = (state * 1103515245 + 12345) % 2147483648) / 2147483648;
  const low = band.minAmps / 10;
  const high = (Number.isFinite(band.maxAmps) ? band.maxAmps : band.minAmps * 1e3) * 10;
  const amps = Array.from({ length: 1500 }, () => low * (high / low) ** random());
  for (const breakpoint of band.breakpoints) amps.push(breakpoint * (1 - 1e-6), breakpoint, breakpoint * (1 + 1e-6));
  return amps;
}

/**
 * Whether `time` is the reference's at `amps` up to rounding: within a relative 1e-12 of it, or of its
 * value at a current one part in 10¹⁵ either side (the rounding of the current itself, which is all that
 * matters where the curve is steep, just above a pickup).
 */
function agrees(time: number, reference: (amps: number) => number, amps: number): boolean {
  const near = (value: number) => time === value || Math.abs(time - value) <= 1e-12 * value;
  if (near(reference(amps))) return true;
  const [slower, faster] = [reference(amps * (1 - 1e-15)), reference(amps * (1 + 1e-15))];
  return Number.isFinite(slower) && time <= slower * (1 + 1e-12) && time >= faster * (1 - 1e-12);
}

/** The first current where a band (either edge, single or batch) is not its reference's, or undefined. */
function firstDisagreement(band: Band, reference: Edges, amps: number[]): string | undefined {
  const { minTimes, maxTimes } = evaluateBand(band, Float64Array.from(amps));
  for (let i = 0; i < amps.length; i++) {
    const pairs: Array<[string, number, (amps: number) => number]> = [
      ['minTime', band.minTime(amps[i]), reference.min],
      ['maxTime', band.maxTime(amps[i]), reference.max],
      ['batch minTime', minTimes[i], reference.min],
      ['batch maxTime', maxTimes[i], reference.max],
    ];
    for (const [what, time, edge] of pairs) {
      if (!agrees(time, edge, amps[i])) return `${what} at ${amps[i]} A: ${time} s against ${edge(amps[i])} s`;
    }
  }
  return undefined;
}

describe('bands against a plain reference', () => {
  it('every template, demo device and relay curve gives the reference band up to rounding, single and batch', () => {
    const all = characteristics();
    expect(all.length).toBeGreaterThan(40);
    for (const [name, characteristic] of all) {
      const band = bandOf(characteristic);
      expect(firstDisagreement(band, referenceEdges(characteristic), currentsFor(band, name.length)), name).toBe(
        undefined,
      );
      const ground = groundFaultBandOf(characteristic);
      if (ground && characteristic.kind === 'trip-unit') {
        const reference = tripUnitEdges(characteristic, true);
        expect(firstDisagreement(ground, reference, currentsFor(ground, 3)), `${name}, ground`).toBe(undefined);
      }
    }
  });

  it('the check fails on a band one part in 10¹⁰ off', () => {
    const characteristic = curveTemplates.find((template) => template.characteristic.kind === 'fuse')!.characteristic;
    const band = bandOf(characteristic);
    const off: Band = { ...band, evaluateInto: undefined, minTime: (amps) => band.minTime(amps) * (1 + 1e-10) };
    expect(firstDisagreement(off, referenceEdges(characteristic), currentsFor(band, 1))).toMatch(/^minTime at/);
  });
});
