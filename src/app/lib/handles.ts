import type { Sheet } from '../../plot/sheet.ts';
import type { SheetInput } from '../../plot/sheetInput.ts';
import { pixelOf } from '../../plot/scales.ts';
import { valueAt, withValueAt, type DocumentPath } from './documentPath.ts';
import { pathOfSelection } from './selection.ts';
import { scaleValue } from './stepValue.ts';

/**
 * The settings a band's handle on the sheet moves, inside the characteristic (file form): dragging
 * sideways multiplies the pickup, dragging up or down multiplies the time setting (time dial, time
 * multiplier, band delay), each by the ratio the pointer moved on its log axis.
 */
export interface HandleSettings {
  /** Path of the pickup inside the characteristic, and the trade's name for it. */
  pickup?: { path: DocumentPath; name: string };
  /** Path of the time setting inside the characteristic, and the trade's name for it. */
  time?: { path: DocumentPath; name: string };
}

/**
 * Which settings a characteristic's handle moves, by family; `{}` when nothing on it is adjustable
 * from the sheet (a fuse's curve is fixed: change its rating or template instead).
 *
 * @example handleSettingsOf({ kind: 'relay', timeOvercurrent: { pickup: 5, timeDial: 6 } }).time?.name // 'time dial'
 */
export function handleSettingsOf(characteristic: unknown): HandleSettings {
  const c = (characteristic ?? {}) as Record<string, Record<string, unknown> | string | undefined>;
  const has = (path: DocumentPath) => valueAt(c, path) !== undefined;
  switch (c.kind) {
    case 'relay': {
      if (!has(['timeOvercurrent'])) {
        return has(['instantaneous', 'pickup'])
          ? { pickup: { path: ['instantaneous', 'pickup'], name: 'instantaneous pickup' } }
          : {};
      }
      const time = (['timeDial', 'timeMultiplier', 'delay'] as const).find((key) => has(['timeOvercurrent', key]));
      const names = { timeDial: 'time dial', timeMultiplier: 'time multiplier', delay: 'delay' };
      return {
        pickup: { path: ['timeOvercurrent', 'pickup'], name: 'pickup' },
        time: time ? { path: ['timeOvercurrent', time], name: names[time] } : undefined,
      };
    }
    case 'trip-unit': {
      if (has(['longTime'])) {
        return {
          pickup: { path: ['longTime', 'pickup'], name: 'long-time pickup' },
          time: has(['longTime', 'delay']) ? { path: ['longTime', 'delay'], name: 'long-time delay' } : undefined,
        };
      }
      if (has(['shortTime'])) {
        return {
          pickup: { path: ['shortTime', 'pickup'], name: 'short-time pickup' },
          time: has(['shortTime', 'delay']) ? { path: ['shortTime', 'delay'], name: 'short-time delay' } : undefined,
        };
      }
      return has(['instantaneous', 'pickup'])
        ? { pickup: { path: ['instantaneous', 'pickup'], name: 'instantaneous pickup' } }
        : {};
    }
    case 'thermal-magnetic': {
      const key = has(['magnetic', 'pickup']) ? 'pickup' : has(['magnetic', 'pickupAmps']) ? 'pickupAmps' : undefined;
      return key ? { pickup: { path: ['magnetic', key], name: 'magnetic pickup' } } : {};
    }
    default:
      return {};
  }
}

/**
 * The characteristic with its handle's settings multiplied: pickup by `currentRatio`, the time
 * setting by `timeRatio` (each rounded to 3 significant figures, units kept). The original is not touched.
 *
 * @example movedBy(relay, handleSettingsOf(relay), 1.2, 1) // pickup 5 → 6
 */
export function movedBy<T>(characteristic: T, settings: HandleSettings, currentRatio: number, timeRatio: number): T {
  let next = characteristic;
  for (const [setting, ratio] of [
    [settings.pickup, currentRatio],
    [settings.time, timeRatio],
  ] as const) {
    if (!setting || ratio === 1) continue;
    const scaled = scaleValue(valueAt(characteristic, setting.path), ratio);
    if (scaled !== undefined) next = withValueAt(next, setting.path, scaled);
  }
  return next;
}

/** A handle on the sheet: the device, where its characteristic sits in the document, and its position (sheet px). */
export interface HandlePlacement {
  deviceId: string;
  /** Path of the device's characteristic in the study document. */
  path: DocumentPath;
  settings: HandleSettings;
  x: number;
  y: number;
}

/**
 * Places one handle on each band whose family has both a pickup and a time setting: at twice the
 * band's lowest operating current (just right of the pickup), halfway on the log scale between its
 * edges, held inside the sheet's draw window. Bands without both settings get no handle.
 *
 * @example handlePlacementsOf(input, sheet, document) // [{ deviceId: 'MAIN', x: 412.5, y: 188.1, … }]
 */
export function handlePlacementsOf(input: SheetInput, sheet: Sheet, document: unknown): HandlePlacement[] {
  const [bottom, top] = sheet.window.seconds;
  return input.bands.flatMap((b) => {
    const path = pathOfSelection(document, { kind: 'device', id: b.id });
    if (!path) return [];
    const settings = handleSettingsOf(valueAt(document, [...path, 'characteristic']));
    if (!settings.pickup || !settings.time) return [];
    const amps = b.band.minAmps * 2;
    const low = b.band.minTime(amps);
    const high = b.band.maxTime(amps);
    const seconds = Number.isFinite(high) ? Math.sqrt(low * high) : low;
    if (!Number.isFinite(seconds) || !(amps <= sheet.scales.x.domain[1])) return [];
    const held = Math.min(top, Math.max(bottom, seconds));
    return [
      {
        deviceId: b.id,
        path: [...path, 'characteristic'],
        settings,
        x: pixelOf(sheet.scales.x, amps),
        y: pixelOf(sheet.scales.y, held),
      },
    ];
  });
}
