import { parseStudy, type Study, type StudyInput } from '../../../src/engine/study/index.ts';
import { baseAmps3, baseOhms, polar, scale, type C } from './perUnit.ts';

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

/** A plain long-time trip unit of `sensor` amperes (invented). */
export const tripUnit = (sensor: number) => ({
  kind: 'trip-unit' as const,
  sensor,
  longTime: { pickup: 1, delay: 10 },
});

/**
 * 250 MVA X/R 12 at 12.47 kV, a 1500 kVA 5.75 %Z X/R 6 Δ–Yg unit to a 480 V switchboard with a motor
 * group of 500 A FLA on it, and 100 ft of 2 × 500 kcmil Cu (steel conduit) to an MCC with a 200 A FLA
 * motor group. A primary relay, a switchboard main, a feeder to the MCC and the MCC's motor feeder (invented).
 */
export function motorStudy(): StudyInput {
  return {
    discern: 1,
    name: 'motor contribution through two devices',
    source: { kind: 'utility', id: 'U', bus: 'MV', max: { available: '250 MVA', xr: 12 } },
    buses: [
      { id: 'MV', voltage: '12.47 kV' },
      { id: 'SWBD', voltage: 480 },
      { id: 'MCC', voltage: 480 },
    ],
    transformers: [
      {
        id: 'T',
        from: 'MV',
        to: 'SWBD',
        rating: '1500 kVA',
        primary: '12.47 kV',
        secondary: 480,
        impedance: 5.75,
        xr: 6,
      },
    ],
    cables: [{ id: 'C', from: 'SWBD', to: 'MCC', size: '500 kcmil', sets: 2, length: '100 ft', conduit: 'steel' }],
    motors: [
      { id: 'M1', bus: 'SWBD', fullLoadAmps: 500, xr: 6 },
      { id: 'M2', bus: 'MCC', fullLoadAmps: 200, xr: 6 },
    ],
    devices: [
      {
        id: 'R',
        feeds: 'T',
        characteristic: {
          kind: 'relay',
          ct: '100:5',
          timeOvercurrent: { curve: 'definite-time', pickup: 5, delay: 0.5 },
        },
      },
      { id: 'MAIN', feeds: 'SWBD', characteristic: tripUnit(2000) },
      { id: 'F', feeds: 'C', characteristic: tripUnit(800) },
      { id: 'FM', feeds: 'M2', characteristic: tripUnit(250) },
    ],
  };
}

/**
 * The hand solution of `motorStudy` in per unit on 1500 kVA, 480 V (IEEE 141 / IEEE 399 per-unit method;
 * motors as parallel sources at 4 × FLA, common practice): base current, source, transformer, the two
 * motor groups and the cable. With equal pre-fault voltages, the current a bus receives from its feeder
 * divides at the bus above in inverse proportion to the parallel paths there.
 */
export const motorStudyPerUnit = (() => {
  const S = 1.5e6;
  const ib = baseAmps3(S, 480);
  return {
    ib,
    zs: polar(S / 250e6, 12),
    zt: polar(0.0575, 6),
    zm1: polar(ib / (4 * 500), 6),
    zm2: polar(ib / (4 * 200), 6),
    // 100 ft of 2 × 500 kcmil Cu in steel conduit, NEC Chapter 9 Table 9 (R at 75 °C), R taken to 20 °C for
    // the maximum fault (IEC 60909-0) by Table 8's copper coefficient, (234.5 + 20) / (234.5 + 75).
    zc: scale([0.029 * 0.1 * (254.5 / 309.5), 0.048 * 0.1], 1 / 2 / baseOhms(S, 480)) as C,
  };
})();
