import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

const demo = () => JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8'));
const nec = (study: object) => analyseStudy(parseStudy(study)).findings.filter((f) => f.kind === 'nec-450.3');

describe('nec450Findings', () => {
  it('has the expected defaults: Table 450.3(A) above 1000 V, 450.3(B) at 1000 V and less, primary and secondary', () => {
    const ids = nec(demo()).map((f) => `${f.id} ${f.severity}`);
    expect(ids).toEqual([
      'nec-450.3:T1:primary ok',
      'nec-450.3:T1:secondary ok',
      'nec-450.3:T2:primary ok',
      'nec-450.3:T2:secondary ok',
    ]);
  });

  it('allows the office secondary main 400 A as the next standard rating above 125 % (450.3(B) note 1, 240.6(A); from memory)', () => {
    // 112.5 kVA at 208 V: 312.27 A; 125 % = 390.3 A → next standard rating 400 A (computed).
    const secondary = nec(demo()).find((f) => f.id === 'nec-450.3:T2:secondary')!;
    expect(secondary.explanation).toMatch(/400 A, 128 % of Office dry-type's secondary rated current 312\.3 A/);
    expect(secondary.explanation).toMatch(/next standard rating, 400 A/);
    expect(secondary.work!.at(-1)!.value).toBeCloseTo((100 * 400) / 312.269, 3);
  });

  it('limits the primary to 250 % with secondary protection, not rounded up (450.3(B) note 3; from memory)', () => {
    const study = demo();
    study.devices.find((d: { id: string }) => d.id === 'FDR-OFC').characteristic.sensor = 400;
    const primary = nec(study).find((f) => f.id === 'nec-450.3:T2:primary')!;
    // 480 V side: 135.32 A; 250 % = 338.3 A; a 400 A sensor is 296 % (computed).
    expect(primary.severity).toBe('fail');
    expect(primary.explanation).toMatch(/296 % .* allows 250 % \(338\.3 A\)/);
  });

  it('uses the primary-only column when no secondary main feeds the secondary bus', () => {
    const study = demo();
    study.devices = study.devices.filter((d: { id: string }) => d.id !== 'OFC-MAIN');
    study.views = study.views.map((v: { devices: string[] }) => ({
      ...v,
      devices: v.devices.filter((d) => d !== 'OFC-MAIN'),
    }));
    const primary = nec(study).find((f) => f.id === 'nec-450.3:T2:primary')!;
    // Primary only, 9 A or more: 125 % × 135.32 A = 169.1 A → next standard rating 175 A; 300 A fails.
    expect(primary.severity).toBe('fail');
    expect(primary.explanation).toMatch(
      /primary only, primary current 9 A or more allows 125 % or the next standard rating, 175 A/,
    );
  });
});
