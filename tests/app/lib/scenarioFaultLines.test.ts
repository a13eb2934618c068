import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { scenarioFaultLinesOf } from '../../../src/app/lib/scenarioFaultLines.ts';
import { scenarioViewOf } from '../../../src/app/lib/scenarioParts.ts';
import { faultLabel } from '../../../src/plot/marks/faultLine.ts';
import { largestFaultOf } from '../../../src/engine/fault/index.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { scenariosOf } from '../../../src/engine/scenario/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

const study = parseStudy(
  readFileSync(new URL('../../../demo/harrowmere-standby-overlap.json', import.meta.url), 'utf8'),
);
const network = networkOf(study);
const scenarios = scenariosOf(study).map((s) => scenarioViewOf(study, s));
const view = (id: string) => study.views.find((v) => v.id === id)!;

describe('scenarioFaultLinesOf', () => {
  it('has the expected defaults: one maximum line per bus and level, headed by the scenarios giving it', () => {
    const lines = scenarioFaultLinesOf(network, { ...view('emergency'), faults: ['EMP'] }, scenarios);
    // The utility feeds the emergency panel alike normally and with the tie closed; the generator less.
    expect(lines.map((f) => [f.busId, f.kind, f.scenario])).toEqual([
      ['EMP', 'max', 'Normal, Dock on the office feeder'],
      ['EMP', 'max', 'On generator'],
    ]);
    const [utility, generator] = lines;
    // Each the larger of the bus's three-phase and line-to-ground faults, as far as the bands reach.
    expect(utility.ownAmps).toBe(largestFaultOf(scenarios[0].parts[0].faults.buses.get('EMP')!.max, false));
    expect(generator.ownAmps).toBe(largestFaultOf(scenarios[1].parts[0].faults.buses.get('EMP')!.max, false));
    expect(generator.ownAmps).toBeLessThan(utility.ownAmps);
    expect(faultLabel(generator, 480)).toMatch(/^On generator: EMP \d[\d.]* kA @ 480 V$/);
  });

  it('a bus no source reaches in a scenario has no line of that scenario', () => {
    const lines = scenarioFaultLinesOf(network, { ...view('emergency-generator'), faults: ['GEN'] }, scenarios);
    expect(lines.map((f) => f.scenario)).toEqual(['On generator']);
  });

  it("lines sit on the view's reference voltage, and a ground-fault view takes the line-to-ground level", () => {
    const base = { ...view('emergency'), faults: ['EMP'], referenceVoltage: 12_470 };
    const [line] = scenarioFaultLinesOf(network, base, scenarios);
    expect(line.ownVolts).toBe(480);
    // On the primary's voltage, the current through the transformer above EMP, as the view's own lines.
    const through = scenarios[0].parts[0].faults.buses.get('EMP')!.reflected.find((r) => r.volts === 12_470)!;
    expect(line.amps).toBeCloseTo(through.maxAmps, 9);
    expect(line.reflection).toMatch(/^through /);
    const [ground] = scenarioFaultLinesOf(network, { ...base, groundFault: true }, scenarios);
    expect(ground.label).toBe('EMP L-G');
    expect(ground.ownAmps).toBe(scenarios[0].parts[0].faults.buses.get('EMP')!.max.lineToGround);
  });

  it("without listed fault buses, the buses the view's devices sit on", () => {
    const lines = scenarioFaultLinesOf(network, { ...view('emergency-generator'), faults: undefined }, scenarios);
    expect(new Set(lines.map((f) => f.busId))).toEqual(new Set(['GEN', 'EMP']));
  });
});
