// A small worked system for the setting-window tests: a relay-protected 1500 kVA service transformer,
// a 2000 A main with short-time, and a 400 A feeder to a motor panel. Invented data.
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { withSettingChanges, type SettingValue } from '../../../src/engine/window/index.ts';

/** The worked study as a file would hold it. */
export function workedStudy(): StudyInput {
  return {
    discern: 1,
    name: 'worked window study',
    source: { kind: 'utility', id: 'U', bus: 'MV', max: { available: '250 MVA', xr: 12 } },
    buses: [
      { id: 'MV', voltage: '12.47 kV' },
      { id: 'SWBD', voltage: 480 },
      { id: 'PNL', voltage: 480 },
    ],
    transformers: [
      {
        id: 'T1',
        from: 'MV',
        to: 'SWBD',
        rating: '1500 kVA',
        primary: '12.47 kV',
        secondary: 480,
        impedance: '5.75 %',
        xr: 6,
      },
    ],
    cables: [{ id: 'C-F', from: 'SWBD', to: 'PNL', size: '500 kcmil', length: '100 ft' }],
    motors: [{ id: 'M1', bus: 'PNL', hp: 100 }],
    devices: [
      {
        id: 'R-T1',
        feeds: 'T1',
        characteristic: {
          kind: 'relay',
          ct: '100:5',
          timeOvercurrent: { curve: 'ieee-extremely-inverse', pickup: 5.5, timeDial: 6 },
          instantaneous: { pickup: 80 },
          tolerance: { pickup: 5, time: 5 },
        },
      },
      {
        id: 'MAIN',
        feeds: 'SWBD',
        characteristic: {
          kind: 'trip-unit',
          sensor: 2000,
          longTime: { pickup: 1, delay: 4 },
          shortTime: { pickup: 4, delay: 0.3 },
        },
      },
      {
        id: 'FDR',
        feeds: 'C-F',
        characteristic: {
          kind: 'trip-unit',
          sensor: 400,
          longTime: { pickup: 1, delay: 4 },
          instantaneous: { pickup: 10 },
        },
      },
    ],
  };
}

/**
 * The failing findings about a device once one setting is changed in the file and the whole study is
 * checked again: the independent reading the window must agree with (interrupting duty aside, which
 * is reported rather than set). A pickup below the load it feeds is only a warning in the check, but
 * a bound of the window, so it counts here.
 */
export function failuresWith(input: StudyInput, deviceId: string, changes: Record<string, SettingValue>) {
  const changed = withSettingChanges(
    input,
    Object.entries(changes).map(([key, to]) => ({ deviceId, key, to })),
  );
  return analyseStudy(parseStudy(changed)).findings.filter(
    (f) =>
      (f.severity === 'fail' || (f.kind === 'carry-load' && f.severity === 'warning')) &&
      f.subjects.includes(deviceId) &&
      f.kind !== 'interrupting-duty',
  );
}
