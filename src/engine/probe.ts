import type { Analysis } from './analysis.ts';
import { locationBusOf } from './network/index.ts';

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
}

/** What the vertical readout on the sheet shows at one current (DESIGN §3 "probe"). */
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
  /** One sentence for the readout, e.g. "FDR-MCC clears first, 0.21 s before MAIN may operate". */
  summary: string;
}

/**
 * Reads every device of a view at one current on the view's base: each device's minTime and maxTime,
 * which clears first and by how much before the next device may operate.
 *
 * @example probeAt(analysis, 'main-path', 20_000).first // 'FDR-MCC'
 */
export function probeAt(analysis: Analysis, viewId: string, amps: number): Probe {
  const view = analysis.study.views.find((v) => v.id === viewId);
  if (!view) throw new RangeError(`no view "${viewId}" in the study`);
  const referenceVolts = view.referenceVoltage;
  const readings = view.devices.map((deviceId): ProbeReading => {
    const device = analysis.network.devices.get(deviceId)!;
    const ownVolts = locationBusOf(analysis.network, device).voltage;
    const ownAmps = (amps * referenceVolts) / ownVolts;
    const band = analysis.bands.get(deviceId)!;
    return {
      deviceId,
      name: device.name ?? deviceId,
      ownAmps,
      ownVolts,
      minTime: band.minTime(ownAmps),
      maxTime: band.maxTime(ownAmps),
    };
  });
  const clearing = readings.filter((reading) => reading.maxTime < Infinity);
  if (clearing.length === 0) {
    const operating = readings.filter((reading) => reading.minTime < Infinity);
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
  const others = readings.filter((reading) => reading !== first);
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
