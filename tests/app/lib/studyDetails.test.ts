import { describe, expect, it } from 'vitest';
import { nextRevisionMark, revisionsOf, STUDY_DETAIL_FIELDS } from '../../../src/app/lib/studyDetails.ts';
import { studySchema } from '../../../src/engine/study/index.ts';

describe('studyDetails', () => {
  it('has the expected defaults: every detail field is a top-level field of the study schema', () => {
    const keys = Object.keys(studySchema.shape);
    for (const field of STUDY_DETAIL_FIELDS) expect(keys).toContain(field.key);
    expect(keys).toContain('revisions');
  });

  it('nextRevisionMark follows letters and numbers', () => {
    expect(nextRevisionMark([])).toBe('A');
    expect(nextRevisionMark([{ revision: 'B' }])).toBe('C');
    expect(nextRevisionMark([{ revision: '3' }])).toBe('4');
    expect(nextRevisionMark([{ revision: 'Z' }])).toBe('ZA');
  });

  it('revisionsOf reads a half-typed log without throwing', () => {
    expect(revisionsOf({ revisions: [{ revision: 'A' }, null, 3] })).toEqual([{ revision: 'A' }, {}, {}]);
    expect(revisionsOf({})).toEqual([]);
  });
});
