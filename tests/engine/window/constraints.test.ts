import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { constraintsOf, trialOf } from '../../../src/engine/window/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { panelStudy, tripUnit } from '../checks/panelFixtures.ts';
import { standbyChainStudy, standbySource } from '../generator/fixtures.ts';

/**
 * A 480 V switchboard with 30 kA available at X/R 10 and a moulded-case feeder breaker on it with the
 * interrupting rating given. Invented data.
 */
function feederStudy(interruptingRating: string): StudyInput {
  return {
    discern: 1,
    name: 'feeder on a 30 kA switchboard',
    source: { kind: 'utility', id: 'U', bus: 'SWBD', max: { available: '30 kA', xr: 10 } },
    buses: [
      { id: 'SWBD', voltage: 480 },
      { id: 'PNL', voltage: 480 },
    ],
    cables: [{ id: 'C1', from: 'SWBD', to: 'PNL', size: '500 kcmil', length: '50 ft' }],
    devices: [
      {
        id: 'FDR',
        feeds: 'C1',
        interruptingRating,
        characteristic: { kind: 'trip-unit', sensor: 400, longTime: { pickup: 1, delay: 4 } },
      },
    ],
  };
}

// UL 489 test power factor 20 % above 20 kA (from memory): (X/R)test = tan(acos(0.2)) = 4.898979. Peak ratio at X/R 10
// (IEEE 1015-2006): MF = (1 + e^(−π/10)) / (1 + e^(−π/4.898979)) = 1.133 39, duty 1.133 39 × 30 kA = 34.0 kA (computed).
const FACTOR = (1 + Math.exp(-Math.PI / 10)) / (1 + Math.exp(-Math.PI / Math.tan(Math.acos(0.2))));

const interrupting = (study: StudyInput) => {
  const trial = trialOf(parseStudy(study));
  const constraint = constraintsOf(trial, 'FDR').find((c) => c.id === 'interrupting')!;
  return { constraint, result: constraint.evaluate(trial) };
};
const check = (study: StudyInput) =>
  analyseStudy(parseStudy(study)).findings.find((f) => f.id === 'interrupting-duty:FDR')!;

describe('constraintsOf: interrupting duty', () => {
  it('has the expected defaults: the X/R multiplying factor of the rating basis, reported not set', () => {
    const { constraint } = interrupting(feederStudy('35 kA'));
    expect(constraint.favours).toBe('fixed');
    expect(constraint.label).toBe('interrupt 34 kA, the largest fault where it sits corrected for X/R');
    expect(constraint.source).toMatch(/^NFPA 70 110\.9; moulded-case breaker, UL 489 test circuit power factor 20 %/);
  });

  it('fails a 32 kA breaker on 30 kA symmetrical at X/R 10, as the NFPA 70 110.9 check does', () => {
    // 32 kA is above the 30 kA symmetrical current but below the 34.0 kA duty.
    const { result } = interrupting(feederStudy('32 kA'));
    expect(result.ok).toBe(false);
    assertInDelta(result.margin, 32_000 - FACTOR * 30_000, 1e-6);
    expect(result.text).toBe('rated 32 kA, duty 34 kA');
    expect(check(feederStudy('32 kA')).severity).toBe('fail');
  });

  it('passes a 35 kA breaker there, as the check does', () => {
    const { result } = interrupting(feederStudy('35 kA'));
    expect(result.ok).toBe(true);
    assertInDelta(result.margin, 35_000 - FACTOR * 30_000, 1e-6);
    expect(check(feederStudy('35 kA')).severity).toBe('ok');
  });

  it('reports an infinite source as unbounded, not met and not failed, as the check warns', () => {
    const study = { ...feederStudy('35 kA'), source: { kind: 'infinite', id: 'U', bus: 'SWBD' } } as StudyInput;
    const { result } = interrupting(study);
    expect(result).toMatchObject({ ok: true, clean: false, text: 'rated 35 kA; the fault here is unbounded' });
    expect(check(study).severity).toBe('warning');
  });

  it('reads the symmetrical fault for a device without an interrupting rating', () => {
    const study = feederStudy('35 kA');
    delete study.devices![0].interruptingRating;
    const { constraint, result } = interrupting(study);
    expect(constraint.label).toBe('interrupt 30 kA, the largest symmetrical fault where it sits');
    expect(result).toMatchObject({ ok: true, text: 'no interrupting rating given' });
  });
});

/**
 * An invented 500 kVA, 480 V standby generator (X″d 0.12, X′d 0.2, Xd 2.0 pu, excitation support 3 × rated)
 * whose breaker GEN-CB (800 A sensor, long-time 0.75 × = 600 A, about rated current, delay 1 s at 6 ×;
 * short-time 2 × at 0.2 s) feeds a panel whose 100 A feeder FDR has an instantaneous trip at 10 ×.
 * `genInstantaneous` adds an instantaneous trip to GEN-CB (× sensor). Invented settings.
 */
function generatorTree(genInstantaneous?: number, shortTimePickup = 2): StudyInput {
  return standbyChainStudy(
    'standby generator, breaker and feeder',
    { c1: { size: '500 kcmil', length: '50 ft' }, c2: { size: '1/0', length: '100 ft' } },
    {
      id: 'GEN-CB',
      characteristic: {
        kind: 'trip-unit',
        sensor: 800,
        longTime: { pickup: 0.75, delay: 1 },
        shortTime: { pickup: shortTimePickup, delay: 0.2 },
        ...(genInstantaneous ? { instantaneous: { pickup: genInstantaneous } } : {}),
      },
    },
    {
      id: 'FDR',
      characteristic: {
        kind: 'trip-unit',
        sensor: 100,
        longTime: { pickup: 1, delay: 4 },
        instantaneous: { pickup: 10 },
      },
    },
  );
}

describe('constraintsOf: a generator-fed tree', () => {
  const constraintOf = (input: StudyInput, deviceId: string, id: string) => {
    const trial = trialOf(parseStudy(input));
    const constraint = constraintsOf(trial, deviceId).find((c) => c.id === id);
    return { constraint, result: constraint?.evaluate(trial) };
  };
  const severityOf = (input: StudyInput, id: string) =>
    analyseStudy(parseStudy(input)).findings.find((f) => f.id === id)?.severity;

  it('holds each pair to the decrement check too: slower for the device above, faster for the one below', () => {
    const above = constraintOf(generatorTree(), 'GEN-CB', 'decrement-below:FDR').constraint!;
    expect([above.kind, above.favours, above.subjects]).toEqual(['coordinate-below', 'slower', ['FDR']]);
    expect(above.source).toMatch(/IEEE Std 551.*IEEE C37\.112/);
    const below = constraintOf(generatorTree(), 'FDR', 'decrement-above:GEN-CB').constraint!;
    expect([below.kind, below.favours, below.subjects]).toEqual(['coordinate-above', 'faster', ['GEN-CB']]);
  });

  it('an instantaneous trip at 3 × 800 A on GEN-CB operates within half a cycle on the 4.8 kA falling current, before FDR clears (0.05 s): fails as the check does', () => {
    const { result } = constraintOf(generatorTree(3), 'GEN-CB', 'decrement-below:FDR');
    expect(severityOf(generatorTree(3), 'decrement:GEN-CB/FDR')).toBe('fail');
    expect(result!.ok).toBe(false);
    expect(result!.margin).toBeLessThan(0);
  });

  it('with short-time delay 0.2 s alone GEN-CB waits for FDR on the decaying current: holds as the check does', () => {
    const { result } = constraintOf(generatorTree(), 'GEN-CB', 'decrement-below:FDR');
    expect(severityOf(generatorTree(), 'decrement:GEN-CB/FDR')).toBe('ok');
    expect(result!.ok).toBe(true);
    expect(result!.margin).toBeGreaterThan(0);
  });

  it('leaves a pair on a single-phase bus unlimited on the decaying current, which is not worked out there', () => {
    // A 100 kVA single-phase 480–240 V unit on the generator, LOW on its primary over BR on its secondary.
    const { result } = constraintOf(SINGLE_PHASE_ON_GENERATOR, 'BR', 'decrement-above:LOW');
    expect(severityOf(SINGLE_PHASE_ON_GENERATOR, 'decrement:LOW/BR')).toBe('info');
    expect([result!.ok, result!.margin]).toEqual([true, Infinity]);
    expect(result!.text).toMatch(/^Lighting panel is a single-phase bus/);
  });

  it('holds the generator breaker below the armature damage curve (NFPA 70 445.12(A)), favouring faster, as the check does', () => {
    const ok = constraintOf(generatorTree(), 'GEN-CB', 'withstand:G1');
    expect([ok.constraint!.kind, ok.constraint!.favours]).toEqual(['generator-withstand', 'faster']);
    expect(severityOf(generatorTree(), 'generator-withstand:G1:GEN-CB')).toBe('ok');
    expect([ok.result!.ok, ok.result!.clean]).toEqual([true, true]);
    // Short-time pickup 6 × 600 A: the long-time band alone up to 3.6 kA, past the armature's 37.5 / (I² − 1).
    // The check warns (the machine's inherent protection may cover it, NFPA 70 445.12(A)): allowed, not clean.
    const slow = constraintOf(generatorTree(undefined, 6), 'GEN-CB', 'withstand:G1');
    expect(severityOf(generatorTree(undefined, 6), 'generator-withstand:G1:GEN-CB:0')).toBe('warning');
    expect([slow.result!.ok, slow.result!.clean]).toEqual([true, false]);
    expect(slow.result!.margin).toBeLessThan(0);
  });

  it('gives neither to a device not nearest the generator, nor on a utility-fed tree', () => {
    expect(constraintOf(generatorTree(), 'FDR', 'withstand:G1').constraint).toBeUndefined();
    const utility = {
      ...generatorTree(),
      source: { kind: 'utility', id: 'U', bus: 'GEN', max: { available: '20 kA' } },
    };
    const ids = constraintsOf(trialOf(parseStudy(utility as StudyInput)), 'GEN-CB').map((c) => c.id);
    expect(ids.filter((id) => id.startsWith('decrement') || id === 'withstand:G1')).toEqual([]);
  });
});

describe('a fuse above a relay', () => {
  it('labels the coordination constraint with both the margin and the fuse ratio (preloading, common practice)', () => {
    // A 200 A fuse (invented points) feeding a cable whose relay (CT 100:5, definite time) is below it.
    const study = feederStudy('65 kA');
    study.buses = [...study.buses!, { id: 'LOAD', voltage: 480 }];
    study.cables = [...study.cables!, { id: 'C2', from: 'PNL', to: 'LOAD', size: '2 AWG', length: '50 ft' }];
    study.devices = [
      {
        id: 'F',
        feeds: 'C1',
        characteristic: {
          kind: 'fuse',
          minimumMelting: [
            [400, 300],
            [2000, 1],
            [10000, 0.01],
          ],
          totalClearing: [
            [400, 400],
            [2000, 1.5],
            [10000, 0.02],
          ],
        },
      },
      {
        id: 'R',
        feeds: 'C2',
        characteristic: {
          kind: 'relay',
          ct: '100:5',
          timeOvercurrent: { curve: 'definite-time', pickup: 5, delay: 0.3 },
        },
      },
    ];
    const constraint = constraintsOf(trialOf(parseStudy(study)), 'R').find((c) => c.id === 'above:F')!;
    expect(constraint.label).toMatch(/\(0\.1 s margin, 75 % time ratio\)/);
  });
});

/** A generator feeding a single-phase lighting panel through a 100 kVA 480–240 V unit (invented). */
const SINGLE_PHASE_ON_GENERATOR: StudyInput = {
  discern: 1,
  name: 'single-phase panel on a generator',
  source: standbySource(),
  buses: [
    { id: 'GEN', voltage: 480 },
    { id: 'PNL', voltage: 480 },
    { id: 'S', name: 'Lighting panel', voltage: 240 },
    { id: 'S2', voltage: 240 },
  ],
  cables: [
    { id: 'C1', from: 'GEN', to: 'PNL', size: '4/0', length: '50 ft' },
    { id: 'C2', from: 'S', to: 'S2', size: '1/0 AWG', length: '30 ft' },
  ],
  transformers: [
    { id: 'T', from: 'PNL', to: 'S', rating: '100 kVA', primary: 480, secondary: 240, impedance: '3 %', phases: 1 },
  ],
  devices: [
    {
      id: 'LOW',
      feeds: 'T',
      characteristic: {
        kind: 'trip-unit',
        sensor: 400,
        longTime: { pickup: 1, delay: 4 },
        shortTime: { pickup: 4, delay: 0.3 },
      },
    },
    {
      id: 'BR',
      feeds: 'C2',
      characteristic: {
        kind: 'trip-unit',
        sensor: 200,
        longTime: { pickup: 1, delay: 4 },
        instantaneous: { pickup: 8 },
      },
    },
  ],
};

/**
 * A feeder F (instantaneous 10 × 400 A) supplies, by cable, panel P alone; its main PM, marked emergency,
 * feeds branch breaker BR, marked `below` (emergency, or an elevator circuit). Invented settings.
 */
function seriesStudy(below: 'emergency' | 'elevator'): StudyInput {
  return panelStudy('a feeder over the one main it supplies', {
    F: { characteristic: tripUnit(400, { instantaneous: { pickup: 10 } }) },
    PM: { system: 'emergency', characteristic: tripUnit(400, { shortTime: { pickup: 4, delay: 0.3 } }) },
    BR: { system: below, characteristic: tripUnit(100, { instantaneous: { pickup: 10 } }) },
  });
}

describe('constraintsOf: code selectivity over the devices below a pair', () => {
  const labelOf = (input: StudyInput) => {
    const trial = trialOf(parseStudy(input));
    return constraintsOf(trial, 'F').find((c) => c.id === 'below:PM')!.label;
  };

  it('leaves the Exception’s pair (a feeder over the one main it supplies) to plain coordination, as the check does (NFPA 70 700.32)', () => {
    expect(labelOf(seriesStudy('emergency'))).not.toMatch(/must be shown selective/);
  });

  it('asks it to be shown selective for an elevator circuit below it (NFPA 70 620.62 has no such Exception)', () => {
    expect(labelOf(seriesStudy('elevator'))).toMatch(/must be shown selective, NFPA 70 700\.32, 620\.62/);
  });
});

describe('constraintsOf: the load side of an emergency device (NFPA 70 (2023) 700.32(A))', () => {
  it('asks a pair below an emergency device to be shown selective in the 2023 edition, not before', () => {
    const input = seriesStudy('emergency');
    // PM alone marked: BR on its load side.
    input.devices![2] = { ...input.devices![2], system: undefined };
    const labelOf = (edition: '2020' | '2023') => {
      const trial = trialOf(parseStudy({ ...input, coordination: { edition } }));
      return constraintsOf(trial, 'PM').find((c) => c.id === 'below:BR')!.label;
    };
    expect(labelOf('2023')).toMatch(/must be shown selective, NFPA 70 700\.32/);
    expect(labelOf('2020')).not.toMatch(/must be shown selective/);
  });
});
