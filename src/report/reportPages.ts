import { CAUTION } from '../engine/caution.ts';
import type { Box, Primitive, TextItem } from '../plot/geometry.ts';
import { SHEET_COLOURS } from '../plot/palette.ts';
import { pagePoints, type PagePlacement, type Paper } from '../plot/pdf.ts';
import type { Drawing } from '../plot/svg.ts';
import { textWidth, wrapText } from '../plot/textWidth.ts';
import { figureTileDefaults, figureTilingOf, type FigureTile, type FigureTiling } from './figureTiles.ts';
import type { ReportBlock, StudyReport } from './studyReport.ts';

/** Paper and orientation of a printed report. */
export interface PageSetup {
  paper: Paper;
  orientation: 'landscape' | 'portrait';
}

/** How printed pages are laid out, in points. */
export const pageDefaults = {
  margin: 48,
  body: 9.5,
  small: 8,
  heading: 15,
  lineHeight: 1.35,
  fontFamily: 'DejaVu Sans, Arial, Helvetica, sans-serif',
} as const;

/** One printed page: its own drawing (text, rules, header and footer) and at most one figure placed on it. */
export interface ReportPage {
  drawing: Drawing;
  figure?: PagePlacement;
}

/**
 * Lays a report out on pages of one paper size: a cover, a table of contents with page numbers, then
 * each section from a new page; paragraphs and lists wrap, tables split between rows with their header
 * repeated, each figure gets a page of its own scaled to fit (one too large to read so, such as a
 * whole-site one-line, an overview page and then a page per tile at a legible scale: `figureTilingOf`),
 * and every page carries the study name, the revision, the page number and the caution. Text is
 * measured with the DejaVu Sans widths of the embedded face, so what is laid out here is what prints.
 * Deterministic.
 * @example reportPagesOf(studyReportOf(analysis), { paper: 'letter', orientation: 'portrait' }).length
 */
export function reportPagesOf(report: StudyReport, setup: PageSetup): ReportPage[] {
  const [pageWidth, pageHeight] = pagePoints(setup.paper, setup.orientation);
  const { margin, body, heading, lineHeight } = pageDefaults;
  const contentWidth = pageWidth - 2 * margin;
  const top = margin + 18;
  const bottom = pageHeight - margin - 30;

  const pages: { items: Primitive[]; figure?: PagePlacement }[] = [];
  let page: Primitive[] = [];
  let y = top;
  const newPage = () => {
    page = [];
    pages.push({ items: page });
    y = top;
  };
  const room = (height: number) => {
    if (y + height > bottom && y > top) newPage();
  };
  const line = (
    text: string,
    x: number,
    size: number,
    weight: 'normal' | 'bold' = 'normal',
    fill = SHEET_COLOURS.text,
  ) => {
    page.push(textItem(text, x, y + size, size, weight, fill));
    y += size * lineHeight;
  };
  const paragraph = (
    text: string,
    x: number = margin,
    width: number = contentWidth,
    size: number = body,
    weight: 'normal' | 'bold' = 'normal',
  ) => {
    for (const row of wrapText(text, width, size, weight)) {
      room(size * lineHeight);
      line(row, x, size, weight);
    }
  };

  // Cover: title, study details, revision log, notes and the cautions. Every line asks for room first, so
  // a long description or revision log runs on to further pages (running head and footer included)
  // rather than printing over the footer or pushing the cautions off the page.
  newPage();
  y = top + 60;
  paragraph(report.title, margin, contentWidth, 20, 'bold');
  y += 16;
  const labelWidth = 90;
  const detailStep = 11 * lineHeight;
  for (const [label, value] of report.details) {
    const rows = wrapText(value, contentWidth - labelWidth, 11);
    (rows.length > 0 ? rows : ['']).forEach((row, i) => {
      room(detailStep);
      // The label goes beside the value's first row, on whichever page that row lands.
      if (i === 0) page.push(textItem(label, margin, y + 11, 11, 'bold', SHEET_COLOURS.mutedText));
      line(row, margin + labelWidth, 11);
    });
    y += 3;
  }
  // A cover heading keeps its first line with it: room for both, or both go to the next page.
  const coverHeading = (text: string, next: number) => {
    y += 12;
    room(detailStep + next);
    line(text, margin, 11, 'bold');
  };
  if (report.revisions.length > 0) {
    // The table keeps its heading with its header and first row.
    table(['revision', 'date', 'by', 'what changed'], report.revisions, [], {
      height: 12 + detailStep,
      draw: () => {
        y += 12;
        line('Revision log', margin, 11, 'bold');
      },
    });
  }
  if (report.notes) {
    coverHeading('Notes', body * lineHeight);
    paragraph(report.notes);
  }
  y += 4;
  coverHeading('Cautions', body * lineHeight);
  for (const caution of report.cautions) bullet(caution);

  // Contents: filled in once the sections are laid out and their first pages are known.
  newPage();
  const contentsPage = page;
  const firstPages: number[] = [];

  report.sections.forEach((section, index) => {
    newPage();
    firstPages.push(pages.length);
    for (const row of wrapText(`${index + 1}. ${section.title}`, contentWidth, heading, 'bold'))
      line(row, margin, heading, 'bold');
    y += 6;
    for (const block of section.blocks) {
      layBlock(block);
      y += body * 0.6;
    }
  });

  // The contents page, now that the page numbers are known.
  page = contentsPage;
  y = top;
  line('Contents', margin, heading, 'bold');
  y += 8;
  report.sections.forEach((section, index) => {
    const number = String(firstPages[index]);
    page.push(textItem(number, margin + contentWidth, y + 11, 11, 'normal', SHEET_COLOURS.text, 'end'));
    line(`${index + 1}. ${section.title}`, margin, 11);
    y += 2;
  });

  // Every page's header and footer.
  const footer = wrapText(CAUTION, contentWidth, 6.5);
  const runningHead = [
    report.details.find(([l]) => l === 'Study')?.[1],
    report.details.find(([l]) => l === 'Revision')?.[1],
  ]
    .filter(Boolean)
    .map((part, i) => (i === 1 ? `revision ${part}` : part))
    .join(' — ');
  return pages.map((p, index) => {
    const items = [...p.items];
    if (index > 0) items.push(textItem(runningHead, margin, margin, 7.5, 'normal', SHEET_COLOURS.mutedText));
    items.push(
      {
        type: 'path',
        d: `M${margin},${pageHeight - margin - 24}L${margin + contentWidth},${pageHeight - margin - 24}`,
        stroke: SHEET_COLOURS.gridMajor,
        strokeWidth: 0.5,
        fill: 'none',
        role: 'page-rule',
      },
      ...footer
        .slice(0, 2)
        .map((text, i) =>
          textItem(
            text,
            margin,
            pageHeight - margin - 14 + i * 8.5,
            6.5,
            'normal',
            SHEET_COLOURS.mutedText,
            'start',
            'caution',
          ),
        ),
      textItem(
        `page ${index + 1} of ${pages.length}`,
        margin + contentWidth,
        pageHeight - margin + 6,
        7.5,
        'normal',
        SHEET_COLOURS.mutedText,
        'end',
        'page-number',
      ),
    );
    return {
      drawing: {
        width: pageWidth,
        height: pageHeight,
        fontFamily: pageDefaults.fontFamily,
        title: `${runningHead}, page ${index + 1}`,
        description: `Page ${index + 1} of ${pages.length} of the coordination study report.`,
        patterns: [],
        layers: [{ name: 'page', items }],
      },
      figure: p.figure,
    };
  });

  // Accepts a block; lays it out from the current point, breaking pages where needed.
  function layBlock(block: ReportBlock): void {
    switch (block.type) {
      case 'paragraph':
        return paragraph(block.text);
      case 'list':
        for (const item of block.items) bullet(item);
        return;
      case 'table':
        return table(block.columns, block.rows, block.numeric);
      case 'work': {
        room(4 * body * lineHeight);
        paragraph(block.title, margin, contentWidth, body, 'bold');
        for (const text of block.text.split('\n')) paragraph(text, margin + 8, contentWidth - 8, pageDefaults.small);
        return;
      }
      case 'figure': {
        // A figure takes a page of its own (a fresh one unless this page is still empty under its heading).
        if (y > top + 3 * heading) newPage();
        const tiling = tilingOf(block.drawing, block.caption);
        if (tiling === null) return placeFigure(block.drawing, block.caption);
        // Too small to read whole: the whole as an overview, then a page for each tile, row by row.
        const count = tiling.tiles.length;
        placeFigure(
          block.drawing,
          `${block.caption} — overview; continued at a readable size on the next ${count} pages`,
        );
        const tilePages: number[] = [];
        for (const tile of tiling.tiles) {
          newPage();
          tilePages.push(pages.length);
          placeFigure(block.drawing, tileCaption(block.caption, tile, tiling), {
            window: tile.window,
            scale: tiling.scale,
          });
        }
        if (block.landmarks && block.landmarks.places.length > 0 && count >= figureTileDefaults.indexedFrom) {
          const { of, places } = block.landmarks;
          newPage();
          paragraph(
            // The caption as written: it may name a scenario or a generator, whose case is theirs.
            `Where each ${of} is on the parts above — ${block.caption}`,
            margin,
            contentWidth,
            body,
            'bold',
          );
          y += 4;
          table([of, 'part', 'page'], landmarkRows(places, tiling, tilePages), [false, true, true]);
        }
        return;
      }
    }
  }

  // Accepts a drawing, its caption and, for a tile, the window shown and its scale; the caption and the
  // drawing (scaled to fit when whole) fill the rest of the page.
  function placeFigure(drawing: Drawing, caption: string, tile?: { window: Box; scale: number }): void {
    paragraph(caption, margin, contentWidth, body, 'bold');
    const box = { x: margin, y: y + 4, width: contentWidth, height: bottom - y - 8 };
    const fit = tile?.scale ?? Math.min(box.width / drawing.width, box.height / drawing.height);
    const shown = tile?.window ?? drawing;
    const [w, h] = [shown.width * fit, shown.height * fit];
    pages[pages.length - 1].figure = {
      drawing,
      x: box.x + (box.width - w) / 2,
      y: box.y,
      width: w,
      height: h,
      ...(tile && { window: tile.window }),
    };
    // The page is full: what follows starts on the next one.
    y = bottom;
  }

  // Accepts a figure about to be placed at the current point; its tiles when it cannot print legibly
  // whole, or null. Tile pages start at the top; the room under their captions is known only once the
  // captions are, which name the tile count, so the room is taken again until the captions fit it.
  function tilingOf(drawing: Drawing, caption: string): FigureTiling | null {
    const captionHeight = (text: string) => wrapText(text, contentWidth, body, 'bold').length * body * lineHeight;
    const fit = Math.min(contentWidth / drawing.width, (bottom - y - captionHeight(caption) - 8) / drawing.height);
    let above = captionHeight(tileCaption(caption, { row: 1, column: 1 }, { rows: 1, columns: 1 }));
    for (;;) {
      const room = { width: contentWidth, height: bottom - top - above - 8 };
      const tiling = figureTilingOf(drawing, fit, room);
      if (tiling === null) return null;
      const tallest = Math.max(...tiling.tiles.map((tile) => captionHeight(tileCaption(caption, tile, tiling))));
      if (tallest <= above) return tiling;
      above = tallest;
    }
  }

  // Accepts one list item; a bullet and its wrapped text.
  function bullet(text: string): void {
    const rows = wrapText(text, contentWidth - 12, body);
    rows.forEach((row, i) => {
      room(body * lineHeight);
      if (i === 0) page.push(textItem('•', margin + 2, y + body, body, 'normal', SHEET_COLOURS.text));
      line(row, margin + 12, body);
    });
  }

  // Accepts a table; columns sized to their contents within the page, cells wrapped, header repeated after a break.
  function table(
    columns: string[],
    rows: string[][],
    numeric: boolean[] = [],
    lead?: { height: number; draw: () => void },
  ): void {
    const size = pageDefaults.small;
    const pad = 4;
    const natural = columns.map(
      (column, c) =>
        Math.max(textWidth(column, size, 'bold'), ...rows.map((row) => textWidth(row[c] ?? '', size))) + 2 * pad,
    );
    const longestWord = (text: string, weight: 'normal' | 'bold') =>
      Math.max(0, ...text.split(/\s+/).map((word) => textWidth(word, size, weight)));
    const narrowest = columns.map(
      (column, c) =>
        Math.max(longestWord(column, 'bold'), ...rows.map((row) => longestWord(row[c] ?? '', 'normal'))) + 2 * pad,
    );
    const widths = fitColumns(narrowest, natural, contentWidth);
    const step = size * lineHeight;
    const drawRow = (cells: string[], weight: 'normal' | 'bold') => {
      const wrapped = cells.map((cell, c) => wrapText(cell, widths[c] - 2 * pad, size, weight));
      const height = Math.max(1, ...wrapped.map((lines) => lines.length)) * step + pad;
      return { wrapped, height };
    };
    const header = drawRow(columns, 'bold');
    const put = (row: { wrapped: string[][]; height: number }, weight: 'normal' | 'bold') => {
      let x: number = margin;
      row.wrapped.forEach((lines, c) => {
        const right = numeric[c] === true;
        lines.forEach((text, i) =>
          page.push(
            textItem(
              text,
              right ? x + widths[c] - pad : x + pad,
              y + size + i * step,
              size,
              weight,
              SHEET_COLOURS.text,
              right ? 'end' : 'start',
            ),
          ),
        );
        x += widths[c];
      });
      y += row.height;
      page.push({
        type: 'path',
        d: `M${margin},${y - pad / 2}L${margin + contentWidth},${y - pad / 2}`,
        stroke: SHEET_COLOURS.gridMinor,
        strokeWidth: 0.5,
        fill: 'none',
        role: 'table-rule',
      });
    };
    // Lines `from` to `to` of a row, as a row of their own.
    const partOf = (row: { wrapped: string[][] }, from: number, to: number) => {
      const wrapped = row.wrapped.map((lines) => lines.slice(from, to));
      return { wrapped, height: Math.max(1, ...wrapped.map((lines) => lines.length)) * step + pad };
    };
    const linesOf = (row: { wrapped: string[][] }) => Math.max(1, ...row.wrapped.map((lines) => lines.length));
    // What a page holds under the header; a row taller than that is split at page feet.
    const pageRoom = bottom - top - header.height;
    // The header keeps its first row (or, of a row taller than a page, two lines of it) and what leads
    // into the table (a heading) with it: a header alone at the foot of a page says nothing.
    const leadHeight = lead?.height ?? 0;
    const first = rows.length > 0 ? drawRow(rows[0], 'normal') : undefined;
    const kept = first && first.height <= pageRoom - leadHeight ? first.height : 2 * step + pad;
    room(leadHeight + header.height + kept);
    lead?.draw();
    put(header, 'bold');
    // True while nothing stands under the header just put: a row that does not fit there is split, not
    // moved on, or the header would stand alone.
    let underHeader = true;
    for (const [index, cells] of rows.entries()) {
      let row = index === 0 && first ? first : drawRow(cells, 'normal');
      if (y + row.height <= bottom || (!underHeader && row.height <= pageRoom)) {
        if (y + row.height > bottom) {
          newPage();
          put(header, 'bold');
        }
        put(row, 'normal');
        underHeader = false;
        continue;
      }
      // Taller than the room under the header: as many lines as fit here, the rest under the header on
      // the next pages.
      for (;;) {
        const fit = Math.max(underHeader ? 1 : 0, Math.floor((bottom - y - pad) / step));
        if (linesOf(row) <= fit) {
          put(row, 'normal');
          underHeader = false;
          break;
        }
        if (fit > 0) {
          put(partOf(row, 0, fit), 'normal');
          row = partOf(row, fit, Infinity);
        }
        newPage();
        put(header, 'bold');
        underHeader = true;
      }
    }
  }
}

// Accepts each column's narrowest width (its longest word) and natural width (its longest cell unwrapped)
// and the room there is. Where every cell fits unwrapped, the spare room is shared out evenly; else each
// column gets its narrowest width and the rest of the room in proportion to what wrapping takes from it,
// so a column of long sentences gets the room a column of short values does not need. Where the longest
// words alone are too wide, the widest give way.
function fitColumns(narrowest: number[], natural: number[], width: number): number[] {
  const total = natural.reduce((a, b) => a + b, 0);
  if (total <= width) return natural.map((w) => w + (width - total) / natural.length);
  const least = narrowest.reduce((a, b) => a + b, 0);
  // Not even the longest words fit: only the columns of the longest words give way, down to one width
  // between them (their words break), so that short values and headers elsewhere stay whole.
  if (least >= width) {
    const ascending = [...narrowest].sort((a, b) => a - b);
    let left = width;
    for (let i = 0; i < ascending.length; i++) {
      const even = left / (ascending.length - i);
      if (ascending[i] >= even) return narrowest.map((w) => Math.min(w, even));
      left -= ascending[i];
    }
  }
  const share = (width - least) / (total - least);
  return natural.map((w, c) => narrowest[c] + (w - narrowest[c]) * share);
}

// Accepts a figure's caption, one of its tiles and the grid's rows and columns; the tile page's caption,
// numbering the tiles row by row and placing this one in the grid ("row 2 of 3, column 1 of 2").
function tileCaption(
  caption: string,
  tile: Pick<FigureTile, 'row' | 'column'>,
  grid: Pick<FigureTiling, 'rows' | 'columns'>,
): string {
  const part = (tile.row - 1) * grid.columns + tile.column;
  return `${caption} — part ${part} of ${grid.rows * grid.columns} (row ${tile.row} of ${grid.rows}, column ${tile.column} of ${grid.columns})`;
}

// Accepts text and where it goes; one text primitive on a page.
function textItem(
  text: string,
  x: number,
  y: number,
  size: number,
  weight: 'normal' | 'bold',
  fill: string,
  anchor: 'start' | 'end' = 'start',
  role = 'page-text',
): TextItem {
  return { type: 'text', x, y, text, size, anchor, fill, weight, role };
}

/**
 * The index of a tiled figure: each landmark by name (in natural order, "P2" before "P10"), with the
 * first part, row by row, that shows its box whole, else the first that shows where it starts, and
 * that part's page. A landmark no part shows (none should: the tiles cover the drawing) is left out.
 */
function landmarkRows(landmarks: { name: string; box: Box }[], tiling: FigureTiling, tilePages: number[]): string[][] {
  const holds = (window: Box, x: number, y: number) =>
    x >= window.x && x <= window.x + window.width && y >= window.y && y <= window.y + window.height;
  const rows: string[][] = [];
  for (const { name, box } of landmarks) {
    const whole = tiling.tiles.findIndex(
      ({ window }) => holds(window, box.x, box.y) && holds(window, box.x + box.width, box.y + box.height),
    );
    const index = whole >= 0 ? whole : tiling.tiles.findIndex(({ window }) => holds(window, box.x, box.y));
    if (index >= 0) rows.push([name, String(index + 1), String(tilePages[index])]);
  }
  return rows.sort((a, b) => a[0].localeCompare(b[0], 'en', { numeric: true }));
}
