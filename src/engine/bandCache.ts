import { bandOf, fastestOf, groundFaultBandOf, type Band } from './band.ts';
import type { Characteristic } from './devices/characteristic.ts';
import { sameContent } from './sameContent.ts';

/**
 * Bands remembered by the characteristic they come from. A band depends on its characteristic alone,
 * so one built for an equal characteristic serves again: the same object (an unchanged device of an
 * edited study keeps its parsed characteristic) is found by identity, an equal one (a site's many
 * identical breakers) by comparing it with the last few kinds given, else by its content as text.
 * Results are exactly what `bandOf` returns; only the work is saved. Bands are read-only by the
 * `Band` contract, so sharing one between devices is safe.
 */
const byObject = new WeakMap<Characteristic, Band>();
const groundByObject = new WeakMap<Characteristic, Band | null>();
const byContent = new Map<string, Band>();
const groundByContent = new Map<string, Band | null>();
/** Distinct characteristics remembered by content before the memory starts afresh. */
const CONTENT_LIMIT = 20_000;
/**
 * The content as text of each characteristic with a ground-fault element, written once for both its
 * phase and its ground band. Other keys are not kept: a study holds thousands, which the collector
 * would copy while the analysis runs.
 */
const keys = new WeakMap<Characteristic, string>();

/**
 * The characteristics last given whose bands are known, the latest first: a study's devices come in
 * few kinds, and comparing a characteristic with these field by field is a few times quicker than
 * writing its content out as text (the numbers of its point tables, above all).
 */
const recent: Characteristic[] = [];
const RECENT_LIMIT = 16;

/** A recent characteristic with the same content as `characteristic`, moved to the front; or undefined. */
function recentTwinOf(characteristic: Characteristic): Characteristic | undefined {
  for (let i = 0; i < recent.length; i++) {
    const twin = recent[i];
    if (sameContent(twin, characteristic)) {
      recent.copyWithin(1, 0, i);
      recent[0] = twin;
      return twin;
    }
  }
  return undefined;
}

function rememberRecent(characteristic: Characteristic): void {
  recent.unshift(characteristic);
  if (recent.length > RECENT_LIMIT) recent.pop();
}

function contentOf(characteristic: Characteristic): string {
  let key = keys.get(characteristic);
  if (key === undefined) {
    key = JSON.stringify(characteristic);
    if (characteristic.kind === 'trip-unit' && characteristic.ground) keys.set(characteristic, key);
  }
  return key;
}

/**
 * `bandOf(characteristic)`, built once per distinct characteristic.
 * @example cachedBandOf(device.characteristic).minTime(4000)
 */
export function cachedBandOf(characteristic: Characteristic): Band {
  let band = byObject.get(characteristic);
  if (band) return band;
  const twin = recentTwinOf(characteristic);
  band = twin && byObject.get(twin);
  if (!band) {
    const key = contentOf(characteristic);
    band = byContent.get(key);
    if (!band) {
      band = bandOf(characteristic);
      if (byContent.size >= CONTENT_LIMIT) byContent.clear();
      byContent.set(key, band);
    }
    rememberRecent(characteristic);
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
  const twin = recentTwinOf(characteristic);
  band = twin && groundByObject.get(twin);
  if (band === undefined) {
    const key = contentOf(characteristic);
    band = groundByContent.get(key);
    if (band === undefined) {
      band = groundFaultBandOf(characteristic) ?? null;
      if (groundByContent.size >= CONTENT_LIMIT) groundByContent.clear();
      groundByContent.set(key, band);
    }
    if (twin) groundByObject.set(twin, band);
  }
  groundByObject.set(characteristic, band);
  return band ?? undefined;
}

/**
 * Each device's band by id, built only when first asked for (`get`): a sheet draws a few devices of
 * a large study, and only theirs are built. Given a lookup of devices by id that already exists (the
 * network's `devices`), an edit of a large study costs no pass over its devices. Bands come from
 * `cachedBandOf`, so a device an edit left alone gets its band back at once. `size`, `has` and `keys`
 * cover every device; iterating builds them all, in the devices' order.
 *
 * @example lazyBandsOf(study.devices).get('MAIN')?.minTime(20_000)
 */
export function lazyBandsOf(
  devices: readonly DeviceWithCharacteristic[] | ReadonlyMap<string, Pick<DeviceWithCharacteristic, 'characteristic'>>,
): Map<string, Band> {
  return new LazyBands('get' in devices ? devices : new Map(devices.map((device) => [device.id, device] as const)));
}

type DeviceWithCharacteristic = { id: string; characteristic: Characteristic };

class LazyBands extends Map<string, Band> {
  #devices: ReadonlyMap<string, Pick<DeviceWithCharacteristic, 'characteristic'>>;

  constructor(devices: ReadonlyMap<string, Pick<DeviceWithCharacteristic, 'characteristic'>>) {
    super();
    this.#devices = devices;
  }

  override get(id: string): Band | undefined {
    let band = super.get(id);
    if (band) return band;
    // The base constructor runs before the field is set (and may call `set`, never `get`).
    const device = this.#devices?.get(id);
    if (!device) return undefined;
    band = cachedBandOf(device.characteristic);
    super.set(id, band);
    return band;
  }

  override has(id: string): boolean {
    return this.#devices.has(id);
  }

  override get size(): number {
    return this.#devices?.size ?? 0;
  }

  // Iteration follows the devices' order, whichever bands were asked for first.
  override entries(): MapIterator<[string, Band]> {
    return this.#all().entries();
  }

  override keys(): MapIterator<string> {
    return this.#devices.keys();
  }

  override values(): MapIterator<Band> {
    return this.#all().values();
  }

  #all(): Map<string, Band> {
    return new Map(Array.from(this.#devices.keys(), (id) => [id, this.get(id)!]));
  }

  override forEach(callback: (band: Band, id: string, map: Map<string, Band>) => void): void {
    for (const [id, band] of this.entries()) callback(band, id, this);
  }

  override [Symbol.iterator](): MapIterator<[string, Band]> {
    return this.entries();
  }
}

const fastestPairs = new WeakMap<Band, WeakMap<Band, Band>>();

/**
 * `fastestOf([phase, ground])`, built once per pair of band objects (a device's phase band and its
 * ground-fault band, met again in every pair the device is part of).
 * @example cachedFastestOf(cachedBandOf(c), cachedGroundBandOf(c)!).minTime(1500)
 */
export function cachedFastestOf(phase: Band, ground: Band): Band {
  let byGround = fastestPairs.get(phase);
  if (!byGround) fastestPairs.set(phase, (byGround = new WeakMap()));
  let band = byGround.get(ground);
  if (!band) byGround.set(ground, (band = fastestOf([phase, ground])));
  return band;
}
