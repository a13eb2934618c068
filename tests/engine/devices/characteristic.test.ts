import { describe, expect, it } from 'vitest';
import {
  characteristicSchema,
  createCharacteristicSchema,
  DEVICE_KINDS,
} from '../../../src/engine/devices/characteristic.ts';
import { readCharacteristic } from '../../../src/engine/devices/readCharacteristic.ts';
import { readStudy } from '../../../src/engine/study/parse.ts';

const relay = { kind: 'relay', ct: '600:5', instantaneous: { pickup: 40 } } as const;

function rejection(input: unknown, path?: string): string {
  try {
    readCharacteristic(input, { path });
  } catch (error) {
    return (error as Error).message;
  }
  return 'accepted';
}

describe('characteristic', () => {
  it('has the expected defaults', () => {
    expect(DEVICE_KINDS).toEqual(['relay', 'trip-unit', 'thermal-magnetic', 'fuse']);
    const parsed = characteristicSchema.parse(relay);
    expect(parsed.kind).toBe('relay');
  });

  it('createCharacteristicSchema(50) reads cycles at 50 Hz', () => {
    const parsed = createCharacteristicSchema(50).parse({ ...relay, breakerTime: '3 cycles' });
    expect(parsed.kind === 'relay' && parsed.breakerTime).toBeCloseTo(0.06, 12);
    const at60 = readCharacteristic({ ...relay, breakerTime: '3 cycles' });
    expect(at60.kind === 'relay' && at60.breakerTime).toBeCloseTo(0.05, 12);
  });

  it('readCharacteristic names the path of an unknown kind and of a missing kind', () => {
    expect(rejection({ kind: 'recloser' })).toMatch(/^characteristic\.kind: expected a known "kind", got "recloser"$/);
    expect(rejection({ ct: '600:5' }, 'device.characteristic')).toMatch(
      /^device\.characteristic\.kind: expected a known "kind"/,
    );
    expect(rejection('relay')).toMatch(/^characteristic: expected an object, got "relay"$/);
  });

  it('a study reads its devices through the characteristic schema', () => {
    const { problems } = readStudy({
      discern: 1,
      name: 'invented',
      source: { kind: 'infinite', id: 'U', bus: 'B' },
      buses: [{ id: 'B', voltage: 480 }],
      devices: [
        {
          id: 'M',
          feeds: 'B',
          characteristic: {
            kind: 'fuse',
            minimumMelting: [[1, 2]],
            totalClearing: [
              [1, 2],
              [2, 1],
            ],
          },
        },
      ],
    });
    expect(problems.map((p) => `${p.path}: ${p.message}`)).toEqual([
      'study.devices[0].characteristic.minimumMelting: expected at least 2 points, got 1',
    ]);
  });
});
