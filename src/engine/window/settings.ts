import tripUnitRanges from '../../../curves/trip-unit-ranges.json' with { type: 'json' };
import type { Characteristic } from '../devices/characteristic.ts';
import type { Device } from '../study/index.ts';

/**
 * One adjustable numeric setting of a device, as the setting window varies it. Every setting of
 * every family is oriented the same way: a higher value never makes the device operate sooner
 * (a higher pickup, time dial, multiplier or delay), which is what lets each window edge be solved
 * by bisection.
 */
export interface SettingSpec {
  /** Dotted path inside the characteristic, e.g. 'longTime.pickup' or 'timeOvercurrent.timeDial'. */
  key: string;
  /** Words for tables: 'long-time pickup'. */
  label: string;
  /** Unit as the setting is written: '× I_n', 's', 'A (secondary)', '' for a time dial. */
  unit: string;
  /** The value in the study now. */
  current: number;
  /** Lowest and highest value the device offers (the present value always included). */
  min: number;
  max: number;
  /** The values the device offers, ascending, when it has steps; `undefined` when continuous. */
  values?: number[];
  /** Amperes (at the device's own voltage) per unit of the setting, for pickups; 1 A for relays' secondary amps × ratio. */
  ampsPerUnit?: number;
  /** Where the range comes from, for the report. */
  rangeSource: string;
}

/** An on/off choice the window also weighs: the instantaneous element, I²t in on the short-time element. */
export interface SwitchSpec {
  key: 'instantaneous' | 'shortTime.i2t';
  label: string;
  current: boolean;
  /** The states the device may take: an instantaneous trip may be switched off only behind a short-time element. */
  options: boolean[];
}

/** A range override for one setting: lowest, highest and step, or the list of values. */
export interface SettingRangeOverride {
  min?: number;
  max?: number;
  step?: number;
  values?: number[];
}

/** Options of `adjustableSettingsOf`. */
export interface AdjustableSettingsOptions {
  /** Ranges by setting key that replace the generic ones (from a device's `adjustable` field). */
  overrides?: Record<string, SettingRangeOverride>;
}

/** Generic trip-unit ranges and steps, from `curves/trip-unit-ranges.json` (common practice). */
const TRIP_UNIT = tripUnitRanges.ranges;
const TRIP_UNIT_SOURCE = 'generic trip-unit range (common practice)';
const RELAY_SOURCE = 'usual digital relay range, continuous (common practice)';

/**
 * Values from `min` in `step`s up to `max` and never past it (a range whose span is not a whole
 * number of steps ends at the last step below `max`), rounded so that 0.1 + 0.2 stays 0.3.
 */
function stepsOf(min: number, max: number, step: number): number[] {
  const values: number[] = [];
  // The tolerance keeps a span of exactly n steps at n despite rounding (0.45 / 0.05 = 8.999…).
  const count = Math.floor((max - min) / step + 1e-9);
  for (let k = 0; k <= count; k++) values.push(Math.min(Number((min + k * step).toPrecision(12)), max));
  return values;
}

/** A spec with its range widened to hold the present value and that value added to a step list. */
function specOf(
  key: string,
  label: string,
  unit: string,
  current: number,
  range: { min: number; max: number; step?: number; values?: number[]; above?: number },
  rangeSource: string,
  ampsPerUnit?: number,
): SettingSpec {
  let values = range.values ?? (range.step ? stepsOf(range.min, range.max, range.step) : undefined);
  const { above } = range;
  if (above !== undefined) {
    // Only values strictly above the bound (as the study schema reads it: `value - above > 0`); a
    // continuous range starts 1 % above it, at three significant figures.
    if (values) values = values.filter((v) => v - above > 0);
    else if (range.min - above <= 0) range = { ...range, min: Number((above * 1.01).toPrecision(3)) };
  }
  if (values && !values.some((v) => Math.abs(v - current) <= 1e-9 * Math.max(1, Math.abs(current)))) {
    values = [...values, current];
  }
  values = values ? [...new Set(values)].sort((a, b) => a - b) : undefined;
  const min = Math.min(values ? values[0] : range.min, current);
  const max = Math.max(values ? values[values.length - 1] : range.max, current);
  return { key, label, unit, current, min, max, values, ampsPerUnit, rangeSource };
}

/**
 * The adjustable numeric settings of a device, in the order the recommendation lowers them
 * (fault-clearing speed first: instantaneous, then short-time, then long-time or the inverse
 * curve, then ground). Fuses and thermal-magnetic breakers have none. Trip-unit ranges and steps
 * are the generic ones of `curves/trip-unit-ranges.json`; relay settings are continuous over the
 * usual digital-relay ranges; `overrides` replace either.
 *
 * @example adjustableSettingsOf(main).map((s) => s.key)
 *   // ['instantaneous.pickup', 'shortTime.delay', 'shortTime.pickup', 'longTime.delay', 'longTime.pickup', …]
 */
export function adjustableSettingsOf(device: Device, options: AdjustableSettingsOptions = {}): SettingSpec[] {
  const { overrides = {} } = options;
  const c = device.characteristic;
  const specs: SettingSpec[] = [];
  const add = (
    key: string,
    label: string,
    unit: string,
    current: number,
    range: { min: number; max: number; step?: number; above?: number },
    source: string,
    ampsPerUnit?: number,
  ) => {
    const own = overrides[key];
    const merged = own ? { ...range, ...own } : range;
    specs.push(specOf(key, label, unit, current, merged, own ? 'range given in the study' : source, ampsPerUnit));
  };
  if (c.kind === 'trip-unit') {
    const ratedAmps = c.longTime.pickup * c.sensor;
    // A delay must stay above the band drawn below it (the trip-unit schema's rule), so it is offered from
    // the first step above that band.
    const delayRange = (range: { min: number; max: number; step: number }) => ({
      ...range,
      above: c.tolerance.shortTimeBelow,
    });
    if (c.instantaneous) {
      add(
        'instantaneous.pickup',
        'instantaneous pickup',
        '× I_n',
        c.instantaneous.pickup,
        TRIP_UNIT.instantaneousPickup,
        TRIP_UNIT_SOURCE,
        c.sensor,
      );
    }
    if (c.shortTime) {
      add(
        'shortTime.delay',
        'short-time delay',
        's',
        c.shortTime.delay,
        delayRange(TRIP_UNIT.shortTimeDelay),
        TRIP_UNIT_SOURCE,
      );
      add(
        'shortTime.pickup',
        'short-time pickup',
        '× I_r',
        c.shortTime.pickup,
        TRIP_UNIT.shortTimePickup,
        TRIP_UNIT_SOURCE,
        ratedAmps,
      );
    }
    add(
      'longTime.delay',
      'long-time delay',
      `s at ${c.longTime.delayAt} × I_r`,
      c.longTime.delay,
      TRIP_UNIT.longTimeDelay,
      TRIP_UNIT_SOURCE,
    );
    add(
      'longTime.pickup',
      'long-time pickup',
      '× I_n',
      c.longTime.pickup,
      TRIP_UNIT.longTimePickup,
      TRIP_UNIT_SOURCE,
      c.sensor,
    );
    if (c.ground) {
      add(
        'ground.delay',
        'ground-fault delay',
        's',
        c.ground.delay,
        delayRange(TRIP_UNIT.groundDelay),
        TRIP_UNIT_SOURCE,
      );
      add(
        'ground.pickup',
        'ground-fault pickup',
        '× I_n',
        c.ground.pickup,
        TRIP_UNIT.groundPickup,
        TRIP_UNIT_SOURCE,
        c.sensor,
      );
    }
  } else if (c.kind === 'relay') {
    const secondary = c.ct.secondary;
    const ratio = c.ct.primary / c.ct.secondary;
    if (c.instantaneous) {
      add(
        'instantaneous.pickup',
        'instantaneous pickup',
        'A (secondary)',
        c.instantaneous.pickup,
        { min: 0.5 * secondary, max: 20 * secondary },
        RELAY_SOURCE,
        ratio,
      );
    }
    const toc = c.timeOvercurrent;
    if (toc) {
      if (toc.timeDial !== undefined)
        add('timeOvercurrent.timeDial', 'time dial', '', toc.timeDial, { min: 0.5, max: 15 }, RELAY_SOURCE);
      if (toc.timeMultiplier !== undefined)
        add(
          'timeOvercurrent.timeMultiplier',
          'time multiplier',
          '',
          toc.timeMultiplier,
          { min: 0.025, max: 1.2 },
          RELAY_SOURCE,
        );
      if (toc.delay !== undefined)
        add('timeOvercurrent.delay', 'definite-time delay', 's', toc.delay, { min: 0.02, max: 10 }, RELAY_SOURCE);
      add(
        'timeOvercurrent.pickup',
        'pickup (tap)',
        'A (secondary)',
        toc.pickup,
        { min: 0.1 * secondary, max: 3.2 * secondary },
        RELAY_SOURCE,
        ratio,
      );
    }
  }
  return specs;
}

/**
 * The on/off choices of a device: a trip unit's or relay's instantaneous element (off allowed only
 * where a short-time or time-overcurrent element still clears faults) and a trip unit's I²t in/out.
 *
 * @example switchesOf(main) // [{ key: 'instantaneous', current: true, options: [true, false] }, …]
 */
export function switchesOf(device: Device): SwitchSpec[] {
  const c = device.characteristic;
  const switches: SwitchSpec[] = [];
  if (c.kind === 'trip-unit') {
    if (c.instantaneous)
      switches.push({
        key: 'instantaneous',
        label: 'instantaneous trip',
        current: true,
        options: c.shortTime ? [true, false] : [true],
      });
    if (c.shortTime)
      switches.push({
        key: 'shortTime.i2t',
        label: 'short-time I²t in',
        current: c.shortTime.i2t,
        options: [false, true],
      });
  } else if (c.kind === 'relay' && c.instantaneous) {
    switches.push({
      key: 'instantaneous',
      label: 'instantaneous element',
      current: true,
      options: c.timeOvercurrent ? [true, false] : [true],
    });
  }
  return switches;
}

/** One setting change: a numeric setting's new value, or a switch's new state. */
export type SettingValue = number | boolean;

/**
 * The characteristic with one setting changed (a new object; the input is untouched). A numeric key
 * sets the value at its dotted path; `instantaneous: false` removes the instantaneous element,
 * `true` keeps it; `shortTime.i2t` sets I²t in or out.
 *
 * @example characteristicWith(c, 'shortTime.delay', 0.3)
 */
export function characteristicWith(c: Characteristic, key: string, value: SettingValue): Characteristic {
  if (key === 'instantaneous') {
    if (value) return c;
    const rest = { ...c } as Record<string, unknown>;
    delete rest.instantaneous;
    return rest as Characteristic;
  }
  const [group, field] = pathOf(key);
  const record = c as unknown as Record<string, Record<string, unknown> | undefined>;
  const element = record[group];
  if (!element || typeof element !== 'object') return c;
  return { ...c, [group]: { ...element, [field]: value } } as Characteristic;
}

/** Each setting key split at its dots, once (a window changes a few keys many times). */
const paths = new Map<string, string[]>();

/** `key.split('.')`, remembered. */
function pathOf(key: string): string[] {
  let path = paths.get(key);
  if (!path) paths.set(key, (path = key.split('.')));
  return path;
}

/** The device with several settings changed (applied in order). @example deviceWith(main, { 'shortTime.delay': 0.3 }) */
export function deviceWith(device: Device, changes: Record<string, SettingValue>): Device {
  let characteristic = device.characteristic;
  for (const [key, value] of Object.entries(changes)) characteristic = characteristicWith(characteristic, key, value);
  return characteristic === device.characteristic ? device : { ...device, characteristic };
}

/**
 * The device with one setting at each value asked for, one object per value: the constraints that
 * read the same trial setting then share it (and what is remembered of it).
 *
 * @example const at = devicesAlong(main, 'shortTime.delay'); at(0.3) === at(0.3) // true
 */
export function devicesAlong(device: Device, key: string): (value: number) => Device {
  const devices = new Map<number, Device>();
  return (value) => {
    let found = devices.get(value);
    if (!found) devices.set(value, (found = deviceWith(device, { [key]: value })));
    return found;
  };
}

/** A setting's value on a device (`undefined` when the element is absent). @example settingValue(main, 'longTime.pickup') // 1 */
export function settingValue(device: Device, key: string): SettingValue | undefined {
  const c = device.characteristic as unknown as Record<string, Record<string, unknown> | undefined>;
  if (key === 'instantaneous') return c.instantaneous !== undefined;
  const [group, field] = key.split('.');
  const value = c[group]?.[field];
  return typeof value === 'number' || typeof value === 'boolean' ? value : undefined;
}

/** The main pairs of settings the 2-D map is drawn for: pickup across, time setting up. */
export function mainPairsOf(device: Device): { x: string; y: string; label: string }[] {
  const c = device.characteristic;
  if (c.kind === 'trip-unit') {
    const pairs = [{ x: 'longTime.pickup', y: 'longTime.delay', label: 'long-time pickup × long-time delay' }];
    if (c.shortTime)
      pairs.push({ x: 'shortTime.pickup', y: 'shortTime.delay', label: 'short-time pickup × short-time delay' });
    return pairs;
  }
  if (c.kind === 'relay' && c.timeOvercurrent) {
    const toc = c.timeOvercurrent;
    const y =
      toc.timeDial !== undefined
        ? 'timeOvercurrent.timeDial'
        : toc.timeMultiplier !== undefined
          ? 'timeOvercurrent.timeMultiplier'
          : 'timeOvercurrent.delay';
    return [
      {
        x: 'timeOvercurrent.pickup',
        y,
        label: `pickup × ${y === 'timeOvercurrent.timeDial' ? 'time dial' : y === 'timeOvercurrent.timeMultiplier' ? 'time multiplier' : 'delay'}`,
      },
    ];
  }
  return [];
}
