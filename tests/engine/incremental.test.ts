import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { AnalysisMemo } from '../../src/engine/incremental.ts';
import { networkOf, seriesPairs } from '../../src/engine/network/index.ts';
import { parseStudy, type Study, type StudyInput } from '../../src/engine/study/index.ts';

const demo = (): StudyInput =>
  JSON.parse(readFileSync(new URL('../../demo/harrowmere-full.json', import.meta.url), 'utf8')) as StudyInput;
/** Findings as plain data (the lazily written sentences included). */
const plain = (study: StudyInput, memo?: AnalysisMemo) => {
  const analysis = analyseStudy(parseStudy(study), memo);
  return JSON.parse(JSON.stringify({ findings: analysis.findings, pairs: analysis.pairs, counts: analysis.counts }));
};
const deviceOf = (study: StudyInput, id: string) => study.devices!.find((d) => d.id === id)!;

describe('AnalysisMemo', () => {
  it('has the expected defaults: a first analysis with a memo is a fresh analysis', () => {
    const memo = new AnalysisMemo();
    expect(plain(demo(), memo)).toEqual(plain(demo()));
    expect(memo.lastRun.faultsReused).toBe(false);
    expect(memo.lastRun.pairsReused).toBe(0);
  });

  it('after a setting edit re-checks only the pairs of that device, and agrees with a fresh analysis', () => {
    const memo = new AnalysisMemo();
    plain(demo(), memo);
    const edited = demo();
    (deviceOf(edited, 'FDR-DOCK').characteristic as { longTime: { delay: number } }).longTime.delay = 6;
    expect(plain(edited, memo)).toEqual(plain(edited));
    const network = networkOf(parseStudy(edited));
    const all = [...seriesPairs(network)];
    const involving = all.filter((p) => p.upstream.id === 'FDR-DOCK' || p.downstream.id === 'FDR-DOCK').length;
    expect(memo.lastRun.faultsReused).toBe(true);
    expect(memo.lastRun.pairsChecked).toBe(involving);
    expect(memo.lastRun.pairsReused).toBe(all.length - involving);
  });

  it('works the fault levels out again when the network changes, and agrees with a fresh analysis', () => {
    const memo = new AnalysisMemo();
    plain(demo(), memo);
    const edited = demo();
    edited.cables![0].length = '300 ft';
    expect(plain(edited, memo)).toEqual(plain(edited));
    expect(memo.lastRun.faultsReused).toBe(false);
  });

  it('works the fault levels out again when a conductor temperature changes, every other network list kept', () => {
    const memo = new AnalysisMemo();
    const before = parseStudy(demo());
    analyseStudy(before, memo);
    // As the workbench reads an edit of the option: the same lists, a new temperatures object.
    const hotter = { ...before, conductorTemperatures: { maximumFault: 20, minimumFault: 200 } };
    const viaMemo = analyseStudy(hotter, memo);
    expect(memo.lastRun.faultsReused).toBe(false);
    const fresh = analyseStudy(hotter);
    expect(viaMemo.faults.buses.get('MCC')!.min.threePhase).toBe(fresh.faults.buses.get('MCC')!.min.threePhase);
    expect(fresh.faults.buses.get('MCC')!.min.threePhase).toBeLessThan(
      analyseStudy(before).faults.buses.get('MCC')!.min.threePhase,
    );
  });

  // As the workbench edits: the parsed study copied along the edited path, every other object kept.
  const withDevice = (
    study: Study,
    id: string,
    change: (device: Study['devices'][number]) => Study['devices'][number],
  ) => ({
    ...study,
    devices: study.devices.map((device) => (device.id === id ? change(device) : device)),
  });
  const plainOf = (study: Study, memo?: AnalysisMemo) => {
    const analysis = analyseStudy(study, memo);
    return JSON.parse(JSON.stringify({ findings: analysis.findings, pairs: analysis.pairs, counts: analysis.counts }));
  };

  it("keeps each item's findings whose inputs are the same objects, and agrees with a fresh analysis after each edit", () => {
    const memo = new AnalysisMemo();
    let study = parseStudy(demo());
    plainOf(study, memo);
    const edits: ((s: Study) => Study)[] = [
      // A setting: only the edited device's own checks run again.
      (s) =>
        withDevice(s, 'FDR-DOCK', (d) => {
          const unit = d.characteristic as Extract<typeof d.characteristic, { kind: 'trip-unit' }>;
          return { ...d, characteristic: { ...unit, longTime: { ...unit.longTime!, delay: 6 } } };
        }),
      // A name: every sentence naming the device is written again.
      (s) => ({ ...s, devices: s.devices.map((d) => ({ ...d, name: `${d.name ?? d.id} (renamed)` })) }),
      // A cable: the network changed, so every check runs again.
      (s) => ({ ...s, cables: s.cables.map((c, i) => (i === 0 ? { ...c, length: c.length * 2 } : c)) }),
      // The sensitivity settings.
      (s) => ({
        ...s,
        coordination: { ...s.coordination, sensitivity: { ...s.coordination.sensitivity, maxTime: 0.5 } },
      }),
    ];
    const reused: number[] = [];
    for (const edit of edits) {
      study = edit(study);
      expect(plainOf(study, memo)).toEqual(plainOf(study));
      reused.push(memo.lastRun.itemsReused);
    }
    // Per device its sensitivity and its load; per transformer its protection and NEC 450.3; per cable
    // its short-circuit limit and its ampacity.
    const items =
      2 * study.devices.length + 2 * study.transformers.length + 2 * study.cables.length + study.motors.length;
    // After the setting edit all but a few items are kept; after the renaming and the cable, none is.
    expect(reused[0]).toBeGreaterThan(items - 6);
    expect(reused.slice(1, 3)).toEqual([0, 0]);
    expect(reused[3]).toBe(items - study.devices.length);
  });

  /** Every number of a characteristic, as [object, key] pairs, in a fixed order. */
  const numbersIn = (value: object): [Record<string, number>, string][] =>
    Object.entries(value).flatMap(([key, field]) =>
      typeof field === 'number'
        ? [[value as Record<string, number>, key] as [Record<string, number>, string]]
        : field && typeof field === 'object' && !Array.isArray(field)
          ? numbersIn(field)
          : [],
    );
  /** The item at `i` (wrapped) of a list replaced by `change(item)`, every other item kept. */
  const replaced = <T>(list: T[], i: number, change: (item: T) => T) =>
    list.map((item, j) => (j === i % list.length ? change(item) : item));
  // Edits as the workbench makes them: `i` picks the item, `x` in [0, 1) the new value.
  const EDITS: Array<(s: Study, i: number, x: number) => Study> = [
    (s, i, x) => ({
      ...s,
      devices: replaced(s.devices, i, (d) => {
        const characteristic = structuredClone(d.characteristic);
        const numbers = numbersIn(characteristic);
        const [object, key] = numbers[Math.floor(x * numbers.length)];
        object[key] *= 0.7 + 0.6 * x;
        return { ...d, characteristic };
      }),
    }),
    (s, i, x) => ({ ...s, devices: replaced(s.devices, i, (d) => ({ ...d, name: `device ${x}` })) }),
    (s, i, x) => ({ ...s, devices: replaced(s.devices, i, (d) => ({ ...d, margin: x < 0.5 ? 0.1 : 0.3 })) }),
    (s, i, x) => ({ ...s, buses: replaced(s.buses, i, (b) => ({ ...b, name: `bus ${x}` })) }),
    (s, i, x) => ({ ...s, transformers: replaced(s.transformers, i, (t) => ({ ...t, impedance: 4 + 3 * x })) }),
    (s, i, x) => ({ ...s, cables: replaced(s.cables, i, (c) => ({ ...c, length: c.length * (0.5 + x) })) }),
    (s, i, x) => ({ ...s, motors: replaced(s.motors, i, (m) => ({ ...m, name: `motor ${x}` })) }),
    // What the load and ampacity checks read: a device's rating, a cable's ampacity, a motor's size.
    (s, i, x) => ({ ...s, devices: replaced(s.devices, i, (d) => ({ ...d, rating: 50 + 1000 * x })) }),
    (s, i, x) => ({ ...s, cables: replaced(s.cables, i, (c) => ({ ...c, ampacity: 100 + 400 * x })) }),
    (s, i, x) => ({ ...s, motors: replaced(s.motors, i, (m) => ({ ...m, hp: 5 + 200 * x })) }),
    (s, _i, x) => ({
      ...s,
      coordination: { ...s.coordination, sensitivity: { ...s.coordination.sensitivity, maxTime: 0.5 + 4 * x } },
    }),
  ];

  it('agrees with a fresh analysis after any sequence of edits (property)', () => {
    const base = parseStudy(demo());
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.nat(EDITS.length - 1), fc.nat(), fc.double({ min: 0, max: 0.999, noNaN: true })), {
          minLength: 1,
          maxLength: 4,
        }),
        (edits) => {
          const memo = new AnalysisMemo();
          let study = base;
          plainOf(study, memo);
          for (const [edit, i, x] of edits) {
            study = EDITS[edit](study, i, x);
            expect(plainOf(study, memo)).toEqual(plainOf(study));
          }
        },
      ),
      { numRuns: 12 },
    );
  });
});
