import { formatVolts } from '../engine/quantity/format.ts';
import type { Box, HatchPattern, Layer, Primitive, TextItem } from './geometry.ts';
import { candidatesAround, placeLabels, pointsAlong, type LabelCandidate, type LabelPlacement } from './layout.ts';
import { legendEntriesOf } from './legendEntries.ts';
import { axisX, axisY, plotFrame } from './marks/axis.ts';
import { BAND_DASHES, bandArea } from './marks/bandArea.ts';
import { faultBandHeight, faultLabelBand, faultLabelSlots, faultLine } from './marks/faultLine.ts';
import { gridX, gridY, halfCycleRule } from './marks/grid.ts';
import { labelItems, labelSize, type LabelSpec } from './marks/label.ts';
import { legend, legendHeight } from './marks/legend.ts';
import { marker } from './marks/marker.ts';
import { overlapHatch, overlapHatchDefaults } from './marks/overlapHatch.ts';
import { startingLine, startingLineDefaults } from './marks/startingLine.ts';
import { studyStrip } from './marks/studyStrip.ts';
import { withstandLine, withstandLineDefaults, type CurveGeometry } from './marks/withstandLine.ts';
import { curveColour, OKABE_ITO } from './palette.ts';
import { drawWindowOf, scalesOf, type DrawWindow, type PlotFrame, type SheetScales } from './scales.ts';
import { inferCurrentRange } from './currentRange.ts';
import { frameOf, type SheetFrame } from './sheetFrame.ts';
import { checkSheetInput, type RegionStatus, type SheetBand, type SheetInput } from './sheetInput.ts';
import type { BandTrace } from './bandTrace.ts';
import { resolveSheetOptions, type SheetOptions } from './sheetOptions.ts';
import { textWidth } from './textWidth.ts';

/** Default time axis of a sheet (s): the half-cycle line to 1000 s, as TCC paper prints it. */
export const DEFAULT_TIME_RANGE: [number, number] = [0.01, 1000];

/** A curve on the sheet, for the probe, the guide and the findings panel: what it is and the colour and edge pattern it got. */
export interface SheetCurve {
  id: string;
  kind: 'band' | 'withstand' | 'starting';
  label: string;
  colour: string;
  /** SVG dash array of its lines ('' for solid). */
  dash: string;
}

/** A placed label: its text, box (px) and the curve or line it names. */
export interface SheetLabel extends LabelPlacement {
  dataId: string;
  text: string;
}

/**
 * A TCC sheet as plain geometry, ready for `svgOf` or any renderer: the size, the plot frame and
 * scales, hatch patterns, and layers of primitives in paint order. Structured-cloneable.
 */
export interface Sheet {
  width: number;
  height: number;
  fontFamily: string;
  /** The title, for the SVG's `<title>`. */
  title: string;
  /** One sentence describing the sheet, for the SVG's `<desc>`. */
  description: string;
  frame: PlotFrame;
  scales: SheetScales;
  /** Where curves are drawn: the half-cycle line (or the axis bottom) to the top of the sheet. */
  window: DrawWindow;
  patterns: HatchPattern[];
  layers: Layer[];
  labels: SheetLabel[];
  curves: SheetCurve[];
  /** What could not be drawn as asked (a curve off the sheet, a label with no room), for the user. */
  diagnostics: string[];
}

/**
 * Builds a TCC sheet from its input: ranges (given, or decades around what matters; time
 * 0.01–1000 s by default), the study strip across the top (title, revision, date, details,
 * caution), the fault currents' labels set level in a band above the plot, the log-log grid and
 * axes, the findings' regions hatched between the edges in conflict, bands (each with its own
 * colour and edge pattern), withstand and starting curves, markers, every curve labelled where it
 * runs (with a leader when it must stand off), and a key under the axis for whatever could not be
 * labelled. Pure: same input and options, same sheet.
 * @example svgOf(sheetOf(input, { width: 960, height: 720 }))
 */
export function sheetOf(input: SheetInput, options: SheetOptions = {}): Sheet {
  checkSheetInput(input);
  const resolved = resolveSheetOptions(options);
  const { fontSize, idPrefix, margin, width } = resolved;

  // Stage 1: ranges; the strip and the fault-label band, whose heights set where the plot starts.
  const ranges = {
    current: input.currentRange ?? inferCurrentRange(input),
    time: input.timeRange ?? DEFAULT_TIME_RANGE,
  };
  const brief = resolved.studyDetails === 'brief';
  const stripWith = (parts: Partial<SheetInput>) =>
    studyStrip({ ...input, ...parts }, { x: margin, y: margin, width: width - 2 * margin, fontSize });
  const fullStrip = stripWith(brief ? { notes: undefined, caution: '' } : {});
  // A short sheet may leave out its notes before its plot drops below its minimum height; never the caution.
  const briefStrip = brief ? fullStrip : stripWith({ notes: undefined });
  const across = frameOf(ranges, { strip: fullStrip.height, faults: 0, key: 0 }, resolved);
  const faultSlots = faultLabelSlots(input.faultLines, scalesOf(ranges, across.plot), {
    fontSize,
    referenceVolts: input.referenceVolts,
  });
  const faultBand = faultBandHeight(faultSlots.rows, fontSize);

  // Stage 2: one colour and one edge pattern per curve in drawing order, one hatch pattern per region status present.
  const curves: SheetCurve[] = [
    ...input.bands.map((b, i) => ({
      id: b.id,
      kind: 'band' as const,
      label: b.label,
      dash: BAND_DASHES[i % BAND_DASHES.length],
    })),
    ...input.withstand.map((w) => ({
      id: w.id,
      kind: 'withstand' as const,
      label: w.label,
      dash: withstandLineDefaults.dash,
    })),
    ...input.starting.map((s) => ({
      id: s.id,
      kind: 'starting' as const,
      label: s.label,
      dash: startingLineDefaults.dash,
    })),
  ].map((c, i) => ({ ...c, colour: curveColour(i) }));
  const colours = new Map(curves.map((c) => [c.id, c.colour]));
  const dashes = new Map(curves.map((c) => [c.id, c.dash]));
  const statuses = [...new Set(input.regions.map((r) => r.status))];
  const patterns: HatchPattern[] = statuses.map((s, i) => ({
    id: `${idPrefix}-hatch-${i + 1}`,
    ...overlapHatchDefaults[s],
  }));
  const patternIds = new Map<RegionStatus, string>(statuses.map((s, i) => [s, patterns[i].id]));
  const markerColours = input.markers.map((m) => colours.get(m.elementId) ?? OKABE_ITO.black);

  // Stage 3: the plot with its labels, laid out once with no key; again with room for the key if some label found no place.
  const entries = legendEntriesOf(input, { colours, coincident: new Map(), dashes, patternIds, markerColours });
  let key = 0;
  let keyLeast = 0;
  const bands = () => ({ strip: fullStrip.height, stripBrief: briefStrip.height, faults: faultBand, key, keyLeast });
  const traces = new Map<SheetBand, { key: string; trace: BandTrace | null }>();
  let plot = drawPlot(input, frameOf(ranges, bands(), resolved), {
    ranges,
    colours,
    dashes,
    patternIds,
    markerColours,
    fontSize,
    traces,
  });
  const keyWidth = width - 2 * margin;
  const keyEntriesOf = (p: DrawnPlot) => {
    const missing = new Set(p.unplacedDataIds);
    return legendEntriesOf(input, { colours, coincident: p.coincident, dashes, patternIds, markerColours }).filter(
      (e) => missing.has(e.dataId) && e.group !== 'Fault current',
    );
  };
  let keyEntries = keyEntriesOf(plot);
  if (keyEntries.length > 0) {
    // The key may take up to a quarter of the sheet; what does not fit even then is counted and named in the notes.
    key = Math.min(legendHeight(keyEntries, keyWidth, fontSize), resolved.height / 4);
    // Its least: the heading and the "+ n more" line.
    keyLeast = legend(keyEntries, { box: { x: 0, y: 0, width: keyWidth }, fontSize, maxHeight: 0 }).height;
    plot = drawPlot(input, frameOf(ranges, bands(), resolved), {
      ranges,
      colours,
      dashes,
      patternIds,
      markerColours,
      fontSize,
      traces,
    });
    keyEntries = keyEntriesOf(plot);
  }
  const { frame, scales } = plot;
  const diagnostics = [...plot.diagnostics];
  const keyGeometry = legend(keyEntries, {
    box: { x: margin, y: frame.keyTop, width: keyWidth },
    maxHeight: frame.keyHeight,
    fontSize,
  });
  const strip = frame.stripBrief ? briefStrip : fullStrip;
  if (frame.stripBrief && briefStrip.height < fullStrip.height)
    diagnostics.push('The study strip leaves out its notes to keep the plot readable; enlarge the sheet to show them');
  for (const e of keyEntries.slice(keyGeometry.shown))
    diagnostics.push(`"${e.text}" has no room on the plot or in its key; enlarge the sheet to see it named there`);
  void entries;

  const faultItems = faultLabelBand(faultSlots.slots, faultSlots.rows, {
    left: frame.plot.left,
    right: frame.plot.right,
    bottom: frame.plot.top,
    fontSize,
  });
  const layers: Layer[] = [
    ...plot.layers,
    { name: 'fault-labels', items: faultItems },
    { name: 'legend', items: keyGeometry.items },
    { name: 'study-strip', items: strip.items },
  ];
  return {
    width: resolved.width,
    height: resolved.height,
    fontFamily: resolved.fontFamily,
    title: input.title,
    description: `Time-current curves of ${input.study}, view ${input.view}, currents at ${formatVolts(input.referenceVolts)}.`,
    frame: frame.plot,
    scales,
    window: drawWindowOf(scales),
    patterns,
    layers,
    labels: plot.labels,
    curves,
    diagnostics,
  };
}

/** The plot region of a sheet, drawn for one frame: its layers, placed labels, and what could not be labelled. */
interface DrawnPlot {
  frame: SheetFrame;
  scales: SheetScales;
  layers: Layer[];
  labels: SheetLabel[];
  /** Data ids of curves, markers and regions whose label found no place on the plot. */
  unplacedDataIds: string[];
  coincident: Map<string, boolean>;
  diagnostics: string[];
}

// Accepts the input, a frame and the sheet's codes; the plot drawn in that frame with every label placed that fits.
function drawPlot(
  input: SheetInput,
  frame: SheetFrame,
  codes: {
    ranges: { current: [number, number]; time: [number, number] };
    colours: Map<string, string>;
    dashes: Map<string, string>;
    patternIds: Map<RegionStatus, string>;
    markerColours: string[];
    fontSize: number;
    traces: Map<SheetBand, { key: string; trace: BandTrace | null }>;
  },
): DrawnPlot {
  const { colours, dashes, patternIds, markerColours, fontSize } = codes;
  const scales = scalesOf(codes.ranges, frame.plot);
  const diagnostics: string[] = [];
  const specs: LabelSpec[] = [];
  const lines: Float64Array[] = [];
  const lineOwners: (string | undefined)[] = [];
  const addLines = (owner: string | undefined, more: Float64Array[]) => {
    lines.push(...more);
    lineOwners.push(...more.map(() => owner));
  };
  const ref = input.referenceVolts;
  const otherBase = (volts: number) => (Math.abs(volts - ref) <= 1e-9 * ref ? '' : ` (${formatVolts(volts)})`);

  // Regions first: their labels are asked for after the markers', before the curves'.
  const regionItems: Primitive[] = [];
  const regionSpecs: LabelSpec[] = [];
  input.regions.forEach((r, i) => {
    const g = overlapHatch(r, i, scales, { patternId: patternIds.get(r.status)!, fontSize });
    regionItems.push(...g.items);
    if (g.label) regionSpecs.push(g.label);
  });
  const fills: Primitive[] = [];
  const edges: Primitive[] = [];
  const coincident = new Map<string, boolean>();
  const curveSpecs: LabelSpec[] = [];
  for (const b of input.bands) {
    const g = bandArea(b, scales, { colour: colours.get(b.id)!, dash: dashes.get(b.id), traces: codes.traces });
    coincident.set(b.id, !g.items.some((p) => p.role === 'band-fill') && g.items.length > 0);
    fills.push(...g.items.filter((p) => p.role === 'band-fill'));
    edges.push(...g.items.filter((p) => p.role !== 'band-fill'));
    addLines(b.id, g.strokes);
    if (g.strokes.length === 0)
      diagnostics.push(`${b.label} is outside the sheet's current or time range and is not drawn`);
    else
      curveSpecs.push(curveLabel(b.id, `${b.label}${otherBase(b.ownVolts)}`, colours.get(b.id)!, g.strokes, fontSize));
  }
  const others: Primitive[] = [];
  const addCurve = (id: string, label: string, g: CurveGeometry) => {
    others.push(...g.items);
    addLines(id, g.strokes);
    if (g.strokes.length === 0)
      diagnostics.push(`${label} is outside the sheet's current or time range and is not drawn`);
    else curveSpecs.push(curveLabel(id, label, colours.get(id)!, g.strokes, fontSize));
  };
  for (const w of input.withstand) addCurve(w.id, w.label, withstandLine(w, scales, { colour: colours.get(w.id)! }));
  for (const s of input.starting) addCurve(s.id, s.label, startingLine(s, scales, { colour: colours.get(s.id)! }));
  const faultItems: Primitive[] = [];
  for (const f of input.faultLines) {
    const g = faultLine(f, scales, {});
    faultItems.push(...g.items);
    for (const p of g.items) if (p.points) addLines(undefined, [p.points]);
  }
  const markerItems: Primitive[] = [];
  input.markers.forEach((m, i) => {
    const g = marker(m, i, scales, { colour: markerColours[i], fontSize });
    markerItems.push(...g.items);
    if (g.label) specs.push(g.label);
    else diagnostics.push(`marker ${m.label} is outside the sheet's ranges`);
  });
  specs.push(...regionSpecs, ...curveSpecs);

  // Labels, tightest first (markers, regions), then curves, clear of the half-cycle note.
  const halfCycle = halfCycleRule(scales, fontSize);
  const bounds = {
    x: frame.plot.left,
    y: frame.plot.top,
    width: frame.plot.right - frame.plot.left,
    height: frame.plot.bottom - frame.plot.top,
  };
  const { placed, unplaced } = placeLabels(
    specs.map((s) => ({
      id: s.id,
      width: s.candidates[0]?.box.width ?? 0,
      height: s.candidates[0]?.box.height ?? 0,
      anchor: s.anchor,
      candidates: s.candidates,
    })),
    { bounds, lines, lineOwners, obstacles: halfCycle.filter((p) => p.type === 'text').map(textBox) },
  );
  const byId = new Map(specs.map((s) => [s.id, s]));
  const labelLayer = placed.flatMap((p) => labelItems(byId.get(p.id)!, p, {}));

  const currentTitle = `Current in amperes at ${formatVolts(input.referenceVolts)}`;
  const { grid, axes } = gridAndAxesOf(scales, fontSize, currentTitle);
  const layers: Layer[] = [
    { name: 'grid', items: grid },
    { name: 'band-fills', items: fills },
    { name: 'regions', items: regionItems },
    { name: 'half-cycle', items: halfCycle },
    { name: 'curves', items: [...others, ...edges] },
    { name: 'fault-lines', items: faultItems },
    { name: 'markers', items: markerItems },
    { name: 'frame', items: [plotFrame(scales)] },
    { name: 'axes', items: axes },
    { name: 'labels', items: labelLayer },
  ];
  return {
    frame,
    scales,
    layers,
    labels: placed.map((p) => ({ ...p, dataId: byId.get(p.id)!.dataId, text: byId.get(p.id)!.text })),
    unplacedDataIds: unplaced.map((id) => byId.get(id)!.dataId),
    coincident,
    diagnostics,
  };
}

// Accepts a curve's visible lines; a bold label request, whole, at points spread along them.
function curveLabel(id: string, label: string, colour: string, strokes: Float64Array[], fontSize: number): LabelSpec {
  const { width, height } = labelSize(label, fontSize, 'bold');
  const line = longest(strokes);
  const count = 12;
  const anchors = pointsAlong(line, count);
  const middle = (count - 1) / 2;
  // Prefer the middle of the curve a little (its ends crowd into pickups and the sheet's edges), and a label close to it.
  const candidates: LabelCandidate[] = [];
  anchors.forEach((a, k) => {
    candidates.push(...candidatesAround(a, width, height, 3, Math.abs(k - middle) * 0.08));
    candidates.push(...candidatesAround(a, width, height, 14, 1.5 + Math.abs(k - middle) * 0.08));
  });
  return {
    id,
    dataId: id,
    text: label,
    colour,
    size: fontSize,
    weight: 'bold',
    anchor: anchors[Math.floor(anchors.length / 2)] ?? [0, 0],
    candidates,
  };
}

/**
 * The grid and axes of the last few sheets' scales. An edit draws its sheet again at the same scales,
 * and these were a sixth of drawing it. The items are shared by the sheets drawn at those scales,
 * read-only as every primitive of a sheet is.
 */
const gridsAndAxes = new Map<string, { grid: Primitive[]; axes: Primitive[] }>();
const GRIDS_KEPT = 8;

function gridAndAxesOf(scales: SheetScales, fontSize: number, currentTitle: string) {
  const key = `${scales.x.domain}|${scales.x.range}|${scales.y.domain}|${scales.y.range}|${fontSize}|${currentTitle}`;
  let marks = gridsAndAxes.get(key);
  if (!marks) {
    marks = {
      grid: [...gridX(scales, {}), ...gridY(scales, {})],
      axes: [
        ...axisX(scales, { title: currentTitle, fontSize }),
        ...axisY(scales, { title: 'Time in seconds', fontSize }),
      ],
    };
    if (gridsAndAxes.size >= GRIDS_KEPT) gridsAndAxes.delete(gridsAndAxes.keys().next().value!);
    gridsAndAxes.set(key, marks);
  }
  return marks;
}

// Accepts one unrotated line of text; the box its glyphs take.
function textBox(item: TextItem): Box {
  const width = textWidth(item.text, item.size, item.weight);
  const x = item.anchor === 'end' ? item.x - width : item.anchor === 'middle' ? item.x - width / 2 : item.x;
  return { x, y: item.y - item.size * 0.93, width, height: item.size * 1.17 };
}

// Accepts polylines; the one with the most points.
function longest(lines: Float64Array[]): Float64Array {
  return lines.reduce((a, b) => (b.length > a.length ? b : a));
}
