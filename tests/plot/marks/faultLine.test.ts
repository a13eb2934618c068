import { describe, expect, it } from 'vitest';
import {
  faultBandHeight,
  faultLabel,
  faultLabelBand,
  faultLabelSlots,
  faultLine,
  faultLineDefaults,
} from '../../../src/plot/marks/faultLine.ts';
import { pixelOf, scalesOf } from '../../../src/plot/scales.ts';

const scales = scalesOf({ current: [10, 1e5], time: [0.01, 1000] }, { left: 100, top: 50, right: 700, bottom: 650 });
// hand-worked per-unit case (1500 kVA, 12.47 kV–480 V) (computed): 1500 kVA 12.47 kV–480 V, 250 MVA source: 28 421.1 A at 480 V = 1093.99 A at 12.47 kV.
const swbd = { busId: 'SWBD', label: 'SWBD', amps: 1093.99, ownVolts: 480, ownAmps: 28_421.1, kind: 'max' as const };

describe('faultLine', () => {
  it('has the expected defaults', () => {
    expect(faultLineDefaults).toEqual({ colour: '#4d4d4d', strokeWidth: 1.3, minDash: '9 3 2 3', labelScale: 0.9 });
    const g = faultLine(swbd, scales, {});
    expect(g.items[0]).toMatchObject({ role: 'fault-max', stroke: '#4d4d4d', dataId: 'SWBD:max' });
    expect(g.items[0].dash).toBeUndefined();
  });

  it('faultLine draws a full-height vertical at the current on the sheet base', () => {
    const { items } = faultLine(swbd, scales, {});
    const x = pixelOf(scales.x, 1093.99);
    expect([...items[0].points!]).toEqual([x, 650, x, 50]);
  });

  it('faultLabel reads a secondary fault and its primary-reflected value together (hand-worked per-unit case (1500 kVA, 12.47 kV–480 V))', () => {
    expect(faultLabel(swbd, 12_470)).toBe('SWBD 28.4 kA @ 480 V = 1.09 kA @ 12.47 kV');
    expect(faultLabel({ ...swbd, amps: 28_421.1 }, 480)).toBe('SWBD 28.4 kA @ 480 V');
    expect(faultLabel({ ...swbd, amps: 850, ownAmps: 850, kind: 'min' }, 480)).toBe('SWBD min 850 A @ 480 V');
    // A label that already states its current is used as given.
    expect(faultLabel({ ...swbd, label: 'SWBD 28.4 kA @ 480 V' }, 12_470)).toBe('SWBD 28.4 kA @ 480 V');
  });

  it('faultLine dashes the minimum level and draws nothing off the axis', () => {
    expect(faultLine({ ...swbd, kind: 'min' }, scales, {}).items[0].dash).toBe('9 3 2 3');
    expect(faultLine({ ...swbd, amps: 5e5 }, scales, {})).toEqual({ items: [] });
  });

  it('faultLabelSlots sets labels level, apart, and points to a fault beyond the axis with an arrow', () => {
    const faults = [
      swbd,
      { ...swbd, busId: 'MCC', label: 'MCC', amps: 1000, ownAmps: 26_000 },
      { ...swbd, busId: 'MV', label: 'MV', amps: 3e5, ownVolts: 12_470, ownAmps: 3e5 },
    ];
    const { slots, rows } = faultLabelSlots(faults, scales, { fontSize: 11, referenceVolts: 12_470 });
    expect(slots).toHaveLength(3);
    expect(slots.find((s) => s.dataId === 'MV:max')).toMatchObject({ lineX: null });
    expect(slots.find((s) => s.dataId === 'MV:max')!.text).toMatch(/→$/);
    for (const a of slots) {
      expect(a.x).toBeGreaterThanOrEqual(100);
      expect(a.x + a.width).toBeLessThanOrEqual(700 + 1e-9);
      for (const b of slots)
        if (a !== b && a.row === b.row) expect(a.x + a.width <= b.x || b.x + b.width <= a.x).toBe(true);
    }
    const items = faultLabelBand(slots, rows, { left: 100, right: 700, bottom: 50, fontSize: 11 });
    expect(items.filter((p) => p.role === 'fault-label')).toHaveLength(3);
    expect(items.every((p) => p.type !== 'text' || !p.rotate)).toBe(true);
    expect(faultBandHeight(rows, 11)).toBeGreaterThan(0);
    expect(faultBandHeight(0, 11)).toBe(0);
  });
});
