/**
 * NFPA 70 (NEC) Chapter 9 Table 9: AC resistance and reactance of 600 V cables, three-phase, 60 Hz,
 * 75 °C, three single conductors in one conduit, in ohms to neutral per 1000 ft.
 *
 * Every size the table lists, 14 AWG to 1000 kcmil, checked against public reproductions of the
 * table; check them against the edition you cite. The reactance column for PVC conduit also serves
 * aluminium conduit, as in the table. The table lists no aluminium 14 AWG.
 */
export interface Table9Row {
  /** Inductive reactance XL, Ω to neutral per 1000 ft, by conduit. */
  reactance: { pvc: number; aluminium: number; steel: number };
  /** AC resistance at 75 °C, Ω to neutral per 1000 ft, by conductor material then conduit. */
  resistance: {
    copper: { pvc: number; aluminium: number; steel: number };
    /** Absent for 14 AWG, which the table lists in copper only. */
    aluminium?: { pvc: number; aluminium: number; steel: number };
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
  al: [number, number, number] | undefined,
  mark: Table9Row['mark'] = '(confirmed)',
): Table9Row {
  return {
    reactance: { pvc: xPvc, aluminium: xPvc, steel: xSteel },
    resistance: {
      copper: { pvc: cu[0], aluminium: cu[1], steel: cu[2] },
      ...(al && { aluminium: { pvc: al[0], aluminium: al[1], steel: al[2] } }),
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
  '14 AWG': row(0.058, 0.073, [3.1, 3.1, 3.1], undefined),
  '12 AWG': row(0.054, 0.068, [2.0, 2.0, 2.0], [3.2, 3.2, 3.2]),
  '10 AWG': row(0.05, 0.063, [1.2, 1.2, 1.2], [2.0, 2.0, 2.0]),
  '8 AWG': row(0.052, 0.065, [0.78, 0.78, 0.78], [1.3, 1.3, 1.3]),
  '6 AWG': row(0.051, 0.064, [0.49, 0.49, 0.49], [0.81, 0.81, 0.81]),
  '4 AWG': row(0.048, 0.06, [0.31, 0.31, 0.31], [0.51, 0.51, 0.51]),
  '3 AWG': row(0.047, 0.059, [0.25, 0.25, 0.25], [0.4, 0.41, 0.4]),
  '2 AWG': row(0.045, 0.057, [0.19, 0.2, 0.2], [0.32, 0.32, 0.32]),
  '1 AWG': row(0.046, 0.057, [0.15, 0.16, 0.16], [0.25, 0.26, 0.25]),
  '1/0': row(0.044, 0.055, [0.12, 0.13, 0.12], [0.2, 0.21, 0.2]),
  '2/0': row(0.043, 0.054, [0.1, 0.1, 0.1], [0.16, 0.16, 0.16]),
  '3/0': row(0.042, 0.052, [0.077, 0.082, 0.079], [0.13, 0.13, 0.13]),
  '4/0': row(0.041, 0.051, [0.062, 0.067, 0.063], [0.1, 0.11, 0.1]),
  '250 kcmil': row(0.041, 0.052, [0.052, 0.057, 0.054], [0.085, 0.09, 0.086]),
  '300 kcmil': row(0.041, 0.051, [0.044, 0.049, 0.045], [0.071, 0.076, 0.072]),
  '350 kcmil': row(0.04, 0.05, [0.038, 0.043, 0.039], [0.061, 0.066, 0.063]),
  '400 kcmil': row(0.04, 0.049, [0.033, 0.038, 0.035], [0.054, 0.059, 0.055]),
  '500 kcmil': row(0.039, 0.048, [0.027, 0.032, 0.029], [0.043, 0.048, 0.045]),
  '600 kcmil': row(0.039, 0.048, [0.023, 0.028, 0.025], [0.036, 0.041, 0.038]),
  '750 kcmil': row(0.038, 0.048, [0.019, 0.024, 0.021], [0.029, 0.034, 0.031]),
  '1000 kcmil': row(0.037, 0.046, [0.015, 0.019, 0.018], [0.023, 0.027, 0.025]),
});

/** The sizes Table 9 spans, for messages. */
export const TABLE_9_SPAN = '14 AWG to 1000 kcmil';
