import type { Characteristic } from './devices/characteristic.ts';
import type { EdgeElement, EdgeParts } from './devices/composite.ts';
import { fuseBand } from './devices/fuse.ts';
import { relayBand } from './devices/relay.ts';
import { thermalMagneticBand } from './devices/thermalMagnetic.ts';
import { groundBandOf, tripUnitBand } from './devices/tripUnit.ts';

/**
 * A band: what one protective device does on a TCC sheet (DEVELOPERS.md, names).
 *
 * For a current `amps` (RMS symmetrical, at the device's own voltage):
 * - `minTime(amps)` — the earliest time, in seconds, at which the device may operate
 *   (fastest tolerance edge, minimum melting for a fuse); `Infinity` where it never operates;
 * - `maxTime(amps)` — the latest time by which it will have cleared (slowest tolerance edge plus
 *   interrupting time, total clearing for a fuse); `Infinity` where it may never clear.
 *
 * Both edges are non-increasing in current and `minTime(I) ≤ maxTime(I)` everywhere. Neither ever
 * returns NaN. Beyond `maxAmps` (e.g. a fuse's last tabulated point) both edges hold their value at
 * `maxAmps`; the band is drawn only up to `maxAmps`.
 */
export interface Band {
  /** Earliest operating time in seconds at `amps`; `Infinity` where the device never operates. */
  minTime(amps: number): number;
  /** Latest clearing time in seconds at `amps`; `Infinity` where the device may never clear. */
  maxTime(amps: number): number;
  /**
   * Both edges at many currents at once, when the family has a batch form: sets `minTimes[i]` and
   * `maxTimes[i]` to exactly the doubles `minTime(amps[i])` and `maxTime(amps[i])` return, for currents
   * in any order. An edge given `undefined` is not asked for (the overlap finder compares one edge of
   * each band) and need not be evaluated. Optional; `evaluateBand` calls it when present and the two
   * edges otherwise.
   */
  evaluateInto?(amps: Float64Array, minTimes: Float64Array | undefined, maxTimes: Float64Array | undefined): void;
  /**
   * Currents (A, ascending, no duplicates) where either edge changes formula: pickups with their
   * tolerance edges, segment joins, tabulated points. Between two breakpoints both edges are smooth.
   */
  breakpoints: Float64Array;
  /** Lowest current (A) at which `minTime` is finite: the device cannot operate below it. */
  minAmps: number;
  /** Highest current (A) the band is defined to (interrupting rating, last point); `Infinity` if open. */
  maxAmps: number;
  /**
   * Current (A) from which the device is current-limiting (clears within the first half-cycle and
   * lets through less than the prospective current), or `Infinity`. Curves prove nothing above it.
   */
  currentLimitingFrom: number;
  /** Problems found while building the band that do not stop it (e.g. a setting outside its usual range). */
  diagnostics: string[];
  /**
   * Each edge as the elements it is the fastest of (long-time, short-time, instantaneous…), where the
   * family builds it so: a current that changes with time reads them one by one, since each element
   * runs on its own (`edgeTimeOnCurrent`). A scaled band has its band's, scaled; a band combined from
   * others (`fastestOf`) has theirs where they share floor and added time. Absent for a band of one curve
   * (a fuse), which is read as one element.
   */
  parts?: { min: EdgeParts; max: EdgeParts };
}

/** One half-cycle, rounded as practitioners draw it: below this a TCC proves nothing (IEEE 242; the half-cycle limit, common practice). */
export const HALF_CYCLE_SECONDS = 0.01;

/**
 * Evaluates a band at many currents into preallocated arrays; the fast path for drawing and P1.
 * @example evaluateBand(band, new Float64Array([100, 1000]))
 */
export function evaluateBand(
  band: Band,
  amps: Float64Array,
  minTimes = new Float64Array(amps.length),
  maxTimes = new Float64Array(amps.length),
): { minTimes: Float64Array; maxTimes: Float64Array } {
  if (band.evaluateInto) {
    band.evaluateInto(amps, minTimes, maxTimes);
    return { minTimes, maxTimes };
  }
  const { minTime, maxTime } = band;
  for (let i = 0; i < amps.length; i++) {
    minTimes[i] = minTime(amps[i]);
    maxTimes[i] = maxTime(amps[i]);
  }
  return { minTimes, maxTimes };
}

/**
 * A band scaled to another voltage base: a current that flows at `fromVolts` is drawn at
 * `I · fromVolts / toVolts` (voltage-ratio reflection, IEEE 242), optionally multiplied by a fault-type factor
 * (IEEE C37.91 / IEEE C57.109 delta–wye shift factors, e.g. 1/0.866 = 1.155 for the primary device on a Δ–Yg secondary L-L fault).
 *
 * @example scaleBand(feederBand, 480 / 12470) // a 480 V feeder drawn on a 12.47 kV sheet
 */
export function scaleBand(band: Band, currentFactor: number): Band {
  if (currentFactor === 1) return band;
  // One scaled band per band and factor: bands are read-only, and a sheet drawn again after an edit
  // meets the same objects for the devices the edit left alone (so their drawings can be kept).
  let byFactor = scaledBands.get(band);
  if (!byFactor) scaledBands.set(band, (byFactor = new Map()));
  let scaled = byFactor.get(currentFactor);
  if (!scaled) byFactor.set(currentFactor, (scaled = scaledBandOf(band, currentFactor)));
  return scaled;
}

const scaledBands = new WeakMap<Band, Map<number, Band>>();

function scaledBandOf(band: Band, currentFactor: number): Band {
  const { minTime, maxTime, evaluateInto } = band;
  const inverse = 1 / currentFactor;
  // Scratch for the currents at the band's own base, kept with the scaled band and grown when needed.
  let ownAmps = new Float64Array(0);
  return {
    minTime: (amps) => minTime(amps * inverse),
    maxTime: (amps) => maxTime(amps * inverse),
    evaluateInto:
      evaluateInto &&
      ((amps, minTimes, maxTimes) => {
        const n = amps.length;
        if (ownAmps.length < n) ownAmps = new Float64Array(n);
        const scaled = ownAmps.length === n ? ownAmps : ownAmps.subarray(0, n);
        for (let i = 0; i < n; i++) scaled[i] = amps[i] * inverse;
        evaluateInto(scaled, minTimes, maxTimes);
      }),
    breakpoints: band.breakpoints.map((amps) => amps * currentFactor),
    minAmps: band.minAmps * currentFactor,
    maxAmps: band.maxAmps * currentFactor,
    currentLimitingFrom: band.currentLimitingFrom * currentFactor,
    diagnostics: band.diagnostics,
    parts: band.parts && new ScaledParts(band.parts, currentFactor),
  };
}

/** A band's parts drawn at `I · factor`, each edge scaled when first asked for (by a decaying current), not for every band drawn. */
class ScaledParts {
  #parts: NonNullable<Band['parts']>;
  #factor: number;
  #min?: EdgeParts;
  #max?: EdgeParts;
  constructor(parts: NonNullable<Band['parts']>, currentFactor: number) {
    this.#parts = parts;
    this.#factor = currentFactor;
  }
  get min(): EdgeParts {
    return (this.#min ??= scaledParts(this.#parts.min, this.#factor));
  }
  get max(): EdgeParts {
    return (this.#max ??= scaledParts(this.#parts.max, this.#factor));
  }
}

// Accepts an edge's parts and a current factor; the same elements drawn at `I · factor`.
function scaledParts(parts: EdgeParts, currentFactor: number): EdgeParts {
  const inverse = 1 / currentFactor;
  const elements = parts.elements.map((element): EdgeElement => ({
    pickup: element.pickup * currentFactor,
    time: (amps) => element.time(amps * inverse),
    joins: element.joins.map((amps) => amps * currentFactor),
    levels: element.levels,
    // Kept so that curved elements are still followed after flat ones.
    reach: element.reach && ((seconds: number) => element.reach!(seconds) * currentFactor),
    label: element.label,
  }));
  return { elements, floor: parts.floor, add: parts.add };
}

/**
 * The band of a device characteristic, dispatching on its `kind` to the family's band function
 * (`relayBand`, `tripUnitBand`, `thermalMagneticBand`, `fuseBand` in `src/engine/devices/`).
 * Amps are at the device's own voltage (relays: primary amps, through the CT ratio).
 *
 * @example bandOf(study.devices[0].characteristic).maxTime(4000)
 */
export function bandOf(characteristic: Characteristic): Band {
  switch (characteristic.kind) {
    case 'relay':
      return relayBand(characteristic);
    case 'trip-unit':
      return tripUnitBand(characteristic);
    case 'thermal-magnetic':
      return thermalMagneticBand(characteristic);
    case 'fuse':
      return fuseBand(characteristic);
  }
}

/**
 * The band of a device's ground-fault element, for a trip unit that has one; `undefined` otherwise.
 * Amps are ground (residual) current at the device's own voltage.
 *
 * @example groundFaultBandOf(main.characteristic)?.minTime(1500) // 0.4 s
 */
export function groundFaultBandOf(characteristic: Characteristic): Band | undefined {
  return characteristic.kind === 'trip-unit' ? groundBandOf(characteristic) : undefined;
}

/**
 * The band of a device whose elements all see the same current, operating on the fastest: each edge
 * is the smaller of the bands' edges (a device with a phase and a ground-fault element, for a ground
 * fault, which its phase element sees too).
 *
 * @example fastestOf([bandOf(c), groundFaultBandOf(c)!])
 */
export function fastestOf(bands: Band[]): Band {
  if (bands.length === 1) return bands[0];
  const minTimes = bands.map((band) => band.minTime);
  const maxTimes = bands.map((band) => band.maxTime);
  const smallest = (edges: ((amps: number) => number)[], amps: number) => {
    let time = Infinity;
    for (const edge of edges) time = Math.min(time, edge(amps));
    return time;
  };
  const breakpoints = [...new Set(bands.flatMap((band) => [...band.breakpoints]))].sort((a, b) => a - b);
  // The batch form, where every band has one: the first band's edges, lowered to each other band's
  // (the same doubles as `smallest`, a minimum taken in any order). Scratch kept with the band.
  let spareMin = new Float64Array(0);
  let spareMax = new Float64Array(0);
  const evaluateInto = (amps: Float64Array, minOut?: Float64Array, maxOut?: Float64Array) => {
    const n = amps.length;
    if (spareMin.length < n) [spareMin, spareMax] = [new Float64Array(n), new Float64Array(n)];
    bands[0].evaluateInto!(amps, minOut, maxOut);
    for (let b = 1; b < bands.length; b++) {
      bands[b].evaluateInto!(amps, minOut && spareMin, maxOut && spareMax);
      if (minOut) for (let i = 0; i < n; i++) if (spareMin[i] < minOut[i]) minOut[i] = spareMin[i];
      if (maxOut) for (let i = 0; i < n; i++) if (spareMax[i] < maxOut[i]) maxOut[i] = spareMax[i];
    }
  };
  return {
    minTime: (amps) => smallest(minTimes, amps),
    maxTime: (amps) => smallest(maxTimes, amps),
    evaluateInto: bands.every((band) => band.evaluateInto) ? evaluateInto : undefined,
    breakpoints: Float64Array.from(breakpoints),
    minAmps: Math.min(...bands.map((band) => band.minAmps)),
    maxAmps: Math.max(...bands.map((band) => band.maxAmps)),
    currentLimitingFrom: Math.min(...bands.map((band) => band.currentLimitingFrom)),
    diagnostics: bands.flatMap((band) => band.diagnostics),
    parts: fastestParts(bands),
  };
}

// Accepts bands seeing one current; their elements as one device's, where every band has them on the
// same floor and added time (so the fastest of all is the fastest element); otherwise none.
function fastestParts(bands: Band[]): Band['parts'] {
  const edge = (side: 'min' | 'max'): EdgeParts | undefined => {
    const all = bands.map((band) => band.parts?.[side]);
    const [first] = all;
    if (!first || all.some((parts) => !parts || parts.floor !== first.floor || parts.add !== first.add)) return;
    return { elements: all.flatMap((parts) => parts!.elements), floor: first.floor, add: first.add };
  };
  const min = edge('min');
  const max = edge('max');
  return min && max ? { min, max } : undefined;
}
