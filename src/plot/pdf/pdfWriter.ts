import { zlibSync } from 'fflate';
import { pdfDate, pdfTextString } from './pdfSyntax.ts';

/**
 * Collects a PDF file's numbered objects and writes the file (ISO 32000-1 §7.5): header, the
 * objects in number order, the cross-reference table, and the trailer. Numbers are reserved first so
 * objects can point at each other in any order; every stream is FlateDecode-compressed.
 */
export interface PdfWriter {
  /** Reserves the next object number (numbers start at 1). */
  reserve(): number;
  /** Writes object `id` with `body` (a dictionary, array or other value) as its content. */
  object(id: number, body: string): void;
  /**
   * Writes object `id` as a stream of `data` (text is taken as Latin-1 bytes), deflated;
   * `dictionary` holds the stream's other entries, e.g. `/Length1 1234`.
   */
  stream(id: number, data: Uint8Array | string, dictionary?: string): void;
  /** The finished file, with `/Root`, `/Info` and an `/ID` derived from the objects' bytes. */
  finish(root: number, info: number): Uint8Array;
}

/** What the document's properties say. */
export interface PdfInfo {
  /** ISO date, the file's creation date. */
  date: string;
  title?: string;
}

/**
 * A writer that keeps objects in memory until {@link PdfWriter.finish}.
 * @example const pdf = createPdfWriter(); const root = pdf.reserve(); pdf.object(root, '<< /Type /Catalog >>')
 */
export function createPdfWriter(): PdfWriter {
  const objects: Uint8Array[] = [];
  let count = 0;
  return {
    reserve: () => ++count,
    object(id, body) {
      objects[id] = latin1(`${id} 0 obj\n${body}\nendobj\n`);
    },
    stream(id, data, dictionary = '') {
      const packed = zlibSync(typeof data === 'string' ? latin1(data) : data, { level: 6 });
      const head = latin1(
        `${id} 0 obj\n<< /Length ${packed.length} /Filter /FlateDecode${dictionary ? ` ${dictionary}` : ''} >>\nstream\n`,
      );
      objects[id] = concat([head, packed, latin1('\nendstream\nendobj\n')]);
    },
    finish(root, info) {
      // The binary comment line marks the file as binary for transfer programs (§7.5.2).
      const header = latin1('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n');
      const offsets: number[] = [];
      let at = header.length;
      for (let id = 1; id <= count; id++) {
        if (!objects[id]) throw new Error(`PDF object ${id}: expected it written, got nothing`);
        offsets.push(at);
        at += objects[id].length;
      }
      const id = fileIdOf(objects);
      // Each cross-reference entry is exactly 20 bytes: 10-digit offset, 5-digit generation, type, EOL.
      const xref = [
        `xref\n0 ${count + 1}\n0000000000 65535 f\r\n`,
        ...offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n\r\n`),
      ];
      const trailer = `trailer\n<< /Size ${count + 1} /Root ${root} 0 R /Info ${info} 0 R /ID [<${id}> <${id}>] >>\nstartxref\n${at}\n%%EOF\n`;
      return concat([header, ...objects.slice(1), latin1(xref.join('') + trailer)]);
    },
  };
}

/**
 * The document information dictionary's body: producer, creation date and, when given, the title.
 * @example infoDictionary({ date: '2000-01-01' }) // "<< /Producer (discern) /CreationDate (D:20000101000000Z) >>"
 */
export function infoDictionary(info: PdfInfo): string {
  const title = info.title ? ` /Title ${pdfTextString(info.title)}` : '';
  return `<< /Producer (discern) /CreationDate (${pdfDate(info.date)})${title} >>`;
}

// Accepts text whose characters are bytes; those bytes.
function latin1(text: string): Uint8Array {
  const bytes = new Uint8Array(text.length);
  for (let i = 0; i < text.length; i++) bytes[i] = text.charCodeAt(i);
  return bytes;
}

// Accepts byte arrays; one array holding them in order.
function concat(parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((sum, part) => sum + part.length, 0));
  let at = 0;
  for (const part of parts) {
    out.set(part, at);
    at += part.length;
  }
  return out;
}

// Accepts the objects' bytes; a 32-hex-digit identifier of them (FNV-1a in four lanes), the same for the same file.
function fileIdOf(objects: Uint8Array[]): string {
  const lanes = [0x811c9dc5, 0x01000193, 0x9e3779b9, 0x85ebca6b];
  for (const bytes of objects) {
    if (!bytes) continue;
    for (let i = 0; i < bytes.length; i++) {
      for (let lane = 0; lane < 4; lane++) lanes[lane] = Math.imul(lanes[lane] ^ (bytes[i] + lane), 16777619) >>> 0;
    }
  }
  return lanes.map((lane) => lane.toString(16).padStart(8, '0').toUpperCase()).join('');
}
