import { describe, expect, it } from 'vitest';
import type { Finding } from '../../../src/engine/checks/finding.ts';
import { analyseScenarios } from '../../../src/engine/scenario/index.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';

const tripUnit = (sensor: number, more: Record<string, unknown> = {}) => ({
  kind: 'trip-unit' as const,
  sensor,
  longTime: { pickup: 1, delay: 10 },
  ...more,
});

/**
 * A 480 V service fed at the service point (30 kA available): the service main MAIN (2000 A, short-time
 * 4 × at 0.3 s, instantaneous at `mainInstantaneous` × where given) supplies the emergency feeder FDR-EM
 * (400 A, instantaneous 10 ×), marked, and the panel feeder FDR-P (`panelFeeder`), not marked. Invented
 * settings.
 */
function serviceStudy(
  panelFeeder: ReturnType<typeof tripUnit>,
  options: {
    edition?: '2020' | '2023';
    codeSelectivity?: 'above-0.1-s';
    mainInstantaneous?: number;
    marked?: boolean;
  } = {},
): StudyInput {
  const { edition, codeSelectivity, mainInstantaneous, marked = true } = options;
  return {
    discern: 1,
    name: 'a 480 V service with an emergency feeder',
    coordination: { ...(edition ? { edition } : {}), ...(codeSelectivity ? { codeSelectivity } : {}) },
    source: { kind: 'utility', id: 'U', bus: 'SWBD', max: { available: '30 kA', xr: 6 } },
    buses: [
      { id: 'SWBD', voltage: 480 },
      { id: 'EMP', voltage: 480 },
      { id: 'PNL', voltage: 480 },
    ],
    cables: [
      { id: 'C-EM', from: 'SWBD', to: 'EMP', size: '500 kcmil', length: 50 },
      { id: 'C-P', from: 'SWBD', to: 'PNL', size: '500 kcmil', sets: 2, length: 20 },
    ],
    devices: [
      {
        id: 'MAIN',
        feeds: 'SWBD',
        characteristic: tripUnit(2000, {
          shortTime: { pickup: 4, delay: 0.3 },
          ...(mainInstantaneous ? { instantaneous: { pickup: mainInstantaneous } } : {}),
        }),
      },
      {
        id: 'FDR-EM',
        feeds: 'C-EM',
        ...(marked ? { system: 'emergency' as const } : {}),
        characteristic: tripUnit(400, { instantaneous: { pickup: 10 } }),
      },
      { id: 'FDR-P', feeds: 'C-P', characteristic: panelFeeder },
    ],
  };
}

const serviceFinding = (input: StudyInput): Finding | undefined =>
  analyseScenarios(parseStudy(input)).findings.find((f) => f.basis === 'NFPA 70 (2023) 240.11');

/** A panel feeder with the main's own short-time delay: the two bands meet from the main's short-time pickup. */
const sameDelay = tripUnit(800, { shortTime: { pickup: 4, delay: 0.3 } });
/** A panel feeder that clears on its instantaneous below the main's short-time band. */
const instantaneous = tripUnit(800, { instantaneous: { pickup: 6 } });

describe('NFPA 70 (2023) 240.11 selective coordination of a service device’s feeders', () => {
  it('asks every feeder the service main supplies to be selective with it once the emergency feeder must be, and names the pair that overlaps', () => {
    const finding = serviceFinding(serviceStudy(sameDelay))!;
    expect(finding).toMatchObject({ kind: 'code-selectivity', severity: 'fail', subjects: ['MAIN'] });
    expect(finding.title).toBe('MAIN: NFPA 70 240.11 selective coordination of the feeders it supplies');
    expect(finding.explanation).toMatch(
      /^FDR-EM must be selectively coordinated with MAIN, since FDR-EM \(emergency system\) must be selective with every supply-side device/,
    );
    expect(finding.explanation).toMatch(
      /Not shown: Normal: MAIN and FDR-P overlap from 7200 A to .* at 480 V \(three-phase fault\)/,
    );
    // The emergency feeder is read too, over its own range: selective here.
    expect(finding.explanation).not.toMatch(/MAIN and FDR-EM/);
  });

  it('holds where every other feeder is selective with the service main', () => {
    const finding = serviceFinding(serviceStudy(instantaneous))!;
    expect(finding.severity).toBe('ok');
    expect(finding.explanation).toMatch(
      /FDR-EM, FDR-P are selective with it wherever it supplies them \(scenarios checked: Normal\)\.$/,
    );
  });

  it('accepts, with the study option "above-0.1-s", an overlap where the feeder clears within 0.1 s', () => {
    // Both instantaneous trips: the main's from 21.6 kA (24 kA less 10 %), where the feeder clears within 0.1 s.
    const both = { mainInstantaneous: 12 };
    expect(serviceFinding(serviceStudy(instantaneous, both))!.severity).toBe('fail');
    expect(serviceFinding(serviceStudy(instantaneous, { ...both, codeSelectivity: 'above-0.1-s' }))!.severity).toBe(
      'ok',
    );
  });

  it('asks nothing before the 2023 edition, nor of a service with no marked system', () => {
    expect(serviceFinding(serviceStudy(sameDelay, { edition: '2020' }))).toBeUndefined();
    expect(serviceFinding(serviceStudy(sameDelay, { marked: false }))).toBeUndefined();
  });

  it('reads the emergency feeder itself against the service main over its own range', () => {
    // Both feeders with the main's short-time delay: each overlaps it, the emergency one named too.
    const input = serviceStudy(sameDelay);
    input.devices![1].characteristic = sameDelay;
    const finding = serviceFinding(input)!;
    expect(finding.explanation).toMatch(/Normal: MAIN and FDR-EM overlap from /);
    expect(finding.explanation).toMatch(/Normal: MAIN and FDR-P overlap from /);
  });

  it("is not brought in by a branch circuit's device", () => {
    // The marked device a motor's breaker on the service bus: a branch-circuit device, not a feeder device.
    const input = serviceStudy(sameDelay);
    input.motors = [{ id: 'M-FAN', bus: 'SWBD', hp: 20 }];
    input.devices![1] = {
      id: 'FAN-BR',
      feeds: 'M-FAN',
      system: 'emergency',
      characteristic: tripUnit(100, { instantaneous: { pickup: 10 } }),
    };
    input.cables = input.cables!.filter((cable) => cable.id !== 'C-EM');
    input.buses = input.buses!.filter((bus) => bus.id !== 'EMP');
    expect(serviceFinding(input)).toBeUndefined();
  });
});
