import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';

/**
 * A 480 V bus with 20 kA available, a definite-time relay (CT 1000:5, pickup 5 A = 1000 A, 0.5 s)
 * above a trip unit (400 A sensor, long-time 10 s at 6 × I_r). Invented settings.
 */
function pairStudy(
  changes: { relayDelay?: number; relayCurve?: { curve: 'definite-time'; pickup: number; delay: number } } = {},
): StudyInput {
  return {
    discern: 1,
    name: 'worked pair',
    source: { kind: 'utility', id: 'U', bus: 'A', max: { available: '20 kA' } },
    buses: [
      { id: 'A', voltage: 480 },
      { id: 'B', voltage: 480 },
    ],
    cables: [{ id: 'C1', from: 'A', to: 'B', size: '500 kcmil', length: '10 ft' }],
    devices: [
      {
        id: 'UP',
        feeds: 'A',
        characteristic: {
          kind: 'relay',
          ct: '1000:5',
          timeOvercurrent: changes.relayCurve ?? {
            curve: 'definite-time',
            pickup: 5,
            delay: changes.relayDelay ?? 0.5,
          },
        },
      },
      {
        id: 'DOWN',
        feeds: 'C1',
        characteristic: { kind: 'trip-unit', sensor: 400, longTime: { pickup: 1, delay: 10 } },
      },
    ],
  };
}

describe('checkPair', () => {
  it('has the expected defaults: relay over an LV breaker band needs 0.2 s, the range ends at the downstream fault', () => {
    const [pair] = analyseStudy(parseStudy(pairStudy())).pairs;
    expect(pair.kind).toBe('relay/trip-unit');
    expect(pair.rule.margin).toBe(0.2);
    expect(pair.cases).toHaveLength(1);
    assertInDelta(pair.cases[0].intervals.at(-1)!.toAmps, 20_000, 1e-9);
  });

  it('finds the overlap edges a hand solution gives, to 1e-5', () => {
    // Downstream latest clearing: long-time band +20 % (common practice) → t = 12 · (2400 / I)² s above 440 A.
    // Overlap while 12 · (2400/I)² + 0.2 > 0.5 → I < 2400 · √(12 / 0.3) = 15 178.9 A (computed);
    // thin while the slack is under 0.1 s → I < 2400 · √(12 / 0.2) = 18 590.3 A (computed).
    const [pair] = analyseStudy(parseStudy(pairStudy())).pairs;
    const intervals = pair.cases[0].intervals;
    expect(intervals.map((i) => i.status)).toEqual(['selective', 'overlap', 'thin margin', 'selective']);
    assertInDelta(intervals[1].fromAmps, 1000, 1e-5);
    assertInDelta(intervals[1].toAmps, 2400 * Math.sqrt(12 / 0.3), 1e-5);
    assertInDelta(intervals[2].toAmps, 2400 * Math.sqrt(12 / 0.2), 1e-5);
  });

  it('moves the overlap edge up as the relay is slowed, where the hand solution puts it', () => {
    const analysis = analyseStudy(parseStudy(pairStudy({ relayDelay: 0.5 })));
    expect(analysis.findings.filter((f) => f.kind === 'coordination' && f.severity === 'fail')).toHaveLength(1);
    const slow = analyseStudy(parseStudy(pairStudy({ relayCurve: { curve: 'definite-time', pickup: 5, delay: 2 } })));
    // At 1000 A the trip unit may take 12 · 2.4² = 69.1 s: still an overlap there; the edge moves to 2400 · √(12/1.8) (computed).
    const intervals = slow.pairs[0].cases[0].intervals;
    assertInDelta(intervals[1].toAmps, 2400 * Math.sqrt(12 / 1.8), 1e-5);
  });

  it('explains an overlap with both times at the worst point and suggests a direction', () => {
    const finding = analyseStudy(parseStudy(pairStudy())).findings.find((f) => f.status === 'overlap')!;
    expect(finding.title).toBe('UP over DOWN: overlap');
    expect(finding.explanation).toMatch(/^Between 1000 A and 15\.2 kA at 480 V UP may open before DOWN has cleared\./);
    expect(finding.explanation).toMatch(
      /UP may operate in 0\.5 s; DOWN may take up to [\d.]+ s to clear, and 0\.2 s more is required/,
    );
    expect(finding.suggestion).toMatch(/^Slow UP by at least/);
    expect(finding.basis).toMatch(/IEEE 242/);
  });
});

describe('checkPair with a fuse above a breaker', () => {
  /** An invented 200 A fuse over the 400 A feeder, melting in `fastest` s at 20 kA. */
  function fuseOver(fastest: number): StudyInput {
    const study = pairStudy();
    study.devices![0].characteristic = {
      kind: 'fuse',
      minimumMelting: [
        [1200, 100],
        [3000, 5],
        [20000, fastest],
      ],
      totalClearing: [
        [1200, 130],
        [3000, 6.5],
        [20000, fastest * 1.5],
      ],
    };
    return study;
  }

  it('asks the fuse to melt later by the shortfall over its 75 % ratio (preloading, common practice)', () => {
    // The feeder's long-time band (12 · (2400 / I)² s at most) outlasts 75 % of the fuse's melting time
    // up to 20 kA. Raising the melting time by the slack's shortfall divided by 0.75 brings 0.75 · t_melt
    // up to the feeder's clearing time.
    const overlap = analyseStudy(parseStudy(fuseOver(0.2))).findings.find((f) => f.status === 'overlap')!;
    const { upTime, downTime, marginSeconds } = overlap.worst!;
    expect(upTime).toBeGreaterThanOrEqual(0.1);
    assertInDelta(marginSeconds, 0.75 * upTime - downTime, 1e-9);
    const needed = Number((-marginSeconds / 0.75).toPrecision(2));
    expect(overlap.suggestion).toMatch(
      new RegExp(`^Slow UP by at least ${needed} s at .* \\(a larger fuse\\), or speed up DOWN\\.$`),
    );
  });

  it('asks for a larger fuse, not an instantaneous setting it does not have, where it melts within 0.1 s', () => {
    const overlap = analyseStudy(parseStudy(fuseOver(0.01))).findings.find((f) => f.status === 'overlap')!;
    expect(overlap.worst!.upTime).toBeLessThan(0.1);
    expect(overlap.suggestion).toMatch(/^Use a larger fuse for UP, one that melts later than DOWN clears up to 20 kA/);
  });
});

describe('checkPair on an illustrative curve', () => {
  it('tells a selective pair on an invented curve as an info, not an ok, and says why', () => {
    // An illustrative thermal-magnetic breaker (invented data) below the relay delayed 5 s: the curves
    // are apart, but a curve of no product proves nothing of one.
    const study = pairStudy({ relayDelay: 5 });
    study.devices![1].characteristic = {
      kind: 'thermal-magnetic',
      illustrative: true,
      rating: 100,
      thermal: {
        minimum: [
          [1.05, 3600],
          [10, 1],
        ],
        maximum: [
          [1.35, 3600],
          [10, 3],
        ],
      },
      magnetic: { pickup: 10 },
    };
    const [finding] = analyseStudy(parseStudy(study)).findings.filter((f) => f.kind === 'coordination');
    expect([finding.severity, finding.status, finding.title]).toEqual([
      'info',
      'selective',
      'UP over DOWN: selective on illustrative curves',
    ]);
    expect(finding.explanation).toMatch(
      /The curve of DOWN is illustrative \(invented data, not a product\), so this is no claim of selectivity/,
    );
    study.devices![1].characteristic = { ...study.devices![1].characteristic, illustrative: false };
    const [claimed] = analyseStudy(parseStudy(study)).findings.filter((f) => f.kind === 'coordination');
    expect([claimed.severity, claimed.title]).toEqual(['ok', 'UP over DOWN: selective']);
  });
});

describe('checkPair at an infinite bus', () => {
  it('checks a finite range and finds the same edges', () => {
    const study = { ...pairStudy(), source: { kind: 'infinite' as const, id: 'U', bus: 'A' } };
    const [pair] = analyseStudy(parseStudy(study)).pairs;
    const intervals = pair.cases[0].intervals;
    expect(Number.isFinite(intervals.at(-1)!.toAmps)).toBe(true);
    assertInDelta(intervals[1].toAmps, 2400 * Math.sqrt(12 / 0.3), 1e-5);
  });
});

describe('checkPair for a ground fault', () => {
  /** A 2000 A main with a ground-fault element (1200 A, 0.5 s) above a 400 A phase-only feeder; invented settings. */
  function groundStudy(): StudyInput {
    const study = pairStudy();
    study.devices = [
      {
        id: 'MAIN',
        feeds: 'A',
        characteristic: {
          kind: 'trip-unit',
          sensor: 2000,
          longTime: { pickup: 1, delay: 10 },
          ground: { pickup: 0.6, delay: 0.5 },
        },
      },
      {
        id: 'FDR',
        feeds: 'C1',
        characteristic: { kind: 'trip-unit', sensor: 400, longTime: { pickup: 1, delay: 10 } },
      },
    ];
    return study;
  }

  it('adds a ground-fault case where the upstream device has a ground element', () => {
    const [pair] = analyseStudy(parseStudy(groundStudy())).pairs;
    expect(pair.cases.map((c) => c.fault)).toEqual(['three-phase', 'ground-fault']);
  });

  it('finds where the ground element beats the feeder’s long-time band, as a hand solution gives', () => {
    // Ground element from 1200 A − 10 % = 1080 A at 0.5 s (common practice tolerances); feeder at most
    // 12 · (2400/I)² s. Overlap while 12 · (2400/I)² > 0.5 → I < 2400 · √24 = 11 757.6 A; thin until
    // 12 · (2400/I)² > 0.4 → I < 2400 · √30 = 13 145.3 A (computed).
    const [pair] = analyseStudy(parseStudy(groundStudy())).pairs;
    const intervals = pair.cases[1].intervals;
    expect(intervals.map((i) => i.status)).toEqual(['selective', 'overlap', 'thin margin', 'selective']);
    assertInDelta(intervals[1].fromAmps, 1080, 1e-5);
    assertInDelta(intervals[1].toAmps, 2400 * Math.sqrt(24), 1e-5);
    assertInDelta(intervals[2].toAmps, 2400 * Math.sqrt(30), 1e-5);
  });

  it('a source so weak that no three-phase fault reaches a phase pickup still checks the ground-fault case', () => {
    // 300 A available: below both long-time pickups (400 A and 2000 A, less 10 %), above the feeder's
    // ground-fault pickup (120 A less 10 %). The pair's one finding spans the ground-fault case (it used
    // to throw, reading the empty three-phase case).
    const study = groundStudy();
    study.source = { kind: 'utility', id: 'U', bus: 'A', max: { available: '300 A' } };
    study.devices![0].characteristic = {
      kind: 'trip-unit',
      sensor: 2000,
      longTime: { pickup: 1, delay: 10 },
      ground: { pickup: 0.2, delay: 0.5 },
    };
    study.devices![1].characteristic = {
      kind: 'trip-unit',
      sensor: 400,
      longTime: { pickup: 1, delay: 10 },
      ground: { pickup: 0.3, delay: 0.1 },
    };
    const analysis = analyseStudy(parseStudy(study));
    expect(analysis.pairs[0].cases.map((c) => [c.fault, c.intervals.length > 0])).toEqual([
      ['three-phase', false],
      ['ground-fault', true],
    ]);
    const [finding] = analysis.findings.filter((f) => f.kind === 'coordination');
    expect([finding.severity, finding.title]).toEqual(['ok', 'MAIN over FDR: selective']);
    assertInDelta(finding.range!.fromAmps, 108, 1e-9);
  });

  it('checks phase elements up to a line-to-ground current larger than the three-phase one', () => {
    // The utility gives 20 kA three-phase and 24 kA line to ground at A (a zero-sequence impedance below
    // the positive: I_LG = 3E / (2·Z1 + Z0) > E / Z1; symmetrical components, IEEE Std 399). The faulted
    // line carries all of it through both phase-only devices. The main's instantaneous trip, 12 × 2000 A
    // less 10 % = 21.6 kA (common practice tolerance), is beyond every three-phase fault but not every
    // ground fault, where the feeder still takes 12 · (2400 / I)² ≥ 0.12 s (computed).
    const study = pairStudy();
    study.source = { kind: 'utility', id: 'U', bus: 'A', max: { available: '20 kA', lineToGround: '24 kA' } };
    study.devices![0].characteristic = {
      kind: 'trip-unit',
      sensor: 2000,
      longTime: { pickup: 1, delay: 10 },
      instantaneous: { pickup: 12 },
    };
    const analysis = analyseStudy(parseStudy(study));
    const [pair] = analysis.pairs;
    expect(pair.cases.map((c) => c.fault)).toEqual(['three-phase', 'line-to-ground']);
    expect(pair.cases[0].intervals.every((i) => i.status === 'selective')).toBe(true);
    const ground = pair.cases[1].intervals;
    assertInDelta(ground[0].fromAmps, 20_000, 1e-9);
    expect(ground.map((i) => i.status)).toEqual(['selective', 'overlap']);
    assertInDelta(ground[1].fromAmps, 21_600, 1e-5);
    assertInDelta(ground[1].toAmps, 24_000, 1e-9);
    const overlap = analysis.findings.find((f) => f.status === 'overlap')!;
    expect(overlap.title).toBe('UP over DOWN: overlap for a line-to-ground fault');
    // The main has no ground-fault element: the advice is about its instantaneous trip.
    expect(overlap.suggestion).toMatch(/^Raise UP's instantaneous pickup above 24 kA/);
  });

  it('says the overlap is for a ground fault', () => {
    const finding = analyseStudy(parseStudy(groundStudy())).findings.find((f) => f.status === 'overlap')!;
    expect(finding.title).toBe('MAIN over FDR: overlap for a ground fault');
  });
});

describe('checkPair below a single-phase transformer', () => {
  /** A 50 kVA 12.47 kV–120/240 V unit across two lines, a primary relay and a 240 V main (invented settings). */
  function singlePhaseStudy(primary: string): StudyInput {
    return {
      discern: 1,
      name: 'single-phase pair',
      source: { kind: 'utility', id: 'U', bus: 'MV', max: { available: '250 MVA', xr: 12 } },
      buses: [
        { id: 'MV', voltage: '12.47 kV' },
        { id: 'S', voltage: 240 },
      ],
      transformers: [
        { id: 'T', from: 'MV', to: 'S', rating: '50 kVA', primary, secondary: 240, impedance: 2.1, xr: 2, phases: 1 },
      ],
      devices: [
        {
          id: 'R',
          feeds: 'T',
          characteristic: {
            kind: 'relay',
            ct: '10:5',
            timeOvercurrent: { curve: 'definite-time', pickup: 5, delay: 0.5 },
          },
        },
        {
          id: 'MAIN',
          feeds: 'S',
          characteristic: { kind: 'trip-unit', sensor: 200, longTime: { pickup: 1, delay: 10 } },
        },
      ],
    };
  }

  it('checks the full-winding fault and the line-to-neutral fault, of which the primary sees half (half the turns)', () => {
    const analysis = analyseStudy(parseStudy(singlePhaseStudy('12.47 kV')));
    const [pair] = analysis.pairs;
    const bus = analysis.faults.buses.get('S')!;
    expect(pair.cases.map((c) => [c.fault, c.upstreamShift])).toEqual([
      ['single-phase', 1],
      ['line-to-neutral', 0.5],
    ]);
    assertInDelta(pair.cases[0].intervals.at(-1)!.toAmps, bus.max.lineToLine, 1e-12);
    assertInDelta(pair.cases[1].intervals.at(-1)!.toAmps, bus.max.lineToGround, 1e-12);
  });

  it('gives each finding its interval’s currents at both voltages, the primary’s shifted for its fault case, and its worst point', () => {
    // The primary sees half of a line-to-neutral fault (half the turns): 0.5 × 240 / 12 470 of the secondary amps.
    const analysis = analyseStudy(parseStudy(singlePhaseStudy('12.47 kV')));
    const [pair] = analysis.pairs;
    const findings = analysis.findings.filter((f) => f.kind === 'coordination');
    expect(new Set(findings.map((f) => f.id.split(':')[2]))).toEqual(new Set(['single-phase', 'line-to-neutral']));
    for (const finding of findings) {
      const [, , fault, index] = finding.id.split(':');
      const pairCase = pair.cases.find((c) => c.fault === fault)!;
      const interval = pairCase.intervals[Number(index)];
      expect(finding.worst).toBe(interval.worst);
      const [secondary, primary] = finding.range!.atVoltages;
      expect([secondary.volts, primary.volts]).toEqual([240, 12_470]);
      assertInDelta(secondary.fromAmps, interval.fromAmps, 1e-12);
      assertInDelta(primary.toAmps, (interval.toAmps * 240 * pairCase.upstreamShift) / 12_470, 1e-12);
    }
    expect(Object.keys(findings[0])).toEqual([
      'id',
      'kind',
      'severity',
      'status',
      'title',
      'subjects',
      'range',
      'worst',
      'explanation',
      'suggestion',
      'basis',
      'referenceVolts',
    ]);
  });

  it('a unit connected line to neutral puts √3 times the bus-ratio current in its primary line', () => {
    const [pair] = analyseStudy(parseStudy(singlePhaseStudy('7.2 kV'))).pairs;
    assertInDelta(pair.cases[0].upstreamShift, Math.sqrt(3), 1e-12);
    assertInDelta(pair.cases[1].upstreamShift, Math.sqrt(3) / 2, 1e-12);
  });

  it('through a Δ–Y unit above, a line-to-line single-phase load loads one line fully: 2/√3; line to neutral: 1 (symmetrical components, IEEE 399)', () => {
    const chain = (primary: string): StudyInput => ({
      ...singlePhaseStudy(primary),
      buses: [
        { id: 'MV', voltage: '12.47 kV' },
        { id: 'LV', voltage: 480 },
        { id: 'S', voltage: 240 },
      ],
      transformers: [
        { id: 'T3', from: 'MV', to: 'LV', rating: '1500 kVA', primary: '12.47 kV', secondary: 480, impedance: 5.75 },
        { id: 'T', from: 'LV', to: 'S', rating: '50 kVA', primary, secondary: 240, impedance: 2.1, xr: 2, phases: 1 },
      ],
      devices: singlePhaseStudy(primary).devices!.map((d) => (d.id === 'R' ? { ...d, feeds: 'T3' } : d)),
    });
    const across = analyseStudy(parseStudy(chain('480 V'))).pairs[0];
    assertInDelta(across.cases[0].upstreamShift, 2 / Math.sqrt(3), 1e-12);
    assertInDelta(across.cases[1].upstreamShift, 1 / Math.sqrt(3), 1e-12);
    const toNeutral = analyseStudy(parseStudy(chain('277 V'))).pairs[0];
    assertInDelta(toNeutral.cases[0].upstreamShift, 1, 1e-12);
    assertInDelta(toNeutral.cases[1].upstreamShift, 0.5, 1e-12);
  });
});
