import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { handlePlacementsOf, handleSettingsOf, movedBy } from '../../../src/app/lib/handles.ts';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';
import { pixelOf } from '../../../src/plot/scales.ts';
import { sheetOf } from '../../../src/plot/sheet.ts';
import { viewInputOf } from '../../../src/plot/viewInput.ts';

const relay = {
  kind: 'relay',
  ct: '100:5',
  timeOvercurrent: { curve: 'ieee-extremely-inverse', pickup: 5, timeDial: 6 },
};
const tripUnit = {
  kind: 'trip-unit',
  sensor: 2000,
  longTime: { pickup: 1, delay: '4 s' },
  shortTime: { pickup: 4, delay: 0.4 },
};

describe('handles', () => {
  it('has the expected defaults', () => {
    expect(handleSettingsOf(undefined)).toEqual({});
    expect(handleSettingsOf({ kind: 'fuse', minimumMelting: [], totalClearing: [] })).toEqual({});
  });

  it('handleSettingsOf() moves the trade settings of each family', () => {
    expect(handleSettingsOf(relay)).toEqual({
      pickup: { path: ['timeOvercurrent', 'pickup'], name: 'pickup' },
      time: { path: ['timeOvercurrent', 'timeDial'], name: 'time dial' },
    });
    expect(handleSettingsOf(tripUnit).time).toEqual({ path: ['longTime', 'delay'], name: 'long-time delay' });
    expect(
      handleSettingsOf({ kind: 'trip-unit', sensor: 400, shortTime: { pickup: 4, delay: 0.2 } }).pickup?.name,
    ).toBe('short-time pickup');
    expect(handleSettingsOf({ kind: 'thermal-magnetic', magnetic: { pickup: 10 } }).pickup?.path).toEqual([
      'magnetic',
      'pickup',
    ]);
    expect(handleSettingsOf({ kind: 'relay', instantaneous: { pickup: 80 } }).time).toBeUndefined();
  });

  it('movedBy() multiplies pickup and time setting, keeping units, without touching the original', () => {
    const moved = movedBy(tripUnit, handleSettingsOf(tripUnit), 1.25, 1.5);
    expect(moved.longTime).toEqual({ pickup: 1.25, delay: '6 s' });
    expect(moved.shortTime).toBe(tripUnit.shortTime);
    expect(tripUnit.longTime).toEqual({ pickup: 1, delay: '4 s' });
    expect(movedBy(relay, handleSettingsOf(relay), 1, 1)).toBe(relay);
  });

  it('handlePlacementsOf() puts a handle just right of each adjustable pickup, between the band edges', () => {
    const document = JSON.parse(
      readFileSync(new URL('../../../demo/harrowmere-selective.json', import.meta.url), 'utf8'),
    );
    const analysis = analyseStudy(parseStudy(document));
    const input = viewInputOf(analysis, document.views[0].id);
    const sheet = sheetOf(input, { width: 960, height: 720 });
    const handles = handlePlacementsOf(input, sheet, document);
    const withHandles = input.bands.filter((b) => {
      const device = document.devices.find((d: { id: string }) => d.id === b.id);
      const settings = handleSettingsOf(device.characteristic);
      return settings.pickup && settings.time;
    });
    expect(handles.map((h) => h.deviceId)).toEqual(withHandles.map((b) => b.id));
    const main = handles.find((h) => h.deviceId === 'MAIN')!;
    const band = input.bands.find((b) => b.id === 'MAIN')!.band;
    expect(main.path).toEqual([
      'devices',
      document.devices.findIndex((d: { id: string }) => d.id === 'MAIN'),
      'characteristic',
    ]);
    expect(main.x).toBeCloseTo(pixelOf(sheet.scales.x, band.minAmps * 2), 9);
    const amps = band.minAmps * 2;
    expect(main.y).toBeCloseTo(pixelOf(sheet.scales.y, Math.sqrt(band.minTime(amps) * band.maxTime(amps))), 9);
  });
});
