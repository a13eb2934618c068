import { describe, expect, it } from 'vitest';
import { marker, markerDefaults, symbolPath } from '../../../src/plot/marks/marker.ts';
import { scalesOf } from '../../../src/plot/scales.ts';

const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });
const inrush = {
  kind: 'inrush' as const,
  label: 'TX1 inrush 12 × FLA',
  volts: 480,
  amps: 1000,
  seconds: 0.1,
  elementId: 'TX1',
  scale: 1,
};

describe('marker', () => {
  it('has the expected defaults', () => {
    expect(markerDefaults).toEqual({ radius: 4, strokeWidth: 1.4, lineDash: '2 3' });
  });

  it('marker draws a point marker as its kind symbol at the point, with a label request', () => {
    const g = marker(inrush, 0, scales, { colour: '#000000', fontSize: 11 });
    // 1000 A → x 400; 0.1 s → y 530.
    expect(g.items[0]).toMatchObject({ role: 'marker-inrush', d: 'M396,530A4,4 0 1 1 404,530A4,4 0 1 1 396,530Z' });
    expect(g.label?.text).toBe('TX1 inrush 12 × FLA');
    expect(g.label?.anchor[0]).toBeCloseTo(400, 9);
    expect(g.label?.anchor[1]).toBeCloseTo(530, 9);
  });

  it('symbolPath gives each kind its own shape', () => {
    expect(symbolPath('locked-rotor', 10, 10, 4)).toBe('M10,6L14,10L10,14L6,10Z');
    expect(
      new Set(
        ['inrush', 'locked-rotor', 'full-load', 'fault', 'ampacity'].map((k) => symbolPath(k as 'fault', 10, 10, 4)),
      ).size,
    ).toBe(5);
  });

  it('marker without a time is a dotted vertical line, and nothing off the sheet', () => {
    const line = marker({ ...inrush, kind: 'full-load', seconds: undefined }, 1, scales, {
      colour: '#000000',
      fontSize: 11,
    });
    expect(line.items[0]).toMatchObject({ role: 'marker-full-load', dash: '2 3' });
    expect(line.label?.rotate).toBe(-90);
    expect(marker({ ...inrush, seconds: 0.001 }, 2, scales, { colour: '#000000', fontSize: 11 })).toEqual({
      items: [],
      label: null,
    });
  });
});
