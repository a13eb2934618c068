import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/engine/errors.ts';
import { checkSheetInput } from '../../src/plot/sheetInput.ts';
import { fixtureInput } from './fixtures.ts';

describe('checkSheetInput', () => {
  it('has the expected defaults', () => {
    const input = fixtureInput();
    expect(checkSheetInput(input)).toBe(input);
  });

  it('checkSheetInput names the field and the value of each bad number', () => {
    const base = fixtureInput();
    const cases: [Parameters<typeof checkSheetInput>[0], RegExp][] = [
      [
        { ...base, referenceVolts: -480 },
        /^sheet\.referenceVolts: expected a voltage in volts greater than 0, got "-480"$/,
      ],
      [
        { ...base, bands: [{ ...base.bands[0], ownVolts: 0 }] },
        /^sheet\.bands\[0\]\.ownVolts: expected a voltage in volts greater than 0, got "0"$/,
      ],
      [
        { ...base, bands: [{ ...base.bands[0], toAmps: NaN }] },
        /^sheet\.bands\[0\]\.toAmps: expected a current in amps greater than 0, got "NaN"$/,
      ],
      [
        { ...base, withstand: [{ ...base.withstand[0], scale: 0 }] },
        /^sheet\.withstand\[0\]\.scale: expected a current factor greater than 0, got "0"$/,
      ],
      [
        { ...base, starting: [{ ...base.starting[0], scale: -1 }] },
        /^sheet\.starting\[0\]\.scale: expected a current factor greater than 0, got "-1"$/,
      ],
      [
        { ...base, markers: [{ ...base.markers[0], seconds: 0 }] },
        /^sheet\.markers\[0\]\.seconds: expected a time in seconds greater than 0, got "0"$/,
      ],
      [
        { ...base, markers: [{ ...base.markers[0], amps: Infinity }] },
        /^sheet\.markers\[0\]\.amps: expected a current in amps greater than 0, got "Infinity"$/,
      ],
      [
        { ...base, faultLines: [{ ...base.faultLines[0], amps: 0 }] },
        /^sheet\.faultLines\[0\]\.amps: expected a current in amps greater than 0, got "0"$/,
      ],
      [
        { ...base, faultLines: [{ ...base.faultLines[0], kind: 'peak' as 'max' }] },
        /^sheet\.faultLines\[0\]\.kind: expected "max" or "min", got "peak"$/,
      ],
      [
        { ...base, regions: [{ ...base.regions[0], status: 'fine' as 'overlap' }] },
        /^sheet\.regions\[0\]\.status: expected "overlap", "thin margin", "not provable from curves", got "fine"$/,
      ],
      [
        { ...base, regions: [{ ...base.regions[0], fromAmps: 500, toAmps: 100 }] },
        /^sheet\.regions\[0\]: expected fromAmps and toAmps in amps with 0 < fromAmps < toAmps, got \[500,100\]$/,
      ],
      [
        { ...base, currentRange: [1000, 10] },
        /^sheet\.currentRange: expected two currents in amps with 0 < low < high, got \[1000,10\]$/,
      ],
      [
        { ...base, timeRange: [0, 1000] },
        /^sheet\.timeRange: expected two times in seconds with 0 < low < high, got \[0,1000\]$/,
      ],
      [{ ...base, caution: '  ' }, /^sheet\.caution: expected a non-empty text, got " {2}"$/],
    ];
    for (const [input, message] of cases) {
      expect(() => checkSheetInput(input)).toThrow(InputError);
      expect(() => checkSheetInput(input)).toThrow(message);
    }
  });

  it('checkSheetInput rejects a band without edge functions', () => {
    const base = fixtureInput();
    const broken = { ...base, bands: [{ ...base.bands[0], band: {} as never }] };
    expect(() => checkSheetInput(broken)).toThrow(
      /^sheet\.bands\[0\]\.band: expected a band with minTime and maxTime, got \{\}$/,
    );
  });
});
