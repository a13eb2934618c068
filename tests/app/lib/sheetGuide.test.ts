import { describe, expect, it } from 'vitest';
import { sheetGuideOf } from '../../../src/app/lib/sheetGuide.ts';
import { BAND_DASHES, BAND_DASH_NAMES } from '../../../src/plot/marks/bandArea.ts';
import { overlapHatchDefaults } from '../../../src/plot/marks/overlapHatch.ts';
import { REGION_COLOURS } from '../../../src/plot/palette.ts';

const text = (codes?: string[]) =>
  sheetGuideOf({ bands: ['MAIN', 'FDR-MCC'], referenceVoltage: '480 V', codes })
    .flatMap((s) => s.text)
    .join(' ');

describe('sheetGuideOf', () => {
  it('has the expected defaults: the steps in reading order', () => {
    expect(sheetGuideOf({ bands: [], referenceVoltage: '480 V' }).map((s) => s.title)[0]).toBe('The two axes');
  });

  it('describes the hatches as the sheet draws them: only between the edges, each status its own', () => {
    const guide = text();
    expect(guide).toMatch(/only the area between the two edges/);
    // Overlap: single hatching at 45° (rising to the right) in vermillion; thin margin the other way in yellow; unprovable crossed in grey.
    expect(overlapHatchDefaults.overlap).toMatchObject({ angle: 45, cross: false, colour: REGION_COLOURS.overlap });
    expect(guide).toMatch(/vermillion hatching rising to the right is an overlap/);
    expect(overlapHatchDefaults['thin margin']).toMatchObject({ angle: -45, cross: false });
    expect(guide).toMatch(/yellow hatching the other way a thin margin/);
    expect(overlapHatchDefaults['not provable from curves'].cross).toBe(true);
    expect(guide).toMatch(/cross-hatched in grey as not provable/);
    expect(guide).not.toMatch(/dense cross-hatching is an overlap/);
  });

  it('names each band’s edge pattern on the current sheet, so colour is never the only code', () => {
    expect(BAND_DASH_NAMES).toHaveLength(BAND_DASHES.length);
    expect(text(['MAIN, solid edges', 'FDR-MCC, long-dash edges'])).toContain(
      'On this sheet: MAIN, solid edges; FDR-MCC, long-dash edges.',
    );
  });
});
