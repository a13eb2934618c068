import type { Band } from '../band.ts';
import {
  bandOfEdges,
  compositeEdge,
  definiteElement,
  inverseShapeTime,
  named,
  type EdgeElement,
  type InverseShape,
} from './composite.ts';
import { INVERSE_CURVES, inverseMultiple, inverseTime, type InverseCurveName } from './inverseCurves.ts';
import type { Relay } from './relaySchema.ts';

/**
 * The band of a relay and its breaker, in primary amperes (pickup × CT ratio, IEEE 242 CT and tap practice).
 * `minTime` uses the low pickup and time edges; `maxTime` the high edges plus the breaker
 * interrupting time (IEEE C37.112 definite-time practice). The relay trips on its fastest element, never faster than
 * `operatingTime`. Inverse curves give `Infinity` at and below pickup; a definite-time or
 * instantaneous element operates from its pickup on.
 *
 * @example relayBand(relaySchema.parse({ kind: 'relay', ct: '600:5',
 *   timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 5, timeDial: 2 } })).minTime(6000) // 1.37816 s
 */
export function relayBand(relay: Relay): Band {
  const { ct, timeOvercurrent, instantaneous, operatingTime, breakerTime, tolerance } = relay;
  const ratio = ct.primary / ct.secondary;
  const diagnostics: string[] = [];
  // Both edges' inverse elements take their powers from the multiple of the low edge's pickup, so they share them.
  const lowestScale = ratio * (1 - tolerance.pickup / 100);
  const edge = (side: -1 | 1, add: number) => {
    const pickupFactor = 1 + (side * tolerance.pickup) / 100;
    const timeFactor = 1 + (side * tolerance.time) / 100;
    const elements: EdgeElement[] = [];
    if (timeOvercurrent) {
      elements.push(
        named(overcurrentElement(timeOvercurrent, ratio * pickupFactor, timeFactor, lowestScale), 'time-overcurrent'),
      );
    }
    // An instantaneous element operates once the current has lasted the relay's operating time (or its
    // delay): a current that falls below its pickup sooner leaves it unoperated (what a decaying current reads).
    if (instantaneous) {
      const seconds = Math.max(instantaneous.delay * timeFactor, operatingTime);
      elements.push(named(definiteElement(instantaneous.pickup * ratio * pickupFactor, seconds), 'instantaneous'));
    }
    return compositeEdge(elements, operatingTime, add);
  };
  const low = edge(-1, 0);
  const high = edge(1, breakerTime);

  if (timeOvercurrent?.timeDial !== undefined && (timeOvercurrent.timeDial < 0.5 || timeOvercurrent.timeDial > 15)) {
    diagnostics.push(`time dial ${timeOvercurrent.timeDial} is outside the usual 0.5–15 (common practice)`);
  }
  const multiplier = timeOvercurrent?.timeMultiplier;
  if (multiplier !== undefined && (multiplier < 0.025 || multiplier > 1.2)) {
    diagnostics.push(`time multiplier ${multiplier} is outside the usual 0.025–1.2 (common practice)`);
  }
  // IEC 60255-151 bounds the dependent-time range at G_D, above which a relay holds its time; without
  // it the curve keeps falling to the operating-time floor, which flatters the relay below another.
  if (timeOvercurrent?.curve.startsWith('iec') && timeOvercurrent.definiteTimeFrom === undefined) {
    diagnostics.push(
      'no definite-time threshold G_D (definiteTimeFrom) given for the IEC curve: it keeps falling at high multiples; set the one in the relay manual (often 20 × pickup, from memory)',
    );
  }
  if (timeOvercurrent && instantaneous && instantaneous.pickup <= timeOvercurrent.pickup) {
    diagnostics.push('instantaneous pickup is at or below the time-overcurrent pickup: the inverse curve never acts');
  }
  return bandOfEdges(low, high, Infinity, diagnostics);
}

/**
 * The time-overcurrent element in primary amperes, with its pickup and time scaled by the edge factors;
 * `referenceScale` scales the pickup whose multiple's power the element's own is taken from (`InverseShape`).
 */
function overcurrentElement(
  element: NonNullable<Relay['timeOvercurrent']>,
  pickupScale: number,
  timeFactor: number,
  referenceScale: number,
): EdgeElement {
  const pickup = element.pickup * pickupScale;
  if (element.curve === 'definite-time') return definiteElement(pickup, (element.delay ?? 0) * timeFactor);
  const curve: InverseCurveName = element.curve;
  const dial = (element.timeDial ?? element.timeMultiplier ?? 1) * timeFactor;
  const cap = element.definiteTimeFrom ?? Infinity;
  const capTime = inverseTime(curve, cap, dial);
  const { a, b, p } = INVERSE_CURVES[curve];
  const inversePickup = 1 / pickup;
  const referenceInverse = 1 / (element.pickup * referenceScale);
  const shape: InverseShape = { kind: 'inverse', inversePickup, dial, a, b, p, cap, capTime, referenceInverse };
  return {
    pickup,
    time: inverseShapeTime(shape),
    shape,
    joins: Number.isFinite(cap) ? [cap * pickup] : [],
    levels: Number.isFinite(cap) ? [capTime] : [],
    reach: (seconds) => {
      const multiple = inverseMultiple(curve, seconds, dial);
      // At the cap itself the join already marks the change; the crossing must lie strictly below it.
      return multiple < cap * (1 - 1e-9) ? multiple * pickup : Infinity;
    },
  };
}
