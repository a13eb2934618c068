// P1 (DEVELOPERS.md, benchmarks): evaluate one band at 1,000 currents spread over its curve region — from the
// band's lowest operating current to ten times it, where the formulas run — one row per family.
// The families are timed in rounds, each round in a new random order, so no family's call site is
// warmed for it alone; the figure is the median round, the spread that of all rounds.
import { bandOf, evaluateBand, type Band } from '../src/engine/band.ts';
import { characteristicSchema } from '../src/engine/devices/characteristic.ts';
import { curveTemplateById } from '../src/engine/templates/index.ts';
import { medianOf, type Benchmark, type Measured } from './benchmark.ts';

const CURRENTS = 1000;
const ROUNDS = 41;
const CALLS_PER_ROUND = 200;

function bandOfTemplate(id: string): Band {
  const template = curveTemplateById(id);
  if (!template) throw new Error(`no template ${id}`);
  return bandOf(template.characteristic);
}

const families: Array<[string, Band]> = [
  ['relay, IEEE VI with instantaneous', bandOfTemplate('relay-ieee-very-inverse')],
  [
    'relay, IEEE MI with tolerance and instantaneous',
    bandOf(
      characteristicSchema.parse({
        kind: 'relay',
        ct: '600:5',
        timeOvercurrent: { curve: 'ieee-moderately-inverse', pickup: 5, timeDial: 3 },
        instantaneous: { pickup: 50 },
        tolerance: { pickup: 5, time: 5 },
      }),
    ),
  ],
  ['trip unit, LSIG 2000 A', bandOfTemplate('trip-unit-lsig-2000')],
  ['thermal-magnetic, illustrative 225 A', bandOfTemplate('thermal-magnetic-illustrative-225')],
  ['fuse, illustrative time-delay 200 A', bandOfTemplate('fuse-illustrative-time-delay-200')],
];

/** 1,000 log-spaced currents from the band's lowest operating current to ten times it. */
const currentsOf = (band: Band) =>
  Float64Array.from({ length: CURRENTS }, (_, i) => band.minAmps * 10 ** (i / (CURRENTS - 1)));
const inputs = families.map(([, band]) => currentsOf(band));
const minTimes = new Float64Array(CURRENTS);
const maxTimes = new Float64Array(CURRENTS);

let results: Measured[] | undefined;
/** Every family's per-call times (µs), all families timed in each round in a shuffled order. */
function measure(): Measured[] {
  if (results) return results;
  const perFamily: number[][] = families.map(() => []);
  const order = families.map((_, i) => i);
  let seed = 12345;
  const random = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  for (let round = -3; round < ROUNDS; round++) {
    for (let i = order.length - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1));
      [order[i], order[j]] = [order[j], order[i]];
    }
    for (const f of order) {
      const band = families[f][1];
      const amps = inputs[f];
      const start = performance.now();
      for (let k = 0; k < CALLS_PER_ROUND; k++) evaluateBand(band, amps, minTimes, maxTimes);
      const perCall = ((performance.now() - start) * 1000) / CALLS_PER_ROUND;
      if (round >= 0) perFamily[f].push(perCall);
    }
  }
  results = perFamily.map((times) =>
    medianOf(times, `${ROUNDS} rounds of ${CALLS_PER_ROUND} calls, families in random order`),
  );
  return results;
}

export const benchmarks: Benchmark[] = families.map(([what], f) => ({
  id: 'P1',
  what: `one band at 1,000 currents from pickup to 10 × pickup: ${what}`,
  unit: 'µs',
  target: 20,
  async run() {
    return measure()[f];
  },
}));
