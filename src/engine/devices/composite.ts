import type { Band } from '../band.ts';
import { areTwins, FLAT, I2T, INVERSE, OTHER, STRIDE, TABLE, twinTimesInto, type PackedEdge } from './packedEdge.ts';
import { expm1 } from './expm1.ts';
import { logarithmsOf } from './logarithms.ts';
import { tableTimesInto, type TableShape } from './pointTable.ts';
/**
 * One element of a device edge (a long-time ramp, a short-time delay, an instantaneous trip…): it
 * operates from `pickup` amps with a non-increasing time. Composite edges are built from these.
 */
export interface EdgeElement {
  /** Current (A) from which the element operates; below it the element's time is `Infinity`. */
  pickup: number;
  /** Time in seconds at `amps ≥ pickup`; non-increasing in current, never NaN. */
  time(amps: number): number;
  /** Currents (A) above `pickup` where the element's own formula changes (e.g. an I²t ramp meeting its flat part). */
  joins: readonly number[];
  /** Times (s) the element is flat at over some range of current (a definite delay, a capped tail). */
  levels: readonly number[];
  /**
   * The current (A) at which the element's curved part falls to `seconds`, or `Infinity` if it never
   * does there. Flat elements have none. Used to find where a composite edge changes element.
   */
  reach?(seconds: number): number;
  /**
   * The element's formula as data, when it is one of the closed forms below; the composite edge then
   * evaluates it inline instead of calling `time` (same result, a fraction of the cost).
   */
  shape?: ElementShape;
  /** What the element is, in the trade's words ('long-time', 'instantaneous', 'thermal'…), where the family names it. */
  label?: string;
}

/**
 * `element` with its name in the trade's words, for what tells which element operated.
 * @example named(definiteElement(6000, 0.05), 'instantaneous')
 */
export function named<E extends EdgeElement>(element: E, label: string): E {
  return Object.assign(element, { label });
}

/**
 * The closed-form element formulas, as data: `flat` (a definite time), `i2t` (`k / I²`, held at `flat`
 * from `flatFrom` amps), `inverse` (see `InverseShape`) and `table` (a point table, log-log interpolated).
 */
export type ElementShape =
  | TableShape
  | InverseShape
  | { kind: 'flat'; seconds: number }
  | { kind: 'i2t'; k: number; flatFrom: number; flat: number };

/**
 * An inverse-time element: `dial · (a / (M^p − 1) + b)` with `M = I · inversePickup` (A⁻¹), `Infinity`
 * for `M ≤ 1`, held at `capTime` (s) from the multiple `cap`. For an exponent other than 1 or 2,
 * `M^p − 1` is taken from the power of the multiple of another pickup, `R = I · referenceInverse`:
 * `M^p − 1 = (R^p − 1) · K + (K − 1)` with `K = (inversePickup / referenceInverse)^p`, so the two edges
 * of a band with a pickup tolerance share one logarithm and one exponential per current.
 * `referenceInverse` is the lowest pickup's (`R ≥ M`, so `R^p − 1` is never small where `M^p − 1` is
 * not), or `inversePickup` itself, when the formula is the plain `expm1(p · ln M)`. Within a few ulp above
 * the pickup, where rounding may leave `M^p − 1` at or below zero, the time is `Infinity`.
 */
export interface InverseShape {
  kind: 'inverse';
  inversePickup: number;
  dial: number;
  a: number;
  b: number;
  p: number;
  cap: number;
  capTime: number;
  referenceInverse: number;
}

/**
 * The time function of an inverse element (see `InverseShape`): the formula a composite edge computes inline.
 * @example inverseShapeTime({ kind: 'inverse', inversePickup: 1 / 600, dial: 2, a: 19.61, b: 0.491, p: 2,
 *   cap: Infinity, capTime: 0.982, referenceInverse: 1 / 600 })(6000) // 1.37816 s
 */
export function inverseShapeTime(shape: InverseShape): (amps: number) => number {
  const { inversePickup, dial, a, b, p, cap, capTime, referenceInverse } = shape;
  const [scale, scaleMinusOne] = powerScale(shape);
  return (amps) => {
    const m = amps * inversePickup;
    if (m >= cap) return capTime;
    if (!(m > 1)) return Infinity;
    const q =
      p === 2 ? m * m - 1 : p === 1 ? m - 1 : expm1(p * Math.log(amps * referenceInverse)) * scale + scaleMinusOne;
    return q > 0 ? dial * (a / q + b) : Infinity;
  };
}

/** `K` and `K − 1` of an inverse shape (see `InverseShape`), `K − 1` without cancellation. */
function powerScale({ inversePickup, referenceInverse, p }: InverseShape): [number, number] {
  if (inversePickup === referenceInverse) return [1, 0];
  const exponent = p * Math.log(inversePickup / referenceInverse);
  return [Math.exp(exponent), Math.expm1(exponent)];
}

/** A composite edge: its time function and the currents where it changes formula. */
export interface CompositeEdge {
  time(amps: number): number;
  /**
   * `out[i] = time(amps[i])` for every `i`, the same doubles, one element at a time over the whole array.
   * `logs[i]` holds `Math.log(amps[i])` (`logarithmsOf`), read by table elements, so two edges of one band
   * take each logarithm once.
   */
  timesInto(amps: Float64Array, out: Float64Array, logs: Float64Array): void;
  /** Whether `timesInto` reads `logs` (the edge has a table element); otherwise any array will do. */
  tabulated: boolean;
  /** The elements as data, for evaluating two edges together (`twinTimesInto`). */
  packed: PackedEdge;
  /** Pickups, joins and element crossings, ascending and unique (A). */
  breakpoints: number[];
  /** Lowest current (A) at which the edge is finite. */
  minAmps: number;
  /** What the edge is made of: its elements, its floor and its added time, as given to `compositeEdge`. */
  parts: EdgeParts;
}

/**
 * An edge as the elements it is the fastest of: `time(I) = max(floor, min over elements of t(I)) + add`.
 * A current that changes with time needs them one by one, since each element runs on its own.
 */
export interface EdgeParts {
  elements: readonly EdgeElement[];
  /** Seconds the edge is never faster than. */
  floor: number;
  /** Seconds added to every time (a relay's breaker interrupting time). */
  add: number;
}

/**
 * Combines elements into one edge: at each current the device operates on the fastest element
 * (IEEE C37.112 definite-time practice "composite"), never faster than `floor` seconds, and `add` seconds are added
 * (the breaker interrupting time of a relay's clearing edge). Non-increasing if every element is.
 *
 * @example compositeEdge([definiteElement(600, 0.5), definiteElement(3000, 0.02)], 0.016, 0.083).time(4000) // 0.103 s
 */
export function compositeEdge(elements: readonly EdgeElement[], floor = 0, add = 0): CompositeEdge {
  const count = elements.length;
  // Flat elements first: once one at or below the floor has picked up, no other can be faster,
  // so the curved ones (a power or logarithm each) are skipped at high current.
  const ordered = [...elements].sort((x, y) => Number(x.reach !== undefined) - Number(y.reach !== undefined));
  const pickups = Float64Array.from(ordered, (element) => element.pickup);
  const { kinds, params, tables, others } = packed(ordered);
  // One function for every composite edge, with the formulas inline: the callers' call sites see a
  // single function, and no element closure is called except for tables.
  const time = (amps: number): number => {
    let fastest = Infinity;
    for (let i = 0; i < count && fastest > floor; i++) {
      if (!(amps >= pickups[i])) continue;
      const at = i * STRIDE;
      let t: number;
      switch (kinds[i]) {
        case FLAT:
          t = params[at];
          break;
        case I2T:
          t = amps < params[at + 1] ? params[at] / (amps * amps) : params[at + 2];
          break;
        case INVERSE: {
          const m = amps * params[at];
          const p = params[at + 4];
          if (m >= params[at + 5]) t = params[at + 6];
          else if (!(m > 1)) t = Infinity;
          else {
            const q =
              p === 2
                ? m * m - 1
                : p === 1
                  ? m - 1
                  : expm1(p * Math.log(amps * params[at + 7])) * params[at + 8] + params[at + 9];
            t = q > 0 ? params[at + 1] * (params[at + 2] / q + params[at + 3]) : Infinity;
          }
          break;
        }
        default:
          t = others[i]!(amps);
      }
      if (t < fastest) fastest = t;
    }
    return (fastest > floor ? fastest : floor) + add;
  };
  // The same arithmetic as `time`, column by column: each element runs once over the whole array
  // where the fastest so far is still above the floor (the early exit of `time`), so the minimum of
  // the same terms is taken and every result is the same double.
  const bounds = Float64Array.of(floor, add);
  // The last element's pass also applies the floor and the added time, saving a pass, when it is a
  // curved one (as it is in every family: flat elements come first); otherwise a pass of its own does.
  const finishedBy = count > 0 && kinds[count - 1] !== FLAT && kinds[count - 1] !== OTHER ? count - 1 : -1;
  let flats = 0;
  while (flats < count && kinds[flats] === FLAT) flats++;
  const leading = Float64Array.of(
    flats > 0 ? pickups[0] : NaN,
    flats > 0 ? params[0] : Infinity,
    flats > 1 ? pickups[1] : NaN,
    flats > 1 ? params[STRIDE] : Infinity,
  );
  const timesInto = (amps: Float64Array, out: Float64Array, logs: Float64Array): void => {
    const n = amps.length;
    // Read from a Float64Array so the loops see doubles, never a small integer in some closures.
    const lowest = bounds[0];
    const added = bounds[1];
    // One or two leading flat elements in one pass that also sets every current: the faster of those
    // picked up. Taking one the early exit of `time` would skip changes nothing: the floor wins there.
    if (flats === 1) {
      const pickup = pickups[0];
      const seconds = params[0];
      for (let i = 0; i < n; i++) out[i] = amps[i] >= pickup ? seconds : Infinity;
    } else if (flats === 2) {
      const pickupA = pickups[0];
      const secondsA = params[0];
      const pickupB = pickups[1];
      const secondsB = params[STRIDE];
      for (let i = 0; i < n; i++) {
        const current = amps[i];
        const a = current >= pickupA ? secondsA : Infinity;
        out[i] = current >= pickupB && secondsB < a ? secondsB : a;
      }
    } else out.fill(Infinity, 0, n);
    for (let e = flats > 2 ? 0 : flats; e < count; e++) {
      const pickup = pickups[e];
      const at = e * STRIDE;
      switch (kinds[e]) {
        case FLAT: {
          const seconds = params[at];
          for (let i = 0; i < n; i++) {
            if (out[i] > lowest && amps[i] >= pickup && seconds < out[i]) out[i] = seconds;
          }
          break;
        }
        case I2T: {
          const k = params[at];
          const flatFrom = params[at + 1];
          const flat = params[at + 2];
          const finish = e === finishedBy;
          for (let i = 0; i < n; i++) {
            const a = amps[i];
            let fastest = out[i];
            if (fastest > lowest && a >= pickup) {
              const t = a < flatFrom ? k / (a * a) : flat;
              if (t < fastest) fastest = t;
            }
            out[i] = finish ? (fastest > lowest ? fastest : lowest) + added : fastest;
          }
          break;
        }
        case INVERSE:
          inverseTimesInto(params, at, pickup, amps, out, bounds, e === finishedBy);
          break;
        case TABLE:
          // A table is Infinity below its first current, its pickup, so it needs no pickup test here.
          tableTimesInto(tables[e]!, amps, logs, out, bounds, e === finishedBy);
          break;
        default: {
          const time = others[e]!;
          for (let i = 0; i < n; i++) {
            if (!(out[i] > lowest && amps[i] >= pickup)) continue;
            const t = time(amps[i]);
            if (t < out[i]) out[i] = t;
          }
        }
      }
    }
    if (finishedBy >= 0) return;
    for (let i = 0; i < n; i++) {
      const fastest = out[i];
      out[i] = (fastest > lowest ? fastest : lowest) + added;
    }
  };
  // Every flat level another element (or the floor) sits at is where a curved element may hand over.
  const levels = [floor, ...elements.flatMap((element) => element.levels)];
  const points: number[] = [];
  for (const element of elements) {
    points.push(element.pickup, ...element.joins);
    if (!element.reach) continue;
    for (const level of levels) {
      // A level under the floor is hidden by it (an instantaneous trip's opening time under its clearing).
      if (level < floor) continue;
      // Keep a crossing only where the edge really sits at that level (the elements hand over there).
      const amps = element.reach(level);
      const at = Math.max(level, floor) + add;
      if (Number.isFinite(amps) && Math.abs(time(amps) - at) <= 1e-9 * at) points.push(amps);
    }
  }
  return {
    time,
    timesInto,
    tabulated: kinds.includes(TABLE),
    packed: { count, kinds, params, pickups, tables, flats, finishedBy, bounds, leading },
    breakpoints: uniqueAscending(points),
    minAmps: Math.min(Infinity, ...pickups),
    parts: { elements, floor, add },
  };
}

/**
 * An inverse element's pass of `timesInto`, with its constants read once; the formula of `time`.
 * `bounds` holds the edge's floor and added time; with `finish` they are applied too.
 */
function inverseTimesInto(
  params: Float64Array,
  at: number,
  pickup: number,
  amps: Float64Array,
  out: Float64Array,
  bounds: Float64Array,
  finish: boolean,
): void {
  const floor = bounds[0];
  const added = bounds[1];
  const inversePickup = params[at];
  const dial = params[at + 1];
  const a = params[at + 2];
  const b = params[at + 3];
  const p = params[at + 4];
  const cap = params[at + 5];
  const capTime = params[at + 6];
  const referenceInverse = params[at + 7];
  const scale = params[at + 8];
  const scaleMinusOne = params[at + 9];
  const n = amps.length;
  for (let i = 0; i < n; i++) {
    const current = amps[i];
    let fastest = out[i];
    if (fastest > floor && current >= pickup) {
      const m = current * inversePickup;
      let t: number;
      if (m >= cap) t = capTime;
      else if (!(m > 1)) t = Infinity;
      else {
        let q: number;
        if (p === 2) q = m * m - 1;
        else if (p === 1) q = m - 1;
        else {
          q = expm1(p * Math.log(current * referenceInverse)) * scale + scaleMinusOne;
        }
        t = q > 0 ? dial * (a / q + b) : Infinity;
      }
      if (t < fastest) fastest = t;
    }
    out[i] = finish ? (fastest > floor ? fastest : floor) + added : fastest;
  }
}

/**
 * Elements as kind codes and packed parameters; tables keep their shape for `timesInto` (and their
 * `time` for `time`), elements without a shape keep their `time`.
 */
function packed(elements: readonly EdgeElement[]) {
  const kinds = new Int8Array(elements.length);
  const params = new Float64Array(elements.length * STRIDE);
  const tables: (TableShape | undefined)[] = [];
  const others: (((amps: number) => number) | undefined)[] = [];
  elements.forEach((element, i) => {
    const shape = element.shape;
    const at = i * STRIDE;
    tables.push(undefined);
    others.push(undefined);
    if (shape?.kind === 'flat') {
      kinds[i] = FLAT;
      params[at] = shape.seconds;
    } else if (shape?.kind === 'i2t') {
      kinds[i] = I2T;
      params.set([shape.k, shape.flatFrom, shape.flat], at);
    } else if (shape?.kind === 'inverse') {
      kinds[i] = INVERSE;
      const { inversePickup, dial, a, b, p, cap, capTime, referenceInverse } = shape;
      params.set([inversePickup, dial, a, b, p, cap, capTime, referenceInverse, ...powerScale(shape)], at);
    } else if (shape?.kind === 'table') {
      // `time` calls the table's own closure, as before; `timesInto` walks the table with a cursor.
      kinds[i] = TABLE;
      tables[i] = shape;
      others[i] = element.time;
    } else {
      kinds[i] = OTHER;
      others[i] = element.time;
    }
  });
  return { kinds, params, tables, others };
}

/**
 * A flat element: `seconds` from `pickup` amps on (a definite-time or instantaneous trip).
 * @example definiteElement(3000, 0.05).time(4000) // 0.05
 */
export function definiteElement(pickup: number, seconds: number): EdgeElement {
  return { pickup, time: () => seconds, joins: [], levels: [seconds], shape: { kind: 'flat', seconds } };
}

/**
 * An I²t ramp `t = seconds · (throughAmps / I)²` from `pickup`, held flat at `seconds` above
 * `flatFrom` amps (`Infinity` for a ramp that never flattens, like a long-time delay).
 *
 * @example i2tElement(720, 10, 4800).time(2400) // 40 s (hand-worked trip-unit case long-time, tolerance-free)
 */
export function i2tElement(pickup: number, seconds: number, throughAmps: number, flatFrom = Infinity): EdgeElement {
  const k = seconds * throughAmps * throughAmps;
  const flat = Number.isFinite(flatFrom) ? k / (flatFrom * flatFrom) : 0;
  return {
    pickup,
    time: (amps) => (amps < flatFrom ? k / (amps * amps) : flat),
    shape: { kind: 'i2t', k, flatFrom, flat },
    joins: Number.isFinite(flatFrom) && flatFrom > pickup ? [flatFrom] : [],
    levels: Number.isFinite(flatFrom) ? [flat] : [],
    reach: (level) => {
      const amps = Math.sqrt(k / level);
      return amps > pickup && amps < flatFrom * (1 - 1e-9) ? amps : Infinity;
    },
  };
}

/**
 * Sorts currents, keeping only distinct finite positive values (closer than 1e-10 relative counts as one).
 * @example uniqueAscending([600, Infinity, 60, 600]) // [60, 600]
 */
export function uniqueAscending(values: readonly number[]): number[] {
  const sorted = values.filter((v) => Number.isFinite(v) && v > 0).sort((a, b) => a - b);
  // Values within 1e-10 of each other are one breakpoint reached by two routes (rounding apart).
  return sorted.filter((v, i) => i === 0 || v > sorted[i - 1] * (1 + 1e-10));
}

/**
 * A band from its two composite edges: `minTime` the fast edge, `maxTime` the slow one, breakpoints
 * of both, defined from the fast edge's lowest pickup upward with no upper limit.
 *
 * @example bandOfEdges(compositeEdge(low), compositeEdge(high), Infinity, [])
 */
export function bandOfEdges(
  low: CompositeEdge,
  high: CompositeEdge,
  currentLimitingFrom: number,
  diagnostics: string[],
): Band {
  // Two edges built alike (every family's) are evaluated together, a pass per element for both.
  const twins = areTwins(low.packed, high.packed);
  const tabulated = low.tabulated || high.tabulated;
  return {
    minTime: low.time,
    maxTime: high.time,
    evaluateInto: (amps, minTimes, maxTimes) => {
      if (twins && minTimes && maxTimes) return twinTimesInto(low.packed, high.packed, amps, minTimes, maxTimes);
      // Without a table element no edge reads `logs`, and any array will do.
      const logs = tabulated ? logarithmsOf(amps, 1) : amps;
      if (minTimes) low.timesInto(amps, minTimes, logs);
      if (maxTimes) high.timesInto(amps, maxTimes, logs);
    },
    breakpoints: Float64Array.from(uniqueAscending([...low.breakpoints, ...high.breakpoints])),
    minAmps: low.minAmps,
    maxAmps: Infinity,
    currentLimitingFrom,
    diagnostics,
    parts: { min: low.parts, max: high.parts },
  };
}
