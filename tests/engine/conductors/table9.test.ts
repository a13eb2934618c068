import { describe, expect, it } from 'vitest';
import { NEC_TABLE_9, TABLE_9_SPAN, TABLE_9_TEMPERATURE } from '../../../src/engine/conductors/index.ts';

describe('NEC_TABLE_9', () => {
  it('has the expected defaults', () => {
    expect(TABLE_9_TEMPERATURE).toBe(75);
    // Every size NFPA 70 Chapter 9 Table 9 lists.
    expect(Object.keys(NEC_TABLE_9)).toEqual([
      '14 AWG',
      '12 AWG',
      '10 AWG',
      '8 AWG',
      '6 AWG',
      '4 AWG',
      '3 AWG',
      '2 AWG',
      '1 AWG',
      '1/0',
      '2/0',
      '3/0',
      '4/0',
      '250 kcmil',
      '300 kcmil',
      '350 kcmil',
      '400 kcmil',
      '500 kcmil',
      '600 kcmil',
      '750 kcmil',
      '1000 kcmil',
    ]);
    expect(TABLE_9_SPAN).toBe('14 AWG to 1000 kcmil');
  });

  // Each row against NFPA 70 Chapter 9 Table 9, ohms to neutral per 1000 ft (confirmed against three public
  // reproductions of the table that agree row for row).
  it.each([
    ['12 AWG', 0.054, 0.068, [2.0, 2.0, 2.0], [3.2, 3.2, 3.2]],
    ['2 AWG', 0.045, 0.057, [0.19, 0.2, 0.2], [0.32, 0.32, 0.32]],
    ['1/0', 0.044, 0.055, [0.12, 0.13, 0.12], [0.2, 0.21, 0.2]],
    ['4/0', 0.041, 0.051, [0.062, 0.067, 0.063], [0.1, 0.11, 0.1]],
    ['250 kcmil', 0.041, 0.052, [0.052, 0.057, 0.054], [0.085, 0.09, 0.086]],
    ['500 kcmil', 0.039, 0.048, [0.027, 0.032, 0.029], [0.043, 0.048, 0.045]],
    ['750 kcmil', 0.038, 0.048, [0.019, 0.024, 0.021], [0.029, 0.034, 0.031]],
    ['3 AWG', 0.047, 0.059, [0.25, 0.25, 0.25], [0.4, 0.41, 0.4]],
    ['1 AWG', 0.046, 0.057, [0.15, 0.16, 0.16], [0.25, 0.26, 0.25]],
    ['3/0', 0.042, 0.052, [0.077, 0.082, 0.079], [0.13, 0.13, 0.13]],
    ['300 kcmil', 0.041, 0.051, [0.044, 0.049, 0.045], [0.071, 0.076, 0.072]],
    ['400 kcmil', 0.04, 0.049, [0.033, 0.038, 0.035], [0.054, 0.059, 0.055]],
    ['600 kcmil', 0.039, 0.048, [0.023, 0.028, 0.025], [0.036, 0.041, 0.038]],
    ['1000 kcmil', 0.037, 0.046, [0.015, 0.019, 0.018], [0.023, 0.027, 0.025]],
  ] as const)('row %s matches NFPA 70 Chapter 9 Table 9 (confirmed)', (size, xPvc, xSteel, cu, al) => {
    const row = NEC_TABLE_9[size];
    expect(row.reactance).toEqual({ pvc: xPvc, aluminium: xPvc, steel: xSteel });
    expect(row.resistance.copper).toEqual({ pvc: cu[0], aluminium: cu[1], steel: cu[2] });
    expect(row.resistance.aluminium).toEqual({ pvc: al[0], aluminium: al[1], steel: al[2] });
    expect(row.mark).toBe('(confirmed)');
  });

  it('14 AWG is listed in copper only, as in the table (confirmed)', () => {
    const row = NEC_TABLE_9['14 AWG'];
    expect(row.reactance).toEqual({ pvc: 0.058, aluminium: 0.058, steel: 0.073 });
    expect(row.resistance.copper).toEqual({ pvc: 3.1, aluminium: 3.1, steel: 3.1 });
    expect(row.resistance.aluminium).toBeUndefined();
  });

  it('resistance falls as the size grows, in every column', () => {
    const rows = Object.values(NEC_TABLE_9);
    for (let i = 1; i < rows.length; i++)
      for (const material of ['copper', 'aluminium'] as const)
        for (const conduit of ['pvc', 'aluminium', 'steel'] as const)
          expect(rows[i].resistance[material]?.[conduit] ?? 0).toBeLessThanOrEqual(
            rows[i - 1].resistance[material]?.[conduit] ?? Infinity,
          );
  });
});
