import type { SettingValue } from './settings.ts';

/** One change to write into a study document: a device, a setting key, its new value. */
export interface DocumentSettingChange {
  deviceId: string;
  key: string;
  to: SettingValue | undefined;
}

/**
 * The study document (the file's form, units as the user wrote them) with setting changes written in:
 * each numeric setting at its dotted path inside the device's characteristic (in base units: seconds,
 * amperes, multiples), `instantaneous: false` removing the element, `shortTime.i2t` set in or out.
 * Returns a new document; the input is untouched. Throws `RangeError` for a device the document lacks.
 *
 * @example withSettingChanges(document, [{ deviceId: 'MAIN', key: 'shortTime.delay', to: 0.3 }])
 */
export function withSettingChanges<T>(document: T, changes: DocumentSettingChange[]): T {
  // A JSON copy: the document is plain JSON by contract, and this also reads a reactive proxy of it.
  const copy = JSON.parse(JSON.stringify(document)) as {
    devices?: { id: string; characteristic: Record<string, unknown> }[];
  };
  for (const change of changes) {
    const device = copy.devices?.find((d) => d.id === change.deviceId);
    if (!device) throw new RangeError(`no device "${change.deviceId}" in the document`);
    const characteristic = device.characteristic;
    if (change.key === 'instantaneous') {
      if (change.to === false) delete characteristic.instantaneous;
      continue;
    }
    if (change.to === undefined) continue;
    const [group, field] = change.key.split('.');
    const element = characteristic[group];
    if (element && typeof element === 'object') (element as Record<string, unknown>)[field] = change.to;
  }
  return copy as T;
}
