import { readFileSync } from 'node:fs';
import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { CAUTION } from '../../src/engine/caution.ts';
import { formatAmps } from '../../src/engine/quantity/index.ts';
import { readStudy, type Study } from '../../src/engine/study/index.ts';
import { generatorPairStudy } from '../engine/generator/fixtures.ts';
import {
  escapeMarkdown,
  htmlOfReport,
  markdownOfReport,
  pageDefaults,
  pdfOfReport,
  reportPagesOf,
  studyReportOf,
} from '../../src/report/index.ts';

function demo(name: string, change: (raw: Record<string, unknown>) => void = () => {}): Study {
  const raw = JSON.parse(readFileSync(`demo/${name}.json`, 'utf8'));
  change(raw);
  const { study, problems } = readStudy(raw);
  if (!study) throw new Error(problems.map((p) => `${p.path}: ${p.message}`).join('; '));
  return study;
}

const detailed = demo('harrowmere-selective', (raw) => {
  raw.site = 'Harrowmere Cold Store, Unit 4';
  raw.client = 'Harrowmere Logistics (invented)';
  raw.checkedBy = 'A. Reviewer';
  raw.revisions = [
    { revision: 'A', date: '2026-11-20', by: 'discern demo', description: 'first issue' },
    { revision: 'B', date: '2026-12-02', by: 'discern demo', description: 'main short-time delay raised' },
  ];
});

describe('studyReportOf', () => {
  it('has the expected defaults: the sections in the order a study is read', () => {
    expect(pageDefaults.margin).toBe(48);
    const report = studyReportOf(analyseStudy(detailed));
    expect(report.sections.map((s) => s.id)).toEqual([
      'method',
      'one-line',
      'faults',
      'settings',
      'sheets',
      'findings',
      'appendix',
    ]);
    expect(report.details).toContainEqual(['Revision', 'B, 2026-12-02']);
    expect(report.details).toContainEqual(['Checked by', 'A. Reviewer']);
    expect(report.cautions.join(' ')).toMatch(/qualified engineer/);
  });

  it("puts the engine's own fault currents and every device's settings in its tables", () => {
    const analysis = analyseStudy(detailed);
    const report = studyReportOf(analysis);
    const faults = report.sections.find((s) => s.id === 'faults')!.blocks.find((b) => b.type === 'table')!;
    if (faults.type !== 'table') throw new Error('no table');
    for (const bus of detailed.buses) {
      const row = faults.rows.find((r) => r[0] === (bus.name ?? bus.id))!;
      const level = analysis.faults.buses.get(bus.id)!;
      expect(row[2]).toBe(formatAmps(level.max.threePhase, 3));
      expect(row[6]).toBe(formatAmps(level.min.threePhase, 3));
    }
    const settings = report.sections.find((s) => s.id === 'settings')!.blocks[0];
    if (settings.type !== 'table') throw new Error('no table');
    expect(settings.rows.map((r) => r[0])).toEqual(detailed.devices.map((d) => d.name ?? d.id));
    expect(settings.rows.find((r) => r[0] === 'Main 2000 A')![2]).toMatch(/long-time: pickup [\d.]+ × \([\d.]+ k?A\)/);
    const windows = report.sections.find((s) => s.id === 'settings')!.blocks.filter((b) => b.type === 'table')[1];
    if (windows?.type !== 'table') throw new Error('no settings-window table');
    expect(windows.columns).toContain('binding constraints');
    expect(windows.rows.some((r) => r[0] === 'Main 2000 A' && r[3] !== 'none')).toBe(true);
  });

  it('paginates with a contents page whose numbers point at each section, and a caution on every page', () => {
    const report = studyReportOf(analyseStudy(detailed));
    // A4 here, so the contents page and the pages it points at are laid out on the same paper.
    const pages = reportPagesOf(report, { paper: 'a4', orientation: 'portrait' });
    const textOf = (index: number) =>
      pages[index].drawing.layers
        .flatMap((layer) => layer.items)
        .flatMap((item) => (item.type === 'text' ? [item.text] : []))
        .join('\n');
    const contents = textOf(1);
    report.sections.forEach((section, i) => {
      const match = new RegExp(`^(\\d+)$`, 'm');
      expect(contents).toContain(`${i + 1}. ${section.title}`);
      expect(match.test(contents)).toBe(true);
    });
    const numbers = pages[1].drawing.layers[0].items.flatMap((item) =>
      item.type === 'text' && /^\d+$/.test(item.text) ? [Number(item.text)] : [],
    );
    expect(numbers).toHaveLength(report.sections.length);
    numbers.forEach((page, i) => expect(textOf(page - 1)).toContain(`${i + 1}. ${report.sections[i].title}`));
    pages.forEach((page, i) => {
      const words = page.drawing.layers[0].items.flatMap((item) => (item.type === 'text' ? [item.text] : []));
      expect(words.join(' ')).toContain(CAUTION.slice(0, 30));
      expect(words).toContain(`page ${i + 1} of ${pages.length}`);
    });
    // Each figure once whole (the one-line as the overview before its tiles).
    expect(pages.filter((page) => page.figure && !page.figure.window).length).toBe(1 + detailed.views.length);
  });

  it('lays every page out inside its paper, on Tabloid landscape as on A4 portrait', () => {
    for (const setup of [
      { paper: 'tabloid', orientation: 'landscape' },
      { paper: 'a4', orientation: 'portrait' },
    ] as const) {
      for (const page of reportPagesOf(studyReportOf(analyseStudy(detailed)), setup)) {
        for (const item of page.drawing.layers[0].items) {
          if (item.type !== 'text') continue;
          expect(item.x).toBeGreaterThanOrEqual(0);
          expect(item.x).toBeLessThanOrEqual(page.drawing.width);
          expect(item.y).toBeLessThanOrEqual(page.drawing.height);
        }
        if (page.figure) expect(page.figure.y + page.figure.height).toBeLessThanOrEqual(page.drawing.height);
      }
    }
  });

  it('escapes hostile study text in Markdown and HTML', () => {
    const hostile = demo('harrowmere-fused', (raw) => {
      raw.name = '<script>alert(1)</script> [x](javascript:alert(1)) ![i](http://h/i.png)';
    });
    const report = studyReportOf(analyseStudy(hostile));
    const { text: md, figures } = markdownOfReport(report, 'fused');
    expect(md).not.toContain('<script>');
    expect(md).not.toMatch(/(^|[^\\])\[x\]\(/);
    expect(md).not.toMatch(/(^|[^\\])!\[i\]/);
    expect(figures.map((f) => f.name)).toEqual(figures.map((_, i) => `fused-figure-${i + 1}.svg`));
    const html = htmlOfReport(report, { paper: 'letter', orientation: 'portrait' });
    expect(html).not.toContain('<script>');
    expect(html).toContain('&lt;script&gt;');
    expect(escapeMarkdown('a | b')).toBe('a \\| b');
  });
});

describe('the method section of a study fed by a generator alone', () => {
  it('says how its pairs are checked on the decaying current, as a switched study’s does', () => {
    const study = readStudy(
      generatorPairStudy(
        { kind: 'trip-unit', sensor: 800, longTime: { pickup: 1, delay: 10 } },
        { kind: 'trip-unit', sensor: 100, longTime: { pickup: 1, delay: 4 } },
      ),
    ).study!;
    const analysis = analyseStudy(study);
    expect(analysis.scenarios).toBeUndefined();
    const method = studyReportOf(analysis).sections.find((s) => s.id === 'method')!;
    const text = method.blocks.map((b) => (b.type === 'paragraph' ? b.text : '')).join('\n');
    expect(text).toMatch(
      /each pair is also checked on the decaying fault current, each element of a device on its own/,
    );
    expect(text).toMatch(
      /the downstream device is read on the current held at its start and the upstream device on the raised one/,
    );
    // The fault-current item says how the generator itself is modelled; the paragraph does not say it again.
    expect(text).not.toMatch(/Generators are modelled/);
  });
});

describe('the method section on conductor temperatures', () => {
  const methodItems = (study: Study) => {
    const method = studyReportOf(analyseStudy(study)).sections.find((s) => s.id === 'method')!;
    return method.blocks.flatMap((b) => (b.type === 'list' ? b.items : [])).join('\n');
  };

  it("names the defaults with their sources, and a study's own temperatures as its setting", () => {
    expect(methodItems(detailed)).toMatch(
      /taken to 20 °C for maximum fault, as IEC 60909-0 takes it for the maximum short-circuit currents, and to operating temperature \(90 °C\) for minimum fault/,
    );
    const coldSite = demo('harrowmere-selective', (raw) => {
      raw.conductorTemperatures = { maximumFault: -10, minimumFault: 150 };
    });
    expect(methodItems(coldSite)).toMatch(
      /taken to -10 °C for maximum fault \(the study's setting\), and to 150 °C for minimum fault \(the study's setting\)/,
    );
  });
});

describe('pdfOfReport', () => {
  it('prints the same bytes twice, with DejaVu Sans embedded and Ω among its glyphs', async () => {
    const study = demo('harrowmere-fused', (raw) => {
      raw.views = [];
    });
    const report = studyReportOf(analyseStudy(study), { date: '2026-12-02' });
    const setup = { paper: 'letter', orientation: 'portrait' } as const;
    const first = await pdfOfReport(report, setup, { date: '2026-12-02' });
    const second = await pdfOfReport(report, setup, { date: '2026-12-02' });
    expect(Buffer.from(first).equals(Buffer.from(second))).toBe(true);
    const pdf = Buffer.from(first).toString('latin1');
    expect(pdf.match(/\/Type \/Page\b(?!s)/g)).toHaveLength(reportPagesOf(report, setup).length);
    expect(pdf).toContain('/FontFile2');
    expect(pdf).toMatch(/\/BaseFont \/[A-Z+]*DejaVu/);
    // The ToUnicode maps (compressed streams) list the glyphs the text uses: Ω is U+03A9.
    const streams = [...pdf.matchAll(/stream\r?\n([\s\S]*?)\r?\nendstream/g)].flatMap((m) => {
      try {
        return [inflateSync(Buffer.from(m[1], 'latin1')).toString('latin1')];
      } catch {
        return [];
      }
    });
    expect(streams.some((s) => /beginbfchar|beginbfrange/.test(s) && /<03a9>/i.test(s))).toBe(true);
  }, 120_000);
});
