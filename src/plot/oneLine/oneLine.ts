import type { Analysis } from '../../engine/analysis.ts';
import { CAUTION } from '../../engine/caution.ts';
import type { Severity } from '../../engine/checks/finding.ts';
import { formatAmps, formatVolts, significant } from '../../engine/quantity/format.ts';
import { switchSettingsOf, type SwitchSetting } from '../../engine/scenario/index.ts';
import { sameNetworkInputs } from '../../engine/network/sameNetworkInputs.ts';
import type { Device, Study } from '../../engine/study/index.ts';
import type { Box, Primitive, TextItem } from '../geometry.ts';
import { OKABE_ITO, SHEET_COLOURS } from '../palette.ts';
import { fixed } from '../precision.ts';
import type { Drawing } from '../svg.ts';
import { textWidth, wrapText } from '../textWidth.ts';
import { layoutOneLine, type Drop, type OpenSwitch } from './oneLineLayout.ts';
import {
  busSymbol,
  cableSymbol,
  continuationLink,
  deviceSymbol,
  findingMark,
  motorSymbol,
  sourceSymbol,
  switchSymbol,
  symbolDefaults,
  transferSwitchSymbol,
  transformerSymbol,
} from './symbols.ts';
import { addToList } from '../../engine/addToList.ts';

/** How the one-line diagram is laid out. */
export const oneLineDefaults = {
  fontSize: 11,
  lineHeight: 1.3,
  /** px from a column's left edge to its run's line: room for a relay's circle and finding marks on the left. */
  gutter: 52,
  /** px between a symbol and its label. */
  labelGap: 14,
  /** px right of the widest label before the next column. */
  columnPadding: 18,
  margin: 24,
  /** px of the header strip (study name, caution). */
  header: 58,
  /**
   * px: the widest a diagram is drawn before a bus with many branches goes on under a continuation bar.
   * Twice the printable width of Letter landscape (696 pt between the report's 48-pt margins), so a
   * diagram at the limit prints its 11-px labels at 5.5 pt across that page. Not narrower: every row
   * wrapped adds height, and a portrait page then shrinks a large study by its height instead (the
   * whole-site demo's overview prints at 3.35 pt on Letter portrait at this width, 2.7 pt at 946 px;
   * the report then prints it again in tiles at 6 pt, `src/report/figureTiles.ts`).
   */
  maxWidth: 1400,
  fontFamily: 'DejaVu Sans, Arial, Helvetica, sans-serif',
} as const;

/** Options of {@link oneLineOf}. */
export interface OneLineOptions {
  /** Prefix for nothing yet but kept for parity with the sheet; element ids are the study's. */
  title?: string;
}

/** Where an element landed, for hit-testing and tests: its symbol box and its label box. */
export interface OneLinePlace {
  id: string;
  type: 'source' | 'bus' | 'transformer' | 'cable' | 'switch' | 'motor' | 'device';
  symbol: Box;
  label: Box;
}

/** A one-line diagram: a drawing `svgOf` writes, plus where each element is. */
export interface OneLine extends Drawing {
  /** Each element once, where it is drawn. */
  places: OneLinePlace[];
  /** Each continuation bar of a bus too wide for one row: its bar and label, under the bus's id. */
  continuations: OneLinePlace[];
}

/**
 * Draws a study as the trade draws it: a radial one-line diagram top-down from the source, with a
 * symbol of our own drawing for each source, bus, transformer (with its winding connection), cable,
 * motor and protective device, each labelled with its name and key rating, each bus with its maximum
 * and minimum three-phase fault current, and the elements a failing or warning finding concerns
 * marked with a shape as well as a colour. Switches are drawn as a scenario's part sets them
 * (`switchSettingsOf`): a transfer switch on the side it is on, a closed tie closed, and an open tie
 * or a transfer switch's idle side as an open switch under the bus it hangs from, labelled with the
 * bus across it. A bus whose branches side by side would make the diagram wider than
 * `oneLineDefaults.maxWidth` goes on under a bar of its own below, labelled as the same bus continued and
 * linked to it by a dashed line. Pure: same analysis, same diagram.
 * @example svgOf(oneLineOf(analyseStudy(study)))
 */
export function oneLineOf(analysis: Analysis, options: OneLineOptions = {}): OneLine {
  return oneLineWithMarks(oneLineBaseOf(analysis, options), analysis.findings);
}

/**
 * A one-line diagram without its finding marks, and where each element's mark goes. Everything in it
 * comes from the network, the fault levels and what the labels name (`sameOneLineBase`), so an edit of
 * a device's settings, whose findings alone change, keeps it: a large site's takes tens of milliseconds.
 */
export interface OneLineBase {
  drawing: Omit<OneLine, 'layers'> & { layers: Drawing['layers'] };
  /** Where a failing or warning finding's mark goes, for each element that can have one, in drawing order. */
  markSpots: { id: string; x: number; y: number }[];
}

/** A diagram's base with the marks of the findings on it: `oneLineOf`'s result. @example oneLineWithMarks(oneLineBaseOf(analysis), analysis.findings) */
export function oneLineWithMarks(base: OneLineBase, findings: Analysis['findings']): OneLine {
  const severityOf = worstSeverities(findings);
  const marks: Primitive[] = [];
  for (const { id, x, y } of base.markSpots) {
    const severity = severityOf.get(id);
    if (severity === 'fail') marks.push(...findingMark('fail', x, y, id, OKABE_ITO.vermillion));
    else if (severity === 'warning') marks.push(...findingMark('warning', x, y, id, OKABE_ITO.orange));
  }
  return { ...base.drawing, layers: [...base.drawing.layers, { name: 'findings', items: marks }] };
}

/**
 * True when `next` draws the same base as `previous` (`oneLineBaseOf`, same options): the same fault
 * levels and network (an edit of a device's settings keeps both), the same header, each device with
 * the name, kind and rating its label shows, and the switches set as before.
 *
 * @example sameOneLineBase(analysis, analysisAfterAPickupEdit) // true
 */
export function sameOneLineBase(previous: Analysis, next: Analysis): boolean {
  const [a, b] = [previous.study, next.study];
  if (previous.faults !== next.faults || !sameNetworkInputs(a, b)) return false;
  if (switchSettingsOf(a) !== switchSettingsOf(b)) return false;
  if (HEADER_FIELDS.some((field) => a[field] !== b[field])) return false;
  return (
    a.devices === b.devices ||
    a.devices.every((device, i) => {
      const other = b.devices[i];
      return (
        device === other ||
        (device.name === other.name &&
          device.rating === other.rating &&
          device.characteristic.kind === other.characteristic.kind)
      );
    })
  );
}

/** The study's fields the header and the title read. */
const HEADER_FIELDS = [
  'name',
  'site',
  'client',
  'revisions',
  'date',
  'preparedBy',
] as const satisfies readonly (keyof Study)[];

/** What a diagram's base is drawn from. */
type BaseInputs = Pick<Analysis, 'study' | 'network' | 'faults'>;

/** Draws the diagram without its finding marks (see `OneLineBase`). @example oneLineBaseOf(analysis).markSpots.length */
export function oneLineBaseOf(analysis: BaseInputs, options: OneLineOptions = {}): OneLineBase {
  const { study, network } = analysis;
  const { fontSize, lineHeight, gutter, labelGap, columnPadding, margin, header, maxWidth, fontFamily } =
    oneLineDefaults;
  const step = fontSize * lineHeight;
  const row = Math.max(3 * step, symbolDefaults.size + 10);
  const busRow = 2 * step + 8;
  const levelHeight = 3 * row + busRow + 12;
  // A continuation bar's label sits over it (busRow), the bar 12 px above its runs, and 16 px clear of the row above.
  const continuedHeight = busRow + 12 + 16;
  // The link between a bus's bars runs down its own line; its branches start clear of it and of their finding marks.
  const linkLane = gutter + 8;

  const switches = switchesOf(analysis);
  // Each run's labels, written once for measuring its column and again read to draw it.
  const labelsByDrop = new Map<object, { feeder: string[]; element: string[]; main: string[]; bus: string[] }>();
  const labelsOf = (drop: Omit<Drop, 'x' | 'width' | 'top' | 'barRow'>) => {
    let labels = labelsByDrop.get(drop);
    if (!labels)
      labelsByDrop.set(
        drop,
        (labels = {
          feeder: drop.feeder ? deviceLines(drop.feeder) : [],
          element: elementLines(analysis, drop, switches.settingOf),
          main: drop.main ? deviceLines(drop.main) : [],
          bus: drop.childBus ? busLines(analysis, drop.childBus) : [],
        }),
      );
    return labels;
  };
  const widest = (lines: string[]) => lines.reduce((w, line) => Math.max(w, textWidth(line, fontSize)), 0);
  const layout = layoutOneLine(
    network,
    (drop) => {
      const labels = labelsOf(drop);
      const labelWidth = Math.max(
        widest(labels.feeder),
        widest(labels.element),
        widest(labels.main),
        widest(labels.bus),
      );
      return gutter + labelGap + symbolDefaults.size / 2 + labelWidth + columnPadding;
    },
    {
      open: switches.open,
      maxWidth: maxWidth - 2 * margin,
      linkLane,
      measureContinued: (drop) => {
        const lines = continuedLines(analysis, drop.childBus!, 999, 999, 999);
        return gutter + 8 + textWidth(lines[0], fontSize, 'bold') + widest(lines.slice(1)) + columnPadding;
      },
      levelHeight,
      // A motor's run: its feeder and the motor, whose label reaches a little below the circle.
      leafHeight: 2 * row + 8,
      continuedHeight,
    },
  );

  const items: Primitive[] = [];
  const markSpots: OneLineBase['markSpots'] = [];
  const places: OneLinePlace[] = [];
  // Each bus's place by its id, for its bar drawn once the runs under it are placed (found in the list,
  // a large site's thousands of buses each searched thousands of places).
  const busPlaces = new Map<string, OneLinePlace>();
  const left = margin;
  const top = margin + header;
  // A run starts just under the bar it hangs from; its own bar closes its level.
  const runTop = (drop: Drop) => top + drop.top;
  const barYOf = (drop: Drop) => runTop(drop) + 3 * row + busRow;
  const lineX = (drop: Drop) => left + drop.x + gutter;
  const mark = (id: string, x: number, y: number) => void markSpots.push({ id, x, y });
  const text = (lines: string[], x: number, centreY: number, dataId: string, role: string): Box => {
    const firstBaseline = centreY - ((lines.length - 1) * step) / 2 + fontSize * 0.35;
    lines.forEach((line, i) =>
      items.push(<TextItem>{
        type: 'text',
        x,
        y: firstBaseline + i * step,
        text: line,
        size: fontSize,
        anchor: 'start',
        fill: i === 0 ? SHEET_COLOURS.text : SHEET_COLOURS.mutedText,
        weight: i === 0 ? 'bold' : 'normal',
        role,
        dataId,
      }),
    );
    const width = lines.reduce((w, line, i) => Math.max(w, textWidth(line, fontSize, i === 0 ? 'bold' : 'normal')), 0);
    return { x, y: firstBaseline - fontSize, width, height: (lines.length - 1) * step + fontSize * 1.3 };
  };
  const symbolBox = (x: number, y: number): Box => ({
    x: x - symbolDefaults.size / 2,
    y: y - symbolDefaults.size / 2,
    width: symbolDefaults.size,
    height: symbolDefaults.size,
  });

  // Each run: its line, then the feeding device, the element, the main, the bus label and the bar.
  const childLines = new Map<string, number[]>();
  for (const drop of layout.drops) {
    const x = lineX(drop);
    const y0 = runTop(drop);
    const rows = [y0 + row / 2, y0 + row * 1.5, y0 + row * 2.5];
    const barY = drop.childBus ? barYOf(drop) : undefined;
    const labels = labelsOf(drop);
    const labelX = x + symbolDefaults.size / 2 + labelGap;
    // A run ends at its bus bar, at the top of its motor, or at an open switch's upper contact.
    const endY = barY ?? rows[1] - (drop.open ? 9 : symbolDefaults.size / 2);
    const startY = drop.kind === 'source' ? rows[1] : y0 - 12;
    items.push({
      type: 'path',
      d: `M${fixed(x)},${fixed(startY)}L${fixed(x)},${fixed(endY)}`,
      fill: 'none',
      stroke: symbolDefaults.stroke,
      strokeWidth: symbolDefaults.strokeWidth,
      role: 'one-line-run',
      dataId: drop.elementId,
    });
    if (drop.kind !== 'source') {
      const parentBus = drop.kind === 'motor' ? network.elements.get(drop.elementId)!.item : undefined;
      const busId =
        drop.open?.bus ??
        (parentBus && 'bus' in parentBus ? parentBus.bus : network.feederOf.get(drop.childBus ?? '')?.item.from);
      if (busId !== undefined) {
        const bar = barKey(busId, drop.barRow);
        const lines = childLines.get(bar);
        if (lines) lines.push(x);
        else childLines.set(bar, [x]);
      }
    }
    for (const [device, y, lines] of [
      [drop.feeder, rows[0], labels.feeder],
      [drop.main, rows[2], labels.main],
    ] as const) {
      if (!device) continue;
      items.push(...deviceSymbol(device.characteristic.kind, x, y, { dataId: device.id }));
      const label = text(lines, labelX, y, device.id, 'one-line-label');
      places.push({ id: device.id, type: 'device', symbol: symbolBox(x, y), label });
      mark(device.id, x - gutter + 9, y);
    }
    const elementY = rows[1];
    const element = network.elements.get(drop.elementId);
    if (drop.kind === 'source') items.push(...sourceSymbol(x, elementY, study.source.kind, { dataId: drop.elementId }));
    else if (element?.type === 'transformer')
      items.push(...transformerSymbol(x, elementY, element.item.connection, { dataId: drop.elementId }));
    else if (element?.type === 'cable') items.push(...cableSymbol(x, elementY, { dataId: drop.elementId }));
    else if (drop.open) {
      items.push(...switchSymbol(x, elementY, { dataId: drop.elementId, open: true }));
      // A short lead below the open contact: the way on to the bus across, not drawn here.
      items.push({
        type: 'path',
        d: `M${fixed(x)},${fixed(elementY + 9)}L${fixed(x)},${fixed(elementY + 16)}`,
        fill: 'none',
        stroke: symbolDefaults.stroke,
        strokeWidth: symbolDefaults.strokeWidth,
        role: 'one-line-run',
        dataId: drop.elementId,
      });
    } else if (element?.type === 'switch')
      items.push(
        ...(switches.settingOf.get(drop.elementId)?.switch.kind === 'transfer'
          ? transferSwitchSymbol(x, elementY, { dataId: drop.elementId })
          : switchSymbol(x, elementY, { dataId: drop.elementId })),
      );
    else if (element?.type === 'motor') items.push(...motorSymbol(x, elementY, { dataId: drop.elementId }));
    // A transformer's winding marks sit right of its circles: its label starts further right.
    const elementLabelX = labelX + (drop.kind === 'transformer' ? 12 : 0);
    const label = text(labels.element, elementLabelX, elementY, drop.elementId, 'one-line-label');
    places.push({ id: drop.elementId, type: drop.kind, symbol: symbolBox(x, elementY), label });
    mark(drop.elementId, x - gutter + 9, elementY);
    if (drop.childBus !== undefined && barY !== undefined) {
      const busLabel = text(labels.bus, x + 8, barY - busRow / 2 - 2, drop.childBus, 'one-line-bus-label');
      const place: OneLinePlace = {
        id: drop.childBus,
        type: 'bus',
        symbol: { x, y: barY - 3, width: 1, height: 6 },
        label: busLabel,
      };
      places.push(place);
      busPlaces.set(drop.childBus, place);
      mark(drop.childBus, x - gutter + 9, barY);
    }
  }
  // Bus bars span the runs hanging from them (at least their label's width).
  const barOf = (busId: string, barRow: number, x: number, barY: number, label: Box): Box => {
    const xs = childLines.get(barKey(busId, barRow)) ?? [];
    const x2 = Math.max(x + 40, label.x + label.width, ...xs);
    items.push(...busSymbol(x - 6, x2 + 6, barY, { dataId: busId }));
    return { x: x - 6, y: barY - 3, width: x2 - x + 12, height: 6 };
  };
  for (const drop of layout.drops) {
    if (drop.childBus === undefined) continue;
    const place = busPlaces.get(drop.childBus)!;
    place.symbol = barOf(drop.childBus, 0, lineX(drop), barYOf(drop), place.label);
  }
  // A bus continued below: the same bar again over each later row, labelled as continued, linked down the bus's line.
  const continuations: OneLinePlace[] = [];
  const continuedBars = new Map<Drop, number[]>();
  for (const continued of layout.continuations) {
    const { busDrop, barRow, first, of, runs } = continued;
    const busId = busDrop.childBus!;
    const x = lineX(busDrop);
    const barY = top + continued.top - 12;
    const lines = continuedLines(analysis, busId, first, first + runs.length - 1, of);
    const label = text(lines, x + 8, barY - busRow / 2 - 2, busId, 'one-line-continued-label');
    continuations.push({ id: busId, type: 'bus', symbol: barOf(busId, barRow, x, barY, label), label });
    addToList(continuedBars, busDrop, barY);
  }
  for (const [busDrop, barYs] of continuedBars)
    items.push(...continuationLink(lineX(busDrop), barYOf(busDrop), barYs, { dataId: busDrop.childBus! }));

  const width = Math.max(left + layout.width + margin, 640);
  // The deepest runs end at a motor or a bus bar; leave room under either, then the caution.
  const bottom = layout.drops.reduce(
    (most, drop) => Math.max(most, drop.childBus ? barYOf(drop) : runTop(drop) + 2 * row),
    0,
  );
  const height = bottom + margin + 40;
  const title = options.title ?? `${study.name}: one-line diagram`;
  const headerItems: Primitive[] = [
    {
      type: 'text',
      x: left,
      y: margin + 14,
      text: title,
      size: 15,
      anchor: 'start',
      fill: SHEET_COLOURS.text,
      weight: 'bold',
      role: 'one-line-title',
    },
    ...wrapText(detailsLine(analysis), width - 2 * margin, fontSize)
      .slice(0, 1)
      .map((line): Primitive => ({
        type: 'text',
        x: left,
        y: margin + 32,
        text: line,
        size: fontSize,
        anchor: 'start',
        fill: SHEET_COLOURS.mutedText,
        role: 'one-line-details',
      })),
    ...wrapText(`▲ failing finding  ◆ warning.  ${CAUTION}`, width - 2 * margin, 9)
      .slice(0, 3)
      .map((line, i): Primitive => ({
        type: 'text',
        x: left,
        y: height - margin + 4 - (2 - i) * 11,
        text: line,
        size: 9,
        anchor: 'start',
        fill: SHEET_COLOURS.mutedText,
        role: 'caution',
      })),
  ];
  const drawing = {
    width,
    height,
    fontFamily,
    title,
    description: `One-line diagram of ${study.name}: ${study.buses.length} buses, ${study.devices.length} protective devices.`,
    patterns: [],
    layers: [
      { name: 'header', items: headerItems },
      { name: 'diagram', items },
    ],
    places,
    continuations,
  };
  return { drawing, markSpots };
}

// Accepts a bus id and the row of its branches a bar carries; the key its runs' lines are gathered under.
function barKey(busId: string, barRow: number): string {
  return `${barRow}:${busId}`;
}

// Accepts a bus id and the branches a continuation bar carries; its label: the bus named as continued, and which branches.
function continuedLines(analysis: BaseInputs, busId: string, first: number, last: number, of: number): string[] {
  const bus = analysis.network.buses.get(busId)!;
  const branches = first === last ? `branch ${first} of ${of}` : `branches ${first}–${last} of ${of}`;
  return [`${bus.name ?? bus.id}, ${formatVolts(bus.voltage)} (continued)`, branches];
}

// Accepts the findings; the worst failing or warning severity per element or device id.
function worstSeverities(findings: Analysis['findings']): Map<string, Severity> {
  const worst = new Map<string, Severity>();
  for (const finding of findings) {
    if (finding.severity !== 'fail' && finding.severity !== 'warning') continue;
    for (const id of finding.subjects) if (worst.get(id) !== 'fail') worst.set(id, finding.severity);
  }
  return worst;
}

// Accepts a device; its name and key rating.
function deviceLines(device: Device): string[] {
  const kind = {
    relay: 'relay and breaker',
    'trip-unit': 'breaker, electronic trip',
    'thermal-magnetic': 'breaker, thermal-magnetic',
    fuse: 'fuse',
  }[device.characteristic.kind];
  return [device.name ?? device.id, device.rating ? `${kind}, ${significant(device.rating, 4)} A` : kind];
}

// Accepts the analysis; each switch as its scenario sets it, and those connecting nothing drawn, each under a drawn bus.
function switchesOf(analysis: BaseInputs): { settingOf: Map<string, SwitchSetting>; open: OpenSwitch[] } {
  const { study, network } = analysis;
  // A study not split by scenario: each switch in its normal position, as its network links it.
  const settings =
    switchSettingsOf(study) ??
    study.switches.map((item) => ({ switch: item, position: item.kind === 'transfer' ? 'normal' : item.normally }));
  const open: OpenSwitch[] = [];
  for (const { switch: item } of settings) {
    if (network.elements.has(item.id)) continue;
    // An open tie hangs from its `from` bus where that is drawn; a transfer switch from its side that is.
    const [ends, across] =
      item.kind === 'tie' ? [[item.from, item.to], undefined] : [[item.normal, item.emergency], item.to];
    const bus = ends.find((id) => network.buses.has(id));
    if (bus !== undefined) open.push({ id: item.id, bus, across: across ?? ends.find((id) => id !== bus)! });
  }
  return { settingOf: new Map(settings.map((setting) => [setting.switch.id, setting])), open };
}

// Accepts a run; its element's name and key ratings.
function elementLines(
  analysis: BaseInputs,
  drop: Omit<Drop, 'x' | 'width' | 'top' | 'barRow'>,
  settingOf: Map<string, SwitchSetting>,
): string[] {
  const { study, network, faults } = analysis;
  if (drop.open) {
    const { switch: item, position } = settingOf.get(drop.elementId)!;
    if (item.kind === 'tie') return [item.name ?? item.id, `tie, open, to ${drop.open.across}`];
    const side = drop.open.bus === item.normal ? 'normal' : 'emergency';
    return [item.name ?? item.id, `transfer switch on ${position}, ${side} side open`];
  }
  if (drop.kind === 'source') {
    const source = study.source;
    const bus = faults.buses.get(source.bus);
    if (source.kind === 'infinite') return [source.id, 'infinite bus'];
    if (source.kind === 'generator')
      return [
        source.name ?? source.id,
        `generator, ${significant(source.rating / 1000, 4)} kVA, X″d ${significant(source.xdSubtransient, 3)} pu`,
      ];
    const amps = bus ? formatAmps(bus.max.threePhase) : '';
    return [source.id, `utility, ${amps} at ${formatVolts(network.buses.get(source.bus)!.voltage)}`];
  }
  const element = network.elements.get(drop.elementId)!;
  if (element.type === 'transformer') {
    const t = element.item;
    const connection = { 'delta-wye': 'Δ–Yg', 'delta-delta': 'Δ–Δ', 'wye-wye': 'Yg–Yg', 'wye-delta': 'Y–Δ' }[
      t.connection
    ];
    return [
      t.name ?? t.id,
      `${significant(t.rating / 1000, 4)} kVA ${formatVolts(t.primary)}–${formatVolts(t.secondary)}`,
      `${connection}${t.phases === 1 ? ' 1φ' : ''}, ${significant(t.impedance, 3)} %Z`,
    ];
  }
  if (element.type === 'cable') {
    const c = element.item;
    const feet = significant(c.length / 0.3048, 3);
    return [
      c.name ?? c.id,
      `${c.sets > 1 ? `${c.sets} × ` : ''}${c.size} ${c.material === 'copper' ? 'Cu' : 'Al'}, ${feet} ft`,
    ];
  }
  if (element.type === 'switch') {
    // The part's network holds every closed switch as a tie; the study's own switch says what it is.
    const link = element.item;
    const setting = settingOf.get(link.id);
    return [
      link.name ?? link.id,
      setting?.switch.kind === 'transfer' ? `transfer switch on ${setting.position}, from ${link.from}` : 'tie, closed',
    ];
  }
  if (element.type === 'motor') {
    const m = element.item;
    const size =
      m.hp !== undefined
        ? `${significant(m.hp, 4)} hp`
        : m.rating !== undefined
          ? `${significant(m.rating / 1000, 4)} kVA`
          : 'motor';
    return [m.name ?? m.id, size];
  }
  return [drop.elementId];
}

// Accepts a bus id; its name, voltage and fault currents.
function busLines(analysis: BaseInputs, busId: string): string[] {
  const bus = analysis.network.buses.get(busId)!;
  const fault = analysis.faults.buses.get(busId);
  const name = `${bus.name ?? bus.id}, ${formatVolts(bus.voltage)}`;
  if (!fault || !Number.isFinite(fault.max.threePhase)) return [name, 'infinite bus'];
  return [name, `3φ fault ${formatAmps(fault.max.threePhase, 3)} max, ${formatAmps(fault.min.threePhase, 3)} min`];
}

// Accepts the analysis; the study details line under the title.
function detailsLine(analysis: BaseInputs): string {
  const s = analysis.study;
  const revision = s.revisions.at(-1);
  return [
    s.site,
    s.client,
    revision ? `revision ${revision.revision}` : undefined,
    s.date,
    s.preparedBy ? `prepared by ${s.preparedBy}` : undefined,
  ]
    .filter((part): part is string => Boolean(part))
    .join('  ·  ');
}
