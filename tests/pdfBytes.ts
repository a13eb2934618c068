// Reads back what a PDF writer put in a file, for tests: the streams (Flate streams inflated), the
// characters its ToUnicode maps name, and its pages' MediaBoxes. Enough for our writer's output, which
// has no object streams; not a general PDF parser.
import { inflateSync } from 'node:zlib';

/** Every stream of a PDF as Latin-1 text, inflated when its dictionary says FlateDecode. */
export function pdfStreamsOf(bytes: Uint8Array): string[] {
  const buffer = Buffer.from(bytes);
  const text = buffer.toString('latin1');
  const streams: string[] = [];
  for (const match of text.matchAll(/stream\r?\n/g)) {
    const start = match.index + match[0].length;
    if (text.slice(match.index - 3, match.index) === 'end') continue;
    const end = text.indexOf('endstream', start);
    if (end < 0) break;
    const dictionary = text.slice(text.lastIndexOf(' obj', match.index), match.index);
    const raw = buffer.subarray(start, end);
    streams.push((/\/FlateDecode/.test(dictionary) ? inflateSync(raw) : raw).toString('latin1'));
  }
  return streams;
}

/** The Unicode code points the PDF's ToUnicode maps give a glyph for (`<glyph><code>` pairs). */
export function toUnicodeOf(bytes: Uint8Array): Set<number> {
  const points = new Set<number>();
  for (const stream of pdfStreamsOf(bytes).filter((s) => s.includes('begincmap'))) {
    for (const [, code] of stream.matchAll(/<[0-9a-f]{4}><([0-9a-f]{4})>/gi)) points.add(Number.parseInt(code, 16));
  }
  return points;
}

/** Each page's MediaBox width and height in points, rounded to 0.01 pt. */
export function mediaBoxesOf(bytes: Uint8Array): [number, number][] {
  const text = Buffer.from(bytes).toString('latin1');
  return [...text.matchAll(/\/MediaBox \[\s*([\d.-]+) ([\d.-]+) ([\d.-]+) ([\d.-]+)\s*\]/g)].map(
    ([, x0, y0, x1, y1]) => [
      Math.round((Number(x1) - Number(x0)) * 100) / 100,
      Math.round((Number(y1) - Number(y0)) * 100) / 100,
    ],
  );
}
