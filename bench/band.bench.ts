// P1 (DEVELOPERS.md, benchmarks): evaluate one band at 1,000 currents spread over its curve region — from the
// band's lowest operating current to ten times it, where the formulas run — one row per family.
// The families are timed in rounds, each round in a new random order, so no family's call site is
// warmed for it alone; the figure is the median round, the spread that of all rounds. Beside each
// family whose formula needs a logarithm and exponentials per current, the same functions in a plain
// loop over the same currents are timed in the same rounds: the floor of its arithmetic on this
// machine at this hour, against which its figure can be read when the machine runs slowly.
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

/**
 * A plain loop over the currents with the functions a family's formula calls per current, writing
 * both edges: what the arithmetic costs without any of the band's logic.
 */
interface ArithmeticFloor {
  what: string;
  loop(amps: Float64Array, minTimes: Float64Array, maxTimes: Float64Array): void;
}

/**
 * One logarithm and one `expm1` per current (`M^p − 1` of a small exponent), then both edges' formula:
 * the MI row's relay (IEEE C37.112 MI: a = 0.0515 s, b = 0.114 s, p = 0.02) from its lower pickup edge,
 * 570 A (600 A − 5 %), time dial 3 ∓ 5 %, the upper edge's power taken from the lower one's.
 */
const logAndExpm1: ArithmeticFloor = {
  what: 'Math.log and Math.expm1',
  loop(amps, minTimes, maxTimes) {
    for (let i = 0; i < amps.length; i++) {
      const q = Math.expm1(0.02 * Math.log(amps[i] * (1 / 570)));
      minTimes[i] = 2.85 * (0.0515 / q + 0.114);
      maxTimes[i] = 3.15 * (0.0515 / (q * 0.999 - 0.001) + 0.114);
    }
  },
};

/** One logarithm and an exponential per edge per current: log-log interpolation of two tables. */
const logAndTwoExp: ArithmeticFloor = {
  what: 'Math.log and two Math.exp',
  loop(amps, minTimes, maxTimes) {
    for (let i = 0; i < amps.length; i++) {
      const x = Math.log(amps[i]);
      minTimes[i] = Math.exp(14.2 - 2.1 * x);
      maxTimes[i] = Math.exp(14.9 - 2.2 * x);
    }
  },
};

const families: Array<[string, Band, ArithmeticFloor?]> = [
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
    logAndExpm1,
  ],
  ['trip unit, LSIG 2000 A', bandOfTemplate('trip-unit-lsig-2000')],
  ['thermal-magnetic, illustrative 225 A', bandOfTemplate('thermal-magnetic-illustrative-225'), logAndTwoExp],
  ['fuse, illustrative time-delay 200 A', bandOfTemplate('fuse-illustrative-time-delay-200'), logAndTwoExp],
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
  const perFloor: number[][] = families.map(() => []);
  // Each family's band and, where it has one, its arithmetic floor, shuffled together.
  const order = families.flatMap(([, , floor], i) => (floor ? [i, -1 - i] : [i]));
  let seed = 12345;
  const random = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  for (let round = -3; round < ROUNDS; round++) {
    for (let i = order.length - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1));
      [order[i], order[j]] = [order[j], order[i]];
    }
    for (const entry of order) {
      const f = entry < 0 ? -1 - entry : entry;
      const [, band, floor] = families[f];
      const amps = inputs[f];
      const start = performance.now();
      if (entry < 0) for (let k = 0; k < CALLS_PER_ROUND; k++) floor!.loop(amps, minTimes, maxTimes);
      else for (let k = 0; k < CALLS_PER_ROUND; k++) evaluateBand(band, amps, minTimes, maxTimes);
      const perCall = ((performance.now() - start) * 1000) / CALLS_PER_ROUND;
      if (round >= 0) (entry < 0 ? perFloor : perFamily)[f].push(perCall);
    }
  }
  results = perFamily.map((times, f) => {
    const floor = families[f][2];
    const beside = floor
      ? `; ${floor.what} per current in a plain loop over the same currents: ${medianOf(perFloor[f]).value.toPrecision(3)} µs`
      : '';
    return medianOf(times, `${ROUNDS} rounds of ${CALLS_PER_ROUND} calls, families in random order${beside}`);
  });
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
