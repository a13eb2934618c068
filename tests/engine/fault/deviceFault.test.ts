import { describe, expect, it } from 'vitest';
import { deviceFaultOf, faultLevelsOf, throughFaultOf } from '../../../src/engine/fault/index.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { abs, add, div, mul, par, scale, type C } from './perUnit.ts';
import { singlePhaseInput } from './sequenceReference.ts';
import { motorStudy, motorStudyPerUnit, tripUnit } from './studies.ts';

// Every source feeding a fault just below a device through it, in parallel (the hand solution of `motorStudy`).
const { ib, zs, zt, zm1, zm2, zc } = motorStudyPerUnit;
const sub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
const one: C = [1, 0];

describe('deviceFaultOf', () => {
  const study = parseStudy(motorStudy());
  const network = networkOf(study);
  const faults = faultLevelsOf(network);
  const fault = (id: string) => deviceFaultOf(network, faults, network.devices.get(id)!);
  const swbd = faults.buses.get('SWBD')!.max;

  it('a main carries what its transformer passes, not its bus motors: Z_S + Z_T alone', () => {
    assertInDelta(fault('MAIN').threePhase, ib / abs(add(zs, zt)), 1e-9);
    expect(fault('MAIN').threePhase).toBeLessThan(swbd.threePhase);
  });

  it('a feeder carries the source side and the switchboard motor, not the motors below it', () => {
    assertInDelta(fault('F').threePhase, ib / abs(par(add(zs, zt), zm1)), 1e-9);
  });

  it("a motor's device carries everything at its bus but that motor", () => {
    // The MCC total is the source side through the cable in parallel with M2; FM carries all of it but M2's part.
    const toward = add(par(add(zs, zt), zm1), zc);
    assertInDelta(fault('FM').threePhase, ib / abs(toward), 1e-9);
    const total = faults.buses.get('MCC')!.max.threePhase;
    assertInDelta(fault('FM').threePhase, ib * abs(sub(div(one, par(toward, zm2)), div(one, zm2))), 1e-9);
    expect(fault('FM').threePhase).toBeLessThan(total);
  });

  it("the transformer's primary relay carries the utility's own 250 MVA, not the motors' back-feed through the transformer", () => {
    // 250 MVA / (√3 · 12.47 kV) = 11.575 kA; the 12.47 kV bus total also has the motors in it.
    assertInDelta(fault('R').threePhase, 250e6 / (Math.sqrt(3) * 12470), 1e-9);
    expect(fault('R').threePhase).toBeLessThan(faults.buses.get('MV')!.max.threePhase);
  });

  it('line-to-ground through the main: I0 · (2·c1 + 1), c1 its share of the positive sequence (symmetrical components, IEEE 399)', () => {
    const z1 = par(par(add(zs, zt), zm1), add(zc, zm2));
    const i0 = div(one, add(z1, z1, zt));
    const c1 = div(z1, add(zs, zt));
    assertInDelta(fault('MAIN').lineToGround, ib * abs(mul(i0, add(scale(c1, 2), one))), 1e-9);
    expect(fault('MAIN').lineToGround).toBeLessThan(swbd.lineToGround);
  });

  it('on a single-phase bus a device carries the bus fault itself; at an infinite bus there is no limit', () => {
    // No motor contributes below a single-phase unit, so the panel's devices carry its own fault currents.
    const single = singlePhaseInput();
    single.devices = [
      { id: 'PM', feeds: 'S', characteristic: tripUnit(200) },
      { id: 'PF', feeds: 'C', characteristic: tripUnit(100) },
    ];
    const singleNetwork = networkOf(parseStudy(single));
    const singleFaults = faultLevelsOf(singleNetwork);
    for (const id of ['PM', 'PF']) {
      const through = deviceFaultOf(singleNetwork, singleFaults, singleNetwork.devices.get(id)!);
      expect(through).toEqual({
        threePhase: singleFaults.buses.get('S')!.max.threePhase,
        lineToGround: singleFaults.buses.get('S')!.max.lineToGround,
      });
    }
    // Through two devices in series there alike, the line-to-line fault being the bus's own.
    const pair = throughFaultOf(singleNetwork, singleFaults, singleNetwork.devices.get('PM')!, 'S');
    expect(pair.lineToLine).toBe(singleFaults.buses.get('S')!.max.lineToLine);
    const infinite = motorStudy();
    infinite.source = { kind: 'infinite', id: 'U', bus: 'MV' };
    const infiniteNetwork = networkOf(parseStudy(infinite));
    const relay = deviceFaultOf(infiniteNetwork, faultLevelsOf(infiniteNetwork), infiniteNetwork.devices.get('R')!);
    expect(relay.threePhase).toBe(Infinity);
  });
});
