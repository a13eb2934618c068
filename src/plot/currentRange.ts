import { decadeRangeOf } from './scales.ts';
import type { SheetInput } from './sheetInput.ts';

/**
 * The current axis a sheet shows when none is given: decades around every band's pickup, every
 * curve and marker, fault line and region, with a little room at each end. When the sheet has
 * fault lines, the largest of those that matter (or a region beyond it) sets the top, as the trade
 * draws a sheet up to the available fault; otherwise band ends and curves do, and an open-ended band
 * shows a decade past its last breakpoint. The faults that matter are those of buses at the sheet's
 * own voltage when it has any: a medium-voltage fault reflected to a 480 V sheet (302 kA) is a
 * current no 480 V device there ever carries, and would push the axis to 1 MA.
 * @example inferCurrentRange(input) // [10, 100000]
 */
export function inferCurrentRange(input: SheetInput): [number, number] {
  const low: number[] = [];
  const high: number[] = [];
  for (const { band, toAmps } of input.bands) {
    low.push(band.minAmps);
    const end = Math.min(band.maxAmps, toAmps ?? Infinity);
    high.push(Number.isFinite(end) ? end : (band.breakpoints.at(-1) ?? band.minAmps) * 10);
  }
  const curves = [
    ...input.withstand.flatMap((w) => [...w.curve.amps].map((a) => a * w.scale)),
    ...input.starting.flatMap((s) => [...s.curve.amps].map((a) => a * s.scale)),
    ...input.markers.map((m) => m.amps * m.scale),
  ];
  low.push(...curves);
  high.push(...curves);
  for (const r of input.regions) low.push(r.fromAmps);
  const faults = faultsThatMatter(input).map((f) => f.amps);
  const top =
    faults.length > 0
      ? [...faults, ...input.regions.map((r) => r.toAmps)]
      : [...high, ...input.regions.map((r) => r.toAmps)];
  const [from] = decadeRangeOf([...low, ...faults], { pad: 1.2, minDecades: 0 });
  const [, to] = decadeRangeOf(top, { pad: 1.2, minDecades: 0 });
  // The two decade ends, widened to at least two decades (values just inside each end so none moves).
  return decadeRangeOf([from * 1.01, to / 1.01], { pad: 1, minDecades: 2 });
}

/**
 * The fault lines that set a sheet's current axis: those of buses at the sheet's reference voltage,
 * or all of them when none is at that voltage (a sheet on a base no bus has).
 * @example faultsThatMatter(input).map((f) => f.busId) // ['SWBD', 'MCC'] on a 480 V sheet
 */
export function faultsThatMatter(input: SheetInput): SheetInput['faultLines'] {
  const ref = input.referenceVolts;
  const own = input.faultLines.filter((f) => Math.abs(f.ownVolts - ref) <= 1e-9 * ref);
  return own.length > 0 ? own : input.faultLines;
}
