import { decadeRangeOf } from './scales.ts';
import type { SheetInput } from './sheetInput.ts';

/**
 * The current axis a sheet shows when none is given: decades around every band's pickup, every
 * curve and marker, fault line and region, with a little room at each end. When the sheet has
 * fault lines, the largest of them (or a region beyond it) sets the top, as the trade draws a
 * sheet up to the available fault; otherwise band ends and curves do, and an open-ended band shows
 * a decade past its last breakpoint.
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
  const faults = input.faultLines.map((f) => f.amps);
  const top =
    faults.length > 0
      ? [...faults, ...input.regions.map((r) => r.toAmps)]
      : [...high, ...input.regions.map((r) => r.toAmps)];
  const [from] = decadeRangeOf([...low, ...faults], { pad: 1.2, minDecades: 0 });
  const [, to] = decadeRangeOf(top, { pad: 1.2, minDecades: 0 });
  // The two decade ends, widened to at least two decades (values just inside each end so none moves).
  return decadeRangeOf([from * 1.01, to / 1.01], { pad: 1, minDecades: 2 });
}
