import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { deviceFaultOf } from '../../src/engine/fault/index.ts';
import { probeAt } from '../../src/engine/probe.ts';
import { parseStudy } from '../../src/engine/study/index.ts';

const analysis = analyseStudy(parseStudy(readFileSync('demo/harrowmere-selective.json', 'utf8')));

describe('probeAt', () => {
  it('has the expected defaults: one reading per device of the view, on the view’s base', () => {
    const probe = probeAt(analysis, 'service', 10_000);
    expect(probe.referenceVolts).toBe(480);
    expect(probe.readings.map((r) => r.deviceId)).toEqual(['R-T1', 'MAIN', 'FDR-MCC', 'MCC-M1']);
  });

  it('reads each device at its own voltage: 10 kA at 480 V is 384.9 A at 12.47 kV (voltage-ratio reflection, IEEE 242)', () => {
    const relay = probeAt(analysis, 'service', 10_000).readings[0];
    expect(relay.ownVolts).toBe(12_470);
    expect(relay.ownAmps).toBeCloseTo((10_000 * 480) / 12_470, 6);
    expect(relay.minTime).toBe(analysis.bands.get('R-T1')!.minTime(relay.ownAmps));
  });

  it('names the device that clears first and the margin to the next one', () => {
    const probe = probeAt(analysis, 'service', 10_000);
    expect(probe.first).toBe('MCC-M1');
    const motorBreaker = probe.readings.find((r) => r.deviceId === 'MCC-M1')!;
    const feeder = probe.readings.find((r) => r.deviceId === 'FDR-MCC')!;
    expect(probe.margin).toBeCloseTo(feeder.minTime - motorBreaker.maxTime, 12);
    expect(probe.summary).toMatch(
      /^Compressor 1 breaker clears first, [\d.]+ s before MCC feeder 600 A may operate\.$/,
    );
  });

  it('says so when no device operates', () => {
    expect(probeAt(analysis, 'service', 50).summary).toBe('No device operates at this current.');
  });

  it('rejects an unknown view', () => {
    expect(() => probeAt(analysis, 'nowhere', 100)).toThrow(/no view "nowhere"/);
  });

  it('says a current beyond the largest available fault on the sheet flows nowhere, instead of comparing times', () => {
    const swbd = analysis.faults.buses.get('SWBD')!.max.threePhase;
    const beyond = probeAt(analysis, 'service', swbd * 1.5);
    expect(beyond.beyondFault).toBe(true);
    expect(beyond.first).toBeUndefined();
    expect(beyond.summary).toMatch(
      /^Beyond the largest available fault on this sheet \([\d.]+ kA at 480 V\): no such current flows here\.$/,
    );
    expect(beyond.summary).not.toMatch(/not selective/);
    expect(probeAt(analysis, 'service', swbd * 0.99).beyondFault).toBeUndefined();
  });

  it('leaves a device out of the comparison beyond the largest fault at its own location', () => {
    const mcc = analysis.faults.buses.get('MCC')!.max.threePhase;
    const swbd = analysis.faults.buses.get('SWBD')!.max.threePhase;
    expect(swbd).toBeGreaterThan(mcc * 1.02);
    const probe = probeAt(analysis, 'service', Math.sqrt(mcc * swbd));
    expect(probe.readings.find((r) => r.deviceId === 'MCC-M1')!.beyondFault).toBe(true);
    expect(probe.first).not.toBe('MCC-M1');
  });

  it("leaves out a main past what its transformer passes, though its bus's motors take the bus beyond it", () => {
    // The switchboard's 30.4 kA includes its motors' current, which does not pass the main: the main's
    // band ends at the 28.4 kA through the transformer (1.09 kA at 12.47 kV, IEEE 141 per-unit method).
    const through = deviceFaultOf(analysis.network, analysis.faults, analysis.network.devices.get('MAIN')!).threePhase;
    const swbd = analysis.faults.buses.get('SWBD')!.max.threePhase;
    expect(through).toBeLessThan(swbd);
    const probe = probeAt(analysis, 'service', (through + swbd) / 2);
    const main = probe.readings.find((r) => r.deviceId === 'MAIN')!;
    expect([main.beyondFault, main.largestFault, main.busFault]).toEqual([true, through, swbd]);
    expect(probe.beyondFault).toBeUndefined();
    expect(probe.first).not.toBe('MAIN');
    expect(probe.summary).not.toMatch(/Main 2000 A/);
  });
});
