import { bandOf, groundFaultBandOf, type Band } from './band.ts';
import type { Characteristic } from './devices/characteristic.ts';

/**
 * Bands remembered by the characteristic they come from. A band depends on its characteristic alone,
 * so one built for an equal characteristic serves again: the same object (an unchanged device of an
 * edited study keeps its parsed characteristic) is found by identity, an equal one (a site's many
 * identical breakers) by its content. Results are exactly what `bandOf` returns; only the work is
 * saved. Bands are read-only by the `Band` contract, so sharing one between devices is safe.
 */
const byObject = new WeakMap<Characteristic, Band>();
const groundByObject = new WeakMap<Characteristic, Band | null>();
const byContent = new Map<string, Band>();
const groundByContent = new Map<string, Band | null>();
/** Distinct characteristics remembered by content before the memory starts afresh. */
const CONTENT_LIMIT = 20_000;

/**
 * `bandOf(characteristic)`, built once per distinct characteristic.
 * @example cachedBandOf(device.characteristic).minTime(4000)
 */
export function cachedBandOf(characteristic: Characteristic): Band {
  let band = byObject.get(characteristic);
  if (band) return band;
  const key = JSON.stringify(characteristic);
  band = byContent.get(key);
  if (!band) {
    band = bandOf(characteristic);
    if (byContent.size >= CONTENT_LIMIT) byContent.clear();
    byContent.set(key, band);
  }
  byObject.set(characteristic, band);
  return band;
}

/**
 * `groundFaultBandOf(characteristic)`, built once per distinct characteristic; `undefined` where
 * the device has no ground-fault element.
 * @example cachedGroundBandOf(main.characteristic)?.minTime(1500)
 */
export function cachedGroundBandOf(characteristic: Characteristic): Band | undefined {
  if (characteristic.kind !== 'trip-unit' || !characteristic.ground) return undefined;
  let band = groundByObject.get(characteristic);
  if (band !== undefined) return band ?? undefined;
  const key = JSON.stringify(characteristic);
  band = groundByContent.get(key);
  if (band === undefined) {
    band = groundFaultBandOf(characteristic) ?? null;
    if (groundByContent.size >= CONTENT_LIMIT) groundByContent.clear();
    groundByContent.set(key, band);
  }
  groundByObject.set(characteristic, band);
  return band ?? undefined;
}
