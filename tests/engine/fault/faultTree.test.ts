import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  faultLevelsOf,
  faultTreeOf,
  MAXIMUM_FAULT_TEMPERATURE,
  motorImpedanceOf,
} from '../../../src/engine/fault/index.ts';
import { cableImpedanceOf } from '../../../src/engine/conductors/index.ts';
import { networkOf, type Network } from '../../../src/engine/network/index.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { radialStudy } from '../../../bench/radialStudy.ts';
import { assertInDelta } from '../../asserts.ts';
import { case72Input, study } from './studies.ts';

type C = [number, number];
const sub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
const inv = (z: { r: number; x: number }): C => div([1, 0], [z.r, z.x]);

/** Solves Y·v = e_k by Gaussian elimination with partial pivoting (complex), returning v_k = Z_kk. */
function drivingPointImpedance(y: C[][], k: number): C {
  const n = y.length;
  const a = y.map((row, i) => [...row.map((c) => [...c] as C), (i === k ? [1, 0] : [0, 0]) as C]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.hypot(...a[r][col]) > Math.hypot(...a[pivot][col])) pivot = r;
    [a[col], a[pivot]] = [a[pivot], a[col]];
    for (let r = col + 1; r < n; r++) {
      const f = div(a[r][col], a[col][col]);
      for (let c = col; c <= n; c++) a[r][c] = sub(a[r][c], mul(f, a[col][c]));
    }
  }
  const v: C[] = new Array(n);
  for (let r = n - 1; r >= 0; r--) {
    let acc = a[r][n];
    for (let c = r + 1; c < n; c++) acc = sub(acc, mul(a[r][c], v[c]));
    v[r] = div(acc, a[r][r]);
  }
  return v[k];
}

/** A random radial 480 V tree below the 750 kVA worked-case transformer: each new bus hangs off an earlier one. */
const treeArbitrary = fc.array(
  fc.record({
    parent: fc.nat(),
    feet: fc.double({ min: 5, max: 400, noNaN: true }),
    size: fc.constantFrom('4/0', '500 kcmil', '2 AWG', '1/0'),
    motorAmps: fc.option(fc.double({ min: 10, max: 400, noNaN: true }), { nil: undefined }),
  }),
  { minLength: 1, maxLength: 8 },
);

function studyOf(nodes: { parent: number; feet: number; size: string; motorAmps: number | undefined }[]) {
  const input = case72Input();
  input.cables = [];
  input.motors = [];
  const names = ['LV'];
  nodes.forEach((node, i) => {
    const id = `B${i}`;
    input.buses.push({ id, voltage: 480 });
    input.cables!.push({
      id: `C${i}`,
      from: names[node.parent % names.length],
      to: id,
      size: node.size,
      length: node.feet,
    });
    if (node.motorAmps !== undefined) input.motors!.push({ id: `M${i}`, bus: id, fullLoadAmps: node.motorAmps });
    names.push(id);
  });
  input.buses = input.buses.filter((b) => b.id !== 'PNL');
  return input as StudyInput;
}

/** The maximum-fault tree of a utility-fed network, as `faultLevelsOf` builds it. */
function maximumTreeOf(network: Network) {
  const { source } = network.study;
  return faultTreeOf(network, {
    kind: 'max',
    level: source.kind === 'utility' ? source.max : undefined,
    motors: true,
    temperature: MAXIMUM_FAULT_TEMPERATURE,
    toleranced: true,
  });
}

describe('faultTreeOf', () => {
  it('has the expected defaults', () => {
    // With no motors nothing hangs below any bus, and `toward` is the plain source path.
    const network = networkOf(study(case72Input()));
    const tree = faultTreeOf(network, {
      kind: 'max',
      level: undefined,
      motors: false,
      temperature: MAXIMUM_FAULT_TEMPERATURE,
      toleranced: false,
    });
    expect(tree.order).toEqual(['MV', 'LV', 'PNL']);
    expect(tree.below.get('LV')).toBeUndefined();
    expect(tree.toward.get('MV')).toEqual({ r: 0, x: 0 });
  });

  it('the Thevenin reduction equals a direct nodal solution of the same network (property)', () => {
    fc.assert(
      fc.property(treeArbitrary, (nodes) => {
        const s = study(studyOf(nodes));
        const network = networkOf(s);
        const levels = faultLevelsOf(network);
        // Nodal admittance matrix at 480 V: the source path to LV as a shunt, cables as branches, motors as shunts.
        const ids = s.buses.filter((b) => b.voltage === 480).map((b) => b.id);
        const index = new Map(ids.map((id, i) => [id, i]));
        const y: C[][] = ids.map(() => ids.map((): C => [0, 0]));
        const addShunt = (i: number, adm: C) => (y[i][i] = [y[i][i][0] + adm[0], y[i][i][1] + adm[1]]);
        // No motors sit above LV, so the reduced path toward the source from LV is the utility plus transformer.
        const condition = { kind: 'max' as const, level: s.source.kind === 'utility' ? s.source.max : undefined };
        const tree = faultTreeOf(network, {
          ...condition,
          motors: true,
          temperature: MAXIMUM_FAULT_TEMPERATURE,
          toleranced: true,
        });
        const sourcePath = tree.toward.get('LV')!;
        addShunt(0, inv(sourcePath));
        s.cables.forEach((cable, i) => {
          const adm = inv(
            cableImpedanceOf(cable, { temperature: MAXIMUM_FAULT_TEMPERATURE, path: `study.cables[${i}]` }).z,
          );
          const a = index.get(cable.from)!;
          const b = index.get(cable.to)!;
          addShunt(a, adm);
          addShunt(b, adm);
          y[a][b] = sub(y[a][b], adm);
          y[b][a] = sub(y[b][a], adm);
        });
        for (const motor of s.motors) addShunt(index.get(motor.bus)!, inv(motorImpedanceOf(motor, 480).z));
        for (const id of ids) {
          const z = drivingPointImpedance(y, index.get(id)!);
          const amps = 480 / (Math.sqrt(3) * Math.hypot(...z));
          assertInDelta(levels.buses.get(id)!.max.threePhase, amps, 1e-9);
        }
      }),
      { numRuns: 60 },
    );
  });

  it('takes the element impedances of a tree with the same source, temperature and tolerance, and no others', () => {
    const network = networkOf(study(case72Input()));
    const max = maximumTreeOf(network);
    const withoutMotors = { ...max.condition, motors: false };
    const taken = faultTreeOf(network, withoutMotors, max);
    const computed = faultTreeOf(network, withoutMotors);
    expect(taken.toward).toEqual(computed.toward);
    expect(taken.below).toEqual(computed.below);
    expect(taken.branchZ).toEqual(computed.branchZ);
    for (const id of computed.branchZ.keys()) expect(taken.steps.get(id)!.steps).toEqual(computed.steps.get(id)!.steps);
    expect(max.steps.get('NO-SUCH-ELEMENT')).toBeUndefined();
    expect(taken.branchZ.get('C')).toBe(max.branchZ.get('C'));
    // At 90 °C the cables' resistance differs, so nothing is taken from the 20 °C tree.
    const hot = faultTreeOf(network, { ...withoutMotors, temperature: 90 }, max);
    expect(hot.branchZ.get('C')!.r).toBeGreaterThan(max.branchZ.get('C')!.r);
  });

  it("works out a motor's steps where the condition counts motors, and gives none where it does not", () => {
    const generated = parseStudy(radialStudy(25));
    const network = networkOf(generated);
    const max = maximumTreeOf(network);
    const bare = faultTreeOf(network, { ...max.condition, motors: false }, max);
    const motor = generated.motors[0];
    // The first step is the motor's own full-load current; the same steps each time they are read.
    expect(max.steps.get(motor.id)!.steps[0].label).toMatch(new RegExp(motor.id));
    expect(max.steps.get(motor.id)!.steps).toEqual(max.steps.get(motor.id)!.steps);
    expect(max.motorZ.get(motor.id)).toEqual(motorImpedanceOf(motor, 480).z);
    expect(bare.steps.get(motor.id)).toBeUndefined();
  });
});
