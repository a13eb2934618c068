import type { Band } from '../engine/band.ts';
import { InputError, expectedGot } from '../engine/errors.ts';
import type { Marker, StartingCurve, WithstandCurve } from '../engine/withstand/withstand.ts';

/**
 * What one TCC sheet draws, already on the sheet's voltage base (`referenceVolts`): bands are
 * scaled with `scaleBand`, the other curves carry a `scale` (amps × scale = amps on the sheet), and
 * own-voltage values are kept for labels. Built from a study's view and its analysis.
 */
export interface SheetInput {
  /** Study name, for the title block. */
  study: string;
  /** View name, for the title block. */
  view: string;
  /** Title printed above the plot. */
  title: string;
  preparedBy?: string;
  checkedBy?: string;
  /** Where the system is. */
  site?: string;
  /** For whom the study is made. */
  client?: string;
  /** The study's current revision mark ("B"). */
  revision?: string;
  /** As the user wrote it; the sheet never reads a clock. */
  date?: string;
  notes?: string;
  /** Voltage base of the sheet (V): a current I at voltage V is drawn at I·V/V_ref. */
  referenceVolts: number;
  bands: SheetBand[];
  withstand: SheetWithstand[];
  markers: SheetMarker[];
  starting: SheetStarting[];
  faultLines: SheetFaultLine[];
  regions: SheetRegion[];
  /** Current axis in amps at `referenceVolts`; automatic (snapped to decades) when omitted. */
  currentRange?: [number, number];
  /** Time axis in seconds; 0.01–1000 s when omitted. */
  timeRange?: [number, number];
  /** The short caution line every exported figure carries. */
  caution: string;
}

/** A device's band on the sheet's base, with the voltage its device works at (V). */
export interface SheetBand {
  id: string;
  label: string;
  band: Band;
  ownVolts: number;
  /**
   * Highest current (A, on the sheet's base) to draw the band to, as the trade ends a curve at the
   * maximum fault current at the device's location; the band's own `maxAmps` when omitted.
   */
  toAmps?: number;
}

/** A withstand curve; its amps × `scale` are amps on the sheet. */
export interface SheetWithstand {
  id: string;
  label: string;
  curve: WithstandCurve;
  scale: number;
}

/** A marker; its amps × `scale` are amps on the sheet. */
export type SheetMarker = Marker & { scale: number };

/** A motor starting curve; its amps × `scale` are amps on the sheet. */
export interface SheetStarting {
  id: string;
  label: string;
  curve: StartingCurve;
  scale: number;
}

/** A bus's fault current: `amps` on the sheet's base, `ownAmps` at the bus's `ownVolts`. */
export interface SheetFaultLine {
  busId: string;
  label: string;
  amps: number;
  ownVolts: number;
  ownAmps: number;
  kind: 'max' | 'min';
  /**
   * How a bus at another voltage gives the sheet's current, where it is not plainly the voltage ratio
   * ("through T1": the current flowing through that transformer), or what a ratio leaves out ("by the
   * voltage ratio; T1's primary lines carry 641 A"); the label says it after the sheet's current.
   */
  reflection?: string;
  /**
   * The operating scenario (or scenarios, as one phrase) the level belongs to, for a sheet that shows
   * the fault lines of several: it heads the line's label ("On generator: EMP 3.61 kA @ 480 V").
   */
  scenario?: string;
}

/** Status of a hatched region, as the overlap finder names it. */
export type RegionStatus = 'overlap' | 'thin margin' | 'not provable from curves';

/** A current interval (amps at the sheet's base) a finding marks on the sheet. */
export interface SheetRegion {
  fromAmps: number;
  toAmps: number;
  status: RegionStatus;
  label: string;
  findingId: string;
  /**
   * A few words on which fault the region is, where its currents are not the ones a reader would
   * assume ("secondary L-L": the fault's currents by the voltage ratio, the upstream band shifted);
   * the region's label on the plot ends with them.
   */
  fault?: string;
  /**
   * The two edges in conflict, on the sheet's base: the upstream device's band (its `minTime`, the
   * earliest operation) and the downstream device's (its `maxTime`, the latest clearing). When given,
   * only the area between them is hatched; otherwise the interval's whole height.
   */
  edges?: { upstream: Band; downstream: Band };
}

const REGION_STATUSES: readonly RegionStatus[] = ['overlap', 'thin margin', 'not provable from curves'];

/**
 * Checks the numbers and keywords of a sheet input and throws an `InputError` naming the first bad
 * field (`sheet.bands[2].ownVolts: expected a voltage in volts greater than 0, got "0"`). Returns the
 * input unchanged.
 * @example checkSheetInput(input).referenceVolts // 480
 */
export function checkSheetInput(input: SheetInput): SheetInput {
  positive('sheet.referenceVolts', input.referenceVolts, 'a voltage in volts greater than 0');
  text('sheet.caution', input.caution);
  input.bands.forEach((b, i) => {
    text(`sheet.bands[${i}].id`, b.id);
    positive(`sheet.bands[${i}].ownVolts`, b.ownVolts, 'a voltage in volts greater than 0');
    if (b.toAmps !== undefined) positive(`sheet.bands[${i}].toAmps`, b.toAmps, 'a current in amps greater than 0');
    if (typeof b.band?.minTime !== 'function' || typeof b.band?.maxTime !== 'function')
      throw new InputError(`sheet.bands[${i}].band`, expectedGot('a band with minTime and maxTime', b.band));
  });
  input.withstand.forEach((w, i) =>
    positive(`sheet.withstand[${i}].scale`, w.scale, 'a current factor greater than 0'),
  );
  input.starting.forEach((s, i) => positive(`sheet.starting[${i}].scale`, s.scale, 'a current factor greater than 0'));
  input.markers.forEach((m, i) => {
    positive(`sheet.markers[${i}].scale`, m.scale, 'a current factor greater than 0');
    positive(`sheet.markers[${i}].amps`, m.amps, 'a current in amps greater than 0');
    if (m.seconds !== undefined) positive(`sheet.markers[${i}].seconds`, m.seconds, 'a time in seconds greater than 0');
  });
  input.faultLines.forEach((f, i) => {
    positive(`sheet.faultLines[${i}].amps`, f.amps, 'a current in amps greater than 0');
    positive(`sheet.faultLines[${i}].ownAmps`, f.ownAmps, 'a current in amps greater than 0');
    positive(`sheet.faultLines[${i}].ownVolts`, f.ownVolts, 'a voltage in volts greater than 0');
    if (f.kind !== 'max' && f.kind !== 'min')
      throw new InputError(`sheet.faultLines[${i}].kind`, expectedGot('"max" or "min"', f.kind));
  });
  input.regions.forEach((r, i) => {
    if (!REGION_STATUSES.includes(r.status))
      throw new InputError(
        `sheet.regions[${i}].status`,
        expectedGot(REGION_STATUSES.map((s) => `"${s}"`).join(', '), r.status),
      );
    range(`sheet.regions[${i}]`, [r.fromAmps, r.toAmps], 'fromAmps and toAmps in amps with 0 < fromAmps < toAmps');
  });
  if (input.currentRange) range('sheet.currentRange', input.currentRange, 'two currents in amps with 0 < low < high');
  if (input.timeRange) range('sheet.timeRange', input.timeRange, 'two times in seconds with 0 < low < high');
  return input;
}

// Accepts a finite number above zero.
function positive(path: string, value: unknown, expected: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0)
    throw new InputError(path, expectedGot(expected, value));
}

// Accepts any string (labels may be empty, ids and the caution may not).
function text(path: string, value: unknown): void {
  if (typeof value !== 'string' || value.trim() === '')
    throw new InputError(path, expectedGot('a non-empty text', value));
}

// Accepts a finite, positive, strictly ascending pair.
function range(path: string, pair: readonly unknown[], expected: string): void {
  const [low, high] = pair;
  const ok =
    pair.length === 2 &&
    typeof low === 'number' &&
    typeof high === 'number' &&
    Number.isFinite(low) &&
    Number.isFinite(high) &&
    low > 0 &&
    high > low;
  if (!ok) throw new InputError(path, expectedGot(expected, pair));
}
