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
    // The switchboard's fault includes its motors' current, which does not pass the main: the main's band
    // ends at the current through the transformer (IEEE 141 per-unit method), on this phase sheet at 480 V
    // the larger of the three-phase (28.4 kA) and line-to-ground (29.4 kA, Δ–Yg with X0 below X1) faults.
    const main = deviceFaultOf(analysis.network, analysis.faults, analysis.network.devices.get('MAIN')!);
    const through = Math.max(main.threePhase, main.lineToGround);
    const bus = analysis.faults.buses.get('SWBD')!.max;
    const swbd = Math.max(bus.threePhase, bus.lineToGround);
    expect(through).toBeLessThan(swbd);
    const probe = probeAt(analysis, 'service', (through + swbd) / 2);
    const reading = probe.readings.find((r) => r.deviceId === 'MAIN')!;
    expect([reading.beyondFault, reading.largestFault, reading.busFault]).toEqual([true, through, swbd]);
    expect(probe.beyondFault).toBeUndefined();
    expect(probe.first).not.toBe('MAIN');
    expect(probe.summary).not.toMatch(/Main 2000 A/);
  });
});
