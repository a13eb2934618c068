import { describe, expect, it } from 'vitest';
import { settingsText } from '../../../src/engine/report/settingsText.ts';
import { characteristicSchema } from '../../../src/engine/devices/index.ts';

const relay = (breakerTime: string) =>
  characteristicSchema.parse({
    kind: 'relay',
    ct: '600:5',
    timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 4, timeDial: 2 },
    breakerTime,
  });

describe('settingsText', () => {
  it('gives a breaker interrupting time in cycles as breakers are rated, with its seconds', () => {
    // 5 cycles at 60 Hz = 5/60 s; at 50 Hz the same seconds are 4.167 cycles, so seconds alone.
    expect(settingsText(relay('5 cycles'), 60)).toContain('breaker interrupting time 5 cycles (0.08333 s)');
    expect(settingsText(relay('5 cycles'), 50)).toContain('breaker interrupting time 0.08333 s');
    expect(settingsText(relay('0.05 s'), 60)).toContain('breaker interrupting time 3 cycles (0.05 s)');
    expect(settingsText(relay('0.0083333333 s'), 60)).toContain('breaker interrupting time 0.5 cycles (0.008333 s)');
    expect(settingsText(relay('0.08 s'), 60)).toContain('breaker interrupting time 0.08 s');
  });

  it('names the curve as IEEE C37.112 does and puts the pickup in primary amperes beside the relay amperes', () => {
    expect(settingsText(relay('5 cycles'))).toContain(
      'time-overcurrent IEEE very inverse: pickup 4 A (480 A primary), time dial 2',
    );
  });
});
