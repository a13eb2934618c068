import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseScenarios } from '../../../src/engine/scenario/index.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { generatorPairStudy, standbySource } from '../generator/fixtures.ts';
import { panelStudy } from './panelFixtures.ts';

const tripUnit = (sensor: number, shortOrInstantaneous: Record<string, unknown>) => ({
  kind: 'trip-unit' as const,
  sensor,
  longTime: { pickup: 1, delay: 10 },
  ...shortOrInstantaneous,
});

/**
 * A 480 V service: breaker A (instantaneous at 4 × 2000 A) feeds breaker B (short-time 0.5 s), which feeds
 * a 1000 kVA 480–4160 V unit; relay C at 4160 V, on the emergency system, feeds a cable. A over B
 * overlaps from 7.2 kA (A's instantaneous less 10 %). Invented settings.
 */
function stepUpStudy(codeSelectivity?: 'above-0.1-s'): StudyInput {
  return {
    discern: 1,
    name: 'step-up emergency feeder',
    ...(codeSelectivity ? { coordination: { codeSelectivity } } : {}),
    source: { kind: 'utility', id: 'U', bus: 'LV0', max: { available: '30 kA' } },
    buses: [
      { id: 'LV0', voltage: 480 },
      { id: 'LV', voltage: 480 },
      { id: 'MV', voltage: 4160 },
      { id: 'LOAD', voltage: 4160 },
    ],
    cables: [
      { id: 'C1', from: 'LV0', to: 'LV', size: '500 kcmil', length: 20 },
      { id: 'C2', from: 'MV', to: 'LOAD', size: '2 AWG', length: 100 },
    ],
    transformers: [
      { id: 'T', from: 'LV', to: 'MV', rating: '1000 kVA', primary: 480, secondary: 4160, impedance: '5.75 %' },
    ],
    devices: [
      { id: 'A', feeds: 'C1', characteristic: tripUnit(2000, { instantaneous: { pickup: 4 } }) },
      { id: 'B', feeds: 'T', characteristic: tripUnit(1600, { shortTime: { pickup: 4, delay: 0.5 } }) },
      {
        id: 'C',
        feeds: 'C2',
        system: 'emergency',
        characteristic: {
          kind: 'relay',
          ct: '100:5',
          timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 4, timeDial: 0.3 },
          instantaneous: { pickup: 60 },
        },
      },
    ],
  };
}

describe('NFPA 70 700.32 selective coordination', () => {
  it('names the pair that overlaps on the supply side of the marked device, up to the currents its zone drives', () => {
    const code = analyseScenarios(parseStudy(stepUpStudy())).findings.find((f) => f.kind === 'code-selectivity')!;
    expect(code.severity).toBe('fail');
    expect(code.explanation).toMatch(/Normal: A and B \(on the supply side of C\) overlap from 7200 A to /);
  });

  it('with "above-0.1-s", reads the marked device at its own voltage: C takes over 0.1 s at what 7.2 kA at 480 V is at 4160 V', () => {
    // 7200 A at 480 V is 831 A at 4160 V, where relay C (IEEE very inverse, 80 A, dial 0.3; IEEE C37.112)
    // takes 0.3 · (19.61 / (10.38² − 1) + 0.491) = 0.20 s before its breaker: a fault there lasts longer
    // than 0.1 s, so the overlap counts. Read as 7200 A on C's own base it would clear within 0.1 s.
    const code = analyseScenarios(parseStudy(stepUpStudy('above-0.1-s'))).findings.find(
      (f) => f.kind === 'code-selectivity',
    )!;
    expect(code.severity).toBe('fail');
  });

  describe('on a generator: the decaying current of a fault at the marked device', () => {
    // UP's invented melting and clearing curves (described below).
    const UP_FUSE: Parameters<typeof generatorPairStudy>[0] = {
      kind: 'fuse',
      illustrative: true,
      minimumMelting: [
        [600, 272],
        [1804, 29.92],
        [2640, 14.28],
        [3000, 0.5],
        [30_000, 0.48],
      ],
      totalClearing: [
        [600, 353.6],
        [1804, 38.08],
        [2640, 17.68],
        [3000, 0.65],
        [30_000, 0.6],
      ],
    };

    /**
     * The standby generator (X″d 0.12, X′d 0.2 pu, T′d 0.4 s, held at 3 × rated: 1804 A) on bus GEN feeds
     * fuse UP and, below it, breaker DOWN on the emergency system: long time 10 s at 6 × 400 A, short time
     * 6 × flat 0.3 s. UP's invented melting curve is a little above DOWN's long time up to DOWN's
     * short-time pickup (2640 A with its tolerance) and falls steeply to 0.5 s by 3000 A. At every constant
     * current UP's melting, taken at 75 % for preloading, is no earlier than DOWN's clearing (thin margins
     * only). On the decaying current UP melts part way while the current is above 2640 A, where DOWN's
     * short-time element resets unfinished (the current falls below it at about 0.146 s), and DOWN's long
     * time, integrated from zero, clears after 75 % of UP's melting. Invented curves.
     */
    const generatorStudy = (codeSelectivity?: 'above-0.1-s'): StudyInput =>
      generatorPairStudy(UP_FUSE, tripUnit(400, { shortTime: { pickup: 6, delay: 0.3 } }), {
        system: 'emergency',
        coordination: codeSelectivity ? { codeSelectivity } : undefined,
      });

    it('reads a load-side pair on the decaying current too, in the 2023 edition (NFPA 70 700.32(A))', () => {
      // The same pair with the fuse marked instead: the breaker is on its load side.
      const study = generatorPairStudy(UP_FUSE, tripUnit(400, { shortTime: { pickup: 6, delay: 0.3 } }), {
        coordination: { edition: '2023' },
      });
      study.devices![0] = { ...study.devices![0], system: 'emergency' };
      const code = analyseScenarios(parseStudy(study)).findings.find((f) => f.id === 'code-selectivity:UP')!;
      expect(code.severity).toBe('fail');
      expect(code.explanation).toMatch(
        /Not shown: Normal: on the load side of UP, on the generator's decaying current \(a fault at GEN /,
      );
    });

    it('fails a pair that no constant current shows overlapping, where the upstream fuse gains while the short time resets', () => {
      const { findings } = analyseScenarios(parseStudy(generatorStudy()));
      const pair = findings.filter((f) => f.kind === 'coordination');
      expect(pair.map((f) => f.status)).not.toContain('overlap');
      const code = findings.find((f) => f.kind === 'code-selectivity')!;
      expect(code.severity).toBe('fail');
      const said = code.explanation.match(
        /Not shown: Normal: on the generator's decaying current \(a fault at GEN \(480 V\), 5010 A falling to 1800 A\), DOWN clears by ([\d.]+) s \(on its long-time element\) and UP can operate from ([\d.]+) s: DOWN's clearing is ([\d.]+) % of UP's earliest operation, against at most 75 % required/,
      );
      expect(said).not.toBeNull();
      const [clears, opens, share] = said!.slice(1).map(Number);
      // DOWN clears on its long time, integrated from zero on a current falling to 1804 A: a little before its
      // 12 × (2400 / 1804)² = 21.24 s there (the sustained current), after 20 s. UP's melting, taken at 75 %,
      // comes earlier than that.
      expect(clears).toBeGreaterThan(20);
      expect(clears).toBeLessThan(21.24);
      expect(0.75 * opens).toBeLessThan(clears);
      expect(share).toBeGreaterThan(75);
      // The marked device clears after 21 s there, so "above-0.1-s" does not accept it either.
      const above = analyseScenarios(parseStudy(generatorStudy('above-0.1-s'))).findings;
      expect(above.find((f) => f.kind === 'code-selectivity')!.severity).toBe('fail');
    });
    it('with "above-0.1-s", accepts an overlap on the decaying current above a marked breaker whose instantaneous trip clears within 0.1 s', () => {
      // MAIN (800 A, instantaneous 5 ×) over FDR (400 A, 9 ×) over the emergency breaker DOWN (300 A, 10 ×:
      // 3300 A with its tolerance, clearing within 3 cycles). A fault at PNL starts near 4.9 kA: DOWN's
      // instantaneous trip outlasts its half-cycle opening time there, so DOWN clears within 0.05 s and the
      // MAIN–FDR overlap lasts no longer than 0.1 s, which the option accepts. Invented settings.
      const trip = (sensor: number, pickup: number) => tripUnit(sensor, { instantaneous: { pickup } });
      const study: StudyInput = {
        discern: 1,
        name: 'instantaneous trips on a standby generator',
        coordination: { codeSelectivity: 'above-0.1-s' },
        source: standbySource(),
        buses: [
          { id: 'GEN', voltage: 480 },
          { id: 'SWB', voltage: 480 },
          { id: 'PNL', voltage: 480 },
        ],
        cables: [
          { id: 'C0', from: 'GEN', to: 'SWB', size: '500 kcmil', length: '10 ft' },
          { id: 'C1', from: 'SWB', to: 'PNL', size: '500 kcmil', length: '10 ft' },
        ],
        devices: [
          { id: 'MAIN', feeds: 'C0', characteristic: trip(800, 5) },
          { id: 'FDR', feeds: 'C1', characteristic: trip(400, 9) },
          { id: 'DOWN', feeds: 'PNL', system: 'emergency', characteristic: trip(300, 10) },
        ],
      };
      const code = analyseScenarios(parseStudy(study)).findings.find((f) => f.kind === 'code-selectivity')!;
      expect(code.explanation).not.toMatch(/decaying current/);
      const decrement = analyseScenarios(parseStudy(study)).findings.find((f) => f.id === 'decrement:FDR/DOWN')!;
      assertInDelta(decrement.worst!.downTime, 3 / 60, 1e-9);
    });
  });
});

/**
 * A 480 V feeder F (400 A, short-time 4 × at 0.3 s) supplies, by cable C1, panel P, whose main PM is set
 * exactly as F; PM feeds branch breaker BR (100 A, instantaneous 10 ×), marked `system`. F and PM overlap
 * over their whole short-time band; PM over BR is selective. Invented settings.
 */
function panelMainStudy(system: 'emergency' | 'elevator'): StudyInput {
  const sameAsFeeder = tripUnit(400, { shortTime: { pickup: 4, delay: 0.3 } });
  return panelStudy('a feeder and the main of the panel it alone supplies', {
    F: { characteristic: sameAsFeeder },
    PM: { characteristic: sameAsFeeder },
    BR: { system, characteristic: tripUnit(100, { instantaneous: { pickup: 10 } }) },
  });
}

describe('the Exception for two devices in series with no load in parallel with the downstream one', () => {
  const codeFinding = (input: StudyInput) =>
    analyseScenarios(parseStudy(input)).findings.find((f) => f.id === 'code-selectivity:BR')!;

  it('leaves a feeder and the main of the panel it alone supplies out of an emergency device’s chain, and says so (NFPA 70 700.32, 708.54 Exception)', () => {
    const finding = codeFinding(panelMainStudy('emergency'));
    expect(finding.severity).toBe('ok');
    expect(finding.explanation).toMatch(/Not asked of F over PM: the Exception to 700\.32 /);
    expect(finding.explanation).toMatch(/Confirm that no load is tapped between them\./);
  });

  it('checks the upper device of an exempt pair with the devices below the lower one: the chain stays unbroken', () => {
    // The standby demo with the primary relay's instantaneous at 20 × 5 A on its 100:5 CT: 400 A at
    // 12.47 kV, about 10.4 kA at 480 V, below the fault at the emergency panel. The relay and the one
    // secondary main need not be selective; the relay and the emergency feeder under that main must.
    const input = JSON.parse(readFileSync('demo/harrowmere-standby.json', 'utf8')) as StudyInput;
    const relay = input.devices!.find((d) => d.id === 'R-T1')!.characteristic as { instantaneous: { pickup: number } };
    relay.instantaneous.pickup = 20;
    const finding = analyseScenarios(parseStudy(input)).findings.find((f) => f.id === 'code-selectivity:FDR-EM')!;
    expect(finding.severity).toBe('fail');
    expect(finding.explanation).toMatch(/Normal: T1 primary relay and Emergency feeder overlap from 9870 A to /);
    expect(finding.explanation).toMatch(/Not asked of T1 primary relay over Main 2000 A/);
  });

  it('asks it of elevator circuits (NFPA 70 620.62 has no such Exception)', () => {
    const finding = codeFinding(panelMainStudy('elevator'));
    expect(finding.severity).toBe('fail');
    expect(finding.explanation).toMatch(/Normal: F and PM \(on the supply side of BR\) overlap from /);
  });
});

/**
 * An emergency feeder FE (800 A, short-time 4 × at 0.4 s) supplies panel P by cable; its main PM (400 A,
 * short-time 4 × at 0.2 s) feeds branch breaker BR (225 A, short-time 4 × at 0.2 s), neither marked. PM and
 * BR overlap over their short-time bands; FE is selective over both. Invented settings.
 */
function loadSideStudy(edition: '2020' | '2023'): StudyInput {
  return {
    discern: 1,
    name: 'an emergency feeder and the devices on its load side',
    coordination: { edition },
    source: { kind: 'utility', id: 'U', bus: 'A', max: { available: '30 kA', xr: 6 } },
    buses: [
      { id: 'A', voltage: 480 },
      { id: 'P', voltage: 480 },
      { id: 'L', voltage: 480 },
    ],
    cables: [
      { id: 'C1', from: 'A', to: 'P', size: '500 kcmil', sets: 2, length: 100 },
      { id: 'C2', from: 'P', to: 'L', size: '4/0', length: 50 },
    ],
    devices: [
      {
        id: 'FE',
        feeds: 'C1',
        system: 'emergency',
        characteristic: tripUnit(800, { shortTime: { pickup: 4, delay: 0.4 } }),
      },
      { id: 'PM', feeds: 'P', characteristic: tripUnit(400, { shortTime: { pickup: 4, delay: 0.2 } }) },
      { id: 'BR', feeds: 'C2', characteristic: tripUnit(225, { shortTime: { pickup: 4, delay: 0.2 } }) },
    ],
  };
}

describe('the Exception with the marked device below it', () => {
  it('pairs the device above the exempt link with the marked main itself, not only with its feeder', () => {
    // Service main SM (short-time 4 × 2000 A at 0.3 s) over feeder F (instantaneous 10 × 400 A), which alone
    // supplies panel P, whose main PM is marked (short-time 4 × 400 A at 0.3 s, no instantaneous). F over PM
    // is left out; SM over F is selective; SM over PM, which the article asks for, overlaps from 7.2 kA
    // (SM's short-time pickup less 10 %). Invented settings.
    const input = panelMainStudy('emergency');
    input.devices = [
      { id: 'SM', feeds: 'A', characteristic: tripUnit(2000, { shortTime: { pickup: 4, delay: 0.3 } }) },
      { id: 'F', feeds: 'C1', characteristic: tripUnit(400, { instantaneous: { pickup: 10 } }) },
      {
        id: 'PM',
        feeds: 'P',
        system: 'emergency',
        characteristic: tripUnit(400, { shortTime: { pickup: 4, delay: 0.3 } }),
      },
    ];
    input.cables = input.cables!.filter((cable) => cable.id === 'C1');
    input.buses = input.buses!.filter((bus) => bus.id !== 'L');
    const finding = analyseScenarios(parseStudy(input)).findings.find((f) => f.id === 'code-selectivity:PM')!;
    expect(finding.severity).toBe('fail');
    expect(finding.explanation).toMatch(/Normal: SM and PM overlap from 7200 A to /);
    expect(finding.explanation).not.toMatch(/SM and F /);
    expect(finding.explanation).toMatch(/Not asked of F over PM: the Exception to 700\.32 /);
  });
});

describe('NFPA 70 (2023) 700.32(A): selective with the load-side devices too', () => {
  const codeFinding = (input: StudyInput) =>
    analyseScenarios(parseStudy(input)).findings.find((f) => f.id === 'code-selectivity:FE')!;

  it('names a pair on the load side of the emergency feeder that overlaps, in the 2023 edition', () => {
    const finding = codeFinding(loadSideStudy('2023'));
    expect(finding.severity).toBe('fail');
    expect(finding.explanation).toMatch(/must be selectively coordinated with every supply-side and load-side device/);
    expect(finding.explanation).toMatch(/Normal: PM and BR \(BR on the load side of FE\) overlap from /);
    // FE over PM, the main of the panel FE alone supplies, is left to the Exception.
    expect(finding.explanation).toMatch(/Not asked of FE over PM: the Exception to 700\.32/);
  });

  it('reads on through a device of another system below it, whose own finding reads only its supply side', () => {
    const input = loadSideStudy('2023');
    input.devices![1] = { ...input.devices![1], system: 'elevator' };
    expect(codeFinding(input).explanation).toMatch(/Normal: PM and BR \(BR on the load side of FE\) overlap from /);
  });

  it('asks only the supply side before the 2023 edition: of FE, at the top of its tree, nothing', () => {
    expect(codeFinding(loadSideStudy('2020'))).toBeUndefined();
  });
});
