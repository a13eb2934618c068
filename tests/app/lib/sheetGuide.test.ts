import { describe, it, expect } from 'vitest';
import { sheetGuideOf } from '../../../src/app/lib/sheetGuide.ts';

describe('sheetGuide', () => {
  it('has the expected defaults', () => {
    const steps = sheetGuideOf({ bands: [], referenceVoltage: '480 V' });
    expect(steps[0].title).toBe('The two axes');
    expect(steps[1].text[0]).toContain('(the devices of the view)');
  });

  it('sheetGuideOf() names the curves and the voltage base of the sheet being read', () => {
    const steps = sheetGuideOf({ bands: ['Main 2000 A', 'MCC feeder'], referenceVoltage: '480 V' });
    expect(steps[0].text.join(' ')).toContain('drawn at 480 V');
    expect(steps[1].text[0]).toContain('(Main 2000 A, MCC feeder)');
    expect(steps.map((s) => s.title)).toContain('Two bands in series: selective or not');
    // REFERENCE §3.5: below about one half-cycle a curve proves nothing.
    expect(steps.flatMap((s) => s.text).join(' ')).toMatch(
      /Below about 0\.01 s \(one half-cycle\) curves prove nothing/,
    );
  });
});
