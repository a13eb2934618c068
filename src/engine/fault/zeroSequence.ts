import { expectedGot, InputError } from '../errors.ts';
import type { Network } from '../network/index.ts';
import type { Cable, Study, Transformer } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import {
  addImpedance,
  formatImpedance,
  magnitudeOf,
  scaleImpedance,
  ZERO_IMPEDANCE,
  type Impedance,
} from './impedance.ts';
import { reflectImpedance } from './reflect.ts';
import type { SourceLevel } from './sourceImpedance.ts';
import type { FaultTree } from './faultTree.ts';
import { impedanceStep, num, withLazySteps } from './workSteps.ts';

/** A neutral grounding as entered on a source or transformer secondary. */
export type Grounding = Transformer['grounding'];

/**
 * Zero-sequence impedance of a cable as a multiple of its positive-sequence impedance when no Z0 is
 * entered, by conduit type. `Z0 ≈ 3 · Z1` is a screening value for three conductors with the return
 * through the raceway and the equipment grounding conductor (common practice); enter the cable's R0/X0
 * (`zeroSequence`) where the ground return matters.
 */
export const CABLE_ZERO_SEQUENCE_MULTIPLE: Readonly<Record<Cable['conduit'], number>> = {
  steel: 3,
  aluminium: 3,
  pvc: 3,
};

/**
 * The neutral impedance a grounding puts in series, in ohms: 0 solid, `R` or `jX` for a resistor or
 * reactor; `undefined` for an ungrounded neutral (no zero-sequence path). The zero-sequence network
 * carries it three times (`3·Zn`), since all three sequence currents flow through it.
 *
 * @example neutralImpedanceOf({ kind: 'resistance', ohms: 1.39 }) // { r: 1.39, x: 0 }
 */
export function neutralImpedanceOf(grounding: Grounding | undefined): Impedance | undefined {
  if (!grounding || grounding.kind === 'solid') return ZERO_IMPEDANCE;
  if (grounding.kind === 'ungrounded') return undefined;
  const ohms = grounding.ohms ?? 0;
  return grounding.kind === 'resistance' ? { r: ohms, x: 0 } : { r: 0, x: ohms };
}

/**
 * The source's zero-sequence impedance in ohms at its bus, neutral grounding included; `undefined` for
 * an ungrounded source. With a line-to-ground level given, `|2·Z1 + Z0| = √3·V / I_LG` and Z0 is taken
 * at Z1's angle (common practice); that level is the current available at the bus, so it already holds
 * the neutral grounding and `3·Zn` is not added again. `kept`, the Z0 another condition's level fixed
 * (the maximum's, for a minimum without zero-sequence data), is taken as it is, for the same reason.
 * Else `Z0 = R0/R1 · R1 + j · X0/X1 · X1 + 3·Zn`, both ratios 1 by default: a solidly grounded source
 * with Z0 = Z1 (common practice for a utility with no data).
 *
 * @example sourceZeroSequenceOf({ available: { va: 250e6 }, xr: 12 }, { r: 0.0000511, x: 0.000613 }, 480, { kind: 'solid' })
 */
export function sourceZeroSequenceOf(
  level: SourceLevel | undefined,
  z1: Impedance,
  volts: number,
  grounding: Grounding | undefined,
  path = 'study.source.max',
  kept?: Impedance,
): { z0: Impedance | undefined; steps: WorkStep[] } {
  const zn = neutralImpedanceOf(grounding);
  if (!zn)
    return {
      z0: undefined,
      steps: [
        {
          label: 'source neutral ungrounded: no zero-sequence path',
          formula: 'Z0 = ∞',
          substituted: 'Z0 = ∞',
          value: Infinity,
          unit: 'Ω',
        },
      ],
    };
  const steps: WorkStep[] = [];
  if (kept) {
    steps.push(
      impedanceStep(
        `source zero-sequence impedance at ${num(volts)} V, kept from the maximum's line-to-ground level`,
        'Z0_min = Z0_max',
        `Z0 = (${formatImpedance(kept)}) Ω`,
        kept,
        'Ω',
        'the zero-sequence path of a utility source does not change with the system behind its grounded transformers (IEEE 399 short-circuit chapter; IEEE 142)',
      ),
    );
    return { z0: kept, steps };
  }
  if (level?.lineToGround) {
    const amps = level.lineToGround.amps ?? level.lineToGround.va! / (Math.sqrt(3) * volts);
    const loop = (Math.sqrt(3) * volts) / amps;
    const m1 = magnitudeOf(z1);
    const m0 = loop - 2 * m1;
    if (!(m0 >= 0))
      throw new InputError(
        `${path}.lineToGround`,
        expectedGot('a line-to-ground level at most 1.5 times the three-phase level', `${num(amps)} A`),
      );
    const z0 = m1 === 0 ? { r: 0, x: m0 } : scaleImpedance(z1, m0 / m1);
    steps.push(
      impedanceStep(
        `source zero-sequence impedance from its line-to-ground level at ${num(volts)} V (neutral grounding included)`,
        '|Z0| = √3 · V / I_LG − 2·|Z1|, at the angle of Z1',
        `|Z0| = 1.7320508 × ${num(volts)} V / ${num(amps)} A − 2 × ${num(m1)} Ω`,
        z0,
        'Ω',
        'symmetrical components, I_LG = 3·V_LN / |Z1 + Z2 + Z0| (IEEE 399 short-circuit chapter); Z0 angle common practice',
      ),
    );
    // The available line-to-ground current already flows through the neutral grounding: no 3·Zn on top.
    return { z0, steps };
  }
  const x0x1 = level?.x0x1 ?? 1;
  const r0r1 = level?.r0r1 ?? level?.x0x1 ?? 1;
  const z0 = { r: z1.r * r0r1, x: z1.x * x0x1 };
  steps.push(
    impedanceStep(
      `source zero-sequence impedance at ${num(volts)} V`,
      'Z0 = (R0/R1)·R1 + j(X0/X1)·X1',
      `Z0 = ${num(r0r1)} × ${num(z1.r)} Ω + j${num(x0x1)} × ${num(z1.x)} Ω`,
      z0,
      'Ω',
      level?.x0x1 === undefined && level?.r0r1 === undefined
        ? 'no zero-sequence data: Z0 = Z1, a solidly grounded source (common practice)'
        : 'entered ratios',
    ),
  );
  if (zn.r === 0 && zn.x === 0) return { z0, steps };
  const total = addImpedance(z0, scaleImpedance(zn, 3));
  steps.push(groundingStep('source', z0, zn, total));
  return { z0: total, steps };
}

/** The work step adding `3·Zn` to a zero-sequence impedance. */
function groundingStep(what: string, z0: Impedance, zn: Impedance, total: Impedance): WorkStep {
  return impedanceStep(
    `${what} neutral grounding impedance, three times in the zero-sequence network`,
    'Z0 = Z0 + 3·Zn',
    `Z0 = (${formatImpedance(z0)}) Ω + 3 × (${formatImpedance(zn)}) Ω`,
    total,
    'Ω',
    'symmetrical components (IEEE 142 / IEEE 399)',
  );
}

/**
 * The zero-sequence impedance of a cable in ohms: entered `zeroSequence` R0/X0 per 1000 ft, else
 * `CABLE_ZERO_SEQUENCE_MULTIPLE` × its positive-sequence impedance at the same temperature.
 *
 * @example cableZeroSequenceOf(cable, { r: 0.00145, x: 0.0024 }) // { r: 0.00435, x: 0.0072 }
 */
export function cableZeroSequenceOf(cable: Cable, z1: Impedance): { z0: Impedance; readonly steps: WorkStep[] } {
  // The step is written when first read: a study has thousands of cables, and work is read for a few.
  if (cable.zeroSequence) {
    const { resistance, reactance } = cable.zeroSequence;
    const feet = cable.length / 0.3048;
    const z0 = {
      r: (resistance * feet) / 1000 / cable.sets,
      x: (reactance * feet) / 1000 / cable.sets,
    };
    return withLazySteps({ z0 }, () => [
      impedanceStep(
        `${cable.id} zero-sequence impedance`,
        'Z0 = (R0 + jX0) · L / 1000 / n',
        `Z0 = (${num(resistance)} + j${num(reactance)}) Ω/1000 ft × ${num(feet)} ft / 1000 / ${cable.sets}`,
        z0,
        'Ω',
        'cable data',
      ),
    ]);
  }
  const k = CABLE_ZERO_SEQUENCE_MULTIPLE[cable.conduit];
  const z0 = scaleImpedance(z1, k);
  return withLazySteps({ z0 }, () => [
    impedanceStep(
      `${cable.id} zero-sequence impedance (no R0/X0 entered)`,
      `Z0 = ${k} · Z1`,
      `Z0 = ${k} × (${formatImpedance(z1)}) Ω`,
      z0,
      'Ω',
      `Z0 ≈ ${k} × Z1 for cable in ${cable.conduit} conduit, common practice`,
    ),
  ]);
}

/** The zero-sequence network at each three-phase bus for one condition. */
export interface ZeroSequenceNetwork {
  /** Zero-sequence Thevenin impedance at each bus (Ω at its voltage); undefined where no path reaches it. */
  atBus: Map<string, Impedance | undefined>;
  /** The steps that produce each element's own zero-sequence impedance, by element id (written when first read). */
  steps: Map<string, { readonly steps: WorkStep[] }>;
}

/**
 * The zero-sequence Thevenin impedance at every three-phase bus (symmetrical components, IEEE 399
 * short-circuit chapter; transformer zero-sequence connections per IEEE C57.12.00 / IEEE 142 practice):
 * the source's Z0 (`sourceZeroSequenceOf`, or `keptSourceZ0` where given) at its bus; a cable adds its Z0; a Δ–Yg transformer starts a new path
 * at its secondary, `Z0_T + 3·Zn` (the delta traps zero sequence, so nothing upstream is seen); a
 * Yg–Yg transformer passes the primary network through, `Z0_up·(V_s/V_p)² + Z0_T + 3·Zn`; Δ–Δ and Y–Δ
 * secondaries have none. Transformers take `Z0_T = Z1_T` (common practice for three-legged core and
 * shell units without test data). Motors have ungrounded neutrals and add nothing. Buses below a
 * single-phase transformer are not in this network.
 *
 * @example zeroSequenceOf(network, maxTree, study.source.max).atBus.get('SWBD')
 */
export function zeroSequenceOf(
  network: Network,
  tree: FaultTree,
  level: SourceLevel | undefined,
  levelPath = 'study.source.max',
  keptSourceZ0?: Impedance,
): ZeroSequenceNetwork {
  const study: Study = network.study;
  const volts = (busId: string) => network.buses.get(busId)!.voltage;
  const steps = new Map<string, { readonly steps: WorkStep[] }>();
  const root = study.source.bus;
  const sourceGrounding = study.source.kind === 'infinite' ? undefined : study.source.grounding;
  const source = sourceZeroSequenceOf(
    level,
    tree.branchZ.get(study.source.id)!,
    volts(root),
    sourceGrounding,
    levelPath,
    keptSourceZ0,
  );
  steps.set(study.source.id, { steps: source.steps });
  const atBus = new Map<string, Impedance | undefined>([[root, source.z0]]);
  const order = [root];
  for (let i = 0; i < order.length; i++)
    for (const branch of network.branchesFrom.get(order[i]) ?? []) {
      if (branch.type === 'transformer' && branch.item.phases === 1) continue;
      order.push(branch.item.to);
      const up = atBus.get(branch.item.from);
      if (branch.type === 'switch') {
        atBus.set(branch.item.to, up);
        continue;
      }
      if (branch.type === 'cable') {
        const cable = branch.item;
        const own = cableZeroSequenceOf(cable, tree.branchZ.get(cable.id)!);
        steps.set(cable.id, own);
        atBus.set(cable.to, up && addImpedance(up, own.z0));
        continue;
      }
      const t = branch.item;
      const zT = tree.branchZ.get(t.id)!;
      const zn = neutralImpedanceOf(t.grounding);
      const wyeSecondary = t.connection === 'delta-wye' || t.connection === 'wye-wye';
      const own: WorkStep[] = [];
      let z0: Impedance | undefined;
      if (!wyeSecondary || !zn) {
        own.push({
          label: `${t.id} secondary (${t.connection}${wyeSecondary ? ', neutral ungrounded' : ''}): no zero-sequence path`,
          formula: 'Z0 = ∞',
          substituted: 'Z0 = ∞, I_LG = 0',
          value: Infinity,
          unit: 'Ω',
          source: 'ungrounded system: a bolted line-to-ground fault draws only charging current (IEEE 142)',
        });
      } else {
        const through =
          t.connection === 'wye-wye' ? up && reflectImpedance(up, volts(t.from), volts(t.to)) : ZERO_IMPEDANCE;
        if (through) {
          const base = addImpedance(through, zT);
          own.push(
            impedanceStep(
              `${t.id} zero-sequence impedance (${t.connection})`,
              t.connection === 'wye-wye'
                ? 'Z0 = Z0_up · (V_s / V_p)² + Z0_T, Z0_T = Z1_T'
                : 'Z0 = Z0_T = Z1_T (delta traps zero sequence)',
              t.connection === 'wye-wye'
                ? `Z0 = (${formatImpedance(through)}) Ω + (${formatImpedance(zT)}) Ω`
                : `Z0 = (${formatImpedance(zT)}) Ω`,
              base,
              'Ω',
              'transformer zero-sequence connections (IEEE 399 short-circuit chapter); Z0_T = Z1_T common practice',
            ),
          );
          z0 = addImpedance(base, scaleImpedance(zn, 3));
          if (zn.r !== 0 || zn.x !== 0) own.push(groundingStep(t.id, base, zn, z0));
        }
      }
      steps.set(t.id, { steps: own });
      atBus.set(t.to, z0);
    }
  return { atBus, steps };
}
