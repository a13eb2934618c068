import type { GeneratorRating } from '../../../src/engine/generator/index.ts';
import type { StudyInput } from '../../../src/engine/study/index.ts';

/**
 * An invented 500 kVA, 480 V standby generator with typical small-machine data (X″d 0.12, X′d 0.2, Xd 2.0 pu;
 * T″d 0.015 s, T′d 0.4 s). Rated current 500 000 / (√3 × 480) = 601.4065 A.
 */
export function generatorOf(overrides: Partial<GeneratorRating> = {}): GeneratorRating {
  return {
    id: 'G1',
    rating: 500e3,
    voltage: 480,
    powerFactor: 0.8,
    xdSubtransient: 0.12,
    xdTransient: 0.2,
    xd: 2.0,
    tdSubtransient: 0.015,
    tdTransient: 0.4,
    ...overrides,
  };
}

/** Rated current of `generatorOf()` (A), I_r = S / (√3 · V). */
export const RATED_AMPS = 500e3 / (Math.sqrt(3) * 480);

/**
 * The decrement's exponential form written out by hand (IEEE Std 551; standard machine theory), in per unit,
 * for the checks to compare against: E·[(1/X″ − 1/X′)e^(−t/T″) + (1/X′ − 1/X)e^(−t/T′) + 1/X].
 */
export function decrementByHand(t: number, x2 = 0.12, x1 = 0.2, x = 2.0, t2 = 0.015, t1 = 0.4, e = 1): number {
  return e * ((1 / x2 - 1 / x1) * Math.exp(-t / t2) + (1 / x1 - 1 / x) * Math.exp(-t / t1) + 1 / x);
}

/**
 * The same machine as a study's source "Standby generator" on bus GEN, with excitation support holding
 * 3 × rated current (a fresh object each call, for a test to change).
 */
export function standbySource(): Extract<StudyInput['source'], { kind: 'generator' }> {
  return {
    kind: 'generator',
    id: 'G1',
    name: 'Standby generator',
    bus: 'GEN',
    rating: '500 kVA',
    voltage: 480,
    xdSubtransient: 0.12,
    xdTransient: 0.2,
    xd: 2,
    tdSubtransient: 0.015,
    tdTransient: 0.4,
    sustained: 3,
  };
}

type Characteristic = NonNullable<StudyInput['devices']>[number]['characteristic'];

/**
 * The standby generator (`standbySource`, its excitation support held at `sustained` × rated) on bus GEN,
 * with device UP there and device DOWN feeding 20 ft of 500 kcmil to bus PNL: the shape of the
 * decaying-current checks' studies (a fresh object each call). Invented.
 */
export function generatorPairStudy(
  up: Characteristic,
  down: Characteristic,
  {
    sustained = 3,
    system,
    coordination,
  }: { sustained?: number; system?: 'emergency'; coordination?: StudyInput['coordination'] } = {},
): StudyInput {
  return {
    discern: 1,
    name: 'a pair on a standby generator',
    ...(coordination ? { coordination } : {}),
    source: { ...standbySource(), sustained },
    buses: [
      { id: 'GEN', voltage: 480 },
      { id: 'PNL', voltage: 480 },
    ],
    cables: [{ id: 'C1', from: 'GEN', to: 'PNL', size: '500 kcmil', length: '20 ft' }],
    devices: [
      { id: 'UP', feeds: 'GEN', characteristic: up },
      { id: 'DOWN', feeds: 'C1', characteristic: down, ...(system ? { system } : {}) },
    ],
  };
}

/**
 * The standby generator (`standbySource`) on bus GEN, cable C1 to panel PNL and cable C2 from PNL to
 * LOAD: device `feeder` feeds C1 and `branch` feeds C2, so a fault at PNL is the pair's (a fresh object
 * each call). Invented.
 */
export function standbyChainStudy(
  name: string,
  cables: { c1: { size: string; length: string }; c2: { size: string; length: string } },
  feeder: { id: string; characteristic: Characteristic },
  branch: { id: string; characteristic: Characteristic },
): StudyInput {
  return {
    discern: 1,
    name,
    source: standbySource(),
    buses: [
      { id: 'GEN', voltage: 480 },
      { id: 'PNL', voltage: 480 },
      { id: 'LOAD', voltage: 480 },
    ],
    cables: [
      { id: 'C1', from: 'GEN', to: 'PNL', ...cables.c1 },
      { id: 'C2', from: 'PNL', to: 'LOAD', ...cables.c2 },
    ],
    devices: [
      { ...feeder, feeds: 'C1' },
      { ...branch, feeds: 'C2' },
    ],
  };
}
