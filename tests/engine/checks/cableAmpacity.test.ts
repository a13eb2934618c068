import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { cableAmpacityOf, tableAmpacity } from '../../../src/engine/conductors/index.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { workedStudy } from '../window/fixtures.ts';

/**
 * A 480 V switchboard feeding a panel through one cable, its breaker rated `rating` (invented data).
 * `motors` (hp) sit on the panel, fed straight through the cable.
 */
function feederStudy(options: {
  size: string;
  rating: number;
  sets?: number;
  material?: 'copper' | 'aluminium';
  ampacity?: number;
  /** Ω per 1000 ft, for a size NEC Table 9 does not list. */
  resistance?: number;
  volts?: number;
  motors?: number[];
}): StudyInput {
  const volts = options.volts ?? 480;
  return {
    discern: 1,
    name: 'feeder ampacity',
    source: { kind: 'utility', id: 'U', bus: 'SWBD', max: { available: '30 kA', xr: 8 } },
    buses: [
      { id: 'SWBD', voltage: volts },
      { id: 'PNL', voltage: volts },
    ],
    cables: [
      {
        id: 'C1',
        from: 'SWBD',
        to: 'PNL',
        size: options.size,
        length: '100 ft',
        sets: options.sets ?? 1,
        material: options.material ?? 'copper',
        ...(options.ampacity === undefined ? {} : { ampacity: options.ampacity }),
        ...(options.resistance === undefined ? {} : { resistance: options.resistance, reactance: 0.04 }),
      },
    ],
    motors: (options.motors ?? []).map((hp, i) => ({ id: `M${i + 1}`, bus: 'PNL', hp })),
    devices: [
      {
        id: 'FDR',
        feeds: 'C1',
        rating: options.rating,
        characteristic: { kind: 'trip-unit', sensor: options.rating, longTime: { pickup: 1, delay: 4 } },
      },
    ],
  };
}
const ampacityFinding = (input: StudyInput) =>
  analyseStudy(parseStudy(input)).findings.find((f) => f.kind === 'cable-ampacity');

describe('cableAmpacityFindings', () => {
  it('has the expected defaults: 75 °C copper from Table 310.16, the device compared by 240.4', () => {
    const finding = ampacityFinding(feederStudy({ size: '500 kcmil', rating: 400 }))!;
    expect(finding.id).toBe('cable-ampacity:C1');
    expect(finding.severity).toBe('ok');
    expect(finding.subjects).toEqual(['FDR', 'C1']);
    expect(finding.basis).toBe('500 kcmil copper: 380 A per conductor at 75 °C, NFPA 70 Table 310.16; NFPA 70 240.4.');
  });

  it('reads Table 310.16 at 75 °C (NFPA 70 Table 310.16; from memory, checked against public reproductions)', () => {
    expect(tableAmpacity('12 AWG', 'copper')).toBe(25);
    expect(tableAmpacity('4/0', 'copper')).toBe(230);
    expect(tableAmpacity('500 kcmil', 'copper')).toBe(380);
    expect(tableAmpacity('2000 kcmil', 'copper')).toBe(665);
    expect(tableAmpacity('4/0', 'aluminium')).toBe(180);
    expect(tableAmpacity('500 kcmil', 'aluminium')).toBe(310);
    expect(tableAmpacity('14 AWG', 'aluminium')).toBeUndefined();
  });

  it('a cable carries its sets times one conductor’s ampacity, the table’s or the one it is given (NFPA 70 310.10(G), conductors in parallel; from memory)', () => {
    expect(cableAmpacityOf({ size: '500 kcmil', material: 'copper', sets: 2 })).toBe(760);
    expect(cableAmpacityOf({ size: '250 kcmil', material: 'copper', sets: 1 })).toBe(255);
    expect(cableAmpacityOf({ size: '500 kcmil', material: 'copper', sets: 3, ampacity: 300 })).toBe(900);
    expect(cableAmpacityOf({ size: '14 AWG', material: 'aluminium', sets: 1 })).toBeUndefined();
  });

  it('allows the next standard rating above the ampacity up to 800 A: 4/0 copper, 230 A, on 250 A but not 300 A (NFPA 70 240.4(B), 240.6(A))', () => {
    expect(ampacityFinding(feederStudy({ size: '4/0', rating: 250 }))!.severity).toBe('ok');
    const over = ampacityFinding(feederStudy({ size: '4/0', rating: 300 }))!;
    expect(over.severity).toBe('fail');
    expect(over.title).toBe("FDR is rated above C1's ampacity");
    expect(over.explanation).toMatch(
      /4\/0 copper carries 230 A, and 240\.4\(B\) allows the next standard rating at or above it, 250 A/,
    );
    expect(over.suggestion).toMatch(/a device rated 250 A or less/);
  });

  it("compares a trip unit's sensor rating unless its rating is given, as 240.6(B) and (C) read", () => {
    // A 300 A sensor set at 0.8 (240 A) on 4/0 copper: the sensor is above 250 A; with access to the
    // setting restricted the rating is the setting, 240 A.
    const input = feederStudy({ size: '4/0', rating: 300 });
    const device = input.devices![0] as { rating?: number; characteristic: { longTime: { pickup: number } } };
    device.characteristic.longTime.pickup = 0.8;
    delete device.rating;
    const sensor = ampacityFinding(input)!;
    expect(sensor.severity).toBe('fail');
    expect(sensor.explanation).toMatch(/maximum long-time setting \(sensor rating, NEC 240\.6\(B\)\), 300 A/);
    expect(sensor.suggestion).toMatch(/access to FDR's long-time setting is restricted \(NFPA 70 240\.6\(C\)\)/);
    device.rating = 240;
    expect(ampacityFinding(input)!.severity).toBe('ok');
  });

  it('rates a trip unit set above the rating given at its setting: 500 kcmil copper (380 A) on 0.67 × 600 A (NFPA 70 240.6(C), 240.4(B))', () => {
    // Given as 400 A, the next standard rating above 380 A, but set to 402 A: no reading of 240.6
    // rates it below its long-time setting, and 402 A is above the 400 A that 240.4(B) allows.
    const input = feederStudy({ size: '500 kcmil', rating: 400 });
    const device = input.devices![0] as { characteristic: { sensor: number; longTime: { pickup: number } } };
    device.characteristic.sensor = 600;
    device.characteristic.longTime.pickup = 0.67;
    const above = ampacityFinding(input)!;
    expect(above.severity).toBe('fail');
    expect(above.explanation).toMatch(/long-time pickup setting, above the rating given \(NEC 240\.6\(C\)\), 402 A/);
    // Set to 396 A, the rating given stands.
    device.characteristic.longTime.pickup = 0.66;
    expect(ampacityFinding(input)!.severity).toBe('ok');
  });

  it('allows no more than the ampacity above 800 A: 3 × 500 kcmil, 1140 A, on 1200 A fails, 4 sets pass (NFPA 70 240.4(C))', () => {
    const three = ampacityFinding(feederStudy({ size: '500 kcmil', sets: 3, rating: 1200 }))!;
    expect(three.severity).toBe('fail');
    expect(three.explanation).toMatch(/3 × 500 kcmil copper carries 1140 A, and above 800 A, 240\.4\(C\)/);
    expect(ampacityFinding(feederStudy({ size: '500 kcmil', sets: 4, rating: 1200 }))!.severity).toBe('ok');
  });

  it('keeps the small-conductor limits: 12 AWG copper (25 A in the table) on no more than 20 A (NFPA 70 240.4(D))', () => {
    expect(ampacityFinding(feederStudy({ size: '12 AWG', rating: 20 }))!.severity).toBe('ok');
    const over = ampacityFinding(feederStudy({ size: '12 AWG', rating: 25 }))!;
    expect(over.severity).toBe('fail');
    expect(over.explanation).toMatch(/240\.4\(D\) limits 12 AWG copper to 20 A/);
  });

  it("takes the cable's own ampacity per conductor in place of the table", () => {
    // 500 kcmil derated to 300 A per conductor: the next standard rating is 300 A, so 400 A fails.
    const derated = ampacityFinding(feederStudy({ size: '500 kcmil', rating: 400, ampacity: 300 }))!;
    expect(derated.severity).toBe('fail');
    expect(derated.basis).toMatch(/^500 kcmil copper: 300 A per conductor as given/);
  });

  it('holds a motor circuit to 125 % of the full-load current, leaving its device to 430.52 (NFPA 70 430.22, 240.4(G))', () => {
    // 100 hp at 460 V: 124 A (Table 430.250, from memory), so the conductors need 155 A; 2/0 copper
    // carries 175 A and 1 AWG 130 A. The 400 A breaker above one motor is a branch-circuit device.
    const branch = ampacityFinding(feederStudy({ size: '2/0', rating: 400, motors: [100] }))!;
    expect(branch.severity).toBe('ok');
    expect(branch.explanation).toMatch(/carries the 155 A its load needs/);
    expect(branch.explanation).toMatch(/sized by NFPA 70 430\.52/);
    const small = ampacityFinding(feederStudy({ size: '1 AWG', rating: 400, motors: [100] }))!;
    expect(small.severity).toBe('fail');
    expect(small.title).toBe('C1 is too small for the load it feeds');
    expect(small.suggestion).toMatch(/to carry at least 155 A/);
  });

  it('warns, rather than fails, a device above the ampacity of a feeder to several motors (NFPA 70 430.62 may allow it)', () => {
    // 125 % × 124 A + 124 A = 279 A (NEC 430.24); 300 kcmil carries 285 A, next standard rating 300 A.
    const feeder = ampacityFinding(feederStudy({ size: '300 kcmil', rating: 400, motors: [100, 100] }))!;
    expect(feeder.severity).toBe('warning');
    expect(feeder.explanation).toMatch(/carries the 279 A its load needs/);
    expect(feeder.explanation).toMatch(/430\.62 may allow it/);
  });

  it("leaves conductors protected only on a transformer's primary to 240.21(C), still holding them to their motor load", () => {
    // The worked study without its main and feeder: the panel cable's nearest device is the 12.47 kV relay.
    const input = workedStudy();
    input.devices = input.devices!.filter((d) => d.id === 'R-T1');
    const finding = ampacityFinding(input)!;
    expect(finding.subjects).toEqual(['R-T1', 'C-F']);
    expect(finding.severity).toBe('ok');
    expect(finding.explanation).toMatch(/carries the 155 A its load needs/);
    expect(finding.explanation).toMatch(/NFPA 70 240\.21\(C\) governs/);
    input.motors = [];
    expect(ampacityFinding(input)).toBeUndefined();
  });

  it('checks nothing above 1000 V, and asks for the ampacity of a size the table does not list', () => {
    expect(ampacityFinding(feederStudy({ size: '500 kcmil', rating: 400, volts: 4160 }))).toBeUndefined();
    const unlisted = ampacityFinding(feederStudy({ size: '2500 kcmil', resistance: 0.006, rating: 600 }))!;
    expect(unlisted.severity).toBe('info');
    expect(unlisted.explanation).toMatch(/lists no copper conductor of 2500 kcmil: give C1's ampacity/);
  });
});
