// P2 and P3 (DESIGN §7): fault levels and every pair check on large generated studies, and the
// overlap finder's edges against a dense reference sampled at 10⁵ points per decade.
import { readFileSync } from 'node:fs';
import { HALF_CYCLE_SECONDS, bandOf, scaleBand, type Band } from '../src/engine/band.ts';
import { type CheckContext } from '../src/engine/checks/context.ts';
import { checkPair } from '../src/engine/checks/coordination.ts';
import { faultLevelsOf } from '../src/engine/fault/index.ts';
import { locationBusOf, networkOf, seriesPairs } from '../src/engine/network/index.ts';
import { findOverlaps } from '../src/engine/overlap.ts';
import { parseStudy, type Study } from '../src/engine/study/index.ts';
import { medianMs, type Benchmark } from './benchmark.ts';
import { radialStudy } from './radialStudy.ts';

/** Fault levels plus every series pair of a study, as `analyseStudy` runs them. */
function faultsAndPairs(study: Study): number {
  const network = networkOf(study);
  const faults = faultLevelsOf(network);
  const bands = new Map(study.devices.map((device) => [device.id, bandOf(device.characteristic)]));
  const context: CheckContext = { network, faults, bands };
  let intervals = 0;
  for (const pair of seriesPairs(network)) intervals += checkPair(context, pair, study.coordination).check.cases.length;
  return intervals;
}

const studies = new Map<number, Study>();
const studyOf = (devices: number) => {
  if (!studies.has(devices)) studies.set(devices, parseStudy(radialStudy(devices)));
  return studies.get(devices)!;
};
let p2Ms2000 = 0;

/** The class the finder gives one current, re-stated independently for the reference. */
function denseClass(up: Band, down: Band, amps: number, margin: number, thin: number): number {
  const never = (t: number) => (t > 1000 ? Infinity : t);
  const u = never(up.minTime(amps));
  if (u === Infinity) return 0;
  const d = never(down.maxTime(amps));
  const limiting = amps >= Math.min(up.currentLimitingFrom, down.currentLimitingFrom) && u < 0.1;
  const bothInstantaneous = u <= HALF_CYCLE_SECONDS && d <= 0.1 && down.minTime(amps) <= HALF_CYCLE_SECONDS;
  if (bothInstantaneous || limiting) return 3;
  const slack = u - (d + margin);
  return !(slack >= 0) ? 2 : slack < thin ? 1 : 0;
}

/** Every edge the dense grid sees: the geometric midpoint of each pair of samples whose class differs. */
function denseEdges(up: Band, down: Band, from: number, to: number, margin: number, thin: number): number[] {
  const perDecade = 1e5;
  const steps = Math.ceil(perDecade * Math.log10(to / from));
  const ratio = Math.pow(to / from, 1 / steps);
  const edges: number[] = [];
  let amps = from;
  let previous = denseClass(up, down, amps, margin, thin);
  for (let i = 1; i <= steps; i++) {
    const next = amps * ratio;
    const c = denseClass(up, down, next, margin, thin);
    if (c !== previous) edges.push(Math.sqrt(amps * next));
    previous = c;
    amps = next;
  }
  return edges;
}

/** The pairs of the three demo studies on their downstream voltage, with their margins and ranges. */
function demoPairs() {
  return ['selective', 'overlap', 'fused'].flatMap((name) => {
    const study = parseStudy(readFileSync(new URL(`../demo/harrowmere-${name}.json`, import.meta.url), 'utf8'));
    const network = networkOf(study);
    const faults = faultLevelsOf(network);
    return seriesPairs(network).map(({ upstream, downstream }) => {
      const upBus = locationBusOf(network, upstream);
      const downBus = locationBusOf(network, downstream);
      const up = scaleBand(bandOf(upstream.characteristic), upBus.voltage / downBus.voltage);
      const down = bandOf(downstream.characteristic);
      const toAmps = faults.buses.get(downBus.id)!.max.threePhase;
      return { name: `${name} ${upstream.id}/${downstream.id}`, up, down, toAmps, margin: 0.1, thin: 0.1 };
    });
  });
}

export const benchmarks: Benchmark[] = [
  {
    id: 'P2',
    what: 'fault levels + every pair check, generated radial study of 2,000 devices, one core',
    unit: 'ms',
    target: 300,
    async run() {
      const study = studyOf(2000);
      p2Ms2000 = medianMs(() => faultsAndPairs(study), 9, 2);
      return { value: p2Ms2000, detail: `${study.devices.length} devices, ${study.buses.length} buses, median of 9` };
    },
  },
  {
    id: 'P2',
    what: 'the same at 4,000 devices, as a multiple of the 2,000-device time',
    unit: '×',
    target: 2.2,
    async run() {
      const study = studyOf(4000);
      const ms = medianMs(() => faultsAndPairs(study), 9, 2);
      return { value: ms / p2Ms2000, detail: `${ms.toFixed(0)} ms` };
    },
  },
  ...(() => {
    let speedup = 0;
    let worstError = 0;
    let edgeCount = 0;
    const measure = () => {
      if (edgeCount > 0) return;
      let denseMs = 0;
      let finderMs = 0;
      for (const pair of demoPairs()) {
        const from = Math.min(pair.up.minAmps, pair.down.minAmps);
        const options = { toAmps: pair.toAmps, margin: pair.margin, thinMargin: pair.thin };
        let reference: number[] = [];
        const start = performance.now();
        reference = denseEdges(pair.up, pair.down, from, pair.toAmps, pair.margin, pair.thin);
        denseMs += performance.now() - start;
        finderMs += medianMs(() => findOverlaps(pair.up, pair.down, options), 21, 3);
        const edges = findOverlaps(pair.up, pair.down, options)
          .slice(1)
          .map((interval) => interval.fromAmps);
        for (const edge of reference) {
          const nearest = edges.reduce((best, e) => (Math.abs(e - edge) < Math.abs(best - edge) ? e : best), Infinity);
          worstError = Math.max(worstError, Math.abs(nearest - edge) / edge);
          edgeCount++;
        }
      }
      speedup = denseMs / finderMs;
    };
    return [
      {
        id: 'P3',
        what: 'overlap-interval edges vs a dense reference (10⁵ points per decade), worst relative error in current',
        unit: '%',
        target: 0.1,
        async run() {
          measure();
          return { value: worstError * 100, detail: `${edgeCount} edges over the demo studies' pairs` };
        },
      },
      {
        id: 'P3',
        what: 'overlap finder speed-up over the dense reference',
        unit: '×',
        target: 50,
        higherIsBetter: true,
        async run() {
          measure();
          return { value: speedup };
        },
      },
    ] satisfies Benchmark[];
  })(),
];
