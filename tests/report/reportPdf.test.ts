import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { CAUTION } from '../../src/engine/caution.ts';
import { readStudy } from '../../src/engine/study/index.ts';
import { pdfNumber } from '../../src/plot/pdf/pdfSyntax.ts';
import { pdfOfReport, reportPagesOf, studyReportOf } from '../../src/report/index.ts';
import { pagesOf, readPdf, textRunsOf } from '../plot/pdf/pdfReader.ts';

describe('pdfOfReport', () => {
  it('prints the whole-site one-line as an overview and tiles, each tile clipped to its window, the caution on every page', async () => {
    const { study, problems } = readStudy(readFileSync('demo/harrowmere-full.json', 'utf8'));
    if (!study) throw new Error(problems.map((p) => p.message).join('; '));
    const report = studyReportOf(analyseStudy(study), { date: '2026-12-02' });
    const setup = { paper: 'letter', orientation: 'portrait' } as const;
    const laidOut = reportPagesOf(report, setup);
    const file = readPdf(await pdfOfReport(report, setup, { date: '2026-12-02' }));
    const printed = pagesOf(file);
    expect(printed).toHaveLength(laidOut.length);

    const tiled = laidOut.flatMap((page, index) =>
      page.figure?.window ? [{ index, window: page.figure.window }] : [],
    );
    expect(tiled.length).toBeGreaterThan(1);
    const overview = printed[tiled[0].index - 1].content;
    const { width, height } = laidOut[tiled[0].index].figure!.drawing;
    expect(overview).toContain(`\n0 0 ${pdfNumber(width)} ${pdfNumber(height)} re W n\n`);
    for (const { index, window } of tiled) {
      const clip = [window.x, window.y, window.width, window.height].map((v) => pdfNumber(v)).join(' ');
      expect(printed[index].content).toContain(`\n${clip} re W n\n`);
    }

    printed.forEach((page, i) => {
      const runs = textRunsOf(file, page).join(' ');
      expect(runs).toContain(CAUTION.slice(0, 40));
      expect(runs).toContain(`page ${i + 1} of ${printed.length}`);
    });
  }, 120_000);
});
