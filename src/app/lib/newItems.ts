import type { StudyInput } from '../../engine/study/index.ts';
import { locationBusOf, pathTo, type Network } from '../../engine/network/index.ts';

type ViewInput = NonNullable<StudyInput['views']>[number];

/**
 * The smallest valid study to build on: a utility source (placeholder 250 MVA, X/R 12, for the user
 * to replace with the utility's figures) feeding one 12.47 kV bus. A finite source keeps every fault
 * current, and so every sheet, finite.
 * @example readStudy(newStudyDocument()).study // a valid study
 */
export function newStudyDocument(): StudyInput {
  return {
    discern: 1,
    name: 'New study',
    frequency: 60,
    source: { kind: 'utility', id: 'UTIL', bus: 'BUS-1', max: { available: '250 MVA', xr: 12 } },
    buses: [{ id: 'BUS-1', name: 'Service bus', voltage: '12.47 kV' }],
    transformers: [],
    cables: [],
    motors: [],
    devices: [],
    views: [],
  };
}

/**
 * A new view for one device: that device and every device above it on its way to the source,
 * drawn on the voltage of the device's own bus (written as the bus's voltage is written), with the
 * withstand curves of the transformers and cables on that path and the starting curve of a motor
 * the device feeds.
 * `undefined` when the device is not in the network.
 *
 * @example newViewOf(document, network, 'FDR-MCC') // { id: 'V2', referenceVoltage: 480, devices: ['MAIN', 'FDR-MCC'], withstand: ['T1', 'C-MCC'], … }
 */
export function newViewOf(document: StudyInput, network: Network, deviceId: string): ViewInput | undefined {
  const device = network.devices.get(deviceId);
  if (!device) return undefined;
  const path = pathTo(network, device.feeds);
  const devices = path.map((id) => network.deviceFeeding.get(id)?.id).filter((id): id is string => id !== undefined);
  // The path's transformers (withstand and inrush) and cables (damage), and a motor the device feeds
  // (starting), drawn by default: what the devices of the sheet are there to protect or ride through.
  const kindOf = (id: string) => network.elements.get(id)?.type;
  const withstand = path.filter((id) => kindOf(id) === 'transformer' || kindOf(id) === 'cable');
  const motors = path.filter((id) => kindOf(id) === 'motor');
  const bus = locationBusOf(network, device);
  const written = document.buses.find((b) => b.id === bus.id)?.voltage ?? bus.voltage;
  const taken = new Set((document.views ?? []).map((v) => v.id));
  let n = taken.size + 1;
  while (taken.has(`V${n}`)) n++;
  return {
    id: `V${n}`,
    title: `${device.name ?? device.id} and the devices above it`,
    referenceVoltage: written,
    devices,
    withstand,
    motors,
  };
}

/**
 * An id not yet used anywhere in the document (ids share one namespace): `stem-1`, `stem-2`, …
 * @example freeIdOf(document, 'C') // 'C-1'
 */
export function freeIdOf(document: StudyInput, stem: string): string {
  const taken = new Set<string>([
    document.source.id,
    ...document.buses.map((b) => b.id),
    ...(document.transformers ?? []).map((t) => t.id),
    ...(document.cables ?? []).map((c) => c.id),
    ...(document.motors ?? []).map((m) => m.id),
    ...(document.devices ?? []).map((d) => d.id),
  ]);
  let n = 1;
  while (taken.has(`${stem}-${n}`)) n++;
  return `${stem}-${n}`;
}

/**
 * The document with a new branch from `busId` to a new bus: a cable (same voltage as the bus, as
 * written) or a transformer (primary at the bus voltage; secondary 480 V, or 208 V below a 480 V
 * bus, whose voltage `busVolts` is in volts). The values are placeholders for the user to replace
 * with the nameplate and the run.
 *
 * @example withNewBranch(document, 'SWBD', 'cable', 480).cables.at(-1) // { id: 'C-1', from: 'SWBD', to: 'B-1', … }
 */
export function withNewBranch(
  document: StudyInput,
  busId: string,
  kind: 'cable' | 'transformer',
  busVolts: number,
): StudyInput {
  const bus = document.buses.find((b) => b.id === busId);
  if (!bus) throw new RangeError(`study.buses: expected a bus "${busId}", got none`);
  const to = freeIdOf(document, 'B');
  if (kind === 'cable') {
    const id = freeIdOf(document, 'C');
    return {
      ...document,
      buses: [...document.buses, { id: to, name: `Bus fed by ${id}`, voltage: bus.voltage }],
      cables: [...(document.cables ?? []), { id, from: busId, to, size: '4/0', length: '100 ft' }],
    };
  }
  const id = freeIdOf(document, 'T');
  // Below 1 kV the usual next step down is a 208 V dry-type; above it, a 480 V unit substation.
  const lowVoltage = busVolts < 1000;
  const secondary = lowVoltage ? '208 V' : '480 V';
  return {
    ...document,
    buses: [...document.buses, { id: to, name: `Bus fed by ${id}`, voltage: secondary }],
    transformers: [
      ...(document.transformers ?? []),
      {
        id,
        from: busId,
        to,
        rating: lowVoltage ? '75 kVA' : '500 kVA',
        primary: bus.voltage,
        secondary,
        impedance: lowVoltage ? '3.5 %' : '5.75 %',
      },
    ],
  };
}

/**
 * The document with a new motor on `busId` (placeholder rating for the user to replace).
 * @example withNewMotor(document, 'MCC').motors.at(-1) // { id: 'M-1', bus: 'MCC', hp: 50 }
 */
export function withNewMotor(document: StudyInput, busId: string): StudyInput {
  const id = freeIdOf(document, 'M');
  return { ...document, motors: [...(document.motors ?? []), { id, name: `Motor ${id}`, bus: busId, hp: 50 }] };
}

/**
 * The document without a device, taken off every view too; a view left with no device goes with it.
 * @example withoutDevice(document, 'FDR-DOCK').devices.some((d) => d.id === 'FDR-DOCK') // false
 */
export function withoutDevice(document: StudyInput, deviceId: string): StudyInput {
  return {
    ...document,
    devices: (document.devices ?? []).filter((d) => d.id !== deviceId),
    views: (document.views ?? [])
      .map((v) => (v.devices.includes(deviceId) ? { ...v, devices: v.devices.filter((id) => id !== deviceId) } : v))
      .filter((v) => v.devices.length > 0),
  };
}

/**
 * The document without a motor, its device and its place on views (starting curves).
 * @example withoutMotor(document, 'M-COMP2').motors.length // one fewer
 */
export function withoutMotor(document: StudyInput, motorId: string): StudyInput {
  const device = (document.devices ?? []).find((d) => d.feeds === motorId);
  const rest = device ? withoutDevice(document, device.id) : document;
  return {
    ...rest,
    motors: (rest.motors ?? []).filter((m) => m.id !== motorId),
    views: (rest.views ?? []).map((v) =>
      v.motors?.includes(motorId) ? { ...v, motors: v.motors.filter((id) => id !== motorId) } : v,
    ),
  };
}
