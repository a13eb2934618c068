import type { Band } from '../band.ts';
import type { FaultLevels } from '../fault/index.ts';
import type { OverlapMemo } from '../overlapMemo.ts';
import { pathTo, type Network } from '../network/index.ts';
import type { Cable, Device, Motor } from '../study/index.ts';
import { formatAmps, formatVolts } from '../quantity/format.ts';
import type { CurrentRange, Finding } from './finding.ts';

/** What every check reads: the tree, its fault levels and each device's band (at its own voltage). */
export interface CheckContext {
  network: Network;
  faults: FaultLevels;
  bands: Map<string, Band>;
  /** Where the pair checks of one analysis keep the finder's answers, to ask each question once. */
  overlaps?: OverlapMemo;
}

/** A device's name for sentences: its name, else its id. */
export function nameOf(device: Device): string {
  return device.name ?? device.id;
}

const NO_SHIFTS: ReadonlyMap<number, number> = new Map();

/**
 * A current interval on the reference base, with the same interval at each other voltage given
 * (a current I at V_ref is I·V_ref/V at voltage V, times the `shifts` factor for that voltage where an
 * unbalanced fault loads a line there more than the voltage ratio says, e.g. 2/√3 across a Δ–Y unit).
 *
 * @example rangeOf(9800, 14900, 480, [12470]).atVoltages[1].toAmps // 573.5 A at 12.47 kV
 */
export function rangeOf(
  fromAmps: number,
  toAmps: number,
  referenceVolts: number,
  voltages: number[],
  shifts: ReadonlyMap<number, number> = NO_SHIFTS,
): CurrentRange {
  // The reference voltage first, then each other voltage once, in order (a study has thousands of ranges).
  const atVoltages: CurrentRange['atVoltages'] = [];
  for (let i = -1; i < voltages.length; i++) {
    const volts = i < 0 ? referenceVolts : voltages[i];
    if (atVoltages.some((seen) => seen.volts === volts)) continue;
    const k = volts === referenceVolts ? 1 : (shifts.get(volts) ?? 1);
    atVoltages.push({
      volts,
      fromAmps: (fromAmps * referenceVolts * k) / volts,
      toAmps: (toAmps * referenceVolts * k) / volts,
    });
  }
  // An exact-size copy: an array grown by `push` keeps room for 17 items, and a study keeps thousands
  // of ranges, which the collector copies while the analysis runs.
  return { fromAmps, toAmps, atVoltages: atVoltages.slice() };
}

/** "between 9.8 kA and 14.9 kA at 480 V (340 A and 517 A at 12.47 kV)" */
export function describeRange(range: CurrentRange): string {
  const [first, ...others] = range.atVoltages;
  const text = (r: { volts: number; fromAmps: number; toAmps: number }) =>
    `${formatAmps(r.fromAmps, 3)} and ${formatAmps(r.toAmps, 3)} at ${formatVolts(r.volts)}`;
  return `between ${text(first)}${others.length > 0 ? ` (${others.map(text).join('; ')})` : ''}`;
}

/**
 * The lowest current at which a band's `maxTime` is at most `horizon` (the device is sure to clear
 * within the sheet), found by bisection from its lowest operating current; `Infinity` if it never
 * surely clears below `limit`.
 */
export function surelyClearsFrom(band: Band, limit: number, horizon = Infinity): number {
  const clears = (amps: number) => band.maxTime(amps) <= horizon;
  let lo = band.minAmps;
  if (clears(lo)) return lo;
  // A band defined from 0 A would never double its way up: the schema forbids it, and this guards it.
  if (!(lo > 0)) return Infinity;
  let hi = lo * 2;
  while (!clears(hi)) {
    if (hi > limit) return Infinity;
    lo = hi;
    hi *= 2;
  }
  for (let i = 0; i < 60 && hi - lo > 1e-9 * hi; i++) {
    const mid = Math.sqrt(lo * hi);
    if (!clears(mid)) lo = mid;
    else hi = mid;
  }
  return hi;
}

/** Starts a sentence with a capital letter. */
export function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** The cable a cable check's finding is about: the subject after its device (`subjects[1]`). */
export function cableSubjectOf(context: CheckContext, finding: Finding): Cable {
  const element = context.network.elements.get(finding.subjects[1]);
  if (element?.type !== 'cable') throw new RangeError(`${finding.id}: its second subject is not a cable`);
  return element.item;
}

/** The motor a motor check's finding is about: the subject after its device (`subjects[1]`). */
export function motorSubjectOf(context: CheckContext, finding: Finding): Motor {
  const element = context.network.elements.get(finding.subjects[1]);
  if (element?.type !== 'motor') throw new RangeError(`${finding.id}: its second subject is not a motor`);
  return element.item;
}

/** The device feeding the element, or the nearest one above it on the way to the source. */
export function protectingDevice(context: CheckContext, elementId: string): Device | undefined {
  const { protectors, devices } = context.network;
  const known = protectors.get(elementId);
  if (known !== undefined) return devices.get(known);
  if (protectors.has(elementId)) return undefined;
  const path = pathTo(context.network, elementId);
  for (let i = path.length - 1; i >= 0; i--) {
    const device = context.network.deviceFeeding.get(path[i]);
    if (device) return device;
  }
  return undefined;
}
