import type { StudyInput } from '../../../src/engine/study/index.ts';

type DeviceInput = NonNullable<StudyInput['devices']>[number];

/** An LV trip unit: long time 1 × `sensor` at 10 s, with the elements given (invented settings). */
export const tripUnit = (sensor: number, more: Record<string, unknown> = {}): DeviceInput['characteristic'] => ({
  kind: 'trip-unit' as const,
  sensor,
  longTime: { pickup: 1, delay: 10 },
  ...more,
});

/**
 * A 480 V bus A (30 kA available, X/R 6) whose feeder F feeds, by cable C1 (100 ft of 500 kcmil), panel P
 * alone; the panel's main PM feeds branch breaker BR by cable C2 (50 ft of 1 AWG) to L: the layout of the
 * Exception for two devices in series with no load in parallel with the downstream one (F over PM).
 * Each device's characteristic and marking as given. Invented.
 */
export function panelStudy(
  name: string,
  devices: { F: Partial<DeviceInput>; PM: Partial<DeviceInput>; BR: Partial<DeviceInput> },
): StudyInput {
  return {
    discern: 1,
    name,
    source: { kind: 'utility', id: 'U', bus: 'A', max: { available: '30 kA', xr: 6 } },
    buses: [
      { id: 'A', voltage: 480 },
      { id: 'P', voltage: 480 },
      { id: 'L', voltage: 480 },
    ],
    cables: [
      { id: 'C1', from: 'A', to: 'P', size: '500 kcmil', length: 100 },
      { id: 'C2', from: 'P', to: 'L', size: '1 AWG', length: 50 },
    ],
    devices: [
      { id: 'F', feeds: 'C1', characteristic: tripUnit(400), ...devices.F },
      { id: 'PM', feeds: 'P', characteristic: tripUnit(400), ...devices.PM },
      { id: 'BR', feeds: 'C2', characteristic: tripUnit(100), ...devices.BR },
    ],
  };
}
