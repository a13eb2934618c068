import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { decayText, decrementTimesOf } from '../../../src/engine/checks/decrementCoordination.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { generatorPairStudy, standbyChainStudy } from '../generator/fixtures.ts';

type Characteristic = NonNullable<StudyInput['devices']>[number]['characteristic'];

/**
 * A 500 kVA, 480 V generator feeding a fuse UP, a cable and a fuse DOWN below it. X″d = X′d = Xd = 0.25 pu
 * makes the decrement flat, so a bolted fault at the generator bus holds I = I_r / 0.25 =
 * 500 000 / (√3 × 480) / 0.25 = 2405.626 A (computed) and each operating time is the curve's time at that
 * current. DOWN total clearing is the straight log-log line t = 9·10⁶ / I² (100 s at 300 A, 0.01 s at 30 kA):
 * 1.555 21 s at 2405.626 A (computed). UP minimum melting is `k` times DOWN's total clearing at every current.
 * Invented curves.
 */
function fusePair(k: number): StudyInput {
  return {
    discern: 1,
    name: 'fuses on a standby generator',
    source: {
      kind: 'generator',
      id: 'G1',
      bus: 'GEN',
      rating: '500 kVA',
      voltage: 480,
      xdSubtransient: 0.25,
      xdTransient: 0.25,
      xd: 0.25,
      tdSubtransient: 0.015,
      tdTransient: 0.4,
    },
    buses: [
      { id: 'GEN', voltage: 480 },
      { id: 'PNL', voltage: 480 },
    ],
    cables: [{ id: 'C1', from: 'GEN', to: 'PNL', size: '4/0', length: '50 ft' }],
    devices: [
      {
        id: 'UP',
        feeds: 'GEN',
        characteristic: {
          kind: 'fuse',
          illustrative: true,
          minimumMelting: [
            [300, 100 * k],
            [30_000, 0.01 * k],
          ],
          totalClearing: [
            [300, 150 * k],
            [30_000, 0.015 * k],
          ],
        },
      },
      {
        id: 'DOWN',
        feeds: 'C1',
        characteristic: {
          kind: 'fuse',
          illustrative: true,
          minimumMelting: [
            [250, 100],
            [25_000, 0.01],
          ],
          totalClearing: [
            [300, 100],
            [30_000, 0.01],
          ],
        },
      },
    ],
  };
}

const AMPS = 500e3 / (Math.sqrt(3) * 480) / 0.25;
const CLEARS = 9e6 / AMPS ** 2;
const decrement = (k: number) =>
  analyseStudy(parseStudy(fusePair(k))).findings.find((f) => f.id === 'decrement:UP/DOWN')!;

describe('decrementFindings', () => {
  it('has the expected defaults: a fuse pair is held to the 75 % rule on the generator current too', () => {
    const finding = decrement(1.5);
    expect(finding.kind).toBe('generator-decrement');
    expect(finding.basis).toMatch(/downstream total clearing ≤ 75 % of upstream minimum melting \(common practice\)/);
    assertInDelta(finding.worst!.amps, AMPS, 1e-6);
    assertInDelta(finding.worst!.downTime, CLEARS, 1e-6);
    assertInDelta(finding.worst!.upTime, 1.5 * CLEARS, 1e-6);
    // X″d = X′d = Xd: the current does not fall, and the explanation says so.
    expect(finding.explanation).toMatch(/^For a fault at GEN \(480 V\) fed by G1, a steady 2410 A,/);
  });

  it('decayText() gives the current from its start to where it settles, or a steady one', () => {
    expect(decayText(2694, 1203)).toBe('2690 A falling to 1200 A');
    expect(decayText(2405.6, 2405.6)).toBe('a steady 2410 A');
    // Equal to three figures, as the text gives them.
    expect(decayText(2408, 2406)).toBe('a steady 2410 A');
  });

  it('fails a fuse pair whose downstream clearing is 83 % of the upstream melting (75 % rule, common practice)', () => {
    // UP melts in 1.2 × 1.555 21 = 1.866 25 s; DOWN clears in 1.555 21 s = 83.3 % of it, over 75 %:
    // not selective, though UP still melts 0.311 s after DOWN has cleared.
    const finding = decrement(1.2);
    expect(finding.severity).toBe('fail');
    expect(finding.title).toBe("UP over DOWN on the generator's decaying current: margin not met");
    expect(finding.explanation).toMatch(
      /DOWN clears by 1\.56 s and UP can operate from 1\.87 s: DOWN's clearing is 83\.3 % of UP's earliest operation, against at most 75 % required\.$/,
    );
    // The finder's bookkeeping: slack 0.75 × 1.866 25 − 1.555 21 = −0.155 52 s, ratio 0.75 × 1.2 = 0.9.
    assertInDelta(finding.worst!.marginSeconds, 0.75 * 1.2 * CLEARS - CLEARS, 1e-6);
    assertInDelta(finding.worst!.ratio, 0.9, 1e-6);
  });

  it('passes a fuse pair whose downstream clearing is 67 % of the upstream melting', () => {
    // UP melts in 1.5 × 1.555 21 = 2.332 82 s; DOWN clears in 66.7 % of it, within 75 %.
    const finding = decrement(1.5);
    // Selective, told as an info: both fuses' curves are illustrative (invented data).
    expect([finding.severity, finding.title]).toEqual([
      'info',
      "UP over DOWN on the generator's decaying current: selective on illustrative curves",
    ]);
    expect(finding.explanation).toMatch(/DOWN's clearing is 66\.7 % of UP's earliest operation, against at most 75 %/);
    assertInDelta(finding.worst!.marginSeconds, 0.75 * 1.5 * CLEARS - CLEARS, 1e-6);
    assertInDelta(finding.worst!.ratio, 1.125, 1e-6);
  });

  it('agrees with the pair finder at the same current: both fail the 83 % pair', () => {
    const analysis = analyseStudy(parseStudy(fusePair(1.2)));
    const coordination = analysis.findings.filter((f) => f.kind === 'coordination' && f.subjects[0] === 'UP');
    expect(coordination.some((f) => f.severity === 'fail')).toBe(true);
  });

  it('tells a pair on a single-phase bus not worked out: the decrement is a three-phase one', () => {
    // The fuse pair with DOWN moved below a 100 kVA single-phase 480–240 V unit (invented).
    const study = fusePair(1.5);
    study.buses!.push({ id: 'S', voltage: 240 });
    study.transformers = [
      { id: 'T', from: 'PNL', to: 'S', rating: '100 kVA', primary: 480, secondary: 240, impedance: '3 %', phases: 1 },
    ];
    study.devices!.push({ ...study.devices![1], id: 'LOW', feeds: 'T' });
    study.devices![1] = { ...study.devices![1], feeds: 'C1' };
    study.cables!.push({ id: 'C2', from: 'S', to: 'S2', size: '1/0 AWG', length: '30 ft' });
    study.buses!.push({ id: 'S2', voltage: 240 });
    study.devices!.push({ ...study.devices![1], id: 'BR', feeds: 'C2' });
    const findings = analyseStudy(parseStudy(study)).findings.filter((f) => f.kind === 'generator-decrement');
    const single = findings.find((f) => f.id === 'decrement:LOW/BR')!;
    expect([single.severity, single.title]).toEqual([
      'info',
      "LOW over BR on the generator's decaying current: not worked out",
    ]);
    expect(single.explanation).toMatch(/^S is a single-phase bus/);
  });

  describe('far behind a long cable: the support holds the current at its start, and the upstream device is read on what it may be raised to', () => {
    /**
     * The standby generator (X″d 0.12, Xd 2 pu, support 3 × rated) feeding 1000 ft of `size` to panel PNL
     * through UP, a 200 A trip unit, and from PNL 10 ft to LOAD through DOWN. Far behind the cable the
     * support's floor (no more than rated voltage drives through the cable, 1/|Ze|) is above the start
     * 1/|Z″ + Ze|: DOWN is read on the current held at the start, UP on the floor. Invented settings.
     */
    const farStudy = (size: string, down: Characteristic): StudyInput =>
      standbyChainStudy(
        'a pair far behind a cable on a standby generator',
        { c1: { size, length: '1000 ft' }, c2: { size, length: '10 ft' } },
        { id: 'UP', characteristic: { kind: 'trip-unit', sensor: 200, longTime: { pickup: 1, delay: 10 } } },
        { id: 'DOWN', characteristic: down },
      );

    it('DOWN clears on the steady start, UP operates on the raised current: each the worse way for the pair', () => {
      const study = parseStudy(
        farStudy('4 AWG', { kind: 'trip-unit', sensor: 100, longTime: { pickup: 1, delay: 4 } }),
      );
      const analysis = analyseStudy(study);
      const times = decrementTimesOf(analysis, study.source as never, { upstream: 'UP', downstream: 'DOWN' }, 'PNL');
      assertInDelta(times.current(0), times.sustainedAmps, 1e-12); // steady at its start
      expect(times.upperSustainedAmps).toBeGreaterThan(times.sustainedAmps * 1.01);
      // On constant currents each time is the band's own: DOWN's latest at the start, UP's earliest at the floor.
      assertInDelta(times.clears, analysis.bands.get('DOWN')!.maxTime(times.sustainedAmps), 1e-6);
      assertInDelta(times.opens, analysis.bands.get('UP')!.minTime(times.upperSustainedAmps), 1e-6);
      // The start is the bus's maximum fault from the machine (no motors here), to the figures given.
      assertInDelta(times.current(0), analysis.faults.buses.get('PNL')!.max.threePhase, 1e-6);
      const finding = analysis.findings.find((f) => f.id === 'decrement:UP/DOWN')!;
      expect(finding.explanation).toMatch(
        /^For a fault at PNL \(480 V\) fed by Standby generator, a steady \d+ A \(the excitation support may raise it toward \d+ A, on which the upstream device is read\), DOWN clears by [\d.]+ s \(on its long-time element\) and UP (can operate from [\d.]+ s on the raised current \(on its long-time element\)|does not operate on the raised current)/,
      );
    });

    it('a downstream device the steady current never reaches is told so, with no excitation support to add', () => {
      // 12 AWG: the start is below DOWN's 400 A pickup (its lower tolerance, 360 A, too).
      const study = parseStudy(
        farStudy('12 AWG', { kind: 'trip-unit', sensor: 400, longTime: { pickup: 1, delay: 4 } }),
      );
      const finding = analyseStudy(study).findings.find((f) => f.id === 'decrement:UP/DOWN')!;
      expect(finding.title).toBe("UP over DOWN on the generator's decaying current: downstream never clears");
      expect(finding.explanation).toMatch(
        /DOWN never clears: the current, 168 A from the start, is below what it needs to operate\.$/,
      );
      expect(finding.suggestion).toBe("Lower DOWN's pickup below the 168 A the fault starts at.");
    });
  });

  it('a downstream pickup above the start itself is told so, with no excitation support to add: none lifts the start', () => {
    // DOWN, a 5000 A sensor at 1.2 × (6000 A), above the 5010 A the fault starts at. Invented.
    const study = generatorPairStudy(
      { kind: 'relay', ct: '800:5', timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 4, timeDial: 6 } },
      { kind: 'trip-unit', sensor: 5000, longTime: { pickup: 1.2, delay: 4 } },
    );
    const finding = analyseStudy(parseStudy(study)).findings.find((f) => f.id === 'decrement:UP/DOWN')!;
    expect(finding.explanation).toMatch(
      /5010 A falling to 1800 A, DOWN never clears: the current, 5010 A from the start, is below what it needs to operate\.$/,
    );
    expect(finding.suggestion).toBe("Lower DOWN's pickup below the 5010 A the fault starts at.");
  });

  it('suggests more excitation support where the floor is below the start, so more support lifts the current DOWN is read on', () => {
    // DOWN, a 1600 A trip unit at 1.2 × (1920 A): the current falls from 5010 A to the 3 × rated (1804 A)
    // support before DOWN's long time completes, so it never clears; held at 4 × rated (2406 A) it does. Invented.
    const study = (sustained: number) =>
      generatorPairStudy(
        { kind: 'relay', ct: '800:5', timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 4, timeDial: 6 } },
        { kind: 'trip-unit', sensor: 1600, longTime: { pickup: 1.2, delay: 4 } },
        { sustained },
      );
    const at = (sustained: number) =>
      analyseStudy(parseStudy(study(sustained))).findings.find((f) => f.id === 'decrement:UP/DOWN')!;
    expect(at(3).suggestion).toMatch(/, or give the generator more excitation support\.$/);
    expect(at(3).title).toMatch(/downstream never clears$/);
    expect(at(4).title).not.toMatch(/never clears/);
  });

  describe('each element on its own: a short-time delay the current leaves unfinished gives no head start', () => {
    /**
     * The standby generator (X″d 0.12, X′d 0.2 pu, T′d 0.4 s; excitation support held at `sustained` ×
     * rated, 601.4 A) on bus GEN, a relay UP (IEEE C37.112 very inverse, CT 800:5, pickup 4 A, TD 6) and a
     * 400 A trip unit DOWN feeding a short cable: long time 10 s at 6 ×, short time 6 × flat 0.3 s, so its
     * latest short-time clearing is 0.3 + 0.05 s above 6 × 400 × 1.1 = 2640 A (the default tolerances).
     * Invented settings.
     */
    const onGenerator = (sustained: number) => {
      const study = generatorPairStudy(
        { kind: 'relay', ct: '800:5', timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 4, timeDial: 6 } },
        { kind: 'trip-unit', sensor: 400, longTime: { pickup: 1, delay: 10 }, shortTime: { pickup: 6, delay: 0.3 } },
        { sustained },
      );
      return analyseStudy(parseStudy(study)).findings.find((f) => f.id === 'decrement:UP/DOWN')!;
    };

    it('with the current held at 3 × rated (1804 A) DOWN clears on long time, after UP: not selective', () => {
      // The current falls below 2640 A at about t = 0.4 · ln(1203 / 836) = 0.146 s (hand-worked from the
      // transient term), before the 0.35 s short-time delay: the element resets and never operates. DOWN
      // clears on its long-time element, integrated from zero, a little before its 12 × (2400 / 1804)² =
      // 21.24 s at the sustained current; integrating DOWN's band whole would have taken the short time
      // 0.146 / 0.35 done and cleared near 12 s, ahead of UP.
      const finding = onGenerator(3);
      expect([finding.severity, finding.title]).toEqual([
        'fail',
        "UP over DOWN on the generator's decaying current: margin not met",
      ]);
      expect(finding.worst!.downTime).toBeGreaterThan(20);
      // The explanation says which element clears, and which operates upstream.
      expect(finding.explanation).toMatch(
        /DOWN clears by 21 s \(on its long-time element\) and UP can operate from [\d.]+ s \(on its time-overcurrent element\)/,
      );
      expect(finding.worst!.downTime).toBeLessThan(12 * (2400 / 1804.2196) ** 2);
      expect(finding.worst!.upTime).toBeLessThan(finding.worst!.downTime);
    });

    it('tells a downstream device still on its way at the sustained current apart from one that never operates', () => {
      // DOWN, a 1600 A trip unit with a 40 s long-time delay: at the sustained 1804 A (above its 1760 A upper
      // pickup) it takes 40 × 1.2 × (9600 / 1804)² = 1359 s, beyond the 1000 s the check follows. Invented.
      const study = generatorPairStudy(
        { kind: 'relay', ct: '800:5', timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 4, timeDial: 6 } },
        { kind: 'trip-unit', sensor: 1600, longTime: { pickup: 1, delay: 40 } },
      );
      const finding = analyseStudy(parseStudy(study)).findings.find((f) => f.id === 'decrement:UP/DOWN')!;
      expect([finding.severity, finding.title]).toEqual([
        'fail',
        "UP over DOWN on the generator's decaying current: downstream does not clear within 1000 s",
      ]);
      const [, seconds] = finding.explanation.match(/at the sustained 1800 A it takes ([\d.]+) s\.$/)!;
      assertInDelta(Number(seconds), 40 * 1.2 * (9600 / 1804.2196) ** 2, 3e-3);
    });

    it('with the current held at 5 × rated (3007 A, above the short-time pickup) DOWN clears at 0.35 s: selective', () => {
      const finding = onGenerator(5);
      expect(finding.severity).toBe('ok');
      expect(finding.explanation).toMatch(/DOWN clears by 0\.35 s \(on its short-time element\)/);
      assertInDelta(finding.worst!.downTime, 0.35, 1e-9);
    });
  });
});
