import type { OneLinePlace } from '../../plot/oneLine/index.ts';
import type { Selection } from './selection.ts';

/** The part of the one-line diagram on screen, in diagram pixels. */
export interface ViewBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

/**
 * The selection an element of the one-line diagram stands for (a device, bus, branch, motor or the source).
 * @example selectionOfPlace({ id: 'T1', type: 'transformer', … }) // { kind: 'transformer', id: 'T1' }
 */
export function selectionOfPlace(place: OneLinePlace): Selection {
  return { kind: place.type, id: place.id };
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
