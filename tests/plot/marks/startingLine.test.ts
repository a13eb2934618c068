import { describe, expect, it } from 'vitest';
import { startingLine, startingLineDefaults } from '../../../src/plot/marks/startingLine.ts';
import { pixelOf, scalesOf } from '../../../src/plot/scales.ts';
import { motorStart } from '../fixtures.ts';

const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });

describe('startingLine', () => {
  it('has the expected defaults', () => {
    expect(startingLineDefaults).toEqual({ strokeWidth: 1.8, dash: '1.5 3.5' });
  });

  it('startingLine draws the motor starting curve dotted with round caps, clipped at 0.01 s and 1000 s', () => {
    const g = startingLine({ id: 'M1', label: 'M1', curve: motorStart(), scale: 1 }, scales, { colour: '#CC79A7' });
    expect(g.items[0]).toMatchObject({ role: 'starting', dash: '1.5 3.5', lineCap: 'round' });
    const ys = [...g.items[0].points!].filter((_, k) => k % 2 === 1);
    expect(Math.min(...ys)).toBe(50);
    expect(Math.max(...ys)).toBe(650);
  });

  it('startingLine puts the locked-rotor current at its amps (hand-worked NFPA 70 Table 430.7(B) case: 789.46 A to 5 s)', () => {
    const g = startingLine({ id: 'M1', label: 'M1', curve: motorStart(), scale: 1 }, scales, { colour: '#CC79A7' });
    const xs = [...g.items[0].points!].filter((_, k) => k % 2 === 0);
    expect(xs.some((x) => Math.abs(x - pixelOf(scales.x, 789.46)) < 1e-9)).toBe(true);
  });
});
