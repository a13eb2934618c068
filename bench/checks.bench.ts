// P2, P2e and P3 (DEVELOPERS.md, benchmarks): the whole analysis of generated studies, from the study's text to every
// finding; band evaluations per pair check against what the check needs; and the overlap finder's
// edges against reference grids.
import { GCProfiler } from 'node:v8';
import { readFileSync } from 'node:fs';
import { HALF_CYCLE_SECONDS, bandOf, fastestOf, groundFaultBandOf, scaleBand, type Band } from '../src/engine/band.ts';
import { analyseStudy } from '../src/engine/analysis.ts';
import type { CheckContext } from '../src/engine/checks/context.ts';
import { checkPair } from '../src/engine/checks/coordination.ts';
import { marginRuleOf } from '../src/engine/checks/margins.ts';
import { faultLevelsOf } from '../src/engine/fault/index.ts';
import { locationBusOf, networkOf, seriesPairs, transformersBetween } from '../src/engine/network/index.ts';
import { findOverlaps, type OverlapOptions } from '../src/engine/overlap.ts';
import { parseStudy, type Study } from '../src/engine/study/index.ts';
import { coresText, medianOf, spreadOf, type Benchmark, type Measured } from './benchmark.ts';
import { radialStudy } from './radialStudy.ts';
import { ROOT } from './root.ts';

// ---------------------------------------------------------------------------------------------
// P2: text → parse → every check → findings, 2,000 and 8,000 devices timed alternately.

// Twenty-one rounds: with seven, one slow 8,000-device run moved the ratio of the medians by a tenth.
// More rounds narrow the medians' spread, not a busy host's: four runs of the same code within ten
// minutes read 3.99–4.45 × with twenty-one, as 3.93–4.46 × with eleven.
const ROUNDS = 21;
const texts = new Map<number, string>();
const textOf = (devices: number) => {
  if (!texts.has(devices)) texts.set(devices, JSON.stringify(radialStudy(devices)));
  return texts.get(devices)!;
};
/** One full analysis from text, as a user's file would be analysed; returns the findings count. */
const analyseText = (text: string) => analyseStudy(parseStudy(text)).findings.length;

/** Bytes allocated by `fn` (heap growth plus everything the collector freed meanwhile) and the collector's time. */
function allocationOf(fn: () => void): { megabytes: number; gcMs: number; ms: number } {
  const profiler = new GCProfiler();
  profiler.start();
  const before = process.memoryUsage().heapUsed;
  const start = performance.now();
  fn();
  const ms = performance.now() - start;
  const after = process.memoryUsage().heapUsed;
  const { statistics } = profiler.stop();
  let freed = 0;
  let gcMicros = 0;
  for (const gc of statistics) {
    freed += gc.beforeGC.heapStatistics.usedHeapSize - gc.afterGC.heapStatistics.usedHeapSize;
    gcMicros += gc.cost;
  }
  return { megabytes: (after - before + freed) / 1e6, gcMs: gcMicros / 1000, ms };
}

let p2: { small: Measured; ratio: Measured; large: Measured } | undefined;
function measureP2() {
  if (p2) return p2;
  const small = textOf(2000);
  const large = textOf(8000);
  for (let i = 0; i < 2; i++) {
    analyseText(small);
    analyseText(large);
  }
  const smallMs: number[] = [];
  const largeMs: number[] = [];
  for (let round = 0; round < ROUNDS; round++) {
    let start = performance.now();
    analyseText(small);
    smallMs.push(performance.now() - start);
    start = performance.now();
    analyseText(large);
    largeMs.push(performance.now() - start);
  }
  const study = parseStudy(small);
  const memory = allocationOf(() => analyseText(small));
  const memoryText = `${memory.megabytes.toFixed(0)} MB allocated per analysis, ${memory.gcMs.toFixed(0)} ms of it collecting garbage`;
  const ratios = largeMs.map((ms, i) => ms / smallMs[i]);
  const ratioSpread = spreadOf(ratios);
  const largeSpread = spreadOf(largeMs);
  const smallSpread = spreadOf(smallMs);
  const mix = `${study.devices.length} devices (${familyMix(study)}), ${study.transformers.length} transformers, ${study.motors.length} motors`;
  p2 = {
    small: medianOf(smallMs, `${mix}; ${ROUNDS} runs alternating with 8,000, ${coresText()}; ${memoryText}`),
    large: medianOf(largeMs),
    ratio: {
      value: largeSpread.median / smallSpread.median,
      spread: ratioSpread,
      detail: `8,000 devices ${largeSpread.median.toFixed(0)} ms (${largeSpread.min.toFixed(0)}–${largeSpread.max.toFixed(0)}); spread of each run's ratio to the 2,000 run before it`,
    },
  };
  return p2;
}

function familyMix(study: Study): string {
  const counts = new Map<string, number>();
  for (const device of study.devices) {
    const kind = device.characteristic.kind;
    const ground = kind === 'trip-unit' && device.characteristic.ground ? ' with ground' : '';
    counts.set(kind + ground, (counts.get(kind + ground) ?? 0) + 1);
  }
  return [...counts].map(([kind, n]) => `${n} ${kind}`).join(', ');
}

// ---------------------------------------------------------------------------------------------
// P2e: band evaluations per pair check, counted by wrapping every band the checks are given.

/**
 * A band that counts every evaluation of either edge in `counter.calls`: one per edge call, and one per
 * current for each edge a batch call is asked for.
 */
function counted(band: Band, counter: { calls: number }): Band {
  const { minTime, maxTime, evaluateInto } = band;
  return {
    ...band,
    minTime: (amps) => {
      counter.calls++;
      return minTime(amps);
    },
    maxTime: (amps) => {
      counter.calls++;
      return maxTime(amps);
    },
    evaluateInto:
      evaluateInto &&
      ((amps, minTimes, maxTimes) => {
        counter.calls += ((minTimes ? 1 : 0) + (maxTimes ? 1 : 0)) * amps.length;
        evaluateInto(amps, minTimes, maxTimes);
      }),
  };
}

/**
 * What a pair case needs at least: both bands' edges (the upstream earliest, the downstream latest)
 * at each knot — the range's ends and every breakpoint of either band inside it — and, per class edge,
 * a bracketing refinement to the tolerance, counted as 10 steps of both edges (a superlinear method's
 * usual count from one grid cell to 1e-6).
 */
const REFINEMENT_STEPS = 10;
function needOf(up: Band, down: Band, fromAmps: number, toAmps: number, classEdges: number): number {
  let knots = 2;
  for (const set of [up.breakpoints, down.breakpoints]) for (const a of set) if (a > fromAmps && a < toAmps) knots++;
  return 2 * knots + 2 * REFINEMENT_STEPS * classEdges;
}

let p2e: Measured | undefined;
function measureP2e(): Measured {
  if (p2e) return p2e;
  const study = parseStudy(textOf(2000));
  const network = networkOf(study);
  const faults = faultLevelsOf(network);
  const counter = { calls: 0 };
  const plain = new Map(study.devices.map((device) => [device.id, bandOf(device.characteristic)]));
  const bands = new Map([...plain].map(([id, band]) => [id, counted(band, counter)]));
  const context: CheckContext = { network, faults, bands };
  const ratios: number[] = [];
  let spent = 0;
  let needed = 0;
  for (const pair of seriesPairs(network)) {
    counter.calls = 0;
    const { check } = checkPair(context, pair, study.coordination);
    const used = counter.calls;
    let need = 0;
    for (const pairCase of check.cases) {
      const { intervals } = pairCase;
      if (intervals.length === 0) continue;
      const upBand = plain.get(pair.upstream.id)!;
      const scale = locationBusOf(network, pair.upstream).voltage / pairCase.referenceVolts / pairCase.upstreamShift;
      need += needOf(
        scaleBand(upBand, scale),
        plain.get(pair.downstream.id)!,
        intervals[0].fromAmps,
        intervals[intervals.length - 1].toAmps,
        intervals.length - 1,
      );
    }
    if (need === 0) continue;
    spent += used;
    needed += need;
    ratios.push(used / need);
  }
  const spread = spreadOf(ratios);
  p2e = {
    value: spent / needed,
    spread,
    detail: `${(spent / ratios.length).toFixed(0)} evaluations per pair check against a need of ${(needed / ratios.length).toFixed(0)} (2 per knot + ${2 * REFINEMENT_STEPS} per class edge), ${ratios.length} pairs of the 2,000-device study; spread over pairs`,
  };
  return p2e;
}

// ---------------------------------------------------------------------------------------------
// P3: the overlap finder's edges against grids classifying every sample independently.

interface PairCase {
  name: string;
  up: Band;
  down: Band;
  options: OverlapOptions & { margin: number; timeRatio: number; thinMargin: number; horizon: number };
}

/** Every case of every series pair, built as the pair check builds them (three-phase, line-to-line, ground). */
function casesOf(study: Study, label: string): PairCase[] {
  const network = networkOf(study);
  const faults = faultLevelsOf(network);
  const settings = study.coordination;
  const cases: PairCase[] = [];
  for (const { upstream, downstream } of seriesPairs(network)) {
    const upBus = locationBusOf(network, upstream);
    const downBus = locationBusOf(network, downstream);
    const rule = marginRuleOf(upstream.characteristic.kind, downstream.characteristic.kind, settings, upstream.margin, {
      upstream: upstream.id,
      downstream: downstream.id,
    });
    const fault = faults.buses.get(downBus.id)!.max;
    const base = {
      margin: rule.margin,
      timeRatio: rule.timeRatio,
      thinMargin: settings.thinMargin,
      halfCycle: settings.halfCycle,
      horizon: settings.horizon,
    };
    const upPhase = bandOf(upstream.characteristic);
    const up = scaleBand(upPhase, upBus.voltage / downBus.voltage);
    const down = bandOf(downstream.characteristic);
    const name = `${label} ${upstream.id}/${downstream.id}`;
    cases.push({ name: `${name} three-phase`, up, down, options: { ...base, toAmps: fault.threePhase } });
    const between = transformersBetween(network, upBus.id, downBus.id);
    if (between.some((t) => t.connection === 'delta-wye')) {
      const options = { ...base, toAmps: fault.lineToLine };
      cases.push({ name: `${name} line-to-line`, up: scaleBand(up, Math.sqrt(3) / 2), down, options });
    }
    const upGround = groundFaultBandOf(upstream.characteristic);
    if (upGround && between.length === 0 && fault.lineToGround > 0) {
      const downGround = groundFaultBandOf(downstream.characteristic);
      cases.push({
        name: `${name} ground-fault`,
        up: fastestOf([upPhase, upGround]),
        down: downGround ? fastestOf([down, downGround]) : down,
        options: { ...base, toAmps: fault.lineToGround },
      });
    }
  }
  return cases;
}

/** The demo studies' cases and one of each distinct case of a generated study (short-time I²t, fuses). */
function p3Cases(): PairCase[] {
  const demo = ['selective', 'overlap', 'fused', 'full'].flatMap((name) =>
    casesOf(parseStudy(readFileSync(`${ROOT}demo/harrowmere-${name}.json`, 'utf8')), name),
  );
  const generated = casesOf(parseStudy(radialStudy(120)), 'generated');
  const seen = new Set<string>();
  const distinct = generated.filter((c) => {
    const key = `${c.name.split(' ').at(-1)} ${c.options.toAmps.toPrecision(3)} ${[...c.up.breakpoints].map((a) => a.toPrecision(4))} ${[...c.down.breakpoints].map((a) => a.toPrecision(4))}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
  return [...demo, ...distinct];
}

/** The class the finder gives one current, re-stated independently from DEVELOPERS.md, bands and overlaps for the references. */
function classAt(c: PairCase, amps: number): number {
  const { margin, timeRatio, thinMargin, horizon } = c.options;
  const never = (t: number) => (t > horizon ? Infinity : t);
  const u = never(c.up.minTime(amps));
  if (u === Infinity) return 0;
  const d = never(c.down.maxTime(amps));
  const limiting = amps >= Math.min(c.up.currentLimitingFrom, c.down.currentLimitingFrom) && u < 0.1;
  const bothInstantaneous = u <= HALF_CYCLE_SECONDS && d <= 0.1 && c.down.minTime(amps) <= HALF_CYCLE_SECONDS;
  if (bothInstantaneous || limiting) return 3;
  const slack = u * timeRatio - (d + margin);
  return !(slack >= 0) ? 2 : slack < thinMargin ? 1 : 0;
}

/** Every edge a grid of `perDecade` log-spaced samples sees: the geometric midpoint of each pair of samples whose class differs. */
function gridEdges(c: PairCase, perDecade: number): number[] {
  const from = Math.min(c.up.minAmps, c.down.minAmps);
  const to = c.options.toAmps;
  if (!(to > from)) return [];
  const steps = Math.ceil(perDecade * Math.log10(to / from));
  const ratio = Math.pow(to / from, 1 / steps);
  const edges: number[] = [];
  let amps = from;
  let previous = classAt(c, amps);
  for (let i = 1; i <= steps; i++) {
    const next = i === steps ? to : amps * ratio;
    const now = classAt(c, next);
    if (now !== previous) edges.push(Math.sqrt(amps * next));
    previous = now;
    amps = next;
  }
  return edges;
}

/** The worst relative distance from each reference edge to the nearest edge found. */
function worstError(reference: number[], found: number[]): number {
  let worst = 0;
  for (const edge of reference) {
    let nearest = Infinity;
    for (const e of found) if (Math.abs(e - edge) < Math.abs(nearest - edge)) nearest = e;
    worst = Math.max(worst, Math.abs(nearest - edge) / edge);
  }
  return worst;
}

const DENSE = 1e5;
/** Candidate densities for the reference "just fine enough for 0.1 %", coarsest first. */
const DENSITIES = [250, 500, 750, 1000, 1500, 2000, 3000, 5000, 10_000];

let p3: { error: Measured; speedFine: Measured; speedDense: Measured } | undefined;
function measureP3() {
  if (p3) return p3;
  const cases = p3Cases();
  const dense = cases.map((c) => gridEdges(c, DENSE));
  const found = cases.map((c) =>
    findOverlaps(c.up, c.down, c.options)
      .slice(1)
      .map((interval) => interval.fromAmps),
  );
  const errors = cases.map((_, i) => worstError(dense[i], found[i]));
  // The coarsest density whose edges all lie within 0.1 % of the dense grid's, in every case.
  const fine =
    DENSITIES.find((perDecade) =>
      cases.every((c, i) => {
        const edges = gridEdges(c, perDecade);
        return edges.length === dense[i].length && worstError(dense[i], edges) < 1e-3;
      }),
    ) ?? DENSE;
  // Timed in rounds: the finder over every case, the fine grid, the dense grid once per few rounds.
  const finderMs: number[] = [];
  const fineMs: number[] = [];
  const denseMs: number[] = [];
  for (let round = 0; round < 9; round++) {
    let start = performance.now();
    for (let k = 0; k < 20; k++) for (const c of cases) findOverlaps(c.up, c.down, c.options);
    finderMs.push((performance.now() - start) / 20);
    start = performance.now();
    for (const c of cases) gridEdges(c, fine);
    fineMs.push(performance.now() - start);
    if (round % 3 === 0) {
      start = performance.now();
      for (const c of cases) gridEdges(c, DENSE);
      denseMs.push(performance.now() - start);
    }
  }
  const finder = spreadOf(finderMs).median;
  const speedFine = fineMs.map((ms, i) => ms / finderMs[i]);
  const speedDense = denseMs.map((ms, i) => ms / finderMs[3 * i]);
  const edges = dense.reduce((n, e) => n + e.length, 0);
  p3 = {
    error: {
      value: Math.max(...errors) * 100,
      spread: spreadOf(errors.map((e) => e * 100)),
      detail: `${edges} edges in ${cases.length} cases (demo pairs; generated trip-unit with short-time I²t, fuse 75 % rule, line-to-line and ground-fault cases) vs ${DENSE.toExponential(0)} points per decade; spread over cases`,
    },
    speedFine: {
      value: spreadOf(fineMs).median / finder,
      spread: spreadOf(speedFine),
      detail: `reference grid of ${fine} points per decade, the coarsest within 0.1 % of the dense one in every case; finder ${(1000 * finder).toFixed(0)} µs for all cases`,
    },
    speedDense: { value: spreadOf(denseMs).median / finder, spread: spreadOf(speedDense) },
  };
  return p3;
}

export const benchmarks: Benchmark[] = [
  {
    id: 'P2',
    what: 'whole analysis from text (parse, faults, bands, every check, findings), generated demo mix, 2,000 devices',
    unit: 'ms',
    target: 120,
    async run() {
      return measureP2().small;
    },
  },
  {
    id: 'P2',
    what: 'the same at 8,000 devices, as a multiple of the 2,000-device time (interleaved A B A B)',
    unit: '×',
    target: 4.4,
    async run() {
      return measureP2().ratio;
    },
  },
  {
    id: 'P2e',
    what: 'band evaluations per pair check, as a multiple of what the check needs',
    unit: '×',
    target: 2,
    inclusive: true,
    async run() {
      return measureP2e();
    },
  },
  {
    id: 'P3',
    what: 'overlap-interval edges, worst relative error in current against the dense reference',
    unit: '%',
    target: 0.1,
    async run() {
      return measureP3().error;
    },
  },
  {
    id: 'P3',
    what: 'overlap finder speed-up over a reference grid just fine enough for 0.1 %',
    unit: '×',
    target: 20,
    higherIsBetter: true,
    async run() {
      return measureP3().speedFine;
    },
  },
  {
    id: 'P3',
    what: `overlap finder speed-up over the dense reference (${DENSE.toExponential(0)} points per decade)`,
    unit: '×',
    target: 20,
    higherIsBetter: true,
    async run() {
      return measureP3().speedDense;
    },
  },
];
