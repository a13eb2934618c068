import { z } from 'zod/mini';
import { withSharedReadings } from '../study/plainReading.ts';
import { fuseSchema } from './fuseSchema.ts';
import { createRelaySchema } from './relaySchema.ts';
import { createThermalMagneticSchema } from './thermalMagneticSchema.ts';
import { createTripUnitSchema } from './tripUnitSchema.ts';

/**
 * Builds the characteristic schema for a system frequency, so that times in cycles parse at it.
 * A discriminated union on `kind`, one member per device family (each in its own file here):
 * `relay`, `trip-unit`, `thermal-magnetic`, `fuse`.
 *
 * @example createCharacteristicSchema(50).parse({ kind: 'relay', ct: '600:5', instantaneous: { pickup: 40 } })
 */
export function createCharacteristicSchema(frequency = 60) {
  // Devices set alike share one reading of their characteristic (see `withSharedReadings`).
  return withSharedReadings(
    z.discriminatedUnion('kind', [
      createRelaySchema(frequency),
      createTripUnitSchema(frequency),
      createThermalMagneticSchema(frequency),
      fuseSchema,
    ]),
  );
}

/**
 * The characteristic of a protective device at 60 Hz: a discriminated union on `kind`.
 * @example characteristicSchema.parse({ kind: 'fuse', minimumMelting: [[200, 300], [2000, 0.01]],
 *   totalClearing: [[220, 300], [2000, 0.02]] })
 */
export const characteristicSchema = createCharacteristicSchema(60);

/** A parsed characteristic: SI units (A, s), every default filled in. */
export type Characteristic = z.output<typeof characteristicSchema>;

/** A characteristic as written in a file (numbers or text with units). */
export type CharacteristicInput = z.input<typeof characteristicSchema>;

/** The device families, as their `kind`. */
export const DEVICE_KINDS = ['relay', 'trip-unit', 'thermal-magnetic', 'fuse'] as const;
