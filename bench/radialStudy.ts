// A generator of large radial studies for the P2 benchmark: invented data, shaped like a real site.
import type { StudyInput } from '../src/engine/study/index.ts';

/**
 * A radial study with about `devices` devices: a 12.47 kV utility, a relay-protected 2500 kVA
 * transformer, a 480 V main, and a tree of cables and panels where every panel feeds `fanout` more,
 * each cable with its trip unit (sensors shrinking down the tree) and the last level feeding motors.
 */
export function radialStudy(devices: number, fanout = 6): StudyInput {
  const study: StudyInput = {
    discern: 1,
    name: `generated radial study, ${devices} devices`,
    source: {
      kind: 'utility',
      id: 'U',
      bus: 'MV',
      max: { available: '500 MVA', xr: 15 },
      min: { available: '300 MVA', xr: 12 },
    },
    buses: [
      { id: 'MV', voltage: 12_470 },
      { id: 'LV', voltage: 480 },
    ],
    transformers: [
      { id: 'T', from: 'MV', to: 'LV', rating: 2500, primary: 12_470, secondary: 480, impedance: 5.75, xr: 7 },
    ],
    cables: [],
    motors: [],
    devices: [
      {
        id: 'R',
        feeds: 'T',
        characteristic: {
          kind: 'relay',
          ct: '200:5',
          timeOvercurrent: { curve: 'ieee-extremely-inverse', pickup: 4, timeDial: 6 },
        },
      },
      {
        id: 'MAIN',
        feeds: 'LV',
        characteristic: {
          kind: 'trip-unit',
          sensor: 4000,
          longTime: { pickup: 1, delay: 10 },
          shortTime: { pickup: 4, delay: 0.4 },
        },
      },
    ],
  };
  let frontier = [{ bus: 'LV', sensor: 4000 }];
  let count = study.devices!.length;
  let n = 0;
  while (count < devices) {
    const next: { bus: string; sensor: number }[] = [];
    for (const parent of frontier) {
      for (let k = 0; k < fanout && count < devices; k++, n++, count++) {
        const bus = `P${n}`;
        const sensor = Math.max(parent.sensor / 3, 15);
        study.buses.push({ id: bus, voltage: 480 });
        study.cables!.push({ id: `C${n}`, from: parent.bus, to: bus, size: '4/0', length: 50 + (n % 7) * 20 });
        study.devices!.push({
          id: `D${n}`,
          feeds: `C${n}`,
          characteristic: {
            kind: 'trip-unit',
            sensor,
            longTime: { pickup: 1, delay: 4 + (n % 5) },
            shortTime: { pickup: 6, delay: 0.1 + 0.1 * (n % 2) },
            instantaneous: { pickup: 12 },
          },
        });
        if (n % 4 === 0) study.motors!.push({ id: `M${n}`, bus, hp: 20 });
        next.push({ bus, sensor });
      }
    }
    frontier = next;
  }
  return study;
}
