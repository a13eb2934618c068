import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import {
  settingWindowOf,
  withSettingChanges,
  type SettingRow,
  type SettingWindow,
} from '../../../src/engine/window/index.ts';
import { failuresWith, workedStudy } from './fixtures.ts';

const input = workedStudy();
const study = parseStudy(input);

/** The constraint kinds a binding names, as the checks' finding kinds. */
const FINDING_KIND: Record<string, string> = {
  'coordinate-below': 'coordination',
  'coordinate-above': 'coordination',
  'transformer-withstand': 'transformer-withstand',
  'cable-withstand': 'cable-withstand',
  inrush: 'transformer-inrush',
  'motor-starting': 'motor-starting',
  'nec-450.3': 'nec-450.3',
  sensitivity: 'sensitivity',
  'carry-load': 'carry-load',
  'cable-ampacity': 'cable-ampacity',
};

/**
 * The brute-force edge: the feasibility of a setting read on a fine log grid (0.02 % steps) across
 * ±1.5 % of the window's edge by checking the whole study at every point; returns the first (or last)
 * clean grid value.
 */
function bruteEdge(deviceId: string, row: SettingRow, edge: number, side: 'lower' | 'upper'): number {
  const clean = (v: number) => failuresWith(input, deviceId, { [row.key]: v }).length === 0;
  const step = 1.0002;
  const from = Math.max(row.min, edge / 1.015);
  const to = Math.min(row.max, edge * 1.015);
  let found = NaN;
  for (let v = from; v <= to; v *= step) {
    const ok = clean(v);
    if (side === 'lower' && ok) return v;
    if (side === 'upper') {
      if (ok) found = v;
      else if (!Number.isNaN(found)) return found;
    }
  }
  return found;
}

/** Whether the window's own rows, switch entries or map cells show a setting that keeps every constraint. */
function showsOne(window: SettingWindow): boolean {
  return (
    window.settings.some((row) => row.intervals.length > 0) ||
    window.switches.some((row) => row.feasible.some(Boolean)) ||
    window.maps.some((map) => map.columns.some((column) => column.intervals.length > 0))
  );
}

/** The recommended settings as changes to the study file. */
function changesOf(window: SettingWindow) {
  return Object.fromEntries(
    window.recommendation!.settings.filter((s) => s.to !== undefined).map((s) => [s.key, s.to!]),
  );
}

/** A fast relay above (time dial 0.5) and a feeder below that waits 0.3 s: the main cannot fit between. */
function tightStudy(): StudyInput {
  const tight = workedStudy();
  const devices = tight.devices!;
  devices[0] = {
    ...devices[0],
    characteristic: {
      kind: 'relay',
      ct: '100:5',
      timeOvercurrent: { curve: 'ieee-extremely-inverse', pickup: 5, timeDial: 0.5 },
      instantaneous: { pickup: 80 },
      tolerance: { pickup: 5, time: 5 },
    },
  };
  devices[2] = {
    ...devices[2],
    characteristic: {
      kind: 'trip-unit',
      sensor: 400,
      longTime: { pickup: 1, delay: 4 },
      shortTime: { pickup: 4, delay: 0.3 },
    },
  };
  return tight;
}

describe('settingWindowOf', () => {
  it('has the expected defaults: every adjustable setting, every constraint with its source, two maps, a recommendation', () => {
    const window = settingWindowOf(study, 'MAIN');
    expect(window.adjustable).toBe(true);
    expect(window.settings.map((s) => s.key)).toEqual([
      'shortTime.delay',
      'shortTime.pickup',
      'longTime.delay',
      'longTime.pickup',
    ]);
    expect(window.constraints.map((c) => c.id)).toEqual(
      expect.arrayContaining(['below:FDR', 'above:R-T1', 'load', 'interrupting']),
    );
    for (const c of window.constraints) expect(c.source).not.toMatch(/from memory|REFERENCE/);
    expect(window.maps.map((m) => m.label)).toEqual([
      'long-time pickup × long-time delay',
      'short-time pickup × short-time delay',
    ]);
    expect(window.exists).toBe(true);
    expect(window.recommendation?.tieBreak).toMatch(/^Fastest first/);
  });

  it("reports, and is not closed by, a trip unit's rating given too large for its cable (NFPA 70 240.4(B)): no setting lowers it", () => {
    // The selective demo's dock feeder, given 400 A, on 4/0 copper (230 A in Table 310.16): the rating
    // fails the ampacity limit whatever the settings, so the window of each setting stays open.
    const demo = JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8')) as StudyInput;
    const dock = demo.cables!.find((c) => c.id === 'C-DOCK')!;
    dock.size = '4/0 AWG';
    const window = settingWindowOf(parseStudy(demo), 'FDR-DOCK');
    expect(window.exists).toBe(true);
    const ampacity = window.constraints.find((c) => c.id === 'ampacity:C-DOCK')!;
    expect(ampacity.favours).toBe('fixed');
  });

  it('holds a trip unit given a rating its cable allows to that rating: 500 kcmil (380 A) on a 600 A sensor given 400 A (NFPA 70 240.4(B), 240.6(C))', () => {
    // Set at 1 × 600 A the feeder is rated at its setting, 600 A; the window of its long-time pickup ends
    // at 400 / 600, where its setting reaches the 400 A the cable allows.
    const demo = JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8')) as StudyInput;
    const dock = demo.devices!.find((d) => d.id === 'FDR-DOCK')! as {
      characteristic: { longTime: { pickup: number } };
    };
    dock.characteristic.longTime.pickup = 1;
    const window = settingWindowOf(parseStudy(demo), 'FDR-DOCK');
    expect(window.constraints.find((c) => c.id === 'ampacity:C-DOCK')!.favours).toBe('faster');
    const pickup = window.settings.find((s) => s.key === 'longTime.pickup')!;
    const top = Math.max(...pickup.intervals.map((i) => i.to));
    expect(top).toBeLessThanOrEqual(400 / 600 + 1e-6);
    expect(pickup.intervals.find((i) => i.to === top)!.upper.id).toBe('ampacity:C-DOCK');
  });

  it('a fuse or thermal-magnetic breaker has nothing to set; a device not in the study is an input error naming the field', () => {
    expect(() => settingWindowOf(study, 'NOPE')).toThrow(/^device: expected one of R-T1, MAIN, FDR, got "NOPE"$/);
  });

  it('uses the setting ranges a device declares in the study in place of the generic ones', () => {
    const own = workedStudy();
    own.devices![2] = { ...own.devices![2], adjustable: { 'longTime.delay': { values: [4, 8, 12] } } };
    const row = settingWindowOf(parseStudy(own), 'FDR', { maps: false }).settings.find(
      (s) => s.key === 'longTime.delay',
    )!;
    expect(row).toMatchObject({ values: [4, 8, 12], min: 4, max: 12, rangeSource: 'range given in the study' });
    expect(() => parseStudy({ ...own, devices: [{ ...own.devices![2], adjustable: { delay: { max: 2 } } }] })).toThrow(
      /adjustable/,
    );
  });

  // IEEE 242 practice for the relay margin over a low-voltage breaker (the study's margin rule); the
  // brute force checks the whole study at each grid point, independently of the window's bisection.
  it.each([
    ['R-T1', 'timeOvercurrent.timeDial'],
    ['R-T1', 'timeOvercurrent.pickup'],
    ['R-T1', 'instantaneous.pickup'],
  ])('%s %s: every continuous edge lies within 0.1 percent of a brute-force fine grid', (deviceId, key) => {
    const row = settingWindowOf(study, deviceId, { maps: false }).settings.find((s) => s.key === key)!;
    expect(row.intervals.length).toBe(1);
    const [interval] = row.intervals;
    if (interval.lower.kind !== 'setting-range') {
      const brute = bruteEdge(deviceId, row, interval.from, 'lower');
      expect(Math.abs(brute / interval.from - 1)).toBeLessThan(1e-3);
    }
    if (interval.upper.kind !== 'setting-range') {
      const brute = bruteEdge(deviceId, row, interval.to, 'upper');
      expect(Math.abs(brute / interval.to - 1)).toBeLessThan(1e-3);
    }
  });

  it.each([
    ['MAIN', 'shortTime.delay'],
    ['MAIN', 'shortTime.pickup'],
    ['MAIN', 'longTime.pickup'],
    ['FDR', 'longTime.pickup'],
    ['FDR', 'instantaneous.pickup'],
  ])('%s %s: the stepped window is exactly the steps the whole study checks clean on', (deviceId, key) => {
    const row = settingWindowOf(study, deviceId, { maps: false }).settings.find((s) => s.key === key)!;
    const inside = (v: number) => row.intervals.some((i) => v >= i.from - 1e-12 && v <= i.to + 1e-12);
    for (const value of row.values!) {
      const clean = failuresWith(input, deviceId, { [key]: value }).length === 0;
      expect(clean, `${key} = ${value}`).toBe(inside(value));
    }
  });

  it('every edge of the 2-D map of the relay agrees with the whole study checked at and just beyond it', () => {
    const map = settingWindowOf(study, 'R-T1').maps[0];
    expect(map.label).toBe('pickup × time dial');
    const open = map.columns.filter((c) => c.intervals.length > 0);
    expect(open.length).toBeGreaterThan(3);
    for (const column of open.filter((_, i) => i % 4 === 0)) {
      const [interval] = column.intervals;
      const at = (dial: number) =>
        failuresWith(input, 'R-T1', { 'timeOvercurrent.pickup': column.x, 'timeOvercurrent.timeDial': dial });
      expect(at(interval.from)).toEqual([]);
      expect(at(interval.to)).toEqual([]);
      if (interval.lower.kind !== 'setting-range') expect(at(interval.from * 0.999).length).toBeGreaterThan(0);
      if (interval.upper.kind !== 'setting-range') expect(at(interval.to * 1.001).length).toBeGreaterThan(0);
    }
  });

  describe('property: inside the window every constraint holds; just outside, the binding one fails', () => {
    const rows = settingWindowOf(study, 'R-T1', { maps: false }).settings.filter((s) => s.intervals.length > 0);
    for (const seed of [1, 7, 42]) {
      it(`seed ${seed}`, () => {
        fc.assert(
          fc.property(
            fc.integer({ min: 0, max: rows.length - 1 }),
            fc.double({ min: 0, max: 1, noNaN: true }),
            (index, t) => {
              const row = rows[index];
              const { from, to, lower, upper } = row.intervals[0];
              const value = from * Math.pow(to / from, t);
              expect(failuresWith(input, 'R-T1', { [row.key]: value })).toEqual([]);
              for (const [binding, outside] of [
                [lower, from * 0.998],
                [upper, to * 1.002],
              ] as const) {
                if (binding.kind === 'setting-range') continue;
                const failures = failuresWith(input, 'R-T1', { [row.key]: outside });
                const subject = binding.id.split(':')[1];
                expect(
                  failures.some(
                    (f) =>
                      f.kind === FINDING_KIND[binding.kind] && (subject === undefined || f.subjects.includes(subject)),
                  ),
                  `${row.key} = ${outside} should break "${binding.label}"`,
                ).toBe(true);
              }
            },
          ),
          { seed, numRuns: 12 },
        );
      });
    }
  });

  it('the recommendation keeps every constraint, and its settings check clean in the whole study', () => {
    for (const id of ['R-T1', 'MAIN', 'FDR']) {
      const { recommendation } = settingWindowOf(study, id, { maps: false });
      expect(recommendation, id).toBeDefined();
      expect(recommendation!.margins.filter((m) => m.favours !== 'fixed' && !m.result.ok)).toEqual([]);
      const changes = Object.fromEntries(
        recommendation!.settings.filter((s) => s.to !== undefined).map((s) => [s.key, s.to!]),
      );
      expect(failuresWith(input, id, changes), id).toEqual([]);
    }
  });

  // A relay set too fast (time dial 2) fails to wait for the main below; one step of the search from
  // its slowest setting lowers the instantaneous first and then cannot keep the transformer's
  // through-fault curve (IEEE C57.109 frequent-fault curve). Yet the time-dial row, the rest held,
  // shows dials from about 4.2 to 10.7 that keep both.
  it('a relay set too fast still has a window when its own time-dial row shows one', () => {
    const fast = workedStudy();
    const relay = fast.devices![0];
    fast.devices![0] = {
      ...relay,
      characteristic: {
        kind: 'relay',
        ct: '100:5',
        timeOvercurrent: { curve: 'ieee-extremely-inverse', pickup: 5.5, timeDial: 2 },
        instantaneous: { pickup: 80 },
        tolerance: { pickup: 5, time: 5 },
      },
    };
    const window = settingWindowOf(parseStudy(fast), 'R-T1', { maps: false });
    expect(window.currentHolds).toBe(false);
    const dial = window.settings.find((s) => s.key === 'timeOvercurrent.timeDial')!;
    expect(dial.intervals).toHaveLength(1);
    expect(dial.intervals[0].from).toBeCloseTo(4.2, 1);
    expect(window.exists).toBe(true);
    expect(window.noWindow).toBeUndefined();
    expect(window.recommendation!.margins.filter((m) => m.favours !== 'fixed' && !m.result.ok)).toEqual([]);
    expect(failuresWith(fast, 'R-T1', changesOf(window))).toEqual([]);
  });

  it('with the relay set anywhere along its time dial, its rows show a window and the window exists', () => {
    for (const timeDial of [0.5, 1, 2, 3, 6, 9, 12]) {
      const variant = workedStudy();
      const characteristic = variant.devices![0].characteristic as { timeOvercurrent: { timeDial: number } };
      characteristic.timeOvercurrent.timeDial = timeDial;
      const window = settingWindowOf(parseStudy(variant), 'R-T1', { remedies: false });
      expect(showsOne(window), `time dial ${timeDial}`).toBe(true);
      expect(window.exists, `time dial ${timeDial}`).toBe(true);
      expect(window.recommendation, `time dial ${timeDial}`).toBeDefined();
    }
  });

  // The full demo with an instantaneous trip on the 2000 A main at 12.5 × I_n: the emergency feeder can no
  // longer fit under it by changing one setting alone, but its long-time map has open cells (a lower
  // long-time pickup with a shorter delay). The search starts from one and finds a setting.
  it('a window exists when only a cell of the pickup × time map shows one', () => {
    const full = JSON.parse(readFileSync('demo/harrowmere-full.json', 'utf8')) as StudyInput;
    const main = full.devices!.find((d) => d.id === 'MAIN')!;
    main.characteristic = { ...main.characteristic, instantaneous: { pickup: 12.5 } } as typeof main.characteristic;
    const window = settingWindowOf(parseStudy(full), 'FDR-EM');
    expect(window.settings.every((row) => row.intervals.length === 0)).toBe(true);
    expect(window.switches.every((row) => !row.feasible.some(Boolean))).toBe(true);
    expect(window.maps[0].columns.some((column) => column.intervals.length > 0)).toBe(true);
    expect(window.exists).toBe(true);
    expect(window.recommendation!.margins.filter((m) => m.favours !== 'fixed' && !m.result.ok)).toEqual([]);
    expect(failuresWith(full, 'FDR-EM', changesOf(window))).toEqual([]);
    // The same answer without drawing the maps: the search solves the cells it needs itself.
    expect(settingWindowOf(parseStudy(full), 'FDR-EM', { maps: false }).exists).toBe(true);
  });

  // The emergency feeder of the full demo waits for its 50 A branch breakers with a full margin today.
  // Switching I²t in and lowering every setting would clear faster on average, but only 0.002 s clear of
  // the branch breakers and thin against the main above: the recommendation keeps a full margin instead
  // (a coordination margin is a minimum to keep, not a target to spend; common practice).
  it('never trades a setting with full margins for one with thin margins', () => {
    const full = parseStudy(readFileSync('demo/harrowmere-full.json', 'utf8'));
    const window = settingWindowOf(full, 'FDR-EM', { maps: false });
    const thin = (margins: SettingWindow['constraints']) =>
      margins.filter((m) => m.favours !== 'fixed' && m.result.ok && !m.result.clean).map((m) => m.id);
    expect(window.currentHolds).toBe(true);
    expect(thin(window.constraints)).toEqual([]);
    expect(thin(window.recommendation!.margins)).toEqual([]);
    expect(window.recommendation!.settings.find((s) => s.key === 'shortTime.i2t')!.to).toBe(false);
  });

  it('names the conflict when no window exists, and the changes elsewhere that would open one', () => {
    const tight = tightStudy();
    const window = settingWindowOf(parseStudy(tight), 'MAIN', { maps: false });
    expect(window.exists).toBe(false);
    expect(window.recommendation).toBeUndefined();
    const { conflicts, explanation, remedies } = window.noWindow!;
    expect(conflicts.map((c) => c.id)).toEqual(expect.arrayContaining(['below:FDR', 'above:R-T1']));
    expect(explanation).toMatch(/^To coordinate with FDR below .*can no longer coordinate with R-T1 above/);
    expect(remedies.map((r) => r.text)).toEqual(
      expect.arrayContaining([expect.stringMatching(/^Speed up FDR /), expect.stringMatching(/^Slow R-T1 above/)]),
    );
  });

  it('each remedy with its changes, applied to the study, opens a window exactly when it says it does', () => {
    const tight = tightStudy();
    const { remedies } = settingWindowOf(parseStudy(tight), 'MAIN', { maps: false }).noWindow!;
    const tried = remedies.filter((r) => r.changes);
    expect(tried.map((r) => r.text)).toEqual(expect.arrayContaining([expect.stringMatching(/^Slow R-T1 above/)]));
    for (const remedy of tried) {
      const changes = remedy.changes!.map(({ deviceId, key, to }) => ({ deviceId, key, to }));
      const changed = parseStudy(withSettingChanges(tight, changes));
      const window = settingWindowOf(changed, 'MAIN', { maps: false, remedies: false });
      expect(window.exists, remedy.text).toBe(remedy.verified);
    }
  });
});
