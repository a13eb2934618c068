import { describe, expect, it } from 'vitest';
import { withstandLine, withstandLineDefaults } from '../../../src/plot/marks/withstandLine.ts';
import { pixelOf, scalesOf, valueOf } from '../../../src/plot/scales.ts';
import { transformerCurve } from '../fixtures.ts';
import { assertInDelta } from '../../asserts.ts';

const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });

describe('withstandLine', () => {
  it('has the expected defaults', () => {
    expect(withstandLineDefaults).toEqual({ strokeWidth: 1.6, dash: '7 4' });
  });

  it('withstandLine draws the C57.109 points dashed and enters at the top of the sheet (hand-worked IEEE C57.109 Category II case)', () => {
    const g = withstandLine({ id: 'TX1', label: 'TX1', curve: transformerCurve(), scale: 1 }, scales, {
      colour: '#009E73',
    });
    expect(g.items).toHaveLength(1);
    expect(g.items[0]).toMatchObject({ role: 'withstand', dash: '7 4', stroke: '#009E73', dataId: 'TX1' });
    const points = g.items[0].points!;
    // 2 pu at 1800 s lies above the sheet: the line starts on the 1000 s line, between 2 and 3 pu.
    expect(points[1]).toBe(50);
    // 4.75 pu (14 283.4 A) at 60 s is a vertex of the line.
    const x = pixelOf(scales.x, 4.75 * 3007.03);
    const i = [...points].findIndex((v, k) => k % 2 === 0 && Math.abs(v - x) < 1e-9);
    assertInDelta(valueOf(scales.y, points[i + 1]), 60, 1e-9);
  });

  it('withstandLine multiplies currents by scale onto the sheet base', () => {
    const g = withstandLine({ id: 'TX1', label: 'TX1', curve: transformerCurve(), scale: 480 / 13_800 }, scales, {
      colour: '#000000',
    });
    // hand-worked IEEE C57.109 Category II case: 17.39 pu = 52 296.2 A at 480 V = 1818.999 A at 13.8 kV, the curve's end at 2 s.
    const points = g.items[0].points!;
    assertInDelta(valueOf(scales.x, points.at(-2)!), 1818.999, 1e-4);
    assertInDelta(valueOf(scales.y, points.at(-1)!), 2, 1e-9);
  });
});
