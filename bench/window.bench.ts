// P7 and P8 (DEVELOPERS.md, benchmarks): one device's setting window in the 25-device demo, and proposals for a
// generated 2,000-device study.
import { readFileSync } from 'node:fs';
import { parseStudy, type Study } from '../src/engine/study/index.ts';
import { proposeSettings, settingWindowOf } from '../src/engine/window/index.ts';
import { coresText, type Benchmark } from './benchmark.ts';
import { radialStudy } from './radialStudy.ts';
import { ROOT } from './root.ts';

/** Wall times in ms of `repeats` runs after `warmup` untimed ones. */
function runsMs(fn: () => void, repeats: number, warmup: number): number[] {
  for (let i = 0; i < warmup; i++) fn();
  const times: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const start = performance.now();
    fn();
    times.push(performance.now() - start);
  }
  return times.sort((a, b) => a - b);
}

/** The median with the runs' spread, in the shape every benchmark reports. */
function measured(times: number[], detail: string) {
  const median = times[Math.floor(times.length / 2)];
  const result = {
    value: median,
    detail,
    spread: { min: times[0], median, max: times[times.length - 1], runs: times.length },
  };
  return result;
}

const demo = (): Study => parseStudy(readFileSync(`${ROOT}demo/harrowmere-full.json`, 'utf8'));

export const benchmarks: Benchmark[] = [
  {
    id: 'P7',
    what: "one device's setting window (the 2000 A main: every setting, both maps, recommendation), 25-device demo",
    unit: 'ms',
    target: 50,
    async run() {
      const study = demo();
      let settings = 0;
      const times = runsMs(() => void (settings = settingWindowOf(study, 'MAIN').settings.length), 15, 3);
      const mapsOff = runsMs(() => void settingWindowOf(study, 'MAIN', { maps: false }), 15, 3);
      return measured(
        times,
        `${settings} settings; without the two maps ${mapsOff[Math.floor(mapsOff.length / 2)].toFixed(1)} ms`,
      );
    },
  },
  {
    id: 'P8',
    what: 'proposals for a generated 2,000-device study (every adjustable device, findings before and after)',
    unit: 'ms',
    target: 3000,
    async run() {
      const study = parseStudy(radialStudy(2000));
      let changes = 0;
      let devices = 0;
      const times = runsMs(
        () => {
          const proposal = proposeSettings(study);
          changes = proposal.changes.length;
          devices = proposal.order.length;
        },
        3,
        1,
      );
      return measured(times, `${devices} adjustable devices set, ${changes} setting changes, ${coresText()}`);
    },
  },
];
