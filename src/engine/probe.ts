import type { Analysis } from './analysis.ts';
import { deviceFaultOf, largestFaultOf } from './fault/index.ts';
import { locationBusOf } from './network/index.ts';
import { formatAmps, formatVolts } from './quantity/format.ts';

/** One device's times at the probed current. */
export interface ProbeReading {
  deviceId: string;
  name: string;
  /** The current this device itself carries (A at its own voltage). */
  ownAmps: number;
  ownVolts: number;
  /** Earliest operation and latest clearing at that current (s); `Infinity` where it does not operate / may not clear. */
  minTime: number;
  maxTime: number;
  /**
   * The largest fault current through the device (A at its own voltage), where its band on the sheet
   * ends (`deviceFaultOf`, `largestFaultOf`); `Infinity` at an infinite bus.
   */
  largestFault?: number;
  /** The largest fault current at the device's bus, as the sheet's line at that bus shows it (A at its own voltage). */
  busFault?: number;
  /** True when the probed current is more than can flow through the device: its times are not read there. */
  beyondFault?: boolean;
}

/** What the vertical readout on the sheet shows at one current (DEVELOPERS.md, names "probe"). */
export interface Probe {
  /** The probed current on the view's reference voltage (A). */
  amps: number;
  referenceVolts: number;
  readings: ProbeReading[];
  /** The device that surely clears first (smallest `maxTime`), if any clears at all. */
  first?: string;
  /**
   * Seconds between the first device's latest clearing and the earliest operation of any other device;
   * negative when another device may operate before the first has cleared (not selective here).
   */
  margin?: number;
  /** True when the current is beyond the largest fault on the sheet (nothing is compared). */
  beyondFault?: boolean;
  /** One sentence for the readout, e.g. "FDR-MCC clears first, 0.21 s before MAIN may operate". */
  summary: string;
}

/**
 * Reads every device of a view at one current on the view's base: each device's minTime and maxTime,
 * which clears first and by how much before the next device may operate. A device that no fault drives
 * that much current through (beyond the end of its band: a main carries no current of its bus's motors)
 * is read but left out of the comparison; beyond the largest fault on the sheet the summary says so
 * instead of comparing times.
 *
 * @example probeAt(analysis, 'main-path', 20_000).first // 'FDR-MCC'
 */
export function probeAt(analysis: Analysis, viewId: string, amps: number): Probe {
  const view = analysis.study.views.find((v) => v.id === viewId);
  if (!view) throw new RangeError(`no view "${viewId}" in the study`);
  const referenceVolts = view.referenceVoltage;
  const ground = view.groundFault;
  const readings = view.devices.map((deviceId): ProbeReading => {
    const device = analysis.network.devices.get(deviceId)!;
    const bus = locationBusOf(analysis.network, device);
    const ownVolts = bus.voltage;
    const ownAmps = (amps * referenceVolts) / ownVolts;
    const band = analysis.bands.get(deviceId)!;
    const level = analysis.faults.buses.get(bus.id)?.max;
    const busFault = level ? largestFaultOf(level, ground) : Infinity;
    const largestFault = level
      ? largestFaultOf(deviceFaultOf(analysis.network, analysis.faults, device), ground)
      : Infinity;
    return {
      deviceId,
      name: device.name ?? deviceId,
      ownAmps,
      ownVolts,
      minTime: band.minTime(ownAmps),
      maxTime: band.maxTime(ownAmps),
      largestFault,
      busFault,
      // A relative tolerance keeps a probe pinned exactly on the fault line on the near side of it.
      beyondFault: ownAmps > largestFault * (1 + 1e-9),
    };
  });
  // Beyond the largest fault on the sheet no such current flows: say so rather than compare times. The
  // largest is that of the devices on the sheet's own voltage, where it has any (a primary device's own
  // bus fault, reflected, is a current no secondary fault ever draws through it).
  const own = readings.filter((r) => Math.abs(r.ownVolts - referenceVolts) <= 1e-9 * referenceVolts);
  const largest = (own.length > 0 ? own : readings).reduce<ProbeReading | undefined>(
    (a, b) => (!a || (b.busFault ?? 0) * b.ownVolts > (a.busFault ?? 0) * a.ownVolts ? b : a),
    undefined,
  );
  const largestAmps = largest ? ((largest.busFault ?? Infinity) * largest.ownVolts) / referenceVolts : Infinity;
  if (largest && amps > largestAmps * (1 + 1e-9)) {
    return {
      amps,
      referenceVolts,
      readings,
      beyondFault: true,
      summary: `Beyond the largest available fault on this sheet (${formatAmps(largest.busFault ?? Infinity, 3)} at ${formatVolts(largest.ownVolts)}): no such current flows here.`,
    };
  }
  const inReach = readings.filter((r) => !r.beyondFault);
  const clearing = inReach.filter((reading) => reading.maxTime < Infinity);
  if (clearing.length === 0) {
    const operating = inReach.filter((reading) => reading.minTime < Infinity);
    return {
      amps,
      referenceVolts,
      readings,
      summary:
        operating.length === 0
          ? 'No device operates at this current.'
          : `${operating.map((r) => r.name).join(', ')} may operate but none surely clears here.`,
    };
  }
  const first = clearing.reduce((a, b) => (b.maxTime < a.maxTime ? b : a));
  const others = inReach.filter((reading) => reading !== first);
  const nextOperating = others.reduce<ProbeReading | undefined>(
    (a, b) => (!a || b.minTime < a.minTime ? b : a),
    undefined,
  );
  const margin = nextOperating ? nextOperating.minTime - first.maxTime : undefined;
  const summary =
    !nextOperating || nextOperating.minTime === Infinity
      ? `${first.name} clears first, by ${round(first.maxTime)} s; no other device operates here.`
      : margin! >= 0
        ? `${first.name} clears first, ${round(margin!)} s before ${nextOperating.name} may operate.`
        : `${first.name} clears by ${round(first.maxTime)} s, but ${nextOperating.name} may operate ${round(-margin!)} s earlier: not selective here.`;
  return { amps, referenceVolts, readings, first: first.deviceId, margin, summary };
}

function round(seconds: number): string {
  return String(Number(seconds.toPrecision(3)));
}
