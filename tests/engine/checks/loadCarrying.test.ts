import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { settingWindowOf, withSettingChanges } from '../../../src/engine/window/index.ts';
import { workedStudy } from '../window/fixtures.ts';

/** The load findings of the worked study (1500 kVA 12.47 kV–480 V, a 2000 A main, a 400 A feeder to a 100 hp motor) with settings changed. */
function loadFindings(
  changes: { deviceId: string; key: string; to: number }[] = [],
  input: StudyInput = workedStudy(),
) {
  const study = parseStudy(withSettingChanges(input, changes));
  return analyseStudy(study).findings.filter((f) => f.kind === 'carry-load');
}
const severityOf = (findings: ReturnType<typeof loadFindings>, deviceId: string) =>
  findings.find((f) => f.id === `carry-load:${deviceId}`)?.severity;

describe('loadFindings', () => {
  it('has the expected defaults: every device with a known load below, each carrying it', () => {
    expect(loadFindings().map((f) => `${f.id} ${f.severity}`)).toEqual([
      'carry-load:R-T1 ok',
      'carry-load:MAIN ok',
      'carry-load:FDR ok',
    ]);
  });

  it("holds the transformer primary relay to the transformer's rated current (IEEE C57.12.00 rated current; common practice)", () => {
    // 1500 kVA at 12.47 kV: 1 500 000 / (√3 · 12 470) = 69.449 A. CT 100:5, so pickup 3.5 A is 70 A and 3.4 A is 68 A.
    expect(severityOf(loadFindings([{ deviceId: 'R-T1', key: 'timeOvercurrent.pickup', to: 3.5 }]), 'R-T1')).toBe('ok');
    const [below] = loadFindings([{ deviceId: 'R-T1', key: 'timeOvercurrent.pickup', to: 3.4 }]);
    expect(below.severity).toBe('warning');
    expect(below.subjects).toEqual(['R-T1', 'T1']);
    expect(below.explanation).toMatch(/pickup, 68 A, is below the 69\.4 A its load needs, T1's rated current/);
    expect(below.suggestion).toMatch(/at least 69\.4 A/);
  });

  it("holds the secondary main to the transformer's rated current: 1500 kVA at 480 V is 1804 A (common practice)", () => {
    // 1 500 000 / (√3 · 480) = 1804.2 A; the 2000 A sensor at 0.9 is 1800 A, at 0.95 it is 1900 A.
    expect(severityOf(loadFindings([{ deviceId: 'MAIN', key: 'longTime.pickup', to: 0.95 }]), 'MAIN')).toBe('ok');
    expect(severityOf(loadFindings([{ deviceId: 'MAIN', key: 'longTime.pickup', to: 0.9 }]), 'MAIN')).toBe('warning');
  });

  it('holds a motor feeder to 125 % of the full-load current: 100 hp at 460 V is 124 A, so 155 A (NFPA 70 Table 430.250, from memory; 430.22)', () => {
    // The 400 A sensor at 0.4 is 160 A, at 0.38 it is 152 A.
    expect(severityOf(loadFindings([{ deviceId: 'FDR', key: 'longTime.pickup', to: 0.4 }]), 'FDR')).toBe('ok');
    const below = loadFindings([{ deviceId: 'FDR', key: 'longTime.pickup', to: 0.38 }]).find(
      (f) => f.id === 'carry-load:FDR',
    )!;
    expect(below.severity).toBe('warning');
    expect(below.explanation).toMatch(/152 A, is below the 155 A/);

    expect(below.basis).toBe('The motor below (125 % of its full-load current): NEC 430.22.');
  });

  it('adds the motors below a feeder as 125 % of the largest plus the rest (NEC 430.24)', () => {
    const input = workedStudy();
    input.motors = [...input.motors!, { id: 'M2', bus: 'PNL', hp: 50 }, { id: 'M3', bus: 'PNL', hp: 50 }];
    // 125 % × 124 A + 65 A + 65 A = 285 A (50 hp at 460 V: 65 A, Table 430.250, from memory); the cable
    // feeds the panel, so the feeder's load is the panel's.
    const [fdr] = loadFindings([], input).filter((f) => f.id === 'carry-load:FDR');
    expect(fdr.severity).toBe('ok');
    expect(fdr.explanation).toMatch(
      /at least the 285 A its load needs: 3 motors below \(125 % of the largest plus the rest\)/,
    );
    expect(fdr.subjects).toEqual(['FDR', 'M1', 'M2', 'M3']);
    expect(severityOf(loadFindings([{ deviceId: 'FDR', key: 'longTime.pickup', to: 0.7 }], input), 'FDR')).toBe(
      'warning',
    );
  });

  it('reports nothing for a device with no known load below, or a fuse without a rating', () => {
    const input = workedStudy();
    input.motors = [];
    expect(loadFindings([], input).map((f) => f.id)).toEqual(['carry-load:R-T1', 'carry-load:MAIN']);
    const fused = workedStudy();
    fused.devices![0] = {
      id: 'R-T1',
      feeds: 'T1',
      characteristic: {
        kind: 'fuse',
        minimumMelting: [
          [200, 100],
          [2000, 0.01],
        ],
        totalClearing: [
          [260, 100],
          [2600, 0.01],
        ],
      },
    };
    expect(loadFindings([], fused).map((f) => f.id)).toEqual(['carry-load:MAIN', 'carry-load:FDR']);
  });

  it('warns exactly where the setting window puts the lower edge of the pickup', () => {
    const study = parseStudy(workedStudy());
    const row = settingWindowOf(study, 'MAIN', { maps: false }).settings.find((s) => s.key === 'longTime.pickup')!;
    const lowest = Math.min(...row.intervals.map((i) => i.from));
    const below = row.values!.filter((v) => v < lowest).at(-1)!;
    expect(severityOf(loadFindings([{ deviceId: 'MAIN', key: 'longTime.pickup', to: lowest }]), 'MAIN')).toBe('ok');
    expect(severityOf(loadFindings([{ deviceId: 'MAIN', key: 'longTime.pickup', to: below }]), 'MAIN')).toBe('warning');
  });
});
