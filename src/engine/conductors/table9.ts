/**
 * NFPA 70 (NEC) Chapter 9 Table 9: AC resistance and reactance of 600 V cables, three-phase, 60 Hz,
 * 75 °C, three single conductors in one conduit, in ohms to neutral per 1000 ft.
 *
 * Rows 12 AWG–750 kcmil except 3/0 are as listed in REFERENCE §1.4 (confirmed against two public
 * reproductions of NEC Table 9). The 3/0 row is from memory: check it against the edition you cite.
 * The reactance column for PVC conduit also serves aluminium conduit, as in the table.
 */
export interface Table9Row {
  /** Inductive reactance XL, Ω to neutral per 1000 ft, by conduit. */
  reactance: { pvc: number; aluminium: number; steel: number };
  /** AC resistance at 75 °C, Ω to neutral per 1000 ft, by conductor material then conduit. */
  resistance: {
    copper: { pvc: number; aluminium: number; steel: number };
    aluminium: { pvc: number; aluminium: number; steel: number };
  };
  /** Where the row comes from. */
  mark: '(confirmed)' | '(from memory)';
}

/** The conductor temperature at which Table 9 resistances are stated (°C). */
export const TABLE_9_TEMPERATURE = 75;

function row(
  xPvc: number,
  xSteel: number,
  cu: [number, number, number],
  al: [number, number, number],
  mark: Table9Row['mark'] = '(confirmed)',
): Table9Row {
  return {
    reactance: { pvc: xPvc, aluminium: xPvc, steel: xSteel },
    resistance: {
      copper: { pvc: cu[0], aluminium: cu[1], steel: cu[2] },
      aluminium: { pvc: al[0], aluminium: al[1], steel: al[2] },
    },
    mark,
  };
}

/**
 * The rows discern carries, keyed by canonical size ("12 AWG", "4/0", "500 kcmil"); resistance
 * triples are [PVC, aluminium, steel conduit].
 *
 * @example NEC_TABLE_9['500 kcmil'].resistance.copper.steel // 0.029 Ω/1000 ft
 */
export const NEC_TABLE_9: Readonly<Record<string, Table9Row>> = Object.freeze({
  '12 AWG': row(0.054, 0.068, [2.0, 2.0, 2.0], [3.2, 3.2, 3.2]),
  '10 AWG': row(0.05, 0.063, [1.2, 1.2, 1.2], [2.0, 2.0, 2.0]),
  '8 AWG': row(0.052, 0.065, [0.78, 0.78, 0.78], [1.3, 1.3, 1.3]),
  '6 AWG': row(0.051, 0.064, [0.49, 0.49, 0.49], [0.81, 0.81, 0.81]),
  '4 AWG': row(0.048, 0.06, [0.31, 0.31, 0.31], [0.51, 0.51, 0.51]),
  '2 AWG': row(0.045, 0.057, [0.19, 0.2, 0.2], [0.32, 0.32, 0.32]),
  '1/0': row(0.044, 0.055, [0.12, 0.13, 0.12], [0.2, 0.21, 0.2]),
  '2/0': row(0.043, 0.054, [0.1, 0.1, 0.1], [0.16, 0.16, 0.16]),
  '3/0': row(0.042, 0.052, [0.077, 0.082, 0.079], [0.13, 0.13, 0.13], '(from memory)'),
  '4/0': row(0.041, 0.051, [0.062, 0.067, 0.063], [0.1, 0.11, 0.1]),
  '250 kcmil': row(0.041, 0.052, [0.052, 0.057, 0.054], [0.085, 0.09, 0.086]),
  '350 kcmil': row(0.04, 0.05, [0.038, 0.043, 0.039], [0.061, 0.066, 0.063]),
  '500 kcmil': row(0.039, 0.048, [0.027, 0.032, 0.029], [0.043, 0.048, 0.045]),
  '750 kcmil': row(0.038, 0.048, [0.019, 0.024, 0.021], [0.029, 0.034, 0.031]),
});
