import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { CAUTION } from '../../src/engine/caution.ts';
import { formatAmps } from '../../src/engine/quantity/format.ts';
import { deviceFaultOf } from '../../src/engine/fault/index.ts';
import { parseStudy } from '../../src/engine/study/index.ts';
import { inferCurrentRange } from '../../src/plot/currentRange.ts';
import { faultLabel } from '../../src/plot/marks/faultLine.ts';
import { viewInputOf } from '../../src/plot/viewInput.ts';
import { assertInDelta } from '../asserts.ts';

const analysed = (name: string) => analyseStudy(parseStudy(readFileSync(`demo/harrowmere-${name}.json`, 'utf8')));

describe('viewInputOf', () => {
  it('has the expected defaults: the view’s devices on its base, fault lines of their buses, the caution', () => {
    const input = viewInputOf(analysed('selective'), 'primary');
    expect(input.referenceVolts).toBe(12_470);
    expect(input.bands.map((b) => b.id)).toEqual(['R-T1', 'MAIN']);
    expect(input.faultLines.map((f) => f.busId)).toEqual(['MV', 'SWBD']);
    expect(input.caution).toBe(CAUTION);
  });

  it('draws a 480 V device on the 12.47 kV sheet at I · 480 / 12 470 (voltage-ratio reflection, IEEE 242)', () => {
    const analysis = analysed('selective');
    const main = viewInputOf(analysis, 'primary').bands[1];
    const own = analysis.bands.get('MAIN')!;
    expect(main.ownVolts).toBe(480);
    expect(main.band.maxTime((20_000 * 480) / 12_470)).toBe(own.maxTime(20_000));
  });

  it("ends each band at the largest current through its own device: the main's at the line through the transformer", () => {
    const analysis = analysed('selective');
    const main = analysis.network.devices.get('MAIN')!;
    const through = deviceFaultOf(analysis.network, analysis.faults, main);
    // On its own 480 V sheet: the larger of the three-phase (28.4 kA, what T1 passes) and line-to-ground
    // (29.4 kA: Δ–Yg, X0 below X1) faults through it, short of the switchboard's 30.4 kA with its motors.
    const service = viewInputOf(analysis, 'service').bands.find((b) => b.id === 'MAIN')!;
    expect(service.toAmps).toBe(Math.max(through.threePhase, through.lineToGround));
    expect(through.lineToGround).toBeGreaterThan(through.threePhase);
    expect(service.toAmps).toBeLessThan(analysis.faults.buses.get('SWBD')!.max.lineToGround);
    // On the primary sheet the same reach, scaled by 480/12 470: past the three-phase line through the
    // transformer, since the line-to-ground fault reaches the primary lines reduced by the Δ–Y unit.
    const primary = viewInputOf(analysis, 'primary');
    assertInDelta(primary.bands[1].toAmps!, (through.lineToGround * 480) / 12_470, 1e-12);
    assertInDelta(primary.faultLines[1].amps, (through.threePhase * 480) / 12_470, 1e-12);
  });

  it('draws a secondary fault on the primary sheet at the current through the transformer: the SWBD total less its motors, × 480/12 470', () => {
    const analysis = analysed('selective');
    const swbd = viewInputOf(analysis, 'primary').faultLines[1];
    const fault = analysis.faults.buses.get('SWBD')!;
    // The motors at 480 V feed the fault without passing through T1 (IEEE 399 current division): the
    // line is the transformer's own reflected through-fault, the current R-T1 and the main carry.
    assertInDelta(swbd.amps, analysis.faults.transformers.get('T1')!.reflectedToPrimary, 1e-12);
    expect(swbd.amps).toBeLessThan((fault.max.threePhase * 480) / 12_470);
    // The label joins two figures of one fault, the three-phase: the bus's and the current through T1.
    expect([swbd.ownVolts, swbd.ownAmps, swbd.reflection]).toEqual([
      480,
      fault.max.threePhase,
      'through Service transformer',
    ]);
    expect(faultLabel(swbd, 12_470)).toBe('SWBD 30 kA @ 480 V → 1.09 kA @ 12.47 kV (through Service transformer)');
  });

  it("draws a secondary line-to-ground fault by the voltage ratio and names the Δ–Y primary's line current beside it", () => {
    const analysis = analysed('selective');
    const study = structuredClone(analysis.study);
    study.views.push({ ...study.views.find((v) => v.id === 'primary')!, id: 'primary-ground', groundFault: true });
    const ground = viewInputOf(analyseStudy(study), 'primary-ground').faultLines.find((f) => f.busId === 'SWBD')!;
    const fault = analysis.faults.buses.get('SWBD')!;
    assertInDelta(ground.amps, (fault.max.lineToGround * 480) / 12_470, 1e-12);
    // The worst primary line of T1 (Δ–Yg) for that fault, from the fault engine: about 1/√3 of the ratio.
    const worst = Math.max(...analysis.faults.transformers.get('T1')!.unbalanced.lineToGround.primaryLineAmps);
    expect(worst / ground.amps).toBeCloseTo(1 / Math.sqrt(3), 1);
    expect(faultLabel(ground, 12_470)).toBe(
      `SWBD L-G 30.4 kA @ 480 V = 1.17 kA @ 12.47 kV (by the voltage ratio; Service transformer's primary lines carry ${formatAmps(worst, 3)})`,
    );
  });

  it('adds the Δ–Yg secondary line-to-ground withstand curve, shifted by 1/√3 (IEEE C37.91 / IEEE C57.109 delta–wye shift factors item 2), and the inrush points', () => {
    const input = viewInputOf(analysed('selective'), 'primary');
    expect(input.withstand.map((w) => w.id)).toEqual(['T1', 'T1:shifted']);
    assertInDelta(input.withstand[1].scale / input.withstand[0].scale, 1 / Math.sqrt(3), 1e-3);
    expect(input.withstand[1].label).toMatch(/× 0\.577\)$/);
    expect(input.markers.filter((m) => m.kind === 'inrush')).toHaveLength(1);
  });

  it('marks a transformer’s full-load current as a line: 1500 kVA at 12.47 kV is 69.45 A, S / (√3 · V) (IEEE 141 per-unit base)', () => {
    const analysis = analysed('selective');
    const [primary] = viewInputOf(analysis, 'primary').markers.filter((m) => m.kind === 'full-load');
    assertInDelta(primary.amps, 1_500_000 / (Math.sqrt(3) * 12_470), 1e-9);
    expect([primary.elementId, primary.seconds, primary.scale]).toEqual(['T1', undefined, 1]);
    expect(primary.label).toBe('Service transformer full-load current (69.45 A at 12.47 kV)');
    // The same line on the 480 V sheet stands at the secondary's full-load current.
    const service = viewInputOf(analysis, 'service').markers.find((m) => m.kind === 'full-load')!;
    assertInDelta(service.amps * service.scale, 1_500_000 / (Math.sqrt(3) * 480), 1e-6);
  });

  it('marks a cable’s ampacity as a line: 2 sets of 500 kcmil copper carry 2 × 380 A (NFPA 70 Table 310.16, 75 °C)', () => {
    const input = viewInputOf(analysed('selective'), 'service');
    const lines = input.markers.filter((m) => m.kind === 'ampacity');
    expect(lines.map((m) => [m.elementId, m.amps, m.seconds, m.scale])).toEqual([['C-MCC', 760, undefined, 1]]);
    expect(lines[0].label).toBe('MCC feeder cable ampacity 760 A (NFPA 70 Table 310.16, 75 °C, 2 sets)');
  });

  it('marks the ampacity a cable is given, and none on a cable above 1000 V (NFPA 70 240.4 is for 1000 V and less)', () => {
    const document = JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8'));
    document.cables.find((c: { id: string }) => c.id === 'C-MCC').ampacity = 300;
    // A 12.47 kV cable between the service bus and the transformer, drawn on the primary sheet.
    document.buses.push({ id: 'MV-T1', voltage: '12.47 kV' });
    document.cables.push({
      id: 'C-MV',
      from: 'MV',
      to: 'MV-T1',
      size: '500 kcmil',
      length: '200 ft',
      material: 'copper',
    });
    document.transformers.find((t: { id: string }) => t.id === 'T1').from = 'MV-T1';
    document.views.find((v: { id: string }) => v.id === 'primary').withstand.push('C-MV');
    const analysis = analyseStudy(parseStudy(document));
    const service = viewInputOf(analysis, 'service').markers.filter((m) => m.kind === 'ampacity');
    expect(service.map((m) => [m.amps, m.label])).toEqual([
      [600, 'MCC feeder cable ampacity 600 A (as given, 2 sets)'],
    ]);
    const primary = viewInputOf(analysis, 'primary');
    expect(primary.withstand.map((w) => w.id)).toContain('C-MV');
    expect(primary.markers.filter((m) => m.kind === 'ampacity')).toEqual([]);
  });

  it('hatches the overlaps of the view’s pairs on the view’s base', () => {
    const regions = viewInputOf(analysed('overlap'), 'service').regions;
    expect(regions.length).toBeGreaterThan(0);
    expect(regions.every((r) => r.toAmps > r.fromAmps)).toBe(true);
    expect(regions.map((r) => r.status)).toContain('overlap');
  });

  it('hatches the findings it is given, in their order, when the same study is drawn again with other findings', () => {
    const analysis = analysed('overlap');
    const all = viewInputOf(analysis, 'service').regions.map((r) => r.findingId);
    expect(all.length).toBeGreaterThan(1);
    // The workbench draws again with the findings of the latest run: here, all but the first one hatched.
    const fewer = analysis.findings.filter((f) => f.id !== all[0]);
    expect(viewInputOf({ ...analysis, findings: fewer }, 'service').regions.map((r) => r.findingId)).toEqual(
      all.slice(1),
    );
    expect(viewInputOf(analysis, 'service').regions.map((r) => r.findingId)).toEqual(all);
    const order = new Map(analysis.findings.map((f, i) => [f.id, i]));
    expect(all.map((id) => order.get(id)!)).toEqual([...all.map((id) => order.get(id)!)].sort((a, b) => a - b));
  });

  it('rejects an unknown view, listing the views', () => {
    expect(() => viewInputOf(analysed('selective'), 'nowhere')).toThrow(
      /no view "nowhere" in the study \(views: service, primary, office, emergency\)/,
    );
  });

  it('sets the current axis by the faults at the sheet’s own voltage: a 12.47 kV fault reflected to 480 V does not stretch it', () => {
    const input = viewInputOf(analysed('overlap'), 'service');
    const mv = input.faultLines.find((f) => f.ownVolts === 12_470)!;
    expect(mv.amps).toBeGreaterThan(200_000);
    expect(inferCurrentRange(input)[1]).toBe(100_000);
  });

  it('hatches each overlap between the two edges in conflict, and ground-fault findings only on a ground-fault view', () => {
    const analysis = analysed('overlap');
    const regions = viewInputOf(analysis, 'service').regions;
    expect(regions.every((r) => r.edges !== undefined)).toBe(true);
    expect(regions.some((r) => r.findingId.includes(':ground-fault:'))).toBe(false);
    const view = analysis.study.views.find((v) => v.id === 'service')!;
    const ground = { ...analysis, study: { ...analysis.study, views: [{ ...view, id: 'g', groundFault: true }] } };
    const input = viewInputOf(ground, 'g');
    expect(input.regions.every((r) => r.findingId.includes(':ground-fault:'))).toBe(true);
    expect(input.bands.map((b) => b.id)).toContain('MAIN:ground-fault');
    expect(input.faultLines.every((f) => f.label.endsWith('L-G'))).toBe(true);
  });

  it('draws the upstream band shifted for a secondary line-to-line fault when a finding rests on it (2/√3 across Δ–Y)', () => {
    const analysis = analysed('fused');
    const input = viewInputOf(analysis, 'office');
    const shifted = input.bands.find((b) => b.id === 'FDR-OFC:line-to-line')!;
    expect(shifted.label).toMatch(/secondary L-L fault \(× 1\.155\)$/);
    const plain = input.bands.find((b) => b.id === 'FDR-OFC')!;
    assertInDelta(shifted.band.minTime(1000), plain.band.minTime(1000 * (2 / Math.sqrt(3))), 1e-9);
    expect(input.regions.some((r) => r.findingId.includes(':line-to-line:'))).toBe(true);
    expect(viewInputOf(analysed('selective'), 'office').bands.some((b) => b.id.endsWith(':line-to-line'))).toBe(false);
  });

  it("says a region of a secondary line-to-line fault spans the fault's currents by the voltage ratio, the upstream device carrying × 1.155", () => {
    const analysis = analysed('fused');
    const input = viewInputOf(analysis, 'office');
    const region = input.regions.find((r) => r.findingId.includes(':line-to-line:'))!;
    const finding = analysis.findings.find((f) => f.id === region.findingId)!;
    // The finding's range at 208 V by the voltage ratio: what the plot hatches, on its 480 V base.
    assertInDelta(region.fromAmps, (finding.range!.fromAmps * finding.referenceVolts!) / 480, 1e-12);
    expect(region.fault).toBe('secondary L-L');
    expect(region.label).toMatch(/\(the fault's current by the voltage ratio; .+ carries × 1\.155 of it\)$/);
    expect(input.regions.filter((r) => r.findingId.includes(':three-phase:')).every((r) => r.fault === undefined)).toBe(
      true,
    );
  });
});
