import type { StudyInput } from '../../../src/engine/study/index.ts';

/**
 * The sequence-network reference system (inputs invented): 250 MVA X/R 12 at 12.47 kV, a 1500 kVA
 * 12.47 kV–480Y/277 V 5.75 %Z X/R 6 Δ–Yg unit, and 100 ft of 2 sets 500 kcmil Cu in steel conduit to a panel.
 */
export function deltaWyeInput(): StudyInput {
  return {
    discern: 1,
    name: 'sequence reference',
    source: { kind: 'utility', id: 'U', bus: 'MV', max: { available: '250 MVA', xr: 12 } },
    buses: [
      { id: 'MV', voltage: '12.47 kV' },
      { id: 'LV', voltage: 480 },
      { id: 'PNL', voltage: 480 },
    ],
    transformers: [
      {
        id: 'T',
        from: 'MV',
        to: 'LV',
        rating: '1500 kVA',
        primary: '12.47 kV',
        secondary: '480 V',
        impedance: '5.75 %',
        xr: 6,
        connection: 'delta-wye',
      },
    ],
    cables: [{ id: 'C', from: 'LV', to: 'PNL', size: '500 kcmil', sets: 2, length: '100 ft', conduit: 'steel' }],
  };
}

/**
 * A 50 kVA single-phase 12.47 kV–120/240 V 2.1 %Z X/R 2 unit across two lines of the same 250 MVA
 * source, and 50 ft of 2/0 Cu in PVC conduit to a panel (inputs invented).
 */
export function singlePhaseInput(): StudyInput {
  return {
    discern: 1,
    name: 'single-phase reference',
    source: { kind: 'utility', id: 'U', bus: 'MV', max: { available: '250 MVA', xr: 12 } },
    buses: [
      { id: 'MV', voltage: '12.47 kV' },
      { id: 'S', voltage: 240 },
      { id: 'P', voltage: 240 },
    ],
    transformers: [
      {
        id: 'T1P',
        from: 'MV',
        to: 'S',
        rating: '50 kVA',
        primary: '12.47 kV',
        secondary: '240 V',
        impedance: '2.1 %',
        xr: 2,
        phases: 1,
      },
    ],
    cables: [{ id: 'C', from: 'S', to: 'P', size: '2/0', length: '50 ft', conduit: 'pvc' }],
  };
}
