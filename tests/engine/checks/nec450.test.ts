import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

const demo = () => JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8'));
const nec = (study: object) => analyseStudy(parseStudy(study)).findings.filter((f) => f.kind === 'nec-450.3');

describe('nec450Findings', () => {
  it('has the expected defaults: Table 450.3(A) above 1000 V, 450.3(B) at 1000 V and less, primary and secondary', () => {
    const ids = nec(demo()).map((f) => `${f.id} ${f.severity}`);
    expect(ids).toEqual([
      'nec-450.3:T1:primary ok',
      'nec-450.3:T1:secondary ok',
      'nec-450.3:T2:primary ok',
      'nec-450.3:T2:secondary ok',
    ]);
  });

  it('allows the office secondary main 400 A as the next standard rating above 125 % (NFPA 70 Table 450.3(B) note 1, 240.6(A); from memory)', () => {
    // 112.5 kVA at 208 V: 312.27 A; 125 % = 390.3 A → next standard rating 400 A (computed).
    const secondary = nec(demo()).find((f) => f.id === 'nec-450.3:T2:secondary')!;
    expect(secondary.explanation).toMatch(/400 A, 128 % of Office dry-type's secondary rated current 312\.3 A/);
    expect(secondary.explanation).toMatch(/next standard rating, 400 A/);
    expect(secondary.work!.at(-1)!.value).toBeCloseTo((100 * 400) / 312.269, 3);
  });

  it('limits the primary to 250 % with secondary protection, not rounded up (450.3(B) note 3; from memory)', () => {
    const study = demo();
    study.devices.find((d: { id: string }) => d.id === 'FDR-OFC').characteristic.sensor = 400;
    const primary = nec(study).find((f) => f.id === 'nec-450.3:T2:primary')!;
    // 480 V side: 135.32 A; 250 % = 338.3 A; a 400 A sensor is 296 % (computed).
    expect(primary.severity).toBe('fail');
    expect(primary.explanation).toMatch(/296 % .* allows 250 % \(338\.3 A\)/);
  });

  it('uses the primary-only column when no secondary main feeds the secondary bus', () => {
    const study = demo();
    study.devices = study.devices.filter((d: { id: string }) => d.id !== 'OFC-MAIN');
    study.views = study.views.map((v: { devices: string[] }) => ({
      ...v,
      devices: v.devices.filter((d) => d !== 'OFC-MAIN'),
    }));
    const primary = nec(study).find((f) => f.id === 'nec-450.3:T2:primary')!;
    // Primary only, 9 A or more: 125 % × 135.32 A = 169.1 A → next standard rating 175 A; 300 A fails.
    expect(primary.severity).toBe('fail');
    expect(primary.explanation).toMatch(
      /primary only, primary current 9 A or more allows 125 % or the next standard rating, 175 A/,
    );
  });
});

/** 1500 kVA 12.47 kV–480 V (invented): primary rated current 1 500 000 / (√3 · 12 470) = 69.449 A. */
function serviceStudy(options: {
  impedance?: number;
  primary?: object;
  rating?: number;
  supervised?: boolean;
  main?: boolean;
}) {
  const { impedance = 5.75, primary, rating, supervised = false, main = true } = options;
  return {
    discern: 1,
    name: 'NEC 450.3(A) case',
    frequency: 60,
    source: { kind: 'utility', id: 'U', bus: 'MV', max: { available: '250 MVA', xr: 12 } },
    buses: [
      { id: 'MV', voltage: '12.47 kV' },
      { id: 'LV', voltage: 480 },
    ],
    transformers: [
      {
        id: 'T1',
        from: 'MV',
        to: 'LV',
        rating: '1500 kVA',
        primary: '12.47 kV',
        secondary: 480,
        impedance: `${impedance} %`,
        xr: 6,
        connection: 'delta-wye',
        supervised,
      },
    ],
    devices: [
      { id: 'P1', feeds: 'T1', rating, characteristic: primary ?? relayWithPickup(20) },
      ...(main
        ? [
            {
              id: 'MAIN',
              feeds: 'LV',
              characteristic: { kind: 'trip-unit', sensor: 2000, longTime: { pickup: 1, delay: 4 } },
            },
          ]
        : []),
    ],
  };
}

/** A relay on a 100:5 CT: pickup in secondary amps × 20 = primary amps. */
function relayWithPickup(tap: number) {
  return { kind: 'relay', ct: '100:5', timeOvercurrent: { curve: 'ieee-extremely-inverse', pickup: tap, timeDial: 6 } };
}

/** An illustrative MV fuse (invented curve); its E rating is the device rating. */
const eFuse = {
  kind: 'fuse',
  illustrative: true,
  minimumMelting: [
    [500, 300],
    [5000, 0.05],
  ],
  totalClearing: [
    [550, 300],
    [5000, 0.08],
  ],
};

const primaryFinding = (study: object) => nec(study).find((f) => f.id === 'nec-450.3:T1:primary')!;

describe('NFPA 70 Table 450.3(A) above 1000 V, as the table reads (from memory: cells and note 1 wording)', () => {
  const fla = 1_500_000 / (Math.sqrt(3) * 12_470); // 69.449 A

  it('limits a continuously adjustable relay pickup to 600 % itself, not the next 240.6(A) rating', () => {
    // 600 % × 69.449 A = 416.69 A. A 416 A pickup (20.8 A × 20) passes; 420 A (21 A) fails, although
    // the next standard rating above 416.69 A would be 450 A at 1000 V and below.
    expect(6 * fla).toBeCloseTo(416.69, 2);
    expect(primaryFinding(serviceStudy({ primary: relayWithPickup(20.8) })).severity).toBe('ok');
    const over = primaryFinding(serviceStudy({ primary: relayWithPickup(21) }));
    expect(over.severity).toBe('fail');
    expect(over.explanation).toMatch(/allows 600 % \(416\.7 A; a continuously adjustable pickup is not rounded up/);
  });

  it('rounds an E-rated fuse up to the next E rating, not the next 240.6(A) rating', () => {
    // 300 % × 69.449 A = 208.35 A: the next E rating is 250E (240.6(A) would stop at 225 A).
    const at250 = primaryFinding(serviceStudy({ primary: eFuse, rating: 250 }));
    expect(at250.severity).toBe('ok');
    expect(at250.explanation).toMatch(/allows 300 % or the next E rating commercially available, 250E/);
    expect(at250.work!.find((w) => /E rating/.test(w.label))!.value).toBe(250);
    expect(primaryFinding(serviceStudy({ primary: eFuse, rating: 300 })).severity).toBe('fail');
  });

  it('takes the next rating from the fuse family the user entered, when given', () => {
    // The same 208.35 A limit against a family made in 200, 225 and 275 A: 225 A is the next available.
    const family = { ...eFuse, availableRatings: [200, 225, 275] };
    const at225 = primaryFinding(serviceStudy({ primary: family, rating: 225 }));
    expect(at225.severity).toBe('ok');
    expect(at225.work!.find((w) => /E rating/.test(w.label))!.source).toMatch(/the fuse family's ratings as entered/);
    expect(primaryFinding(serviceStudy({ primary: family, rating: 250 })).severity).toBe('fail');
  });

  it('reads 6 % in the ≤ 6 % row and 10 % in the 6–10 % row', () => {
    // ≤ 6 %: 600 %; over 6 % to 10 %: 400 % × 69.449 A = 277.80 A.
    expect(primaryFinding(serviceStudy({ impedance: 6, primary: relayWithPickup(20.8) })).severity).toBe('ok');
    expect(primaryFinding(serviceStudy({ impedance: 6.01, primary: relayWithPickup(20.8) })).severity).toBe('fail');
    const ten = primaryFinding(serviceStudy({ impedance: 10, primary: relayWithPickup(13.85) })); // 277 A
    expect(ten.severity).toBe('ok');
    expect(ten.explanation).toMatch(/%Z over 6 % to 10 %.* allows 400 %/);
    expect(primaryFinding(serviceStudy({ impedance: 10, primary: relayWithPickup(13.9) })).severity).toBe('fail'); // 278 A
  });

  it('says a transformer above 10 % impedance is outside the table instead of reading the 6–10 % row', () => {
    const findings = nec(serviceStudy({ impedance: 10.5, primary: relayWithPickup(13.85) }));
    expect(findings.map((f) => `${f.id} ${f.severity}`)).toEqual([
      'nec-450.3:T1:primary warning',
      'nec-450.3:T1:secondary warning',
    ]);
    expect(findings[0].title).toMatch(/T1 at 10\.5 % impedance is outside NEC Table 450\.3\(A\) \(primary\)/);
    expect(findings[0].explanation).toMatch(/the 6–10 % row does not apply/);
  });

  it('still checks a supervised primary-only transformer above 10 %: that row covers any impedance', () => {
    // Supervised location, primary only, breaker: 300 % × 69.449 A = 208.35 A.
    const ok = primaryFinding(
      serviceStudy({ impedance: 12, supervised: true, main: false, primary: relayWithPickup(10.4) }),
    );
    expect(ok.severity).toBe('ok'); // 208 A
    expect(ok.explanation).toMatch(/supervised location, primary only, breaker allows 300 %/);
    const over = primaryFinding(
      serviceStudy({ impedance: 12, supervised: true, main: false, primary: relayWithPickup(10.45) }),
    );
    expect(over.severity).toBe('fail'); // 209 A
  });

  it('keeps the next standard rating for the secondary device at 1000 V and below (125 %, note 1)', () => {
    // 1500 kVA at 480 V: 1804.22 A; 125 % = 2255.3 A → 2500 A by 240.6(A); a 2000 A sensor passes.
    const secondary = nec(serviceStudy({})).find((f) => f.id === 'nec-450.3:T1:secondary')!;
    expect(secondary.severity).toBe('ok');
    expect(secondary.explanation).toMatch(/next standard rating, 2500 A/);
  });
});
