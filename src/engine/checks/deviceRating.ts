import type { Device } from '../study/index.ts';

/** The current NEC limits compare with a device, and what that current is. */
export interface DeviceRating {
  amps: number;
  /** 'rating', 'maximum long-time setting (NEC 240.6(B))', 'pickup in primary amperes'. */
  what: string;
}

/**
 * The ampere figure the NEC compares with a limit: the `rating` given on the device; else a
 * thermal-magnetic breaker's rating, a trip unit's sensor or plug rating (its maximum long-time
 * setting, NEC 240.6(B)), a relay's time-overcurrent pickup in primary amps. A fuse needs its
 * `rating` on the device; without one, `undefined`. A trip unit set above the rating given is rated
 * at its setting: an adjustable trip unit's rating is its long-time pickup setting at the least (its
 * setting where the adjustment is of restricted access, NEC 240.6(C); its largest setting otherwise).
 *
 * @example ratingOf({ rating: 100, ... }) // { amps: 100, what: 'rating' }
 */
export function ratingOf(device: Device): DeviceRating | undefined {
  const c = device.characteristic;
  if (device.rating !== undefined) {
    const setting = c.kind === 'trip-unit' ? c.sensor * c.longTime.pickup : 0;
    // A product of two decimals (0.67 × 600 A) is not above 402 A by a rounding error.
    if (setting > device.rating * (1 + 1e-9))
      return { amps: setting, what: 'long-time pickup setting, above the rating given (NEC 240.6(C))' };
    return { amps: device.rating, what: 'rating' };
  }
  switch (c.kind) {
    case 'thermal-magnetic':
      return { amps: c.rating, what: 'rating' };
    case 'trip-unit':
      return { amps: c.sensor, what: 'maximum long-time setting (sensor rating, NEC 240.6(B))' };
    case 'relay': {
      const pickup = c.timeOvercurrent?.pickup ?? c.instantaneous?.pickup;
      if (pickup === undefined) return undefined;
      return { amps: (pickup * c.ct.primary) / c.ct.secondary, what: 'pickup in primary amperes' };
    }
    default:
      return undefined;
  }
}
