import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { faultLevelsOf, throughFaultOf } from '../../../src/engine/fault/index.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';
import { assertInDelta } from '../../asserts.ts';
import { abs, add, div, mul, par, scale, type C } from './perUnit.ts';
import { motorStudy, motorStudyPerUnit } from './studies.ts';

const { ib, zs, zt, zm1, zm2, zc } = motorStudyPerUnit;
const one: C = [1, 0];

describe('throughFaultOf', () => {
  const study = parseStudy(motorStudy());
  const network = networkOf(study);
  const faults = faultLevelsOf(network);
  const device = (id: string) => network.devices.get(id)!;

  it('main over the MCC feeder, fault just below the feeder: the source side alone, not the switchboard motors', () => {
    const through = throughFaultOf(network, faults, device('MAIN'), 'SWBD');
    assertInDelta(through.threePhase, ib / abs(add(zs, zt)), 1e-9);
    // The bus total also has M1 and M2 (through the cable) in it.
    const total = ib / abs(par(par(add(zs, zt), zm1), add(zc, zm2)));
    assertInDelta(faults.buses.get('SWBD')!.max.threePhase, total, 1e-9);
    expect(through.threePhase).toBeLessThan(total);
    assertInDelta(through.lineToLine, (Math.sqrt(3) / 2) * through.threePhase, 1e-12);
  });

  it('the MCC feeder over the motor feeder: the switchboard motors pass through both, the MCC motor does not', () => {
    const toward = add(par(add(zs, zt), zm1), zc);
    assertInDelta(throughFaultOf(network, faults, device('F'), 'MCC').threePhase, ib / abs(toward), 1e-9);
  });

  it('two buses up, the current divides at the switchboard: the main carries I · Z_M1 / (Z_S + Z_T + Z_M1)', () => {
    const toward = add(par(add(zs, zt), zm1), zc);
    const arriving = div(one, toward);
    const share = div(zm1, add(zs, zt, zm1));
    assertInDelta(
      throughFaultOf(network, faults, device('MAIN'), 'MCC').threePhase,
      ib * abs(mul(arriving, share)),
      1e-9,
    );
  });

  it('line-to-ground through the main: I0 · (2·c1 + 1), c1 the share of positive sequence from the source side (symmetrical components, IEEE 399)', () => {
    const z1 = par(par(add(zs, zt), zm1), add(zc, zm2));
    const i0 = div(one, add(z1, z1, zt));
    const c1 = div(z1, add(zs, zt));
    const expected = ib * abs(mul(i0, add(scale(c1, 2), one)));
    assertInDelta(throughFaultOf(network, faults, device('MAIN'), 'SWBD').lineToGround, expected, 1e-9);
    // Below the bus total, since the motors carry no zero sequence but do carry positive sequence.
    expect(expected).toBeLessThan(faults.buses.get('SWBD')!.max.lineToGround);
  });

  it('the pair checks end their ranges there, and the relay over the main gets the Δ–Y line-to-line case shifted by exactly 2/√3', () => {
    const analysis = analyseStudy(study);
    const pair = (up: string, down: string) => analysis.pairs.find((p) => p.upstream === up && p.downstream === down)!;
    assertInDelta(pair('MAIN', 'F').cases[0].intervals.at(-1)!.toAmps, ib / abs(add(zs, zt)), 1e-9);
    const relay = pair('R', 'MAIN');
    const lineToLine = relay.cases.find((c) => c.fault === 'line-to-line')!;
    expect(lineToLine.upstreamShift).toBe(2 / Math.sqrt(3));
    assertInDelta(lineToLine.intervals.at(-1)!.toAmps, (Math.sqrt(3) / 2) * (ib / abs(add(zs, zt))), 1e-9);
  });

  it('never exceeds the bus total, and falls going up past motor buses (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 2000, noNaN: true }),
        fc.double({ min: 10, max: 2000, noNaN: true }),
        fc.double({ min: 5, max: 1000, noNaN: true }),
        (fla1, fla2, feet) => {
          const input = motorStudy();
          input.motors = [
            { id: 'M1', bus: 'SWBD', fullLoadAmps: fla1 },
            { id: 'M2', bus: 'MCC', fullLoadAmps: fla2 },
          ];
          input.cables![0].length = `${feet} ft`;
          const net = networkOf(parseStudy(input));
          const levels = faultLevelsOf(net);
          const at = (id: string, bus: string) => throughFaultOf(net, levels, net.devices.get(id)!, bus);
          const total = levels.buses.get('MCC')!.max;
          const feeder = at('F', 'MCC');
          const main = at('MAIN', 'MCC');
          return (
            feeder.threePhase <= total.threePhase * (1 + 1e-12) &&
            main.threePhase <= feeder.threePhase * (1 + 1e-12) &&
            feeder.lineToGround <= total.lineToGround * (1 + 1e-12)
          );
        },
      ),
      { numRuns: 100 },
    );
  });
});
