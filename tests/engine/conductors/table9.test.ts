import { describe, expect, it } from 'vitest';
import { NEC_TABLE_9, TABLE_9_TEMPERATURE } from '../../../src/engine/conductors/index.ts';

describe('NEC_TABLE_9', () => {
  it('has the expected defaults', () => {
    expect(TABLE_9_TEMPERATURE).toBe(75);
    expect(Object.keys(NEC_TABLE_9)).toEqual([
      '12 AWG',
      '10 AWG',
      '8 AWG',
      '6 AWG',
      '4 AWG',
      '2 AWG',
      '1/0',
      '2/0',
      '3/0',
      '4/0',
      '250 kcmil',
      '350 kcmil',
      '500 kcmil',
      '750 kcmil',
    ]);
  });

  // Each row against REFERENCE §1.4 "Selected rows" (confirmed against public reproductions of NEC Ch. 9 Table 9).
  it.each([
    ['12 AWG', 0.054, 0.068, [2.0, 2.0, 2.0], [3.2, 3.2, 3.2]],
    ['2 AWG', 0.045, 0.057, [0.19, 0.2, 0.2], [0.32, 0.32, 0.32]],
    ['1/0', 0.044, 0.055, [0.12, 0.13, 0.12], [0.2, 0.21, 0.2]],
    ['4/0', 0.041, 0.051, [0.062, 0.067, 0.063], [0.1, 0.11, 0.1]],
    ['250 kcmil', 0.041, 0.052, [0.052, 0.057, 0.054], [0.085, 0.09, 0.086]],
    ['500 kcmil', 0.039, 0.048, [0.027, 0.032, 0.029], [0.043, 0.048, 0.045]],
    ['750 kcmil', 0.038, 0.048, [0.019, 0.024, 0.021], [0.029, 0.034, 0.031]],
  ] as const)('row %s matches REFERENCE §1.4 (confirmed)', (size, xPvc, xSteel, cu, al) => {
    const row = NEC_TABLE_9[size];
    expect(row.reactance).toEqual({ pvc: xPvc, aluminium: xPvc, steel: xSteel });
    expect(row.resistance.copper).toEqual({ pvc: cu[0], aluminium: cu[1], steel: cu[2] });
    expect(row.resistance.aluminium).toEqual({ pvc: al[0], aluminium: al[1], steel: al[2] });
    expect(row.mark).toBe('(confirmed)');
  });

  it('the 3/0 row is marked from memory and sits between 2/0 and 4/0', () => {
    const row = NEC_TABLE_9['3/0'];
    expect(row.mark).toBe('(from memory)');
    expect(row.resistance.copper.pvc).toBeLessThan(NEC_TABLE_9['2/0'].resistance.copper.pvc);
    expect(row.resistance.copper.pvc).toBeGreaterThan(NEC_TABLE_9['4/0'].resistance.copper.pvc);
  });

  it('resistance falls as the size grows, in every column', () => {
    const rows = Object.values(NEC_TABLE_9);
    for (let i = 1; i < rows.length; i++)
      for (const material of ['copper', 'aluminium'] as const)
        for (const conduit of ['pvc', 'aluminium', 'steel'] as const)
          expect(rows[i].resistance[material][conduit]).toBeLessThanOrEqual(rows[i - 1].resistance[material][conduit]);
  });
});
