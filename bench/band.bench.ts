// P1 (DESIGN §7): evaluate one band at 1,000 currents with evaluateBand, one benchmark per device family.
import { bandOf, evaluateBand, type Band } from '../src/engine/band.ts';
import { characteristicSchema } from '../src/engine/devices/characteristic.ts';
import { curveTemplateById } from '../src/engine/templates/index.ts';
import { medianMs, type Benchmark } from './benchmark.ts';

const CURRENTS = 1000;
const REPEATS = 2000;

/** 1,000 log-spaced currents from 10 A to 1 MA: every region of every band, including "no operation". */
const amps = Float64Array.from({ length: CURRENTS }, (_, i) => 10 * 10 ** ((5 * i) / (CURRENTS - 1)));
const minTimes = new Float64Array(CURRENTS);
const maxTimes = new Float64Array(CURRENTS);

function bandOfTemplate(id: string): Band {
  const template = curveTemplateById(id);
  if (!template) throw new Error(`no template ${id}`);
  return bandOf(template.characteristic);
}

const bands: Array<[string, Band]> = [
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

export const benchmarks: Benchmark[] = bands.map(([what, band]) => ({
  id: 'P1',
  what: `evaluate one band at 1,000 currents: ${what}`,
  unit: 'µs',
  target: 50,
  async run() {
    const ms = medianMs(() => evaluateBand(band, amps, minTimes, maxTimes), REPEATS, 200);
    return { value: ms * 1000, detail: `median of ${REPEATS}` };
  },
}));
