import { bandOf } from '../../engine/band.ts';
import { readCharacteristic, type Characteristic } from '../../engine/devices/index.ts';
import { expectedGot, InputError } from '../../engine/errors.ts';
import { locationBusOf, networkOf } from '../../engine/network/index.ts';
import { formatVolts, parseQuantity, significant } from '../../engine/quantity/index.ts';
import { outsidePhysicalRange, PHYSICAL_RANGES } from '../../engine/study/fields.ts';
import { readStudy } from '../../engine/study/index.ts';
import { flagText, parseArgs, requiredFlag } from '../args.ts';
import type { Command } from '../command.ts';
import { readJsonFile } from '../studyFile.ts';
import { formatTable, tableAmps } from '../table.ts';

const HELP = `discern band <device-or-study.json> [--device id] --amps 100,1000,… [--json]

  --amps     currents at the device's own voltage (A, or text such as "2 kA"), separated by commas
  --device   the device id, when the file is a study with more than one device
  --json     print the times as JSON (null where the device does not operate)

The file may be a study, one device ({ "id", "characteristic", … }) or a bare characteristic.
minTime is the earliest operation, maxTime the latest clearing; relays are in primary amperes.
The header says the voltage the currents are at: the device's bus voltage in a study, else the
device's own (unstated) voltage.
`;

/**
 * `discern band <file> --amps a,b,…`: a device's band (minTime and maxTime) at the given currents,
 * "no operation" where a time is infinite. Bad files, flags or currents throw `InputError` (exit 2).
 *
 * @example await bandCommand.run(['tests/fixtures/devices/feeder-relay.json', '--amps', '600,6000'], io)
 */
export const bandCommand: Command = {
  verb: 'band',
  summary: "a device's earliest operating and latest clearing times at given currents",
  help: HELP,
  async run(args, io) {
    const parsed = parseArgs(args, { amps: 'value', device: 'value', json: 'switch', help: 'switch' });
    if (parsed.flags.has('help')) {
      io.stdout(HELP);
      return 0;
    }
    const [path, extra] = parsed.positionals;
    if (path === undefined) throw new InputError('band', expectedGot('a device or study file', undefined));
    if (extra !== undefined) throw new InputError('band', expectedGot('one file', extra));
    const amps = ampsOf(requiredFlag(parsed, 'amps', 'currents in amperes separated by commas'));
    const { id, characteristic, volts } = deviceOf(path, io.readText, flagText(parsed, 'device'));
    const primary = characteristic.kind === 'relay' ? ' primary' : '';
    const at = volts === undefined ? "the device's own voltage" : formatVolts(volts);
    const band = bandOf(characteristic);
    const rows = amps.map((current) => ({
      amps: current,
      minTime: band.minTime(current),
      maxTime: band.maxTime(current),
    }));
    if (parsed.flags.has('json')) {
      const finite = (t: number) => (Number.isFinite(t) ? t : null);
      const json = {
        device: id ?? null,
        kind: characteristic.kind,
        volts: volts ?? null,
        ampsAre: `${primary ? 'primary ' : ''}amperes at ${at}`,
        rows: rows.map((row) => ({ amps: row.amps, minTime: finite(row.minTime), maxTime: finite(row.maxTime) })),
        diagnostics: band.diagnostics,
      };
      io.stdout(`${JSON.stringify(json, null, 2)}\n`);
      return 0;
    }
    const seconds = (t: number) => (Number.isFinite(t) ? significant(t, 6) : 'no operation');
    const table = formatTable(
      [`current A${primary} at ${at}`, 'minTime s', 'maxTime s'],
      rows.map((row) => [tableAmps(row.amps), seconds(row.minTime), seconds(row.maxTime)]),
      ['right', 'right', 'right'],
    );
    const title = `${id ?? 'device'} (${characteristic.kind})`;
    const notes = band.diagnostics.map((d) => `note: ${d}\n`).join('');
    io.stdout(`${title}\n${table}\n${notes}`);
    return 0;
  },
};

/** The `--amps` list: each a current, a plain number in amperes or text with a unit. */
function ampsOf(text: string): number[] {
  // Each a current a study could hold (1 mA to 10 MA): a denormal such as 1e-310 A would print as 0 A.
  const { smallest, largest } = PHYSICAL_RANGES.current;
  const expected = `currents between ${smallest} A and ${largest} A separated by commas`;
  return text.split(',').map((part) => {
    let value: number;
    try {
      value = parseQuantity(part.trim(), 'current');
    } catch {
      throw new InputError('--amps', expectedGot(expected, part.trim()));
    }
    if (!(value > 0) || outsidePhysicalRange(value, 'current'))
      throw new InputError('--amps', expectedGot(expected, part.trim()));
    return value;
  });
}

/**
 * Reads the file as a study (then `--device` picks the device, and its bus gives the voltage), a single
 * device, or a bare characteristic (no voltage known).
 */
function deviceOf(
  path: string,
  readText: (path: string) => string,
  deviceId: string | undefined,
): { id?: string; characteristic: Characteristic; volts?: number } {
  // The same reading rules as every study file (byte-order mark, one-line syntax errors, repeated fields).
  // With `--device` the file must be a study, and its problems are named as a study's.
  const field = deviceId === undefined ? 'device' : 'study';
  const raw = readJsonFile(path, readText, field, 'a readable device or study file');
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    throw new InputError(field, expectedGot('a JSON object', raw));
  }
  const record = raw as Record<string, unknown>;
  if ('discern' in record) {
    const { study, problems } = readStudy(record);
    if (!study) throw new InputError(problems[0].path, problems[0].message);
    const ids = study.devices.map((d) => d.id);
    const chosen = deviceId ?? (ids.length === 1 ? ids[0] : undefined);
    const device = study.devices.find((d) => d.id === chosen);
    if (!device) {
      const list = ids.map((i) => JSON.stringify(i)).join(', ');
      throw new InputError('--device', expectedGot(ids.length ? `one of ${list}` : 'a study with devices', deviceId));
    }
    const volts = locationBusOf(networkOf(study), device).voltage;
    return { id: device.id, characteristic: device.characteristic, volts };
  }
  if (deviceId !== undefined) throw new InputError('--device', expectedGot('a study file to pick from', deviceId));
  if ('characteristic' in record) {
    const id = typeof record.id === 'string' ? record.id : undefined;
    return { id, characteristic: readCharacteristic(record.characteristic, { path: 'device.characteristic' }) };
  }
  return { characteristic: readCharacteristic(record, { path: 'characteristic' }) };
}
