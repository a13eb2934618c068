import regularUrl from '../assets/fonts/DejaVuSans.ttf?url';

/**
 * The DejaVu Sans face a PDF export embeds, as TTF bytes (the shape `pdfOf`'s `fonts` option takes).
 * The workbench ships the regular face alone: its PDFs draw bold text by stroking the regular
 * outlines, which keeps a second face (21 kB compressed) out of what the browser downloads.
 */
export interface PdfFonts {
  regular: Uint8Array;
}

let loading: Promise<PdfFonts> | undefined;

/**
 * Fetches the subset DejaVu Sans face shipped with the workbench (`src/app/assets/fonts/`), once per
 * page: only its URL is in the start bundle, the bytes come when the first PDF is exported. A failed
 * fetch is not kept, so the next export tries again.
 * @example await pdfOf(sheet, { paper: 'a4', fonts: await loadPdfFonts() })
 */
export function loadPdfFonts(): Promise<PdfFonts> {
  loading ??= fetchFont(regularUrl).then(
    (regular) => ({ regular }),
    (error: unknown) => {
      loading = undefined;
      throw error;
    },
  );
  return loading;
}

// Accepts the URL of a shipped font; its bytes, or an error naming the file and the HTTP status.
async function fetchFont(url: string): Promise<Uint8Array> {
  const response = await fetch(url);
  if (!response.ok) throw new Error(`PDF font ${url}: expected the file, got HTTP ${response.status}`);
  return new Uint8Array(await response.arrayBuffer());
}
