import type { Primitive } from '../geometry.ts';
import { fixed } from '../precision.ts';

/**
 * The one-line diagram's graphical symbols, drawn in the manner of IEEE 315 / IEC 60617 (a square for
 * a circuit breaker, a box with the conductor through it for a fuse, two linked circles for a
 * two-winding transformer, a circle marked M for a motor, a heavy bar for a bus) but of our own
 * proportions. Each symbol is centred on the run's line at (`x`, `y`) and spans `symbolDefaults.size` px.
 */
export const symbolDefaults = {
  /** px: the height a symbol takes on the run. */
  size: 22,
  stroke: '#1a1a1a',
  strokeWidth: 1.5,
  /** px: a bus bar's thickness. */
  busWidth: 4,
} as const;

/** What a symbol is drawn for: its element or device id (for the two-way link) and colour. */
export interface SymbolOptions {
  dataId: string;
  stroke?: string;
}

/** The kinds of protective device the diagram tells apart. */
export type DeviceSymbolKind = 'relay' | 'trip-unit' | 'thermal-magnetic' | 'fuse';

/**
 * A protective device on the run: a breaker square (an electronic trip unit gets a small pulse mark
 * inside, a thermal-magnetic one a small arc), a fuse box, or, for a relay, the breaker square with the
 * relay drawn as a circle marked 51 (IEEE C37.2 device number for an AC inverse-time overcurrent relay)
 * beside it, linked by a dashed line.
 * @example deviceSymbol('fuse', 40, 100, { dataId: 'F1' }).length // 2
 */
export function deviceSymbol(kind: DeviceSymbolKind, x: number, y: number, options: SymbolOptions): Primitive[] {
  const s = symbolDefaults.size / 2 - 2;
  const stroke = options.stroke ?? symbolDefaults.stroke;
  const base = { stroke, strokeWidth: symbolDefaults.strokeWidth, role: 'one-line-device', dataId: options.dataId };
  if (kind === 'fuse') {
    return [
      { type: 'rect', x: x - s / 2, y: y - s, width: s, height: 2 * s, fill: '#ffffff', ...base },
      { type: 'path', d: `M${fixed(x)},${fixed(y - s)}L${fixed(x)},${fixed(y + s)}`, fill: 'none', ...base },
    ];
  }
  const items: Primitive[] = [
    { type: 'rect', x: x - s, y: y - s, width: 2 * s, height: 2 * s, fill: '#ffffff', ...base },
  ];
  if (kind === 'trip-unit') {
    const h = s / 2;
    items.push({
      type: 'path',
      d: `M${fixed(x - h)},${fixed(y + h / 2)}L${fixed(x - h / 3)},${fixed(y + h / 2)}L${fixed(x - h / 3)},${fixed(y - h / 2)}L${fixed(x + h / 3)},${fixed(y - h / 2)}L${fixed(x + h / 3)},${fixed(y + h / 2)}L${fixed(x + h)},${fixed(y + h / 2)}`,
      fill: 'none',
      ...base,
      strokeWidth: 1,
    });
  } else if (kind === 'thermal-magnetic') {
    const h = s / 2;
    items.push({
      type: 'path',
      d: `M${fixed(x - h)},${fixed(y + h / 3)}A${fixed(h)},${fixed(h)} 0 0,1 ${fixed(x + h)},${fixed(y + h / 3)}`,
      fill: 'none',
      ...base,
      strokeWidth: 1,
    });
  } else if (kind === 'relay') {
    const r = s * 0.9;
    const cx = x - s - 6 - r;
    items.push(
      {
        type: 'path',
        d: `M${fixed(x - s)},${fixed(y)}L${fixed(cx + r)},${fixed(y)}`,
        fill: 'none',
        ...base,
        dash: '3 2',
      },
      { type: 'path', d: circlePath(cx, y, r), fill: '#ffffff', ...base },
      {
        type: 'text',
        x: cx,
        y: y + 3,
        text: '51',
        size: 8,
        anchor: 'middle',
        fill: stroke,
        role: 'one-line-device',
        dataId: options.dataId,
      },
    );
  }
  return items;
}

/**
 * A two-winding transformer: two linked circles, each marked with its winding connection (a small
 * triangle for delta, a three-armed star for wye, with a ground mark below it when the wye is grounded).
 * @example transformerSymbol(40, 100, 'delta-wye', { dataId: 'T1' }).length // 5
 */
export function transformerSymbol(
  x: number,
  y: number,
  connection: 'delta-wye' | 'delta-delta' | 'wye-wye' | 'wye-delta',
  options: SymbolOptions,
): Primitive[] {
  const r = symbolDefaults.size / 2 - 2;
  const stroke = options.stroke ?? symbolDefaults.stroke;
  const base = { stroke, strokeWidth: symbolDefaults.strokeWidth, role: 'one-line-branch', dataId: options.dataId };
  const [primary, secondary] = connection.split('-') as ('delta' | 'wye')[];
  const upper = y - r * 0.7;
  const lower = y + r * 0.7;
  return [
    { type: 'path', d: circlePath(x, upper, r), fill: 'none', ...base },
    { type: 'path', d: circlePath(x, lower, r), fill: 'none', ...base },
    windingMark(primary, x + r + 7, upper, base),
    windingMark(secondary, x + r + 7, lower, base),
    ...(secondary === 'wye' ? [groundMark(x + r + 7, lower + 5, base)] : []),
  ];
}

/**
 * A cable: the run's line with a pair of short slanted strokes across it.
 * @example cableSymbol(40, 100, { dataId: 'C1' }).length // 1
 */
export function cableSymbol(x: number, y: number, options: SymbolOptions): Primitive[] {
  const stroke = options.stroke ?? symbolDefaults.stroke;
  const d = [-3, 3].map((dy) => `M${fixed(x - 6)},${fixed(y + dy + 3)}L${fixed(x + 6)},${fixed(y + dy - 3)}`).join('');
  return [
    {
      type: 'path',
      d,
      fill: 'none',
      stroke,
      strokeWidth: symbolDefaults.strokeWidth,
      role: 'one-line-branch',
      dataId: options.dataId,
    },
  ];
}

/** Options of {@link switchSymbol}. */
export interface SwitchSymbolOptions extends SymbolOptions {
  /** Draw the blade swung away from the lower contact: the switch connects nothing. @default false */
  open?: boolean;
}

/**
 * A tie: a break in the run with a small circle at each contact and the blade hinged at the upper
 * contact, bridging the break when closed and swung clear of the lower contact when open (IEEE 315 /
 * IEC 60617 style).
 * @example switchSymbol(40, 100, { dataId: 'TIE', open: true }).length // 2
 */
export function switchSymbol(x: number, y: number, options: SwitchSymbolOptions): Primitive[] {
  const stroke = options.stroke ?? symbolDefaults.stroke;
  const base = { stroke, strokeWidth: symbolDefaults.strokeWidth, role: 'one-line-branch', dataId: options.dataId };
  const blade = options.open ? `L${fixed(x + 8)},${fixed(y + 4)}` : `L${fixed(x)},${fixed(y + 5)}`;
  return [
    { type: 'path', d: circlePath(x, y - 7, 2) + circlePath(x, y + 7, 2), fill: '#ffffff', ...base },
    { type: 'path', d: `M${fixed(x)},${fixed(y - 5)}${blade}`, fill: 'none', ...base },
  ];
}

/**
 * A transfer switch: the load contact below, a contact for each side above (the side in use on the
 * run, the idle side set off to the right with a short lead), and the blade from the load contact
 * to the side in use.
 * @example transferSwitchSymbol(40, 100, { dataId: 'ATS' }).length // 3
 */
export function transferSwitchSymbol(x: number, y: number, options: SymbolOptions): Primitive[] {
  const stroke = options.stroke ?? symbolDefaults.stroke;
  const base = { stroke, strokeWidth: symbolDefaults.strokeWidth, role: 'one-line-branch', dataId: options.dataId };
  const idle = x + 9;
  return [
    { type: 'path', d: `M${fixed(idle)},${fixed(y - 9)}L${fixed(idle)},${fixed(y - 14)}`, fill: 'none', ...base },
    {
      type: 'path',
      d: circlePath(x, y - 7, 2) + circlePath(idle, y - 7, 2) + circlePath(x, y + 7, 2),
      fill: '#ffffff',
      ...base,
    },
    { type: 'path', d: `M${fixed(x)},${fixed(y + 5)}L${fixed(x)},${fixed(y - 5)}`, fill: 'none', ...base },
  ];
}

/**
 * A motor: a circle marked M at the end of its run.
 * @example motorSymbol(40, 100, { dataId: 'M1' }).length // 2
 */
export function motorSymbol(x: number, y: number, options: SymbolOptions): Primitive[] {
  const r = symbolDefaults.size / 2;
  const stroke = options.stroke ?? symbolDefaults.stroke;
  return [
    {
      type: 'path',
      d: circlePath(x, y, r),
      fill: '#ffffff',
      stroke,
      strokeWidth: symbolDefaults.strokeWidth,
      role: 'one-line-motor',
      dataId: options.dataId,
    },
    {
      type: 'text',
      x,
      y: y + 4,
      text: 'M',
      size: 11,
      anchor: 'middle',
      fill: stroke,
      weight: 'bold',
      role: 'one-line-motor',
      dataId: options.dataId,
    },
  ];
}

/**
 * The source: a circle holding a sine wave for a utility, a "G" for a generator (IEEE 315 / IEC 60617
 * rotating machine), or the infinity sign for an infinite bus.
 * @example sourceSymbol(40, 30, 'utility', { dataId: 'UTIL' }).length // 2
 */
export function sourceSymbol(
  x: number,
  y: number,
  kind: 'utility' | 'infinite' | 'generator',
  options: SymbolOptions,
): Primitive[] {
  const r = symbolDefaults.size / 2;
  const stroke = options.stroke ?? symbolDefaults.stroke;
  const base = { stroke, strokeWidth: symbolDefaults.strokeWidth, role: 'one-line-source', dataId: options.dataId };
  const inner: Primitive =
    kind === 'utility'
      ? {
          type: 'path',
          d: `M${fixed(x - r * 0.6)},${fixed(y)}Q${fixed(x - r * 0.3)},${fixed(y - r * 0.6)} ${fixed(x)},${fixed(y)}T${fixed(x + r * 0.6)},${fixed(y)}`,
          fill: 'none',
          ...base,
        }
      : {
          type: 'text',
          x,
          y: y + 4,
          text: kind === 'generator' ? 'G' : '∞',
          size: 12,
          anchor: 'middle',
          fill: stroke,
          role: 'one-line-source',
          dataId: options.dataId,
        };
  return [{ type: 'path', d: circlePath(x, y, r), fill: '#ffffff', ...base }, inner];
}

/**
 * A bus: a heavy horizontal bar from `x1` to `x2` at `y`.
 * @example busSymbol(20, 200, 100, { dataId: 'SWBD' })[0].role // 'one-line-bus'
 */
export function busSymbol(x1: number, x2: number, y: number, options: SymbolOptions): Primitive[] {
  return [
    {
      type: 'path',
      d: `M${fixed(x1)},${fixed(y)}L${fixed(x2)},${fixed(y)}`,
      fill: 'none',
      stroke: options.stroke ?? symbolDefaults.stroke,
      strokeWidth: symbolDefaults.busWidth,
      role: 'one-line-bus',
      dataId: options.dataId,
    },
  ];
}

/**
 * The link from a bus's bar to the bars continuing it below: a dashed line down the bus's own line from
 * its bar (at `fromY`) to the last continuation bar, with an arrowhead landing on each continuation bar,
 * so the eye follows the bus from one row of branches to the next.
 * @example continuationLink(40, 200, [400, 600], { dataId: 'SWBD' }).length // 3
 */
export function continuationLink(
  x: number,
  fromY: number,
  barYs: readonly number[],
  options: SymbolOptions,
): Primitive[] {
  const stroke = options.stroke ?? symbolDefaults.stroke;
  const base = { stroke, role: 'one-line-continuation', dataId: options.dataId };
  const lastY = barYs.reduce((most, y) => Math.max(most, y), fromY);
  return [
    {
      type: 'path',
      d: `M${fixed(x)},${fixed(fromY + 2)}L${fixed(x)},${fixed(lastY - 4)}`,
      fill: 'none',
      strokeWidth: symbolDefaults.strokeWidth,
      dash: '5 3',
      ...base,
    },
    ...barYs.map((y): Primitive => ({
      type: 'path',
      d: `M${fixed(x - 4)},${fixed(y - 11)}L${fixed(x + 4)},${fixed(y - 11)}L${fixed(x)},${fixed(y - 2)}Z`,
      fill: stroke,
      strokeWidth: 1,
      ...base,
    })),
  ];
}

/**
 * A finding mark beside a symbol, shaped by severity so colour is never the only code: a filled
 * triangle with "!" for a failure, an open diamond for a warning.
 * @example findingMark('fail', 60, 100, 'T1', '#D55E00').length // 2
 */
export function findingMark(
  severity: 'fail' | 'warning',
  x: number,
  y: number,
  dataId: string,
  colour: string,
): Primitive[] {
  const s = 7;
  if (severity === 'fail') {
    return [
      {
        type: 'path',
        d: `M${fixed(x)},${fixed(y - s)}L${fixed(x + s)},${fixed(y + s * 0.7)}L${fixed(x - s)},${fixed(y + s * 0.7)}Z`,
        fill: colour,
        stroke: colour,
        strokeWidth: 1,
        role: 'one-line-finding',
        dataId,
      },
      {
        type: 'text',
        x,
        y: y + s * 0.55,
        text: '!',
        size: 9,
        anchor: 'middle',
        fill: '#ffffff',
        weight: 'bold',
        role: 'one-line-finding',
        dataId,
      },
    ];
  }
  return [
    {
      type: 'path',
      d: `M${fixed(x)},${fixed(y - s)}L${fixed(x + s)},${fixed(y)}L${fixed(x)},${fixed(y + s)}L${fixed(x - s)},${fixed(y)}Z`,
      fill: '#ffffff',
      stroke: colour,
      strokeWidth: 2,
      role: 'one-line-finding',
      dataId,
    },
    {
      type: 'text',
      x,
      y: y + 3,
      text: '?',
      size: 8,
      anchor: 'middle',
      fill: colour,
      weight: 'bold',
      role: 'one-line-finding',
      dataId,
    },
  ];
}

// Accepts a centre and radius; a closed circle as two arcs.
function circlePath(x: number, y: number, r: number): string {
  return `M${fixed(x - r)},${fixed(y)}A${fixed(r)},${fixed(r)} 0 1,0 ${fixed(x + r)},${fixed(y)}A${fixed(r)},${fixed(r)} 0 1,0 ${fixed(x - r)},${fixed(y)}Z`;
}

// Accepts a winding connection and a centre; a small delta triangle or wye star.
function windingMark(
  winding: 'delta' | 'wye',
  x: number,
  y: number,
  base: { stroke: string; role: string; dataId: string },
): Primitive {
  const s = 4;
  const d =
    winding === 'delta'
      ? `M${fixed(x)},${fixed(y - s)}L${fixed(x + s)},${fixed(y + s * 0.7)}L${fixed(x - s)},${fixed(y + s * 0.7)}Z`
      : `M${fixed(x)},${fixed(y)}L${fixed(x)},${fixed(y - s)}M${fixed(x)},${fixed(y)}L${fixed(x + s * 0.87)},${fixed(y + s / 2)}M${fixed(x)},${fixed(y)}L${fixed(x - s * 0.87)},${fixed(y + s / 2)}`;
  return { type: 'path', d, fill: 'none', strokeWidth: 1, ...base };
}

// Accepts the point a ground lead starts at; a short lead and three shrinking bars.
function groundMark(x: number, y: number, base: { stroke: string; role: string; dataId: string }): Primitive {
  const d = [
    `M${fixed(x)},${fixed(y - 5)}L${fixed(x)},${fixed(y)}`,
    ...[4, 2.6, 1.2].map((w, i) => `M${fixed(x - w)},${fixed(y + i * 2)}L${fixed(x + w)},${fixed(y + i * 2)}`),
  ].join('');
  return { type: 'path', d, fill: 'none', strokeWidth: 1, ...base };
}
