import type { Box, HatchPattern, PathItem, Primitive, RectItem, TextItem } from '../geometry.ts';
import { inkBoundsOf, type Edges } from '../inkBounds.ts';
import type { Drawing } from '../svg.ts';
import { writeHatchTile } from './hatchTile.ts';
import { type Matrix, matrixOperands } from './matrix.ts';
import { pathStepsOf, type PathStep } from './pathData.ts';
import { dashArrayOf, rgbOf } from './paintOf.ts';
import type { PdfFont } from './pdfFont.ts';
import { pdfNumber } from './pdfSyntax.ts';
import type { PdfWriter } from './pdfWriter.ts';

/**
 * The stroke width, as a fraction of the font size, that thickens the regular face's stems where it is
 * the only face embedded. DejaVu Sans Bold's stems are 0.085 em wider than the regular's (0.175 against
 * 0.090 em, the "l" of each face); three quarters of that keeps small letters' counters open.
 */
const SYNTHETIC_BOLD_STROKE = 0.065;

/** One drawing placed on a page of a multi-page PDF, scaled into a box in points from the page's top-left corner. */
export interface PagePlacement {
  drawing: Drawing;
  x: number;
  y: number;
  width: number;
  height: number;
  /**
   * The part of the drawing shown, in the drawing's own px from its top-left corner: it is scaled onto
   * the box and the rest of the drawing is clipped away (a tile of a drawing too large to print whole).
   * Width and height greater than 0. @default the whole drawing
   */
  window?: Box;
}

/**
 * One thing on a page: a drawing placed in a box, or primitives given directly in points from the
 * page's top-left corner (a report's text pages).
 */
export type PageContent = PagePlacement | { items: Primitive[] };

/** What drawing a page needs: where patterns go, the two faces, and the page's height in points. */
export interface PageContext {
  writer: PdfWriter;
  fonts: { normal: PdfFont; bold: PdfFont };
  pageHeight: number;
}

/** A page's content stream and the resources dictionary it draws with. */
export interface PageStream {
  content: string;
  resources: string;
}

/**
 * The content stream of one page (ISO 32000-1 §8–9): each placement in order, drawn in its own
 * pixels through a transform that flips SVG's y-down space onto the page, clipped to its box over a
 * white background as the SVG has (a placement's `window` alone is mapped onto the box and kept by
 * the clip); then paths, rectangles and text with the paint `svg.ts` writes —
 * fill (SVG's black when unset), stroke, width, dash, caps, opacities through ExtGState, hatch
 * patterns as tiling patterns — and text anchored by the face's own advance widths, turned about its
 * anchor when `rotate` is set.
 * @example pageContentOf([{ drawing: sheet, x: 36, y: 36, width: 720, height: 540 }], context).content
 */
export function pageContentOf(contents: PageContent[], context: PageContext): PageStream {
  const { writer, fonts, pageHeight } = context;
  const out: string[] = [];
  const fontRefs = new Map<string, number>();
  const states = new Map<string, string>();
  const patternRefs = new Map<string, number>();

  for (const content of contents) {
    if ('items' in content) {
      out.push('q', `1 0 0 -1 0 ${pdfNumber(pageHeight)} cm`, '4 M');
      for (const item of content.items) drawPrimitive(item, () => null);
      out.push('Q');
      continue;
    }
    const { drawing, x, y, width, height } = content;
    const shown = windowOf(content);
    const [sx, sy] = [width / shown.width, height / shown.height];
    // The window's top-left corner lands on the box's; without a window it is the drawing's origin.
    const placement: Matrix = [sx, 0, 0, -sy, x - shown.x * sx, pageHeight - y + shown.y * sy];
    const clip = [shown.x, shown.y, shown.width, shown.height].map((v) => pdfNumber(v)).join(' ');
    // SVG's defaults differ from PDF's in the miter limit only (4 against 10).
    out.push('q', `${matrixOperands(placement)} cm`, `${clip} re W n`, '1 1 1 rg', `${clip} re f`, '4 M');
    const hatches = new Map(drawing.patterns.map((p) => [p.id, p]));
    const named = new Map<string, string>();
    const patternName = (id: string): string | null => {
      const hatch: HatchPattern | undefined = hatches.get(id);
      if (!hatch) return null;
      let name = named.get(id);
      if (name === undefined) {
        name = `P${patternRefs.size + 1}`;
        patternRefs.set(name, writeHatchTile(writer, hatch, placement));
        named.set(id, name);
      }
      return name;
    };
    // A window leaves out what cannot show in it: a tile of a large drawing carries its own part, not the whole again.
    const shows = content.window === undefined ? () => true : (item: Primitive) => reaches(item, shown);
    for (const layer of drawing.layers)
      for (const item of layer.items) if (shows(item)) drawPrimitive(item, patternName);
    out.push('Q');
  }

  return { content: out.join('\n'), resources: resourcesOf() };

  // Accepts a primitive and the page's names for the drawing's hatches; appends its operators.
  function drawPrimitive(item: Primitive, patternName: (id: string) => string | null): void {
    if (item.type === 'text') return drawText(item);
    const fillPattern = item.patternId === undefined ? null : patternName(item.patternId);
    // SVG fills a shape black unless told otherwise; a hatch it cannot find leaves it unfilled.
    const fill = item.patternId === undefined ? rgbOf(item.fill ?? '#000000') : null;
    const width = item.strokeWidth ?? 1;
    const stroke = item.stroke === undefined || !(width > 0) ? null : rgbOf(item.stroke);
    const filled = fill !== null || fillPattern !== null;
    if (!filled && stroke === null) return;
    const path = item.type === 'rect' ? rectPath(item) : pathOperators(item);
    if (path === '') return;
    const ops: string[] = ['q'];
    const ca = filled ? clamp01(item.fillOpacity ?? 1) : 1;
    const CA = stroke !== null ? clamp01(item.strokeOpacity ?? 1) : 1;
    if (ca < 1 || CA < 1) ops.push(`/${stateName(ca, CA)} gs`);
    if (fillPattern !== null) ops.push(`/Pattern cs /${fillPattern} scn`);
    else if (fill !== null) ops.push(`${fill} rg`);
    if (stroke !== null) {
      ops.push(`${stroke} RG ${pdfNumber(width)} w`);
      const dash = dashArrayOf(item.dash);
      if (dash) ops.push(`${dash} 0 d`);
      if (item.lineCap === 'round') ops.push('1 J');
    }
    ops.push(path, filled && stroke !== null ? 'B' : filled ? 'f' : 'S', 'Q');
    out.push(ops.join('\n'));
  }

  // Accepts a text primitive; appends one text object, placed and turned about its anchor.
  function drawText(item: TextItem): void {
    const colour = rgbOf(item.fill);
    if (colour === null || item.text === '') return;
    const font = item.weight === 'bold' ? fonts.bold : fonts.normal;
    // With one face for both weights, bold is drawn by stroking the regular outlines as well as filling them.
    const synthetic = item.weight === 'bold' && fonts.bold === fonts.normal;
    fontRefs.set(font.name, font.reference(writer));
    const { operand, advance } = font.encode(item.text);
    const shift =
      item.anchor === 'end' ? advance * item.size : item.anchor === 'middle' ? (advance * item.size) / 2 : 0;
    const radians = ((item.rotate ?? 0) * Math.PI) / 180;
    const [cos, sin] = [Math.cos(radians), Math.sin(radians)];
    // Glyphs are drawn y-up: the text matrix flips them back in the page's y-down pixels, then turns them.
    const matrix: Matrix = [cos, sin, sin, -cos, item.x - shift * cos, item.y - shift * sin];
    const text = `BT /${font.name} ${pdfNumber(item.size)} Tf ${colour} rg ${matrixOperands(matrix)} Tm ${operand} Tj ET`;
    // Render mode 2 fills then strokes (ISO 32000-1 §9.3.6); the q … Q keeps the mode and width to this text.
    if (synthetic) out.push(`q ${colour} RG ${pdfNumber(item.size * SYNTHETIC_BOLD_STROKE)} w 1 j 2 Tr`, text, 'Q');
    else out.push(text);
  }

  // Accepts a primitive and a window of its drawing; whether any of its ink may fall inside.
  function reaches(item: Primitive, window: Box): boolean {
    const font = item.type === 'text' && item.weight === 'bold' ? fonts.bold : fonts.normal;
    const [left, top, right, bottom] = inkBoundsIn(item, font);
    return (
      left <= window.x + window.width && right >= window.x && top <= window.y + window.height && bottom >= window.y
    );
  }

  // Accepts fill and stroke opacities; the name of a graphics state setting them, one per pair on the page.
  function stateName(ca: number, CA: number): string {
    const key = `/ca ${pdfNumber(ca)} /CA ${pdfNumber(CA)}`;
    let name = states.get(key);
    if (name === undefined) states.set(key, (name = `G${states.size + 1}`));
    return name;
  }

  // The page's resources dictionary: the fonts, graphics states and patterns its content names.
  function resourcesOf(): string {
    const dictionary = (entries: [string, string][]) =>
      `<< ${entries.map(([name, value]) => `/${name} ${value}`).join(' ')} >>`;
    const parts = ['/ProcSet [/PDF /Text]'];
    if (fontRefs.size > 0) parts.push(`/Font ${dictionary([...fontRefs].map(([n, id]) => [n, `${id} 0 R`]))}`);
    if (states.size > 0) parts.push(`/ExtGState ${dictionary([...states].map(([key, n]) => [n, `<< ${key} >>`]))}`);
    if (patternRefs.size > 0) parts.push(`/Pattern ${dictionary([...patternRefs].map(([n, id]) => [n, `${id} 0 R`]))}`);
    return `<< ${parts.join(' ')} >>`;
  }
}

/**
 * Each primitive's ink bounds, worked out once for all the tiles of a drawing (a large one-line has tens of
 * thousands of items and hundreds of tiles), kept per face since text is measured with it.
 */
const inkBounds = new WeakMap<PdfFont, WeakMap<Primitive, Edges>>();

/**
 * `inkBoundsOf(item)` with text measured in `font`, remembered. Measuring notes the text's glyphs for
 * the subset even where the text is left out, which costs a few glyphs at most.
 */
function inkBoundsIn(item: Primitive, font: PdfFont): Edges {
  let known = inkBounds.get(font);
  if (!known) inkBounds.set(font, (known = new WeakMap()));
  let bounds = known.get(item);
  if (!bounds) known.set(item, (bounds = inkBoundsOf(item, (text) => font.encode(text.text).advance)));
  return bounds;
}

// Accepts a placement; the part of its drawing it shows, checked to have an area (the whole drawing when not given).
function windowOf(placement: PagePlacement): Box {
  const { drawing, window } = placement;
  if (window === undefined) return { x: 0, y: 0, width: drawing.width, height: drawing.height };
  for (const side of ['width', 'height'] as const)
    if (!(window[side] > 0 && Number.isFinite(window[side])))
      throw new RangeError(`window.${side}: expected a size in px greater than 0, got "${window[side]}"`);
  return window;
}

// Accepts a rectangle; its path, or nothing when it has no area (SVG draws no such rectangle).
function rectPath(item: RectItem): string {
  if (!(item.width > 0 && item.height > 0)) return '';
  return `${pdfNumber(item.x)} ${pdfNumber(item.y)} ${pdfNumber(item.width)} ${pdfNumber(item.height)} re`;
}

// Accepts a path primitive; its construction operators (m, l, c, h) in the drawing's pixels.
function pathOperators(item: PathItem): string {
  const steps = pathStepsOf(item.d);
  if (steps.length === 0) return '';
  return steps.map(stepOperator).join(' ');
}

// Accepts one path step; its operator with operands.
function stepOperator(step: PathStep): string {
  const n = pdfNumber;
  switch (step.op) {
    case 'M':
      return `${n(step.x)} ${n(step.y)} m`;
    case 'L':
      return `${n(step.x)} ${n(step.y)} l`;
    case 'C':
      return `${n(step.x1)} ${n(step.y1)} ${n(step.x2)} ${n(step.y2)} ${n(step.x)} ${n(step.y)} c`;
    case 'Z':
      return 'h';
  }
}

// Accepts an opacity; it held to 0–1 (NaN as opaque).
function clamp01(value: number): number {
  return Number.isNaN(value) ? 1 : Math.min(1, Math.max(0, value));
}
