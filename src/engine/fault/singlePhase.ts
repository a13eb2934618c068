import { expectedGot, InputError } from '../errors.ts';
import type { Network } from '../network/index.ts';
import type { Transformer } from '../study/index.ts';
import type { WorkStep } from '../work.ts';
import type { FaultTree } from './faultTree.ts';
import { addImpedance, formatImpedance, parallelImpedance, scaleImpedance, type Impedance } from './impedance.ts';
import { impedanceStep, num } from './workSteps.ts';
import { neutralImpedanceOf, type ZeroSequenceNetwork } from './zeroSequence.ts';

/**
 * Half-winding impedance of a 120/240 V centre-tapped unit as multiples of the full-winding per-unit
 * R and X (both on the full kVA rating, at the half-winding voltage): 1.5 × R and 1.2 × X, common
 * practice for distribution transformers without the maker's half-winding data.
 */
export const HALF_WINDING_MULTIPLIERS = Object.freeze({ r: 1.5, x: 1.2 });

/** One single-phase fault loop at a bus. */
export interface SinglePhaseLoop {
  /** Loop impedance (Ω) at `volts`. */
  z: Impedance;
  /** The loop's driving voltage (V): the full winding, or half of it for a line-to-neutral fault. */
  volts: number;
}

/** The single-phase fault loops at a bus below a single-phase transformer, for one condition. */
export interface SinglePhaseBus {
  /** "single-phase 240 V centre-tapped" or "single-phase two-wire". */
  system: string;
  /** The full-winding (line-to-line) loop. */
  lineToLine: SinglePhaseLoop;
  /** The line-to-neutral loop of a centre-tapped secondary, or the grounded-leg loop of a grounded two-wire one. */
  lineToGround?: SinglePhaseLoop;
  /** The work from the primary bus down to this bus. */
  steps: WorkStep[];
}

/** How a single-phase unit's primary winding is connected, explicit or inferred from its rated voltage. */
export function primaryConnectionOf(t: Transformer, primaryBusVolts: number): 'line-to-line' | 'line-to-neutral' {
  if (t.primaryConnection) return t.primaryConnection;
  const toNeutral = primaryBusVolts / Math.sqrt(3);
  return Math.abs(t.primary - toNeutral) < Math.abs(t.primary - primaryBusVolts) ? 'line-to-neutral' : 'line-to-line';
}

/** The secondary winding, explicit or by default: centre-tapped for a 240 V secondary (120/240 V), else two-wire. */
export function secondaryWindingOf(t: Transformer): 'two-wire' | 'centre-tapped' {
  return t.secondaryWinding ?? (Math.abs(t.secondary - 240) < 1 ? 'centre-tapped' : 'two-wire');
}

/**
 * The single-phase fault loops at every bus below a single-phase transformer (IEEE 141 / IEEE 399
 * ohmic method applied to the single-phase loop; the source seen through the loop by symmetrical
 * components). The source in the loop, referred to the full secondary winding by `(V_s / V_w)²`:
 *
 * - primary across two lines of a three-phase bus: `Z1 + Z2 = 2·Z1` at the line-to-line voltage;
 * - primary line to neutral: `(Z1 + Z2 + Z0) / 3` at the line-to-neutral voltage;
 * - primary on a single-phase bus: that bus's full-winding loop.
 *
 * Then the full-winding loop adds the transformer's `Z_T = Z_pu · V_s² / S`. A centre-tapped secondary
 * also has the line-to-neutral loop at `V_s / 2`: the source at a quarter of its full-winding value
 * (half the turns), the half winding `(1.5·R_T + j·1.2·X_T) / 4` (`HALF_WINDING_MULTIPLIERS`, common
 * practice) and the neutral grounding. Each cable adds a two-wire loop, `2 · Z_cable` (supply and
 * return of the same size, NFPA 70 Chapter 9 Table 9 method). Motors below a single-phase transformer
 * are not counted as sources.
 *
 * @example singlePhaseBusesOf(network, maxTree, zeroMax, true).get('PNL-1P')!.lineToLine.z
 */
export function singlePhaseBusesOf(
  network: Network,
  tree: FaultTree,
  zero: ZeroSequenceNetwork,
  toleranced: boolean,
): Map<string, SinglePhaseBus> {
  const { study } = network;
  const volts = (busId: string) => network.buses.get(busId)!.voltage;
  const result = new Map<string, SinglePhaseBus>();
  const order = [study.source.bus];
  for (let i = 0; i < order.length; i++) {
    const busId = order[i];
    for (const branch of network.branchesFrom.get(busId) ?? []) {
      order.push(branch.item.to);
      const above = result.get(busId);
      if (branch.type === 'switch') {
        if (above) result.set(branch.item.to, above);
        continue;
      }
      if (branch.type === 'cable') {
        if (!above) continue;
        const loop = scaleImpedance(tree.branchZ.get(branch.item.id)!, 2);
        const step = (name: string, from: Impedance, to: Impedance) =>
          impedanceStep(
            `${branch.item.to}: ${name} loop after ${branch.item.id}`,
            'Z = Z_from + 2 · Z_cable (supply and return)',
            `Z = (${formatImpedance(from)}) Ω + 2 × (${formatImpedance(tree.branchZ.get(branch.item.id)!)}) Ω`,
            to,
            'Ω',
            'two-wire loop, 2 × one-way length (NFPA 70 Chapter 9 Table 9 method)',
          );
        const lineToLine = { volts: above.lineToLine.volts, z: addImpedance(above.lineToLine.z, loop) };
        const lineToGround = above.lineToGround && {
          volts: above.lineToGround.volts,
          z: addImpedance(above.lineToGround.z, loop),
        };
        result.set(branch.item.to, {
          system: above.system,
          lineToLine,
          lineToGround,
          steps: [
            ...above.steps,
            ...tree.steps.get(branch.item.id)!.steps,
            step('full-winding', above.lineToLine.z, lineToLine.z),
            ...(lineToGround ? [step('line-to-ground', above.lineToGround!.z, lineToGround.z)] : []),
          ],
        });
        continue;
      }
      const t = branch.item;
      const index = study.transformers.indexOf(t);
      if (t.phases === 3) {
        if (above)
          throw new InputError(
            `study.transformers[${index}].phases`,
            expectedGot('1 for a transformer fed from a single-phase bus', '3'),
          );
        continue;
      }
      result.set(t.to, secondaryOf(t, index, busId, above, network, tree, zero, toleranced, volts));
    }
  }
  return result;
}

function secondaryOf(
  t: Transformer,
  index: number,
  primaryBus: string,
  above: SinglePhaseBus | undefined,
  network: Network,
  tree: FaultTree,
  zero: ZeroSequenceNetwork,
  toleranced: boolean,
  volts: (busId: string) => number,
): SinglePhaseBus {
  const steps: WorkStep[] = above ? [...above.steps] : [];
  const vP = volts(primaryBus);
  const vS = volts(t.to);
  let source: Impedance;
  let windingVolts: number;
  if (above) {
    source = above.lineToLine.z;
    windingVolts = above.lineToLine.volts;
  } else {
    const z1 = parallelImpedance(tree.toward.get(primaryBus)!, tree.below.get(primaryBus))!;
    const connection = primaryConnectionOf(t, vP);
    if (connection === 'line-to-line') {
      source = scaleImpedance(z1, 2);
      windingVolts = vP;
      steps.push(
        impedanceStep(
          `${t.id} source in the loop, primary across two lines of ${primaryBus}`,
          'Z_src = Z1 + Z2 = 2 · Z1',
          `Z_src = 2 × (${formatImpedance(z1)}) Ω`,
          source,
          'Ω',
          'symmetrical components, line-to-line loop with Z2 = Z1 (IEEE 399 short-circuit chapter)',
        ),
      );
    } else {
      const z0 = zero.atBus.get(primaryBus);
      if (!z0)
        throw new InputError(
          `study.transformers[${index}].primaryConnection`,
          expectedGot(`"line-to-line" on ${primaryBus}, which has no grounded neutral`, 'line-to-neutral'),
        );
      source = scaleImpedance(addImpedance(z1, z1, z0), 1 / 3);
      windingVolts = vP / Math.sqrt(3);
      steps.push(
        impedanceStep(
          `${t.id} source in the loop, primary line to neutral on ${primaryBus}`,
          'Z_src = (Z1 + Z2 + Z0) / 3',
          `Z_src = (2 × (${formatImpedance(z1)}) Ω + (${formatImpedance(z0)}) Ω) / 3`,
          source,
          'Ω',
          'symmetrical components, line-to-ground loop with Z2 = Z1 (IEEE 399 short-circuit chapter)',
        ),
      );
    }
  }
  const ratio = vS / windingVolts;
  const referred = scaleImpedance(source, ratio * ratio);
  steps.push(
    impedanceStep(
      `${t.id} source loop referred to the ${num(vS)} V winding`,
      'Z = Z_src · (V_s / V_w)²',
      `Z = (${formatImpedance(source)}) Ω × (${num(vS)} V / ${num(windingVolts)} V)²`,
      referred,
      'Ω',
      'per-unit method, IEEE 141 / IEEE 399',
    ),
  );
  const zT = tree.branchZ.get(t.id)!;
  steps.push(...tree.steps.get(t.id)!.steps);
  const full = addImpedance(referred, zT);
  steps.push(
    impedanceStep(
      `${t.to}: full-winding loop`,
      'Z = Z_src + Z_T',
      `Z = (${formatImpedance(referred)}) Ω + (${formatImpedance(zT)}) Ω`,
      full,
      'Ω',
      'series sum',
    ),
  );
  const winding = secondaryWindingOf(t);
  const zn = neutralImpedanceOf(t.grounding);
  const lineToLine = { z: full, volts: vS };
  if (winding === 'two-wire') {
    let lineToGround: SinglePhaseLoop | undefined;
    if (zn) {
      lineToGround = { z: addImpedance(full, zn), volts: vS };
      if (zn.r !== 0 || zn.x !== 0)
        steps.push(
          impedanceStep(
            `${t.to}: grounded-leg loop with the grounding impedance`,
            'Z = Z_full + Zn',
            `Z = (${formatImpedance(full)}) Ω + (${formatImpedance(zn)}) Ω`,
            lineToGround.z,
            'Ω',
          ),
        );
    }
    return { system: `single-phase ${num(vS)} V two-wire`, lineToLine, lineToGround, steps };
  }
  const multipliers = t.halfWinding ?? HALF_WINDING_MULTIPLIERS;
  // Per-unit on the full kVA at the half-winding voltage; ohms at V_s/2 are a quarter of ohms at V_s.
  const half = { r: (multipliers.r * zT.r) / 4, x: (multipliers.x * zT.x) / 4 };
  steps.push(
    impedanceStep(
      `${t.id} half-winding impedance at ${num(vS / 2)} V`,
      'Z_half = (k_R · R_T + j·k_X · X_T) / 4',
      `Z_half = (${num(multipliers.r)} × ${num(zT.r)} Ω + j${num(multipliers.x)} × ${num(zT.x)} Ω) / 4`,
      half,
      'Ω',
      t.halfWinding
        ? 'entered half-winding multipliers'
        : 'half-winding 1.5 × R and 1.2 × X of full-winding values, common practice',
    ),
  );
  const sourceHalf = scaleImpedance(referred, 1 / 4);
  const neutral = zn ?? { r: 0, x: 0 };
  const lineToNeutral = addImpedance(sourceHalf, half, neutral);
  steps.push(
    impedanceStep(
      `${t.to}: line-to-neutral (half-winding) loop at ${num(vS / 2)} V`,
      'Z = Z_src / 4 + Z_half + Zn',
      `Z = (${formatImpedance(referred)}) Ω / 4 + (${formatImpedance(half)}) Ω + (${formatImpedance(neutral)}) Ω`,
      lineToNeutral,
      'Ω',
      'source referred to half the turns, (1/2)²',
    ),
  );
  return {
    system: `single-phase ${num(vS / 2)}/${num(vS)} V centre-tapped`,
    lineToLine,
    lineToGround: { z: lineToNeutral, volts: vS / 2 },
    steps,
  };
}
