import { describe, expect, it } from 'vitest';
import { exportRefusalOf, problemsNamed, saveQuestionOf } from '../../../src/app/lib/problemNotes.ts';
import type { ExportFormat } from '../../../src/app/lib/exports.ts';

const dial = { path: 'study.devices[0].characteristic.timeOvercurrent.timeDial', message: 'expected a number, got ""' };
const rating = { path: 'study.devices[3].rating', message: 'expected a current, got "x"' };

describe('problemNotes', () => {
  it('has the expected defaults: a study without problems is saved and exported without a word', () => {
    expect(problemsNamed([])).toBe('');
    expect(saveQuestionOf([])).toBeUndefined();
    for (const kind of ['svg', 'pdf', 'findings-md', 'report-pdf', 'study-json'] as ExportFormat[])
      expect(exportRefusalOf(kind, [])).toBeUndefined();
  });

  it('problemsNamed() gives the count and the first problem’s field', () => {
    expect(problemsNamed([dial])).toBe('1 problem (study.devices[0].characteristic.timeOvercurrent.timeDial)');
    expect(problemsNamed([dial, rating])).toMatch(/^2 problems \(the first at study\.devices\[0\]\..*\.timeDial\)$/);
  });

  it('saveQuestionOf() asks before a study with problems is saved, saying the file will not open', () => {
    expect(saveQuestionOf([dial])).toMatch(
      /^The study has 1 problem \(study\.devices\[0\]\..*\.timeDial\)\. Save it anyway\? The file will not open until it is fixed, and the study stays marked unsaved\.$/,
    );
  });

  it('exportRefusalOf() refuses every export drawn from the last valid study while the study has problems', () => {
    const drawn: ExportFormat[] = ['svg', 'png', 'pdf', 'findings-md', 'findings-csv', 'probes-csv'];
    for (const kind of [...drawn, 'report-html', 'report-pdf'] as ExportFormat[]) {
      expect(exportRefusalOf(kind, [dial]), kind).toMatch(
        /^fix the 1 problem \(study\.devices\[0\]\..*\.timeDial\) before exporting: the export would show the last valid study$/,
      );
    }
    // The study file is written as typed, behind the save question instead.
    expect(exportRefusalOf('study-json', [dial])).toBeUndefined();
  });
});
