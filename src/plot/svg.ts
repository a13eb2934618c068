import type { HatchPattern, Paint, Primitive } from './geometry.ts';
import { fixed } from './precision.ts';
import type { Sheet } from './sheet.ts';

/** What `svgOf` writes: a TCC sheet, a one-line diagram or a report page. */
export type Drawing = Pick<Sheet, 'width' | 'height' | 'fontFamily' | 'title' | 'description' | 'patterns' | 'layers'>;

/**
 * Writes a sheet as a standalone SVG document: `width`/`height` and a `viewBox`, the title and
 * description, hatch patterns in `<defs>`, a white background and one `<g data-layer>` per layer,
 * one element per line. Deterministic: the same sheet gives the same bytes (stable order, numbers
 * rounded to 3 decimals, ids from the sheet, no clock). Every piece of user text is escaped.
 * @example svgOf(sheetOf(input)).startsWith('<svg xmlns="http://www.w3.org/2000/svg"') // true
 */
export function svgOf(sheet: Drawing): string {
  const { width, height } = sheet;
  const out: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${fixed(width)}" height="${fixed(height)}" viewBox="0 0 ${fixed(width)} ${fixed(height)}" font-family="${escapeXml(sheet.fontFamily)}" role="img">`,
    `  <title>${escapeXml(sheet.title)}</title>`,
    `  <desc>${escapeXml(sheet.description)}</desc>`,
  ];
  if (sheet.patterns.length > 0) {
    out.push('  <defs>');
    for (const pattern of sheet.patterns) out.push(...patternElement(pattern).map((line) => `    ${line}`));
    out.push('  </defs>');
  }
  out.push(`  <rect width="${fixed(width)}" height="${fixed(height)}" fill="#ffffff"/>`);
  for (const layer of sheet.layers) {
    if (layer.items.length === 0) continue;
    out.push(`  <g data-layer="${escapeXml(layer.name)}">`);
    for (const item of layer.items) out.push(`    ${element(item)}`);
    out.push('  </g>');
  }
  out.push('</svg>', '');
  return out.join('\n');
}

/**
 * Escapes text for XML content and attribute values: `&`, `<`, `>`, `"` and `'`.
 * @example escapeXml('<script>"x" & \'y\'') // '&lt;script&gt;&quot;x&quot; &amp; &apos;y&apos;'
 */
export function escapeXml(text: string): string {
  // Characters XML 1.0 forbids (C0 controls but tab and line breaks, lone surrogates, U+FFFE/U+FFFF)
  // are dropped: the schema refuses them in names, and this keeps any other text from making the
  // figure unreadable to XML parsers, resvg (PNG) and the PDF writer.
  return text.replace(NOT_XML, '').replace(/[&<>"']/g, (c) => ESCAPES[c]);
}

// Characters XML 1.0 forbids.
const NOT_XML = new RegExp(
  // eslint-disable-next-line no-control-regex
  '[\\u0000-\\u0008\\u000b\\u000c\\u000e-\\u001f\\ufffe\\uffff]|[\\ud800-\\udbff](?![\\udc00-\\udfff])|(?<![\\ud800-\\udbff])[\\udc00-\\udfff]',
  'g',
);

const ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' };

// Accepts any primitive; one SVG element on one line.
function element(item: Primitive): string {
  const tag = (role: string, dataId?: string) =>
    ` data-role="${escapeXml(role)}"${dataId === undefined ? '' : ` data-id="${escapeXml(dataId)}"`}`;
  switch (item.type) {
    case 'path':
      return `<path d="${item.d}"${paint(item)}${tag(item.role, item.dataId)}/>`;
    case 'rect': {
      const box = `x="${fixed(item.x)}" y="${fixed(item.y)}" width="${fixed(item.width)}" height="${fixed(item.height)}"`;
      return `<rect ${box}${paint(item)}${tag(item.role, item.dataId)}/>`;
    }
    case 'text': {
      const [x, y] = [fixed(item.x), fixed(item.y)];
      const anchor = item.anchor === 'start' ? '' : ` text-anchor="${item.anchor}"`;
      const weight = item.weight === 'bold' ? ' font-weight="bold"' : '';
      const rotate = item.rotate ? ` transform="rotate(${fixed(item.rotate)} ${x} ${y})"` : '';
      const attributes = `x="${x}" y="${y}" font-size="${fixed(item.size)}"${anchor}${weight} fill="${escapeXml(item.fill)}"${rotate}`;
      return `<text ${attributes}${tag(item.role, item.dataId)}>${escapeXml(item.text)}</text>`;
    }
  }
}

// Accepts a shape's paint; its presentation attributes in a fixed order.
function paint(p: Paint): string {
  const parts: string[] = [];
  if (p.patternId !== undefined) parts.push(`fill="url(#${escapeXml(p.patternId)})"`);
  else if (p.fill !== undefined) parts.push(`fill="${escapeXml(p.fill)}"`);
  if (p.fillOpacity !== undefined) parts.push(`fill-opacity="${fixed(p.fillOpacity)}"`);
  if (p.stroke !== undefined) parts.push(`stroke="${escapeXml(p.stroke)}"`);
  if (p.strokeWidth !== undefined) parts.push(`stroke-width="${fixed(p.strokeWidth)}"`);
  if (p.strokeOpacity !== undefined) parts.push(`stroke-opacity="${fixed(p.strokeOpacity)}"`);
  if (p.dash !== undefined) parts.push(`stroke-dasharray="${escapeXml(p.dash)}"`);
  if (p.lineCap !== undefined && p.lineCap !== 'butt') parts.push(`stroke-linecap="${p.lineCap}"`);
  return parts.length > 0 ? ` ${parts.join(' ')}` : '';
}

// Accepts a hatch; a tile of one line (two when cross-hatched) turned to its angle.
function patternElement(p: HatchPattern): string[] {
  const s = fixed(p.spacing);
  const half = fixed(p.spacing / 2);
  const line = (d: string) =>
    `  <path d="${d}" stroke="${escapeXml(p.colour)}" stroke-width="${fixed(p.strokeWidth)}" fill="none"/>`;
  return [
    `<pattern id="${escapeXml(p.id)}" patternUnits="userSpaceOnUse" width="${s}" height="${s}" patternTransform="rotate(${fixed(p.angle)})">`,
    line(`M${half},0L${half},${s}`),
    ...(p.cross ? [line(`M0,${half}L${s},${half}`)] : []),
    '</pattern>',
  ];
}
