import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { radialStudy } from '../../bench/radialStudy.ts';
import { CAUTION } from '../../src/engine/caution.ts';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { analyseScenarios } from '../../src/engine/scenario/index.ts';
import { parseStudy, readStudy } from '../../src/engine/study/index.ts';
import type { Box } from '../../src/plot/geometry.ts';
import type { OneLine } from '../../src/plot/oneLine/index.ts';
import type { Drawing } from '../../src/plot/svg.ts';
import { figureTileDefaults } from '../../src/report/figureTiles.ts';
import {
  pageDefaults,
  reportPagesOf,
  studyReportOf,
  type ReportPage,
  type StudyReport,
} from '../../src/report/index.ts';

/** The selective demo with a description of `sentences` numbered sentences. */
function describedAtLength(sentences: number) {
  const raw = JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8'));
  raw.description = Array.from(
    { length: sentences },
    (_, i) => `Sentence ${i + 1} says which loads this part of the cold store carries and why they matter.`,
  ).join(' ');
  const { study, problems } = readStudy(raw);
  if (!study) throw new Error(problems.map((p) => p.message).join('; '));
  return study;
}

/** A page's body text (not its running head, footer caution or page number), top to bottom. */
function bodyOf(page: ReportPage) {
  return page.drawing.layers[0].items.flatMap((item) =>
    item.type === 'text' && item.role === 'page-text' && item.y > pageDefaults.margin ? [item] : [],
  );
}

describe('reportPagesOf', () => {
  it('runs an 80-sentence description on to further cover pages: every sentence printed, none over the footer, the cautions in full', () => {
    const study = describedAtLength(80);
    const report = studyReportOf(analyseStudy(study));
    const pages = reportPagesOf(report, { paper: 'letter', orientation: 'portrait' });
    // The footer's rule sits 24 pt above the bottom margin; body text must stay above it.
    const rule = pages[0].drawing.height - pageDefaults.margin - 24;
    const contentsAt = pages.findIndex((page) => bodyOf(page).some((item) => item.text === 'Contents'));
    expect(contentsAt).toBeGreaterThan(1);
    const cover = pages.slice(0, contentsAt);
    for (const page of cover) for (const item of bodyOf(page)) expect(item.y, item.text).toBeLessThan(rule);

    // Read back in order, the cover holds the whole description once, then the heading and every caution.
    const text = cover.flatMap((page) => bodyOf(page).map((item) => item.text)).join(' ');
    expect(text).toContain(study.description);
    expect(text.match(/Sentence \d+ says/g)).toHaveLength(80);
    const cautionsAt = text.indexOf('Cautions');
    expect(cautionsAt).toBeGreaterThan(text.indexOf('Sentence 80 says'));
    for (const caution of report.cautions) expect(text.slice(cautionsAt)).toContain(caution);

    // Cover pages after the first carry the running head, and the contents still point at each section.
    for (const page of cover.slice(1)) {
      const head = page.drawing.layers[0].items.find((item) => item.type === 'text' && item.y === pageDefaults.margin);
      expect(head?.type === 'text' && head.text).toMatch(/^Harrowmere Cold Store/);
    }
    const numbers = bodyOf(pages[contentsAt]).flatMap((item) => (/^\d+$/.test(item.text) ? [Number(item.text)] : []));
    numbers.forEach((number, i) =>
      expect(bodyOf(pages[number - 1])[0].text).toBe(`${i + 1}. ${report.sections[i].title}`),
    );
  });

  it('keeps a short cover on one page, the contents on the second', () => {
    const pages = reportPagesOf(studyReportOf(analyseStudy(describedAtLength(2))), {
      paper: 'letter',
      orientation: 'portrait',
    });
    expect(bodyOf(pages[0]).some((item) => item.text === 'Cautions')).toBe(true);
    expect(bodyOf(pages[1])[0].text).toBe('Contents');
  });
});

/** A report of one section holding a figure of `drawing`, then a section of one paragraph. */
function reportWithFigure(drawing: Drawing): StudyReport {
  return {
    title: 'Figure study',
    details: [['Study', 'Figure study']],
    cautions: ['Check every figure.'],
    revisions: [],
    sections: [
      { id: 'figure', title: 'A figure', blocks: [{ type: 'figure', caption: 'The drawing', drawing }] },
      { id: 'after', title: 'After it', blocks: [{ type: 'paragraph', text: 'What follows the figure.' }] },
    ],
  };
}

/** A blank drawing of a size with one 11-px label. */
function labelled(width: number, height: number): Drawing {
  return {
    width,
    height,
    fontFamily: pageDefaults.fontFamily,
    title: 'Labelled',
    description: 'One bus label.',
    patterns: [],
    layers: [
      {
        name: 'labels',
        items: [
          { type: 'text', role: 'label', x: 20, y: 40, text: 'Bus 1', size: 11, anchor: 'start', fill: '#1a1a1a' },
        ],
      },
    ],
  };
}

/** The bold text of a page's body, joined: a figure page's caption (after its section heading, if any). */
function captionOf(page: ReportPage): string {
  return bodyOf(page)
    .filter((item) => item.weight === 'bold' && item.size === pageDefaults.body)
    .map((item) => item.text)
    .join(' ');
}

/** The rows of a tiled figure's index from its first page on: name → [part, page]. */
function indexRowsOf(pages: ReportPage[], indexAt: number): Map<string, string[]> {
  const rows = new Map<string, string[]>();
  for (let at = indexAt; at < pages.length && !/^\d\. /.test(bodyOf(pages[at])[0]?.text ?? ''); at++) {
    // A row is the texts on one line of the page, left to right.
    const lines = new Map<number, { x: number; text: string }[]>();
    for (const item of bodyOf(pages[at])) lines.set(item.y, [...(lines.get(item.y) ?? []), item]);
    for (const line of lines.values()) {
      const [name, part, page] = line.sort((a, b) => a.x - b.x).map((item) => item.text);
      if (/^\d+$/.test(part ?? '') && name !== 'bus') rows.set(name, [part, page]);
    }
  }
  return rows;
}

/**
 * Each bus (by its index name, with its label's box) is indexed once, on the first tile showing its
 * label whole, else the first showing where it starts, and on that tile's page.
 */
function expectIndexed(rows: Map<string, string[]>, labels: Map<string, Box>, tiles: ReportPage[], overviewAt: number) {
  expect(rows.size).toBe(labels.size);
  const windows = tiles.map((tile) => tile.figure!.window!);
  const holds = (w: Box, x: number, y: number) => x >= w.x && x <= w.x + w.width && y >= w.y && y <= w.y + w.height;
  for (const [name, label] of labels) {
    const [part, page] = rows.get(name)!.map(Number);
    const whole = windows.findIndex(
      (w) => holds(w, label.x, label.y) && holds(w, label.x + label.width, label.y + label.height),
    );
    const start = windows.findIndex((w) => holds(w, label.x, label.y));
    expect(part - 1, name).toBe(whole >= 0 ? whole : start);
    // Tile k is on the k-th page after the overview (pages counted from 1).
    expect(page, name).toBe(overviewAt + 1 + part);
  }
}

describe('reportPagesOf with figures', () => {
  it('gives a small figure exactly one page, scaled whole to the width of the page as before', () => {
    const drawing = labelled(400, 300);
    const pages = reportPagesOf(reportWithFigure(drawing), { paper: 'letter', orientation: 'portrait' });
    const placed = pages.flatMap((page, index) => (page.figure ? [{ index, figure: page.figure }] : []));
    expect(placed).toHaveLength(1);
    const [{ index, figure }] = placed;
    const width = pages[index].drawing.width - 2 * pageDefaults.margin;
    expect(figure).toEqual({
      drawing,
      x: pageDefaults.margin,
      y: figure.y,
      width,
      height: (300 * width) / 400,
    });
    expect('window' in figure).toBe(false);
    expect(captionOf(pages[index])).toBe('The drawing');
    expect(bodyOf(pages[index + 1])[0].text).toBe('2. After it');
  });

  it('tiles a figure whose labels would print below 6 pt: an overview, then the tiles, and the contents skip them', () => {
    const drawing = labelled(1200, 4000);
    const pages = reportPagesOf(reportWithFigure(drawing), { paper: 'letter', orientation: 'portrait' });
    const at = pages.findIndex((page) => page.figure?.drawing === drawing);
    const tiles = pages.filter((page) => page.figure?.window);
    expect(tiles.length).toBeGreaterThan(1);
    expect(captionOf(pages[at])).toBe(
      `The drawing — overview; continued at a readable size on the next ${tiles.length} pages`,
    );
    expect(pages.slice(at + 1, at + 1 + tiles.length)).toEqual(tiles);
    expect(captionOf(tiles[1])).toMatch(
      new RegExp(`^The drawing — part 2 of ${tiles.length} \\(row 1 of \\d+, column 2 of \\d+\\)$`),
    );
    // The next section starts after the last tile, and the contents page says so.
    const next = at + tiles.length + 1;
    expect(bodyOf(pages[next])[0].text).toBe('2. After it');
    expect(bodyOf(pages[1]).map((item) => item.text)).toContain(String(next + 1));
  });
});

describe('reportPagesOf with the whole-site one-line of a generated 600-device study', () => {
  const setup = { paper: 'letter', orientation: 'portrait' } as const;
  let report: StudyReport;
  let pages: ReportPage[];
  let oneLine: OneLine;
  let overviewAt: number;
  let tiles: ReportPage[];

  beforeAll(() => {
    report = studyReportOf(analyseStudy(parseStudy(radialStudy(600))));
    pages = reportPagesOf(report, setup);
    const block = report.sections.find((s) => s.id === 'one-line')!.blocks.find((b) => b.type === 'figure');
    if (block?.type !== 'figure') throw new Error('no one-line figure');
    oneLine = block.drawing as OneLine;
    overviewAt = pages.findIndex((page) => page.figure?.drawing === oneLine);
    tiles = pages.filter((page) => page.figure?.drawing === oneLine && page.figure.window);
  }, 120_000);

  it('prints it whole on an overview page naming the tile pages that follow it, one tile a page', () => {
    expect(pages[overviewAt].figure!.window).toBeUndefined();
    expect(tiles.length).toBeGreaterThan(10);
    expect(captionOf(pages[overviewAt])).toMatch(
      new RegExp(`— overview; continued at a readable size on the next ${tiles.length} pages$`),
    );
    expect(pages.slice(overviewAt + 1, overviewAt + 1 + tiles.length)).toEqual(tiles);
    tiles.forEach((tile, i) => {
      const [, row, rows, column, columns] = /\(row (\d+) of (\d+), column (\d+) of (\d+)\)$/
        .exec(captionOf(tile))!
        .map(Number);
      expect(rows * columns).toBe(tiles.length);
      expect(captionOf(tile)).toContain(
        `— part ${i + 1} of ${tiles.length} (row ${row} of ${rows}, column ${column} of ${columns})`,
      );
      // Tiles of one row show the same band of the drawing; of one column, the same strip.
      const first = tiles.find((t) => captionOf(t).endsWith(`(row ${row} of ${rows}, column 1 of ${columns})`))!;
      expect(tile.figure!.window!.y).toBe(first.figure!.window!.y);
    });
  });

  it('prints every text on every tile at 6 pt or more, inside the page above its footer', () => {
    const texts = oneLine.layers.flatMap((layer) =>
      layer.items.flatMap((item) => (item.type === 'text' ? [item] : [])),
    );
    const rule = pages[0].drawing.height - pageDefaults.margin - 24;
    let printed = 0;
    for (const { figure } of tiles) {
      const { window, width, height } = figure!;
      const scale = width / window!.width;
      expect(height / window!.height).toBeCloseTo(scale, 9);
      expect(figure!.y + height).toBeLessThanOrEqual(rule);
      for (const text of texts) {
        const inside =
          text.x >= window!.x &&
          text.x <= window!.x + window!.width &&
          text.y >= window!.y &&
          text.y <= window!.y + window!.height;
        if (!inside) continue;
        printed++;
        // A hair of tolerance for the window's width, divided from the page's in floating point.
        expect(text.size * scale).toBeGreaterThanOrEqual(figureTileDefaults.legibleText - 1e-9);
      }
    }
    expect(printed).toBeGreaterThan(texts.length);
  });

  it('covers the whole drawing with its tiles, every point a half-overlap or more from an edge cut on some tile', () => {
    const windows = tiles.map((tile) => tile.figure!.window!);
    const scale = tiles[0].figure!.width / windows[0].width;
    // Within half the overlap of a cut, a point is the same distance or more inside the neighbour.
    const clear = figureTileDefaults.overlap / 2 / scale - 1e-6;
    const { width, height } = oneLine;
    const along = (length: number) => [...Array.from({ length: Math.ceil(length / 20) }, (_, i) => i * 20), length];
    for (const y of along(height))
      for (const x of along(width)) {
        const shown = windows.some(
          (w) =>
            (w.x <= 0 ? x >= 0 : x - w.x >= clear) &&
            (w.x + w.width >= width ? x <= width : w.x + w.width - x >= clear) &&
            (w.y <= 0 ? y >= 0 : y - w.y >= clear) &&
            (w.y + w.height >= height ? y <= height : w.y + w.height - y >= clear),
        );
        if (!shown) expect.fail(`(${x}, ${y}) px of the one-line is on no tile, or only at a tile's cut edge`);
      }
  });

  it('follows the tiles with an index of the buses: each bus once, on the part and page whose tile shows its name', () => {
    const indexAt = overviewAt + tiles.length + 1;
    expect(captionOf(pages[indexAt])).toMatch(/^Where each bus is on the parts above — The system as modelled/);
    const buses = oneLine.places.filter((place) => place.type === 'bus');
    expectIndexed(indexRowsOf(pages, indexAt), new Map(buses.map((bus) => [bus.id, bus.label])), tiles, overviewAt);
  });

  it('keeps the running head, the caution and the page number on every page, and the contents pointing at each section', () => {
    pages.forEach((page, i) => {
      const texts = page.drawing.layers[0].items.flatMap((item) => (item.type === 'text' ? [item] : []));
      expect(
        texts
          .filter((t) => t.role === 'caution')
          .map((t) => t.text)
          .join(' '),
      ).toContain(CAUTION.slice(0, 60));
      expect(texts.find((t) => t.role === 'page-number')?.text).toBe(`page ${i + 1} of ${pages.length}`);
      if (i > 0)
        expect(texts.find((t) => t.y === pageDefaults.margin)?.text).toBe('generated radial study, 600 devices');
    });
    const contentsAt = pages.findIndex((page) => bodyOf(page)[0]?.text === 'Contents');
    const numbers = bodyOf(pages[contentsAt]).flatMap((item) => (/^\d+$/.test(item.text) ? [Number(item.text)] : []));
    expect(numbers).toHaveLength(report.sections.length);
    numbers.forEach((number, i) =>
      expect(bodyOf(pages[number - 1])[0].text).toBe(`${i + 1}. ${report.sections[i].title}`),
    );
  });
});

describe('the bus index of a tiled one-line whose buses have long names', () => {
  it('sends each bus to a part that shows its name whole where one does, and tells apart two buses of one name', () => {
    const input = radialStudy(200);
    input.buses = input.buses!.map((bus) => ({ ...bus, name: `Refrigeration switchboard ${bus.id}` }));
    input.buses[3].name = input.buses[4].name = 'Shared panel';
    const report = studyReportOf(analyseStudy(parseStudy(input)));
    const pages = reportPagesOf(report, { paper: 'letter', orientation: 'portrait' });
    const block = report.sections.find((s) => s.id === 'one-line')!.blocks[0];
    if (block.type !== 'figure') throw new Error('no one-line figure');
    const oneLine = block.drawing as OneLine;
    const overviewAt = pages.findIndex((page) => page.figure?.drawing === oneLine);
    const tiles = pages.filter((page) => page.figure?.drawing === oneLine && page.figure.window);
    expect(tiles.length).toBeGreaterThanOrEqual(8);
    const named = new Map(input.buses.map((bus) => [bus.id, bus.name!]));
    const labels = new Map(
      oneLine.places
        .filter((place) => place.type === 'bus')
        .map((bus) => {
          const name = named.get(bus.id)!;
          return [name === 'Shared panel' ? `${name} (${bus.id})` : name, bus.label] as const;
        }),
    );
    const rows = indexRowsOf(pages, overviewAt + tiles.length + 1);
    expect([...rows.keys()].filter((name) => name.startsWith('Shared panel'))).toEqual([
      `Shared panel (${input.buses[3].id})`,
      `Shared panel (${input.buses[4].id})`,
    ]);
    expectIndexed(rows, labels, tiles, overviewAt);
    // Names long enough that the first part reaching a label often cuts it, and a later one shows it whole.
    const windows = tiles.map((tile) => tile.figure!.window!);
    const cut = [...labels.values()].filter((label) => {
      const first = windows.find(
        (w) => label.x >= w.x && label.x <= w.x + w.width && label.y >= w.y && label.y <= w.y + w.height,
      )!;
      return label.x + label.width > first.x + first.width;
    });
    expect(cut.length).toBeGreaterThan(5);
  }, 60_000);
});

describe('report tables', () => {
  /** The selective demo's report on letter portrait, with one revision whose description is `description`. */
  const revisedPages = (description: string, studyDescription?: string) => {
    const raw = JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8'));
    raw.revisions = [{ revision: 'A', date: '2026-01-01', by: 'J. Engineer', description }];
    if (studyDescription) raw.description = studyDescription;
    const { study } = readStudy(raw);
    return reportPagesOf(studyReportOf(analyseStudy(study!)), { paper: 'letter', orientation: 'portrait' });
  };
  // The footer's rule sits 24 pt above the bottom margin; body text must stay above it.
  const footerRule = (page: ReportPage) => page.drawing.height - pageDefaults.margin - 24;

  it('split a row taller than a page at page feet, the header above each part: nothing runs past the footer', () => {
    for (const description of ['x'.repeat(9000), Array.from({ length: 1200 }, (_, i) => `w${i}`).join(' ')]) {
      const pages = revisedPages(description);
      for (const page of pages) for (const item of bodyOf(page)) expect(item.y).toBeLessThan(footerRule(page));
      // Every character of the description is printed, in order.
      const printed = pages.flatMap((page) => bodyOf(page).filter((item) => /^(x+|(w\d+ ?)+)$/.test(item.text)));
      expect(printed.map((item) => item.text).join(description.includes(' ') ? ' ' : '')).toBe(description);
      // No page holds the table's header alone.
      for (const page of pages) {
        const texts = bodyOf(page).map((item) => item.text);
        if (texts.includes('what changed')) expect(texts.length).toBeGreaterThan(4);
      }
    }
  });

  it("never leave the revision log's heading and header alone on a page, however long its first row", () => {
    // A row that fits a page under the header but not under the heading and header as well (848–890
    // words on letter portrait) is split under them rather than moved on.
    for (let words = 800; words <= 960; words += 8) {
      const pages = revisedPages(Array.from({ length: words }, (_, i) => `w${i}`).join(' '));
      for (const page of pages) {
        const texts = bodyOf(page).map((item) => item.text);
        if (texts.includes('what changed'))
          expect(
            texts.some((text) => /^w\d+/.test(text)),
            `${words} words`,
          ).toBe(true);
      }
    }
  });

  it("keep the revision log's heading with the table's header and first row", () => {
    const change = Array.from({ length: 120 }, (_, i) => `change${i}`).join(' ');
    for (let words = 300; words <= 560; words += 20) {
      const pages = revisedPages(change, Array.from({ length: words }, (_, i) => `w${i}`).join(' '));
      for (const page of pages) {
        const texts = bodyOf(page);
        const heading = texts.findIndex((item) => item.text === 'Revision log');
        if (heading >= 0) expect(texts.slice(heading + 1).some((item) => item.text === 'what changed')).toBe(true);
      }
    }
  });

  it('never leave a header alone at the foot of a page: its first row goes with it', () => {
    // Where a settings-window header fell at a page's foot (the selective demo on A4 landscape, the
    // standby overlap demo on letter portrait), with its first row taller than two lines.
    for (const demo of ['selective', 'standby-overlap']) {
      const study = parseStudy(readFileSync(`demo/harrowmere-${demo}.json`, 'utf8'));
      const report = studyReportOf(analyseScenarios(study));
      for (const paper of ['letter', 'a4'] as const)
        for (const orientation of ['portrait', 'landscape'] as const)
          for (const page of reportPagesOf(report, { paper, orientation })) {
            const texts = bodyOf(page);
            for (const header of texts.filter((item) => item.text === 'recommended' && item.weight === 'bold'))
              expect(
                texts.some((item) => item.y > header.y + 1 && item.weight !== 'bold'),
                `${demo} ${paper} ${orientation}`,
              ).toBe(true);
          }
    }
  });

  it('let only the column of a word too long for the page give way, and break that word across lines: nothing is cut', () => {
    const raw = JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8'));
    const name = 'MSB-MAIN-2000A-INCOMER-FROM-SERVICE-TRANSFORMER-T1';
    raw.devices[1].name = name;
    const { study } = readStudy(raw);
    const pages = reportPagesOf(studyReportOf(analyseStudy(study!)), { paper: 'letter', orientation: 'portrait' });
    const texts = pages.flatMap((page) => bodyOf(page)).map((item) => item.text);
    expect(texts.filter((text) => text.endsWith('…'))).toEqual([]);
    // The name stands in pieces, one under another, each a part of it; the headers stand whole.
    const pieces = texts.filter((text) => text.length > 3 && name.includes(text));
    expect(pieces.length).toBeGreaterThan(1);
    for (const header of ['now', 'window', 'recommended']) expect(texts).toContain(header);
  });

  it('give a column of long sentences the room a column of short values does not need (A4 portrait)', () => {
    const study = parseStudy(readFileSync('demo/harrowmere-full.json', 'utf8'));
    const report = studyReportOf(analyseStudy(study));
    const pages = reportPagesOf(report, { paper: 'a4', orientation: 'portrait' });
    const texts = pages.flatMap((page) => bodyOf(page));
    // The settings-window table: every header on one line, the binding constraints the widest column.
    for (const header of ['device', 'setting', 'now', 'window', 'recommended', 'binding constraints'])
      expect(texts.some((item) => item.text === header)).toBe(true);
    const at = (text: string) => texts.find((item) => item.text === text)!.x;
    const bindingWidth = pages[0].drawing.width - pageDefaults.margin - at('binding constraints');
    for (const [left, right] of [
      ['setting', 'now'],
      ['now', 'window'],
      ['window', 'recommended'],
      ['recommended', 'binding constraints'],
    ])
      expect(bindingWidth).toBeGreaterThan(at(right) - at(left));
  });
});
