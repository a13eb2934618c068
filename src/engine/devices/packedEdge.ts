import { expm1 } from './expm1.ts';
import { exponential } from './exponential.ts';
import { logarithmsOf } from './logarithms.ts';
import { segmentAt, type TableShape } from './pointTable.ts';

/** Kind codes of a packed element (see `PackedEdge`). */
export const FLAT = 0;
export const I2T = 1;
export const INVERSE = 2;
export const OTHER = 3;
export const TABLE = 4;
/** Parameters per element in `PackedEdge.params`. */
export const STRIDE = 10;

/**
 * A composite edge's elements as data for its batch form: kind codes and, `STRIDE` apart, parameters
 * (flat: seconds; I²t: k, flatFrom, flat; inverse: inversePickup, dial, a, b, p, cap, capTime,
 * referenceInverse, K, K − 1), in evaluation order: `flats` flat elements first, the one at
 * `finishedBy` (or none, -1) applying `bounds` (floor, added time) in its pass.
 */
export interface PackedEdge {
  count: number;
  kinds: Int8Array;
  params: Float64Array;
  pickups: Float64Array;
  tables: readonly (TableShape | undefined)[];
  flats: number;
  finishedBy: number;
  bounds: Float64Array;
  /** The first two flat elements' pickups and seconds, pickup NaN (never reached) where there is none. */
  leading: Float64Array;
}

/**
 * Whether two edges can be evaluated together by `twinTimesInto`: the same kinds of element in the
 * same order, none without a formula, at most two flat elements (which lead) and a curved one last
 * (a relay's, a trip unit's or a breaker's two tolerance edges).
 */
export function areTwins(low: PackedEdge, high: PackedEdge): boolean {
  if (low.count !== high.count || low.count === 0 || low.flats > 2 || low.finishedBy !== low.count - 1) return false;
  for (let e = 0; e < low.count; e++) {
    if (low.kinds[e] !== high.kinds[e] || low.kinds[e] === OTHER) return false;
  }
  return true;
}

/**
 * Both edges of a band at every current, element by element, each pass reading a current once for
 * both edges: the arithmetic of each edge's `time`, so the same doubles. An inverse element takes its
 * power once for both edges when they take it from the same pickup; two tables share the logarithm.
 */
export function twinTimesInto(
  low: PackedEdge,
  high: PackedEdge,
  amps: Float64Array,
  minTimes: Float64Array,
  maxTimes: Float64Array,
): void {
  // The first curved element's pass starts each current from the leading flat elements (`seeded`),
  // the others from the times so far.
  for (let e = low.flats; e < low.count; e++) {
    const finish = e === low.finishedBy;
    const seeded = e === low.flats;
    switch (low.kinds[e]) {
      case I2T: {
        // Two I²t elements in a row (a trip unit's short-time and long-time ramps) share one pass.
        const next = e + 1 < low.count && low.kinds[e + 1] === I2T ? e + 1 : -1;
        i2tTwinInto(low, high, e, next, amps, minTimes, maxTimes, finish || next === low.finishedBy, seeded);
        if (next > 0) e = next;
        break;
      }
      case INVERSE:
        inverseTwinInto(low, high, e, amps, minTimes, maxTimes, finish, seeded);
        break;
      case TABLE:
        tableTwinInto(low, high, e, amps, minTimes, maxTimes, finish, seeded);
    }
  }
}

/**
 * An I²t element's pass for both edges, `k / I²` from the pickup and flat from `flatFrom`, then the
 * element at `next` (another I²t element, or none for -1) in the same pass.
 */
function i2tTwinInto(
  low: PackedEdge,
  high: PackedEdge,
  e: number,
  next: number,
  amps: Float64Array,
  minTimes: Float64Array,
  maxTimes: Float64Array,
  finish: boolean,
  seeded: boolean,
): void {
  const at = e * STRIDE;
  const lowFloor = low.bounds[0];
  // Not finishing, the clamp is -Infinity and nothing is added (x + 0 is x for every time): no branch.
  const lowClamp = finish ? lowFloor : -Infinity;
  const lowAdded = finish ? low.bounds[1] : 0;
  const highFloor = high.bounds[0];
  const highClamp = finish ? highFloor : -Infinity;
  const highAdded = finish ? high.bounds[1] : 0;
  const lowPickup = low.pickups[e];
  const lowK = low.params[at];
  const lowFlatFrom = low.params[at + 1];
  const lowFlat = low.params[at + 2];
  const highPickup = high.pickups[e];
  const highK = high.params[at];
  const highFlatFrom = high.params[at + 1];
  const highFlat = high.params[at + 2];
  // The next element's constants; a NaN pickup, never reached, where there is none.
  const then = next < 0 ? at : next * STRIDE;
  const lowPickup2 = next < 0 ? NaN : low.pickups[next];
  const lowK2 = low.params[then];
  const lowFlatFrom2 = low.params[then + 1];
  const lowFlat2 = low.params[then + 2];
  const highPickup2 = next < 0 ? NaN : high.pickups[next];
  const highK2 = high.params[then];
  const highFlatFrom2 = high.params[then + 1];
  const highFlat2 = high.params[then + 2];
  // Read once: whether each current starts from the leading flat elements, and those elements.
  const fromFlats = seeded === true;
  const lowPickupA = low.leading[0];
  const lowSecondsA = low.leading[1];
  const lowPickupB = low.leading[2];
  const lowSecondsB = low.leading[3];
  const highPickupA = high.leading[0];
  const highSecondsA = high.leading[1];
  const highPickupB = high.leading[2];
  const highSecondsB = high.leading[3];
  for (let i = 0, n = amps.length; i < n; i++) {
    const current = amps[i];
    let lowest: number;
    let highest: number;
    if (fromFlats) {
      lowest = current >= lowPickupA ? lowSecondsA : Infinity;
      if (current >= lowPickupB && lowSecondsB < lowest) lowest = lowSecondsB;
      highest = current >= highPickupA ? highSecondsA : Infinity;
      if (current >= highPickupB && highSecondsB < highest) highest = highSecondsB;
    } else {
      lowest = minTimes[i];
      highest = maxTimes[i];
    }
    if (lowest > lowFloor && current >= lowPickup) {
      const t = current < lowFlatFrom ? lowK / (current * current) : lowFlat;
      if (t < lowest) lowest = t;
    }
    if (highest > highFloor && current >= highPickup) {
      const t = current < highFlatFrom ? highK / (current * current) : highFlat;
      if (t < highest) highest = t;
    }
    if (lowest > lowFloor && current >= lowPickup2) {
      const t = current < lowFlatFrom2 ? lowK2 / (current * current) : lowFlat2;
      if (t < lowest) lowest = t;
    }
    if (highest > highFloor && current >= highPickup2) {
      const t = current < highFlatFrom2 ? highK2 / (current * current) : highFlat2;
      if (t < highest) highest = t;
    }
    minTimes[i] = (lowest > lowClamp ? lowest : lowClamp) + lowAdded;
    maxTimes[i] = (highest > highClamp ? highest : highClamp) + highAdded;
  }
}

/**
 * An inverse element's pass for both edges (`InverseShape`): where both take their power `R^p − 1`
 * from the same pickup and exponent, it is taken once per current.
 */
function inverseTwinInto(
  low: PackedEdge,
  high: PackedEdge,
  e: number,
  amps: Float64Array,
  minTimes: Float64Array,
  maxTimes: Float64Array,
  finish: boolean,
  seeded: boolean,
): void {
  const at = e * STRIDE;
  const lowFloor = low.bounds[0];
  // Not finishing, the clamp is -Infinity and nothing is added (x + 0 is x for every time): no branch.
  const lowClamp = finish ? lowFloor : -Infinity;
  const lowAdded = finish ? low.bounds[1] : 0;
  const lowPickup = low.pickups[e];
  const lowInverse = low.params[at];
  const lowDial = low.params[at + 1];
  const lowA = low.params[at + 2];
  const lowB = low.params[at + 3];
  const lowP = low.params[at + 4];
  const lowCap = low.params[at + 5];
  const lowCapTime = low.params[at + 6];
  const lowReference = low.params[at + 7];
  const lowScale = low.params[at + 8];
  const lowScaleMinusOne = low.params[at + 9];
  const highFloor = high.bounds[0];
  const highClamp = finish ? highFloor : -Infinity;
  const highAdded = finish ? high.bounds[1] : 0;
  const highPickup = high.pickups[e];
  const highInverse = high.params[at];
  const highDial = high.params[at + 1];
  const highA = high.params[at + 2];
  const highB = high.params[at + 3];
  const highP = high.params[at + 4];
  const highCap = high.params[at + 5];
  const highCapTime = high.params[at + 6];
  const highReference = high.params[at + 7];
  const highScale = high.params[at + 8];
  const highScaleMinusOne = high.params[at + 9];
  const shared = lowP === highP && lowReference === highReference;
  // The low edge's logarithms, for a power other than 1 or 2, in a loop of their own (`logarithmsOf`).
  const logs = lowP !== 1 && lowP !== 2 ? logarithmsOf(amps, lowReference) : undefined;
  // Read once: whether each current starts from the leading flat elements, and those elements.
  const fromFlats = seeded === true;
  const lowPickupA = low.leading[0];
  const lowSecondsA = low.leading[1];
  const lowPickupB = low.leading[2];
  const lowSecondsB = low.leading[3];
  const highPickupA = high.leading[0];
  const highSecondsA = high.leading[1];
  const highPickupB = high.leading[2];
  const highSecondsB = high.leading[3];
  for (let i = 0, n = amps.length; i < n; i++) {
    const current = amps[i];
    let power = NaN;
    let lowest: number;
    let highest: number;
    if (fromFlats) {
      lowest = current >= lowPickupA ? lowSecondsA : Infinity;
      if (current >= lowPickupB && lowSecondsB < lowest) lowest = lowSecondsB;
      highest = current >= highPickupA ? highSecondsA : Infinity;
      if (current >= highPickupB && highSecondsB < highest) highest = highSecondsB;
    } else {
      lowest = minTimes[i];
      highest = maxTimes[i];
    }
    if (lowest > lowFloor && current >= lowPickup) {
      const m = current * lowInverse;
      let t: number;
      if (m >= lowCap) t = lowCapTime;
      else if (!(m > 1)) t = Infinity;
      else {
        let q: number;
        if (lowP === 2) q = m * m - 1;
        else if (lowP === 1) q = m - 1;
        else {
          power = expm1(lowP * logs![i]);
          q = power * lowScale + lowScaleMinusOne;
        }
        t = q > 0 ? lowDial * (lowA / q + lowB) : Infinity;
      }
      if (t < lowest) lowest = t;
    }
    if (highest > highFloor && current >= highPickup) {
      const m = current * highInverse;
      let t: number;
      if (m >= highCap) t = highCapTime;
      else if (!(m > 1)) t = Infinity;
      else {
        let q: number;
        if (highP === 2) q = m * m - 1;
        else if (highP === 1) q = m - 1;
        else {
          if (!(shared && power === power)) power = expm1(highP * Math.log(current * highReference));
          q = power * highScale + highScaleMinusOne;
        }
        t = q > 0 ? highDial * (highA / q + highB) : Infinity;
      }
      if (t < highest) highest = t;
    }
    minTimes[i] = (lowest > lowClamp ? lowest : lowClamp) + lowAdded;
    maxTimes[i] = (highest > highClamp ? highest : highClamp) + highAdded;
  }
}

/**
 * Two tables' pass for both edges (see `tableTimesInto`): one logarithm per current for both, and a
 * cursor per table. Each table is Infinity below its first current, its pickup.
 */
function tableTwinInto(
  lowEdge: PackedEdge,
  highEdge: PackedEdge,
  e: number,
  amps: Float64Array,
  minTimes: Float64Array,
  maxTimes: Float64Array,
  finish: boolean,
  seeded: boolean,
): void {
  const low = lowEdge.tables[e]!;
  const high = highEdge.tables[e]!;
  const lowBounds = lowEdge.bounds;
  const highBounds = highEdge.bounds;
  const lowFloor = lowBounds[0];
  const lowClamp = finish ? lowFloor : -Infinity;
  const lowAdded = finish ? lowBounds[1] : 0;
  const highFloor = highBounds[0];
  const highClamp = finish ? highFloor : -Infinity;
  const highAdded = finish ? highBounds[1] : 0;
  const { logAmps: lowLogs, seconds: lowSeconds, logSeconds: lowLogSeconds, slopes: lowSlopes } = low;
  const { logAmps: highLogs, seconds: highSeconds, logSeconds: highLogSeconds, slopes: highSlopes } = high;
  const lowLast = lowLogs.length - 2;
  const highLast = highLogs.length - 2;
  const lowFirst = low.first;
  const lowLastAmps = low.lastAmps;
  const lowHeld = lowSeconds[lowLast + 1];
  const highFirst = high.first;
  const highLastAmps = high.lastAmps;
  const highHeld = highSeconds[highLast + 1];
  // Each cursor's segment held in locals, as in `tableTimesInto`.
  let kl = 0;
  let lowFrom = Infinity;
  let lowTo = -Infinity;
  let lowLogTime = 0;
  let lowSlope = 0;
  let lowTime = 0;
  let kh = 0;
  let highFrom = Infinity;
  let highTo = -Infinity;
  let highLogTime = 0;
  let highSlope = 0;
  let highTime = 0;
  // The logarithms in a loop of their own (`logarithmsOf`); ln(I · 1) is ln(I) exactly.
  const logs = logarithmsOf(amps, 1);
  // Read once: whether each current starts from the leading flat elements, and those elements.
  const fromFlats = seeded === true;
  const lowPickupA = lowEdge.leading[0];
  const lowSecondsA = lowEdge.leading[1];
  const lowPickupB = lowEdge.leading[2];
  const lowSecondsB = lowEdge.leading[3];
  const highPickupA = highEdge.leading[0];
  const highSecondsA = highEdge.leading[1];
  const highPickupB = highEdge.leading[2];
  const highSecondsB = highEdge.leading[3];
  for (let i = 0, n = amps.length; i < n; i++) {
    const current = amps[i];
    const x = logs[i];
    let lowest: number;
    let highest: number;
    if (fromFlats) {
      lowest = current >= lowPickupA ? lowSecondsA : Infinity;
      if (current >= lowPickupB && lowSecondsB < lowest) lowest = lowSecondsB;
      highest = current >= highPickupA ? highSecondsA : Infinity;
      if (current >= highPickupB && highSecondsB < highest) highest = highSecondsB;
    } else {
      lowest = minTimes[i];
      highest = maxTimes[i];
    }
    if (lowest > lowFloor) {
      let t: number;
      if (current >= lowLastAmps) t = lowHeld;
      else if (!(current >= lowFirst)) t = Infinity;
      else {
        if (!(x >= lowFrom && x < lowTo)) {
          kl = segmentAt(lowLogs, lowLast, kl, x);
          lowFrom = lowLogs[kl];
          lowTo = kl < lowLast ? lowLogs[kl + 1] : Infinity;
          lowLogTime = lowLogSeconds[kl];
          lowSlope = lowSlopes[kl];
          lowTime = lowSeconds[kl];
        }
        const dx = x - lowFrom;
        t = dx === 0 ? lowTime : exponential(lowLogTime + dx * lowSlope);
      }
      if (t < lowest) lowest = t;
    }
    if (highest > highFloor) {
      let t: number;
      if (current >= highLastAmps) t = highHeld;
      else if (!(current >= highFirst)) t = Infinity;
      else {
        if (!(x >= highFrom && x < highTo)) {
          kh = segmentAt(highLogs, highLast, kh, x);
          highFrom = highLogs[kh];
          highTo = kh < highLast ? highLogs[kh + 1] : Infinity;
          highLogTime = highLogSeconds[kh];
          highSlope = highSlopes[kh];
          highTime = highSeconds[kh];
        }
        const dx = x - highFrom;
        t = dx === 0 ? highTime : exponential(highLogTime + dx * highSlope);
      }
      if (t < highest) highest = t;
    }
    minTimes[i] = (lowest > lowClamp ? lowest : lowClamp) + lowAdded;
    maxTimes[i] = (highest > highClamp ? highest : highClamp) + highAdded;
  }
}
