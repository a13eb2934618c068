import { hex4 } from './pdfSyntax.ts';

/**
 * A ToUnicode CMap (ISO 32000-1 §9.10.3) mapping two-byte glyph ids to the text they stand for, so
 * text copied or searched in a viewer reads as written. Characters beyond the Basic Multilingual Plane
 * are written as UTF-16 surrogate pairs. Entries go in blocks of at most 100, as the CMap format asks.
 * @example toUnicodeCMap(new Map([[1001, 'Ω']])).includes('<03E9><03A9>') // true
 */
export function toUnicodeCMap(glyphs: ReadonlyMap<number, string>): string {
  const entries = [...glyphs].sort(([a], [b]) => a - b);
  const blocks: string[] = [];
  for (let i = 0; i < entries.length; i += 100) {
    const block = entries.slice(i, i + 100);
    const lines = block.map(([glyph, text]) => `<${hex4(glyph)}><${[...utf16Of(text)].map(hex4).join('')}>`);
    blocks.push(`${block.length} beginbfchar\n${lines.join('\n')}\nendbfchar`);
  }
  return [
    '/CIDInit /ProcSet findresource begin',
    '12 dict begin',
    'begincmap',
    '/CIDSystemInfo << /Registry (Adobe) /Ordering (UCS) /Supplement 0 >> def',
    '/CMapName /Adobe-Identity-UCS def',
    '/CMapType 2 def',
    '1 begincodespacerange',
    '<0000> <FFFF>',
    'endcodespacerange',
    ...blocks,
    'endcmap',
    'CMapName currentdict /CMap defineresource pop',
    'end',
    'end',
  ].join('\n');
}

// Accepts text; its UTF-16 code units.
function* utf16Of(text: string): Generator<number> {
  for (let i = 0; i < text.length; i++) yield text.charCodeAt(i);
}
