import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { generatorFindings } from '../../../src/engine/checks/index.ts';
import { AnalysisMemo } from '../../../src/engine/incremental.ts';
import { parseStudy, type Study, type StudyInput } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { RATED_AMPS as RATED, standbySource } from '../generator/fixtures.ts';

/**
 * An invented 500 kVA, 480 V standby generator (X″d 0.12, X′d 0.2, Xd 2.0 pu) whose breaker, an 800 A
 * sensor with long-time pickup 0.75 (600 A, about rated current), feeds a panel by 50 ft of 500 kcmil.
 * `longDelay` is the long-time band's time at 6 × pickup, `shortPickup` the short-time pickup in multiples
 * of the long-time pickup (0.2 s delay). Invented settings.
 */
function standby(longDelay: number, shortPickup: number, longPickup = 0.75): StudyInput {
  return {
    discern: 1,
    name: 'standby generator and its breaker',
    source: standbySource(),
    buses: [
      { id: 'GEN', voltage: 480 },
      { id: 'PNL', voltage: 480 },
    ],
    cables: [{ id: 'C1', from: 'GEN', to: 'PNL', size: '500 kcmil', length: '50 ft' }],
    devices: [
      {
        id: 'GEN-CB',
        name: 'Generator breaker',
        feeds: 'C1',
        characteristic: {
          kind: 'trip-unit',
          sensor: 800,
          longTime: { pickup: longPickup, delay: longDelay },
          shortTime: { pickup: shortPickup, delay: 0.2 },
        },
      },
    ],
  };
}

const generatorFindingsOf = (input: StudyInput) =>
  analyseStudy(parseStudy(input)).findings.filter((f) => f.kind === 'generator-withstand');

describe('generatorFindings (NFPA 70 445.12(A); IEEE C50.13 armature capability, from memory)', () => {
  it('has the expected defaults: the breaker checked from the 120 s point, 1.14564 × rated = 689.0 A, to the largest fault at the generator bus', () => {
    const [finding] = generatorFindingsOf(standby(1, 2));
    expect(finding.id).toBe('generator-withstand:G1:GEN-CB');
    expect(finding.subjects).toEqual(['GEN-CB', 'G1']);
    expect(finding.referenceVolts).toBe(480);
    assertInDelta(finding.range!.fromAmps, 1.14564 * RATED, 1e-5);
    // Line-to-ground at the terminals of the solidly grounded machine is the largest: about 6.01 kA.
    assertInDelta(finding.range!.toAmps, 6014.07, 1e-5);
    expect(finding.basis).toMatch(/^NFPA 70 445\.12\(A\) .*IEEE C50\.13/);
  });

  it('long-time delay 1 s and short-time pickup 2 × (1200 A, 2 × rated): protects; closest at 1320 A, 8.93 s against (2.195² − 1)·t = 37.5, 9.82 s', () => {
    const findings = generatorFindingsOf(standby(1, 2));
    expect(findings.map((f) => f.severity)).toEqual(['ok']);
    expect(findings[0].title).toBe('Generator breaker protects Standby generator');
    const worst = findings[0].worst!;
    assertInDelta(worst.amps, 1320, 1e-3);
    assertInDelta(worst.upTime, 37.5 / ((worst.amps / RATED) ** 2 - 1), 1e-9);
    expect(worst.downTime).toBeLessThan(worst.upTime);
  });

  it('short-time pickup 6 × (3600 A): does not protect past the curve’s 10 s end, where the armature withstands 37.5 / (6.585² − 1) = 0.885 s at 3960 A, not a held 10 s', () => {
    // A warning, not a failure: NFPA 70 445.12(A) also accepts the machine's inherent protection.
    const findings = generatorFindingsOf(standby(1, 6));
    expect(findings.map((f) => f.severity)).toEqual(['warning']);
    const failure = findings[0];
    expect(failure.title).toBe('Generator breaker does not protect Standby generator');
    // The whole failing interval lies above 2.179 × rated (1311 A), where the curve is no longer drawn.
    expect(failure.range!.fromAmps).toBeGreaterThan(2.17945 * RATED);
    const worst = failure.worst!;
    assertInDelta(worst.amps, 3960, 1e-3);
    assertInDelta(worst.upTime, 0.885343, 1e-5);
    expect(worst.downTime).toBeLessThan(10);
    expect(worst.downTime).toBeGreaterThan(worst.upTime);
    expect(failure.explanation).toMatch(
      /may take up to 0\.992 s to clear, but Standby generator withstands only 0\.885 s/,
    );
    expect(failure.explanation).toMatch(/inherent design or its own protection, as NFPA 70 445\.12\(A\) also allows/);
  });

  it('an 800 A long-time pickup (1.33 × rated) leaves the armature’s overload to nothing from 689 A, then does not protect it', () => {
    const findings = generatorFindingsOf(standby(10, 3, 1));
    expect(findings.map((f) => `${f.severity} ${f.id}`)).toEqual([
      'warning generator-withstand:G1:GEN-CB:below-pickup',
      'warning generator-withstand:G1:GEN-CB:0',
    ]);
    assertInDelta(findings[0].range!.fromAmps, 1.14564 * RATED, 1e-5);
    expect(findings[0].explanation).toMatch(/up to 1\.46 times rated current/);
  });

  it('is not run on a utility-fed tree', () => {
    const input = standby(1, 6);
    const utility = { ...input, source: { kind: 'utility', id: 'U', bus: 'GEN', max: { available: '20 kA' } } };
    expect(generatorFindingsOf(utility as StudyInput)).toEqual([]);
  });

  it('warns when no device lies between the generator and a fault', () => {
    const study = parseStudy({ ...standby(1, 2), devices: [] });
    const analysis = analyseStudy(study);
    const source = study.source as Extract<typeof study.source, { kind: 'generator' }>;
    const [none] = generatorFindings(analysis, source);
    expect(none.severity).toBe('warning');
    expect(none.suggestion).toMatch(/NFPA 70 445\.12\(A\)/);
  });

  it('does not take a device further down for the generator breaker: a panel breaker protects only what lies below it', () => {
    // The one device sits at the panel, behind 50 ft of cable: a fault on that cable reaches the machine
    // through no device at all.
    const input = standby(1, 2);
    input.buses = [...input.buses!, { id: 'LOAD', voltage: 480 }];
    input.cables = [...input.cables!, { id: 'C2', from: 'PNL', to: 'LOAD', size: '2 AWG', length: '50 ft' }];
    input.devices = [{ ...input.devices![0], id: 'PNL-CB', name: 'Panel breaker', feeds: 'C2' }];
    const [finding] = generatorFindingsOf(input);
    expect([finding.severity, finding.title]).toEqual(['warning', 'Standby generator has no overcurrent device']);
  });

  it('with a memo, an edited breaker gives the new finding (the check reads the breaker nearest the generator)', () => {
    const memo = new AnalysisMemo();
    const severities = (study: Study) =>
      analyseStudy(study, memo)
        .findings.filter((f) => f.kind === 'generator-withstand')
        .map((f) => f.severity);
    const before = parseStudy(standby(1, 2));
    // Only the breaker changes: the generator, the network and so the fault levels are the same objects.
    const after = { ...before, devices: parseStudy(standby(1, 6)).devices };
    expect(severities(before)).toEqual(['ok']);
    expect(severities(after)).toEqual(['warning']);
  });
});
