import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { primaryShiftOf, sensitivityCasesOf, zoneBusesOf } from '../../../src/engine/checks/sensitivity.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy, type StudyInput, type Transformer } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';

const demo = (): StudyInput => JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8')) as StudyInput;

/**
 * A 480 V service bus with a 20 kA minimum (solidly grounded, Z0 = Z1) and one fuse feeding a motor on
 * it, whose zone is the bus itself. The fuse's total clearing is a straight line on log-log paper,
 * t = 100 s × (I / 1000 A)^−2, so its times follow by hand.
 */
const fused = (coordination: Record<string, unknown> = {}): StudyInput =>
  ({
    discern: 1,
    name: 'Fused motor on a 20 kA service',
    source: {
      kind: 'utility',
      id: 'UTIL',
      bus: 'SVC',
      max: { available: '30 kA', xr: 6 },
      min: { available: '20 kA', xr: 6 },
    },
    buses: [{ id: 'SVC', voltage: 480 }],
    motors: [{ id: 'M1', bus: 'SVC', hp: 50 }],
    devices: [
      {
        id: 'F1',
        feeds: 'M1',
        characteristic: {
          kind: 'fuse',
          label: 'Invented fuse for tests (illustrative, not a product)',
          illustrative: true,
          minimumMelting: [
            [800, 100],
            [80_000, 0.01],
          ],
          totalClearing: [
            [1000, 100],
            [100_000, 0.01],
          ],
        },
      },
    ],
    coordination,
  }) as unknown as StudyInput;

const sensitivity = (study: StudyInput) =>
  analyseStudy(parseStudy(study)).findings.filter((f) => f.kind === 'sensitivity');

describe('sensitivity to the minimum fault in a zone', () => {
  it('has the expected defaults: 2 s allowed, bolted faults (no arcing factor)', () => {
    const study = parseStudy(fused());
    expect(study.coordination.sensitivity).toEqual({ maxTime: 2 });
    const [finding] = sensitivity(fused());
    expect(finding.basis).toMatch(/bolted faults; clearing within 2 s \(common practice\)/);
  });

  it("names the minimum fault's conductor temperature: operating temperature by default, else the study's setting", () => {
    expect(sensitivity(fused())[0].basis).toMatch(/no motors, conductors at operating temperature;/);
    const hot = { ...fused(), conductorTemperatures: { minimumFault: 250 } } as StudyInput;
    expect(sensitivity(hot)[0].basis).toMatch(/no motors, conductors at 250 °C \(the study's setting\);/);
  });

  it('zoneBusesOf() runs down to the next devices, keeping a bus whose main ends the zone', () => {
    const network = networkOf(parseStudy(demo()));
    const zone = (id: string) => zoneBusesOf(network, network.devices.get(id)!);
    expect(zone('R-T1')).toEqual(['SWBD']); // T1's secondary up to the main's line terminals
    expect(zone('MAIN')).toEqual(['SWBD']);
    expect(zone('FDR-MCC')).toEqual(['MCC']);
    expect(zone('MCC-M1')).toEqual(['MCC']); // a motor's terminals, at its bus
    expect(zone('FDR-OFC')).toEqual(['OFC-P', 'OFC']); // cable, then the office transformer to its main
  });

  it('primaryShiftOf() is the worst primary line current per ampere of faulted secondary line (symmetrical components)', () => {
    // Δ–Y: L-L 2/√3 = 1.1547005 (exactly, not 1/0.866); L-G 1/√3 = 0.5773503. Y–Y passes both as they are;
    // a delta secondary has no L-G current (computed by hand from the sequence networks).
    const t = (connection: string, phases = 3) => ({ connection, phases, secondary: 480 }) as unknown as Transformer;
    assertInDelta(primaryShiftOf(t('delta-wye'), 'line-to-line'), 2 / Math.sqrt(3), 1e-12);
    assertInDelta(primaryShiftOf(t('delta-wye'), 'line-to-ground'), 1 / Math.sqrt(3), 1e-12);
    expect(primaryShiftOf(t('wye-wye'), 'line-to-line')).toBeCloseTo(1, 12);
    expect(primaryShiftOf(t('wye-wye'), 'line-to-ground')).toBe(1);
    expect(primaryShiftOf(t('delta-delta'), 'line-to-ground')).toBe(0);
    assertInDelta(primaryShiftOf(t('wye-delta'), 'line-to-line'), 2 / Math.sqrt(3), 1e-12);
    // Single-phase 120/240 V: a half-winding fault draws half the ampere-turns per ampere on the primary.
    expect(primaryShiftOf({ ...t('delta-wye', 1), secondary: 240 } as Transformer, 'line-to-ground')).toBe(0.5);
  });

  it('clears the minimum line-to-line fault at the far end: 17.32 kA → 1/3 s on t = 100 (I/1000)^−2', () => {
    // L-L = √3/2 × 20 kA = 17 320.51 A; (17.3205)^2 = 300, so t = 100/300 = 0.333333 s.
    // L-G with Z0 = Z1 equals the three-phase fault, 20 kA: t = 100/20^2 = 0.25 s.
    const study = parseStudy(fused());
    const network = networkOf(study);
    const cases = sensitivityCasesOf(analyseStudy(study), network.devices.get('F1')!, study.coordination.sensitivity);
    expect(cases.map((c) => c.fault)).toEqual(['line-to-line', 'line-to-ground']);
    assertInDelta(cases[0].deviceAmps, 17_320.508, 1e-6);
    assertInDelta(cases[0].clearingTime, 1 / 3, 1e-6);
    assertInDelta(cases[1].deviceAmps, 20_000, 1e-6);
    assertInDelta(cases[1].clearingTime, 0.25, 1e-6);
    const [finding] = sensitivity(fused());
    expect(finding.severity).toBe('ok');
    expect(finding.explanation).toMatch(/^For 17\.3 kA line-to-line at SVC \(480 V\), F1 clears within 0\.333 s\./);
  });

  it('applies an arcing factor to the minimum faults and names its basis', () => {
    // 0.5 × 17 320.5 = 8660.25 A; 8.66025^2 = 75 → t = 100/75 = 1.333333 s.
    const study = parseStudy(fused({ sensitivity: { arcingFactor: 0.5 } }));
    const [phase] = sensitivityCasesOf(
      analyseStudy(study),
      networkOf(study).devices.get('F1')!,
      study.coordination.sensitivity,
    );
    assertInDelta(phase.clearingTime, 100 / 75, 1e-6);
    const [finding] = sensitivity(fused({ sensitivity: { arcingFactor: 0.5 } }));
    expect(finding.basis).toMatch(/arcing faults taken as 50 % of the bolted fault .*IEEE 1584 gives the method/);
  });

  it('warns when the device clears later than the time allowed, and fails where it may never clear', () => {
    // maxTime 0.3 s: 0.333 s at the L-L fault is slow (a warning); L-G at 0.25 s passes.
    const slow = sensitivity(fused({ sensitivity: { maxTime: 0.3 } }));
    expect(slow.map((f) => `${f.id} ${f.severity}`)).toEqual(['sensitivity:F1:line-to-line warning']);
    expect(slow[0].explanation).toMatch(/may take 0\.333 s to clear, longer than the 0\.3 s allowed/);
    expect(slow[0].basis).toMatch(/clearing within 0\.3 s \(as set for this study\)/);
    // At the limit itself (1/3 s, the L-L clearing time) the device passes.
    expect(sensitivity(fused({ sensitivity: { maxTime: 1 / 3 } }))[0].severity).toBe('ok');
    // Arcing factor 0.04: 692.8 A L-L and 800 A L-G, both below the 1000 A where total clearing starts.
    const never = sensitivity(fused({ sensitivity: { arcingFactor: 0.04 } }));
    expect(never.map((f) => `${f.id} ${f.severity}`)).toEqual([
      'sensitivity:F1:line-to-line fail',
      'sensitivity:F1:line-to-ground fail',
    ]);
    expect(never[0].explanation).toMatch(/692\.8 A through F1 at 480 V as an arcing fault, F1 may never clear/);
    expect(never[0].suggestion).toMatch(/smaller fuse/);
  });

  it('reflects a secondary fault to a primary device across Δ–Y by the voltage ratio and 2/√3 or 1/√3', () => {
    const study = parseStudy(demo());
    const analysis = analyseStudy(study);
    const relay = analysis.network.devices.get('R-T1')!;
    const [lineToLine, lineToGround] = sensitivityCasesOf(analysis, relay, study.coordination.sensitivity);
    const swbd = analysis.faults.buses.get('SWBD')!.min;
    assertInDelta(lineToLine.deviceAmps, ((swbd.lineToLine * 2) / Math.sqrt(3)) * (480 / 12_470), 1e-12);
    assertInDelta(lineToGround.deviceAmps, (swbd.lineToGround / Math.sqrt(3)) * (480 / 12_470), 1e-12);
    expect(lineToGround.groundElement).toBe(false);
    // The main's ground-fault element acts on a ground fault in its own zone.
    const main = sensitivityCasesOf(analysis, analysis.network.devices.get('MAIN')!, study.coordination.sensitivity);
    expect(main[1].groundElement).toBe(true);
  });

  it('reflects a 120/240 V single-phase secondary fault: full winding by the voltage ratio, half winding at half of it', () => {
    const input = {
      discern: 1,
      name: 'Pole-top unit',
      source: { kind: 'utility', id: 'U', bus: 'MV', max: { available: '250 MVA', xr: 10 } },
      buses: [
        { id: 'MV', voltage: '12.47 kV' },
        { id: 'LV', voltage: 240 },
      ],
      transformers: [
        { id: 'T', from: 'MV', to: 'LV', rating: 50, primary: '12.47 kV', secondary: 240, impedance: 2.1, phases: 1 },
      ],
      devices: [
        {
          id: 'R',
          feeds: 'T',
          characteristic: {
            kind: 'relay',
            ct: '50:5',
            timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 1, timeDial: 1 },
          },
        },
      ],
    } as unknown as StudyInput;
    const study = parseStudy(input);
    const analysis = analyseStudy(study);
    const lv = analysis.faults.buses.get('LV')!.min;
    const [full, half] = sensitivityCasesOf(
      analysis,
      analysis.network.devices.get('R')!,
      study.coordination.sensitivity,
    );
    // Ampere-turn balance: I_pri = I_sec × 240/12 470 for the full winding, × 120/12 470 for a half winding.
    assertInDelta(full.deviceAmps, (lv.lineToLine * 240) / 12_470, 1e-12);
    assertInDelta(half.deviceAmps, (lv.lineToGround * 120) / 12_470, 1e-12);
    const explanations = sensitivity(input).map((f) => f.explanation);
    expect(explanations.join(' ')).toMatch(/full-winding at LV \(240 V\)/);
  });
});
