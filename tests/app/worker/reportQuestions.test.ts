import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { reportOf } from '../../../src/app/worker/reportQuestions.ts';
import { analyseScenarios } from '../../../src/engine/scenario/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';
import { pagePoints } from '../../../src/plot/pdf.ts';
import { reportPagesOf, studyReportOf } from '../../../src/report/index.ts';
import { runVerb } from '../../cli/run.ts';
import { mediaBoxesOf } from '../../pdfBytes.ts';

const ROOT = fileURLToPath(new URL('../../../', import.meta.url));
const demo = (name: string) => parseStudy(readFileSync(`${ROOT}demo/${name}.json`, 'utf8'));

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('reportOf', () => {
  it("writes the HTML report `discern report` writes of the study, every scenario's results with it", async () => {
    const study = demo('harrowmere-standby');
    const answer = await reportOf(study, {
      kind: 'report',
      format: 'html',
      page: { paper: 'a4', orientation: 'landscape' },
    });
    const { code, files } = await runVerb([
      'report',
      `${ROOT}demo/harrowmere-standby.json`,
      '--out',
      'standby.html',
      '--paper',
      'a4',
      '--orientation',
      'landscape',
    ]);
    expect(code).toBe(0);
    const html = new TextDecoder().decode(answer.bytes);
    expect(answer.format).toBe('html');
    expect(html).toBe(files.get('standby.html'));
    expect(html).toContain('On generator');
  });

  it('writes the PDF on the chosen page, a page for each of the report laid out, with the shipped face embedded', async () => {
    // The page fetches the face shipped with the workbench; here it is read from the sources.
    vi.stubGlobal('fetch', async (url: string) => new Response(readFileSync(`${ROOT}${url.replace(/^\//, '')}`)));
    const study = demo('harrowmere-full');
    const page = { paper: 'letter', orientation: 'landscape' } as const;
    const answer = await reportOf(study, { kind: 'report', format: 'pdf', page });
    expect(answer.format).toBe('pdf');
    const bytes = Buffer.from(answer.bytes);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(bytes.toString('latin1')).toContain('/FontFile2');
    const pages = reportPagesOf(studyReportOf(analyseScenarios(study)), page).length;
    const [width, height] = pagePoints('letter', 'landscape');
    expect(mediaBoxesOf(bytes)).toEqual(Array(pages).fill([width, height].map((n) => Math.round(n * 100) / 100)));
  });
});
