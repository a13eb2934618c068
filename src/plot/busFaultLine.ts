import { largestFaultOf, type FaultLevels } from '../engine/fault/index.ts';
import type { Network } from '../engine/network/index.ts';
import { formatAmps } from '../engine/quantity/format.ts';
import type { Transformer } from '../engine/study/index.ts';
import type { SheetFaultLine } from './sheetInput.ts';

/** Voltages within this relative difference are one voltage. */
const SAME_VOLTS = 1e-9;

/**
 * A bus's maximum fault current as a line on a sheet at `referenceVolts`: the larger of the three-phase
 * and line-to-ground faults, or the line-to-ground fault on a ground-fault sheet (`largestFaultOf`, as
 * the bands reach). At the bus's own voltage the line is the bus's whole fault current.
 * On a sheet at the voltage of a transformer the bus lies below, the three-phase line is the current
 * that flows through that transformer, as its primary devices and the secondary main carry it: the
 * motors on the bus's side feed the fault without passing through them (IEEE 399 current division),
 * which is also the top of the range the pair checks use. A line-to-ground fault is drawn by the voltage
 * ratio, the sheet's own convention, and its label adds the current in the transformer's primary
 * lines, which a Δ–Y unit makes smaller (IEEE C37.91). Elsewhere the line is the bus current by the
 * voltage ratio. `undefined` where the bus has no finite fault current (an infinite bus).
 *
 * @example busFaultLineOf(network, faults, 'SWBD', 12_470, false) // { amps: 1094, label: 'SWBD', through: 'through T1', … }
 */
export function busFaultLineOf(
  network: Network,
  faults: FaultLevels,
  busId: string,
  referenceVolts: number,
  ground: boolean,
): SheetFaultLine | undefined {
  const bus = network.buses.get(busId)!;
  const fault = faults.buses.get(busId)!;
  const ownAmps = largestFaultOf(fault.max, ground);
  if (!(Number.isFinite(ownAmps) && ownAmps > 0)) return undefined;
  const line: SheetFaultLine = {
    busId,
    label: ground ? `${busId} L-G` : busId,
    amps: (ownAmps * bus.voltage) / referenceVolts,
    ownVolts: bus.voltage,
    ownAmps,
    kind: 'max',
  };
  if (sameVolts(bus.voltage, referenceVolts)) return line;
  const transformer = transformerFedAt(network, busId, referenceVolts);
  if (!transformer) return line;
  const name = transformer.name ?? transformer.id;
  if (!ground) {
    // The current through the transformer is that of the three-phase fault: the label names the bus's
    // three-phase fault beside it, so the arrow joins two figures of one fault.
    const through = fault.reflected.find((r) => sameVolts(r.volts, referenceVolts));
    return through
      ? { ...line, amps: through.maxAmps, ownAmps: fault.max.threePhase, reflection: `through ${name}` }
      : line;
  }
  // The worst primary line of a line-to-ground fault, known for a fault at the transformer's own secondary bus.
  const primaryLines = transformer.to === busId && faults.transformers.get(transformer.id)?.unbalanced.lineToGround;
  return {
    ...line,
    reflection: primaryLines
      ? `by the voltage ratio; ${name}'s primary lines carry ${formatAmps(Math.max(...primaryLines.primaryLineAmps), 3)}`
      : 'by the voltage ratio',
  };
}

/** The transformer nearest above `busId` whose primary bus is at `volts`, if its path to the source has one. */
function transformerFedAt(network: Network, busId: string, volts: number): Transformer | undefined {
  for (let feeder = network.feederOf.get(busId); feeder; feeder = network.feederOf.get(feeder.item.from))
    if (feeder.type === 'transformer' && sameVolts(network.buses.get(feeder.item.from)!.voltage, volts))
      return feeder.item;
  return undefined;
}

function sameVolts(a: number, b: number): boolean {
  return Math.abs(a - b) <= SAME_VOLTS * b;
}
