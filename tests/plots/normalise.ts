import { normalisePath } from '../asserts.ts';

/**
 * Puts an SVG into the form snapshots are compared in: numbers rounded to 3 decimals, every
 * defined id renumbered in order of appearance (`id-1`, `id-2`, …), one element per line, no
 * trailing spaces.
 */
export function normaliseSvg(svg: string): string {
  const ids = new Map<string, string>();
  for (const [, id] of svg.matchAll(/\bid="([^"]+)"/g)) if (!ids.has(id)) ids.set(id, `id-${ids.size + 1}`);
  let out = svg
    .replace(/\bid="([^"]+)"/g, (_, id: string) => `id="${ids.get(id)}"`)
    .replace(/url\(#([^)]+)\)/g, (whole, id: string) => (ids.has(id) ? `url(#${ids.get(id)})` : whole))
    .replace(
      /\b(d|x|y|x1|y1|x2|y2|width|height|transform|viewBox)="([^"]*)"/g,
      (_, name: string, value: string) => `${name}="${normalisePath(value)}"`,
    );
  out = out.replace(/>\s*</g, '>\n<');
  return `${out
    .split('\n')
    .map((line) => line.trimEnd())
    .filter((line) => line.length > 0)
    .join('\n')}\n`;
}
