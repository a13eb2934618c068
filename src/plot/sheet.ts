import { formatVolts } from '../engine/quantity/format.ts';
import type { Box, HatchPattern, Layer, Primitive, TextItem } from './geometry.ts';
import { candidatesAround, placeLabels, pointsAlong, type LabelPlacement } from './layout.ts';
import { legendEntriesOf } from './legendEntries.ts';
import { axisX, axisY, plotFrame } from './marks/axis.ts';
import { bandArea } from './marks/bandArea.ts';
import { caution } from './marks/caution.ts';
import { faultLine } from './marks/faultLine.ts';
import { gridX, gridY, halfCycleRule } from './marks/grid.ts';
import { labelItems, labelSize, type LabelSpec } from './marks/label.ts';
import { legend } from './marks/legend.ts';
import { marker } from './marks/marker.ts';
import { overlapHatch, overlapHatchDefaults } from './marks/overlapHatch.ts';
import { startingLine } from './marks/startingLine.ts';
import { sheetTitle, titleBlock } from './marks/titleBlock.ts';
import { withstandLine, type CurveGeometry } from './marks/withstandLine.ts';
import { curveColour, OKABE_ITO } from './palette.ts';
import { drawWindowOf, scalesOf, type DrawWindow, type PlotFrame, type SheetScales } from './scales.ts';
import { inferCurrentRange } from './currentRange.ts';
import { frameOf } from './sheetFrame.ts';
import { checkSheetInput, type RegionStatus, type SheetInput } from './sheetInput.ts';
import { resolveSheetOptions, type SheetOptions } from './sheetOptions.ts';
import { textWidth, truncateText } from './textWidth.ts';

/** Default time axis of a sheet (s): the half-cycle line to 1000 s, as TCC paper prints it. */
export const DEFAULT_TIME_RANGE: [number, number] = [0.01, 1000];

/** A curve on the sheet, for the probe and the findings panel: what it is and the colour it got. */
export interface SheetCurve {
  id: string;
  kind: 'band' | 'withstand' | 'starting';
  label: string;
  colour: string;
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
 * Builds a TCC sheet from its input: ranges (given, or decades around what is shown; time
 * 0.01–1000 s by default), the frame, the log-log grid and axes, hatched finding regions, bands,
 * withstand and starting curves, fault lines, markers, labels placed without collisions, the
 * legend, title block, title and caution. Pure: same input and options, same sheet.
 * @example svgOf(sheetOf(input, { width: 960, height: 720 }))
 */
export function sheetOf(input: SheetInput, options: SheetOptions = {}): Sheet {
  checkSheetInput(input);
  const resolved = resolveSheetOptions(options);
  const { fontSize, idPrefix } = resolved;

  // Stage 1: ranges, frame and scales.
  const ranges = {
    current: input.currentRange ?? inferCurrentRange(input),
    time: input.timeRange ?? DEFAULT_TIME_RANGE,
  };
  const frame = frameOf(ranges, input.caution, resolved);
  const scales = scalesOf(ranges, frame.plot);
  const diagnostics: string[] = [];

  // Stage 2: one colour per curve in drawing order, one hatch pattern per region status present.
  const curves: SheetCurve[] = [
    ...input.bands.map((b) => ({ id: b.id, kind: 'band' as const, label: b.label })),
    ...input.withstand.map((w) => ({ id: w.id, kind: 'withstand' as const, label: w.label })),
    ...input.starting.map((s) => ({ id: s.id, kind: 'starting' as const, label: s.label })),
  ].map((c, i) => ({ ...c, colour: curveColour(i) }));
  const colours = new Map(curves.map((c) => [c.id, c.colour]));
  const statuses = [...new Set(input.regions.map((r) => r.status))];
  const patterns: HatchPattern[] = statuses.map((s, i) => ({
    id: `${idPrefix}-hatch-${i + 1}`,
    ...overlapHatchDefaults[s],
  }));
  const patternIds = new Map<RegionStatus, string>(statuses.map((s, i) => [s, patterns[i].id]));

  // Stage 3: the marks, each giving primitives and, where it names something on the plot, a label request.
  const specs: LabelSpec[] = [];
  const lines: Float64Array[] = [];
  const lineOwners: (string | undefined)[] = [];
  const addLines = (owner: string | undefined, more: Float64Array[]) => {
    lines.push(...more);
    lineOwners.push(...more.map(() => owner));
  };
  const regionItems: Primitive[] = [];
  input.regions.forEach((r, i) => {
    const g = overlapHatch(r, i, scales, { patternId: patternIds.get(r.status)!, fontSize });
    regionItems.push(...g.items);
    if (g.label) specs.push(g.label);
  });
  const fills: Primitive[] = [];
  const edges: Primitive[] = [];
  const coincident = new Map<string, boolean>();
  const curveSpecs: LabelSpec[] = [];
  const maxLabel = Math.min(200, (frame.plot.right - frame.plot.left) / 3);
  for (const b of input.bands) {
    const g = bandArea(b, scales, { colour: colours.get(b.id)! });
    coincident.set(b.id, !g.items.some((p) => p.role === 'band-fill') && g.items.length > 0);
    fills.push(...g.items.filter((p) => p.role === 'band-fill'));
    edges.push(...g.items.filter((p) => p.role !== 'band-fill'));
    addLines(b.id, g.strokes);
    if (g.strokes.length === 0)
      diagnostics.push(`${b.label} is outside the sheet's current or time range and is not drawn`);
    else curveSpecs.push(curveLabel(b.id, b.label, colours.get(b.id)!, g.strokes[0], fontSize, maxLabel));
  }
  const others: Primitive[] = [];
  const addCurve = (id: string, label: string, g: CurveGeometry) => {
    others.push(...g.items);
    addLines(id, g.strokes);
    if (g.strokes.length === 0)
      diagnostics.push(`${label} is outside the sheet's current or time range and is not drawn`);
    else curveSpecs.push(curveLabel(id, label, colours.get(id)!, longest(g.strokes), fontSize, maxLabel));
  };
  for (const w of input.withstand) addCurve(w.id, w.label, withstandLine(w, scales, { colour: colours.get(w.id)! }));
  for (const s of input.starting) addCurve(s.id, s.label, startingLine(s, scales, { colour: colours.get(s.id)! }));
  const faultItems: Primitive[] = [];
  for (const f of input.faultLines) {
    const g = faultLine(f, scales, { fontSize, referenceVolts: input.referenceVolts });
    faultItems.push(...g.items);
    for (const p of g.items) if (p.type === 'path' && p.points) addLines(undefined, [p.points]);
    if (g.label) specs.unshift(g.label);
    else diagnostics.push(`fault line ${f.label} (${f.kind}) is outside the sheet's current range`);
  }
  const markerColours = input.markers.map((m) => colours.get(m.elementId) ?? OKABE_ITO.black);
  const markerItems: Primitive[] = [];
  input.markers.forEach((m, i) => {
    const g = marker(m, i, scales, { colour: markerColours[i], fontSize });
    markerItems.push(...g.items);
    if (g.label) specs.unshift(g.label);
    else diagnostics.push(`marker ${m.label} is outside the sheet's ranges`);
  });
  specs.push(...curveSpecs);

  // Stage 4: labels, tightest first (markers, fault lines), then regions and curves, clear of the half-cycle note.
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
  for (const id of unplaced)
    diagnostics.push(`no room on the plot for the label "${byId.get(id)?.text}"; it is in the legend`);

  // Stage 5: the right-hand column (title block at the foot, legend above), title and caution.
  const block = titleBlock(input, { x: frame.panel.x, bottom: frame.panel.bottom, width: frame.panel.width, fontSize });
  const entries = legendEntriesOf(input, { colours, coincident, patternIds, markerColours });
  const legendBox = {
    x: frame.panel.x,
    y: frame.panel.top,
    width: frame.panel.width,
    height: block.top - 12 - frame.panel.top,
  };
  const key = legend(entries, { box: legendBox, fontSize });
  if (key.shown < entries.length)
    diagnostics.push(`the legend shows ${key.shown} of ${entries.length} entries; enlarge the sheet to show all`);
  const title = sheetTitle(input.title, {
    x: frame.plot.left,
    y: frame.titleBaseline,
    width: resolved.width - 2 * resolved.margin - frame.plot.left,
    fontSize,
  });
  const cautionItems = caution(input.caution, {
    x: resolved.margin,
    y: frame.cautionTop,
    width: resolved.width - 2 * resolved.margin,
    fontSize,
  });

  const currentTitle = `Current in amperes at ${formatVolts(input.referenceVolts)}`;
  const layers: Layer[] = [
    { name: 'grid', items: [...gridX(scales, {}), ...gridY(scales, {})] },
    { name: 'regions', items: regionItems },
    { name: 'band-fills', items: fills },
    { name: 'half-cycle', items: halfCycle },
    { name: 'curves', items: [...others, ...edges] },
    { name: 'fault-lines', items: faultItems },
    { name: 'markers', items: markerItems },
    { name: 'frame', items: [plotFrame(scales)] },
    {
      name: 'axes',
      items: [
        ...axisX(scales, { title: currentTitle, fontSize }),
        ...axisY(scales, { title: 'Time in seconds', fontSize }),
      ],
    },
    { name: 'labels', items: labelLayer },
    { name: 'legend', items: key.items },
    { name: 'title-block', items: block.items },
    { name: 'title', items: [title] },
    { name: 'caution', items: cautionItems },
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
    labels: placed.map((p) => ({ ...p, dataId: byId.get(p.id)!.dataId, text: byId.get(p.id)!.text })),
    curves,
    diagnostics,
  };
}

// Accepts a curve's first visible line; a bold label request at points spread along it.
function curveLabel(
  id: string,
  label: string,
  colour: string,
  line: Float64Array,
  fontSize: number,
  maxWidth: number,
): LabelSpec {
  // On the plot a long name is cut; the legend carries it whole.
  const text = truncateText(label, maxWidth, fontSize, 'bold');
  const { width, height } = labelSize(text, fontSize, 'bold');
  const anchors = pointsAlong(line, 12);
  // Prefer the middle of the curve a little (its ends crowd into pickups and the sheet's edges), and a label close to it.
  const candidates = anchors.flatMap((a, k) => [
    ...candidatesAround(a, width, height, 3, Math.abs(k - 5.5) * 0.08),
    ...candidatesAround(a, width, height, 14, 1.5 + Math.abs(k - 5.5) * 0.08),
  ]);
  return {
    id,
    dataId: id,
    text,
    colour,
    size: fontSize,
    weight: 'bold',
    anchor: anchors[Math.floor(anchors.length / 2)] ?? [0, 0],
    candidates,
  };
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
