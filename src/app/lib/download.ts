import { utf8TextOf } from '../../engine/study/utf8Text.ts';

/**
 * Hands a file to the browser as a download (the workbench's only way of writing files).
 * @example downloadBlob('study.json', new Blob([text], { type: 'application/json' }))
 */
export function downloadBlob(fileName: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  link.rel = 'noopener';
  document.body.append(link);
  link.click();
  link.remove();
  // Revoke later: some browsers read the URL after click() returns.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** Downloads text with its media type. @example downloadText('findings.csv', csv, 'text/csv') */
export function downloadText(fileName: string, text: string, type: string): void {
  downloadBlob(fileName, new Blob([text], { type: `${type};charset=utf-8` }));
}

/**
 * A file name from a study's name: lower case, words joined by "-", no characters a file system refuses.
 * @example fileStemOf('Harrowmere Cold Store — selective scheme') // 'harrowmere-cold-store-selective-scheme'
 */
export function fileStemOf(name: string): string {
  const stem = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
  return stem.slice(0, 60) || 'study';
}

/**
 * Reads a file the user picked as UTF-8 text. Bytes that are not UTF-8 throw `InputError` under `study`
 * (read leniently they would become replacement characters, which a save would then write back).
 * @example const text = await readFileText(input.files[0])
 */
export async function readFileText(file: File): Promise<string> {
  return utf8TextOf(new Uint8Array(await file.arrayBuffer()), 'study');
}
