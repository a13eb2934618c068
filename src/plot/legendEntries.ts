import { formatVolts } from '../engine/quantity/format.ts';
import { faultDataId, faultLabel, faultLineDefaults } from './marks/faultLine.ts';
import type { LegendEntry } from './marks/legend.ts';
import { formatRange, overlapHatchDefaults } from './marks/overlapHatch.ts';
import { startingLineDefaults } from './marks/startingLine.ts';
import { withstandLineDefaults } from './marks/withstandLine.ts';
import type { SheetInput } from './sheetInput.ts';

/** The colours and patterns a sheet gave its curves, by id, and whether each band is one line. */
export interface SheetCodes {
  colours: Map<string, string>;
  coincident: Map<string, boolean>;
  /** Each band's edge dash pattern ('' for solid). */
  dashes: Map<string, string>;
  patternIds: Map<string, string>;
  markerColours: string[];
}

/**
 * The legend entries of a sheet (its key shows those the plot could not label), grouped in drawing order: devices, withstand curves, motor starting,
 * markers, fault currents, and the findings' regions. A curve drawn on another voltage base says so
 * ("480 V device, shown at 12.47 kV").
 * @example legendEntriesOf(input, codes).map((e) => e.group) // ['Devices', 'Devices', 'Fault current']
 */
export function legendEntriesOf(input: SheetInput, codes: SheetCodes): LegendEntry[] {
  const ref = input.referenceVolts;
  const base = (volts: number, what: string) =>
    Math.abs(volts - ref) <= 1e-9 * ref ? '' : ` (${formatVolts(volts)} ${what}, shown at ${formatVolts(ref)})`;
  const colour = (id: string) => codes.colours.get(id) ?? '#000000';
  const entries: LegendEntry[] = [];
  for (const b of input.bands)
    entries.push({
      group: 'Devices',
      text: `${b.label}${base(b.ownVolts, 'device')}`,
      swatch: {
        kind: 'band',
        colour: colour(b.id),
        coincident: codes.coincident.get(b.id) ?? false,
        dash: codes.dashes.get(b.id) || undefined,
      },
      dataId: b.id,
    });
  for (const w of input.withstand)
    entries.push({
      group: 'Withstand (damage) curves',
      text: `${w.label}${w.curve.label && w.curve.label !== w.label ? ` — ${w.curve.label}` : ''}${base(w.curve.volts, 'values')}`,
      swatch: {
        kind: 'line',
        colour: colour(w.id),
        dash: withstandLineDefaults.dash,
        width: withstandLineDefaults.strokeWidth,
      },
      dataId: w.id,
    });
  for (const s of input.starting)
    entries.push({
      group: 'Motor starting',
      text: `${s.label}${base(s.curve.volts, 'values')}`,
      swatch: {
        kind: 'line',
        colour: colour(s.id),
        dash: startingLineDefaults.dash,
        width: startingLineDefaults.strokeWidth,
        round: true,
      },
      dataId: s.id,
    });
  input.markers.forEach((m, i) =>
    entries.push({
      group: 'Markers',
      text: `${m.label}${base(m.volts, 'value')}`,
      swatch:
        m.seconds === undefined
          ? { kind: 'line', colour: codes.markerColours[i], dash: '2 3', width: 1 }
          : { kind: 'symbol', colour: codes.markerColours[i], symbol: m.kind },
      dataId: `${m.elementId}:${m.kind}:${i}`,
    }),
  );
  for (const f of input.faultLines)
    entries.push({
      group: 'Fault current',
      text: `${f.kind === 'max' ? 'Maximum' : 'Minimum'}: ${faultLabel(f, ref)}`,
      swatch: {
        kind: 'line',
        colour: faultLineDefaults.colour,
        width: faultLineDefaults.strokeWidth,
        ...(f.kind === 'min' ? { dash: faultLineDefaults.minDash } : {}),
      },
      dataId: faultDataId(f),
    });
  for (const r of input.regions)
    entries.push({
      group: 'Findings on this sheet',
      text: `${r.status[0].toUpperCase()}${r.status.slice(1)}, ${formatRange(r.fromAmps, r.toAmps)}${r.label ? `: ${r.label}` : ''}`,
      swatch: {
        kind: 'hatch',
        colour: overlapHatchDefaults[r.status].colour,
        patternId: codes.patternIds.get(r.status) ?? '',
      },
      dataId: r.findingId,
    });
  return entries;
}
