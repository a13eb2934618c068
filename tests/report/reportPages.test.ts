import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { readStudy } from '../../src/engine/study/index.ts';
import { pageDefaults, reportPagesOf, studyReportOf, type ReportPage } from '../../src/report/index.ts';

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
