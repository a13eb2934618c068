import { z } from 'zod';

/**
 * The characteristic of a protective device: a discriminated union on `kind`, one member per
 * device family (each family's schema lives in its own file in this folder).
 */
export const characteristicSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('placeholder') }).meta({ description: 'a device with no characteristic yet' }),
]);

export type Characteristic = z.output<typeof characteristicSchema>;
