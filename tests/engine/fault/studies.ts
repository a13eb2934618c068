import { parseStudy, type Study, type StudyInput } from '../../../src/engine/study/index.ts';

/**
 * A per-unit worked case as a study (inputs invented): 250 MVA X/R 15 at 4.16 kV, a 750 kVA
 * 4.16 kV–480 V 5.75 %Z X/R 5 transformer, and 100 ft of 2 sets 500 kcmil Cu in steel conduit to a panel.
 */
export function case72Input(): StudyInput {
  return {
    discern: 1,
    name: '750 kVA worked case',
    source: { kind: 'utility', id: 'U', bus: 'MV', max: { available: '250 MVA', xr: 15 } },
    buses: [
      { id: 'MV', voltage: '4.16 kV' },
      { id: 'LV', voltage: 480 },
      { id: 'PNL', voltage: 480 },
    ],
    transformers: [
      {
        id: 'T',
        from: 'MV',
        to: 'LV',
        rating: '750 kVA',
        primary: '4.16 kV',
        secondary: '480 V',
        impedance: '5.75 %',
        xr: 5,
      },
    ],
    cables: [
      {
        id: 'C',
        from: 'LV',
        to: 'PNL',
        size: '500 kcmil',
        sets: 2,
        length: '100 ft',
        material: 'copper',
        conduit: 'steel',
      },
    ],
  };
}

export function study(input: StudyInput): Study {
  return parseStudy(input);
}
