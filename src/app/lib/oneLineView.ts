import type { Primitive } from '../../plot/geometry.ts';
import { inkBoundsOf, type Edges } from '../../plot/inkBounds.ts';
import { textWidth } from '../../plot/textWidth.ts';
import type { OneLine, OneLinePlace } from '../../plot/oneLine/index.ts';
import type { Selection } from './selection.ts';

/** The part of the one-line diagram on screen, in diagram pixels. */
export interface ViewBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

/**
 * The selection an element of the one-line diagram stands for (a device, bus, branch, motor or the
 * source). A source other than the study's own (`sourceId`, when given) is one of its generators,
 * at the root of a tree a scenario splits off.
 * @example selectionOfPlace({ id: 'T1', type: 'transformer', … }) // { kind: 'transformer', id: 'T1' }
 */
export function selectionOfPlace(place: OneLinePlace, sourceId?: string): Selection {
  if (place.type === 'source' && sourceId !== undefined && place.id !== sourceId)
    return { kind: 'generator', id: place.id };
  return { kind: place.type, id: place.id };
}

/** Several one-line diagrams drawn in a row: each with where it starts, the whole size, and every place moved into it. */
export interface OneLineRow {
  diagrams: { diagram: OneLine; x: number }[];
  width: number;
  height: number;
  places: OneLinePlace[];
}

/**
 * Diagrams set side by side, left to right with `gap` px between them (the trees a scenario
 * energises, each drawn from its own source), with every element's place in the row's pixels.
 * @example oneLineRowOf([utility, generator], 40).diagrams[1].x // utility.width + 40
 */
export function oneLineRowOf(diagrams: readonly OneLine[], gap: number): OneLineRow {
  let x = 0;
  const row: OneLineRow = { diagrams: [], width: 0, height: 0, places: [] };
  for (const diagram of diagrams) {
    row.diagrams.push({ diagram, x });
    const moved = (b: ViewBox) => ({ ...b, x: b.x + x });
    // A bus continued on bars below selects as the bus does, from any of its bars (after its own place,
    // so the selection is drawn around the bus's first bar).
    for (const place of [...diagram.places, ...diagram.continuations])
      row.places.push({ ...place, symbol: moved(place.symbol), label: moved(place.label) });
    row.height = Math.max(row.height, diagram.height);
    row.width = x + diagram.width;
    x += diagram.width + gap;
  }
  return row;
}

/**
 * The element whose symbol or label holds a point, symbols first (a label may run past a neighbour's line).
 * @example placeAt(diagram.places, { x: 80, y: 240 })?.id // 'T1'
 */
export function placeAt(places: OneLinePlace[], at: { x: number; y: number }): OneLinePlace | undefined {
  const inside = (b: ViewBox, pad: number) =>
    at.x >= b.x - pad && at.x <= b.x + b.width + pad && at.y >= b.y - pad && at.y <= b.y + b.height + pad;
  return (
    places.find((p) => p.type !== 'bus' && inside(p.symbol, 3)) ??
    places.find((p) => inside(p.label, 1) || inside(p.symbol, 2))
  );
}

/**
 * The view box scaled by `factor` about a fixed point (factor < 1 zooms in), kept between 1/20 and 20
 * times its size so a wheel spun hard stops somewhere sensible.
 * @example zoomedBox({ x: 0, y: 0, width: 100, height: 50 }, { x: 50, y: 25 }, 0.5) // { x: 25, y: 12.5, width: 50, height: 25 }
 */
export function zoomedBox(box: ViewBox, at: { x: number; y: number }, factor: number): ViewBox {
  const f = Math.min(20, Math.max(1 / 20, factor));
  return {
    x: at.x - (at.x - box.x) * f,
    y: at.y - (at.y - box.y) * f,
    width: box.width * f,
    height: box.height * f,
  };
}

/**
 * A view box of the same size centred on a target, to bring an element chosen elsewhere into view.
 * @example viewBoxAround({ x: 500, y: 300, width: 10, height: 10 }, { x: 0, y: 0, width: 200, height: 100 }).x // 405
 */
export function viewBoxAround(target: ViewBox, box: ViewBox): ViewBox {
  return {
    ...box,
    x: target.x + target.width / 2 - box.width / 2,
    y: target.y + target.height / 2 - box.height / 2,
  };
}

/**
 * How much taller, for its width, than the panel a diagram may be and still open whole: past it, fitted
 * whole its labels would be drawn at a third of their size across the panel's width or less (a
 * 2,000-device site's diagram is 80 times as tall as it is wide, and fitted whole showed a blank panel).
 */
const TALLEST_OPENED_WHOLE = 3;

/**
 * The view a diagram opens on in a panel of `panel` px: the whole diagram, or, where it is far taller
 * than the panel, its top (the source and what it feeds first) across its whole width.
 * @example openingBox({ x: 0, y: 0, width: 1400, height: 100_000 }, { width: 300, height: 200 }) // { x: 0, y: 0, width: 1400, height: 933.3… }
 */
export function openingBox(full: ViewBox, panel: { width: number; height: number }): ViewBox {
  const aspect = panel.height / panel.width;
  if (!(aspect > 0 && Number.isFinite(aspect)) || full.height <= TALLEST_OPENED_WHOLE * aspect * full.width)
    return full;
  return { x: full.x, y: full.y, width: full.width, height: full.width * aspect };
}

/**
 * The places in a list of the items whose ink (`edges`: left, top, right and bottom of each, in the
 * diagram's px) reaches the view box grown by `margin` of its size on every side: the panel draws these
 * alone, so a large diagram costs what is near the view, and a small pan or zoom draws nothing new.
 * @example itemsInView([[0, 0, 10, 10], [0, 500, 10, 510]], { x: 0, y: 0, width: 100, height: 100 }) // [0]
 */
export function itemsInView(edges: readonly (readonly number[])[], box: ViewBox, margin = 0.5): number[] {
  const [left, top] = [box.x - box.width * margin, box.y - box.height * margin];
  const [right, bottom] = [box.x + box.width * (1 + margin), box.y + box.height * (1 + margin)];
  const inView: number[] = [];
  for (let i = 0; i < edges.length; i++) {
    const [l, t, r, b] = edges[i];
    if (l <= right && r >= left && t <= bottom && b >= top) inView.push(i);
  }
  return inView;
}

/**
 * What a panel of `panel` px shows of a view box, the drawing fitted whole and centred in it (SVG's
 * `xMidYMid meet`): the box widened, about its centre, to the panel's proportions.
 * @example visibleBox({ x: 0, y: 0, width: 100, height: 100 }, { width: 300, height: 150 }) // { x: -50, y: 0, width: 200, height: 100 }
 */
export function visibleBox(box: ViewBox, panel: { width: number; height: number }): ViewBox {
  const aspect = panel.height / panel.width;
  if (!(aspect > 0 && Number.isFinite(aspect))) return box;
  if (box.height > box.width * aspect) {
    const width = box.height / aspect;
    return { ...box, x: box.x - (width - box.width) / 2, width };
  }
  const height = box.width * aspect;
  return { ...box, y: box.y - (height - box.height) / 2, height };
}

/**
 * Each item's ink on screen (`inkBoundsOf`), text measured in the panel's face (`textWidth`).
 * @example screenInksOf(diagram.layers[0].items)[0] // [left, top, right, bottom]
 */
export function screenInksOf(items: readonly Primitive[]): Edges[] {
  return items.map((item) => inkBoundsOf(item, (text) => textWidth(text.text, 1, text.weight ?? 'normal')));
}
