import type { Probe } from '../../engine/probe.ts';
import { significant } from '../../engine/quantity/index.ts';
import { csvCell as safeCsvCell } from '../../engine/report/csv.ts';
import { CAUTION } from './caution.ts';

/**
 * Pinned probes as CSV: one row per probe and device, with the current on the sheet's base and at
 * the device's own voltage, both times (blank where the device does not operate), which device
 * clears first and the margin.
 *
 * @example probesCsv(probes).split('\n')[1] // 'amps at reference,reference V,device,…'
 */
export function probesCsv(probes: readonly Probe[]): string {
  const time = (seconds: number) => (Number.isFinite(seconds) ? significant(seconds, 6) : '');
  const rows = [
    [`# ${CAUTION}`],
    [
      'amps at reference',
      'reference V',
      'device',
      'own amps',
      'own V',
      'min time s',
      'max time s',
      'clears first',
      'margin s',
    ],
    ...probes.flatMap((probe) =>
      probe.readings.map((r) => [
        significant(probe.amps, 6),
        significant(probe.referenceVolts, 6),
        r.deviceId,
        significant(r.ownAmps, 6),
        significant(r.ownVolts, 6),
        time(r.minTime),
        time(r.maxTime),
        probe.first === r.deviceId ? 'yes' : '',
        probe.first === r.deviceId && probe.margin !== undefined ? significant(probe.margin, 6) : '',
      ]),
    ),
  ];
  return `${rows.map((row) => row.map(csvCell).join(',')).join('\n')}\n`;
}

/**
 * One CSV cell, quoted when it holds a comma, quote or line break (RFC 4180), with formula
 * injection neutralised (a device id or name starting with `=`, `+`, `-`, `@`, tab or CR is
 * prefixed with an apostrophe): the same rule as the findings CSV.
 * @example csvCell('a, b') // '"a, b"'
 */
export function csvCell(value: string): string {
  return safeCsvCell(value);
}
