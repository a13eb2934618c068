import { describe, expect, it } from 'vitest';
import { networkOf } from '../../../src/engine/network/index.ts';
import { readStudy } from '../../../src/engine/study/index.ts';
import { layoutOneLine, type Drop } from '../../../src/plot/oneLine/index.ts';

// Accepts how many feeders leave the source bus and how many motors each feeder's bus carries (0: the
// motors hang from the source bus itself); the study's radial network.
function fannedNetwork(feeders: number, motorsEach: number) {
  const buses = [{ id: 'MAIN', voltage: 480 }];
  const cables = [];
  const motors = [];
  for (let f = 0; f < Math.max(feeders, 1); f++) {
    const bus = feeders === 0 ? 'MAIN' : `P${f + 1}`;
    if (feeders > 0) {
      buses.push({ id: bus, voltage: 480 });
      cables.push({ id: `C${f + 1}`, from: 'MAIN', to: bus, size: '4/0', length: 20 });
    }
    for (let m = 0; m < motorsEach; m++) motors.push({ id: `${bus}-M${m + 1}`, bus, hp: 10 });
  }
  const { study, problems } = readStudy({
    discern: 1,
    name: 'Fanned out',
    source: { kind: 'infinite', id: 'S', bus: 'MAIN' },
    buses,
    cables,
    motors,
  });
  if (!study) throw new Error(problems.map((p) => `${p.path}: ${p.message}`).join('; '));
  return networkOf(study);
}

// Every column 100 px wide: the numbers below are then sums one can do by hand.
const hundred = () => 100;

describe('layoutOneLine', () => {
  it('has the expected defaults: one row per bus however wide, each run a level (1) below its bus', () => {
    const layout = layoutOneLine(fannedNetwork(0, 12), hundred);
    expect(layout.width).toBe(1200);
    expect(layout.continuations).toEqual([]);
    const motors = layout.drops.filter((drop) => drop.kind === 'motor');
    expect(motors.map((drop) => drop.x)).toEqual(Array.from({ length: 12 }, (_, i) => 100 * i));
    expect(motors.every((drop) => drop.top === drop.depth && drop.barRow === 0)).toBe(true);
  });

  it('deals 10 branches of 100 px into the fewest rows within 450 px, past a 20-px link lane, under continuation bars', () => {
    // Side by side: 1,000 px > 450. Rows may take 450 − 20 = 430 px: 4 branches each, so 3 rows (4, 4, 2);
    // 3 branches a row would need 4 rows, so 400 px is as narrow as 3 rows get. Width: 20 + 400 = 420.
    const layout = layoutOneLine(fannedNetwork(0, 10), hundred, {
      maxWidth: 450,
      linkLane: 20,
      levelHeight: 10,
      leafHeight: 4,
      continuedHeight: 3,
    });
    expect(layout.width).toBe(420);
    const motors = layout.drops.filter((drop) => drop.kind === 'motor');
    expect(motors.map((drop) => [drop.barRow, drop.x])).toEqual([
      [0, 20],
      [0, 120],
      [0, 220],
      [0, 320],
      [1, 20],
      [1, 120],
      [1, 220],
      [1, 320],
      [2, 20],
      [2, 120],
    ]);
    // Row 0 hangs a level below the source (10) and reaches 4 lower (14); each next row's runs start
    // 3 below the row above: 14 + 3 = 17, reaching 21; then 24, reaching 28.
    expect(layout.continuations.map((c) => [c.barRow, c.top, c.first, c.runs.length, c.of])).toEqual([
      [1, 17, 5, 4, 10],
      [2, 24, 9, 2, 10],
    ]);
    expect(motors.map((drop) => drop.top)).toEqual([10, 10, 10, 10, 17, 17, 17, 17, 24, 24]);
    expect(layout.bottom).toBe(28);
  });

  it('wraps a bus inside a wrapped bus and keeps every column within maxWidth, lane and all', () => {
    // Each feeder's 5 motors (500 px) fit 500 px alone, but under a wrapped main bus its lane would make
    // 520: the budget narrows until they wrap too (3 and 2 motors, 320 px), and the main bus takes one feeder a row.
    const layout = layoutOneLine(fannedNetwork(3, 5), hundred, { maxWidth: 500, linkLane: 20 });
    expect(layout.width).toBeLessThanOrEqual(500);
    for (const drop of layout.drops) expect(drop.x + drop.width, drop.elementId).toBeLessThanOrEqual(layout.width);
    const feeders = layout.drops.filter((drop) => drop.kind === 'cable');
    expect(feeders.map((drop) => [drop.barRow, drop.x, drop.width])).toEqual([
      [0, 20, 320],
      [1, 20, 320],
      [2, 20, 320],
    ]);
    expect(layout.continuations.map((c) => `${c.busDrop.childBus} ${c.barRow}`)).toEqual([
      'MAIN 1',
      'MAIN 2',
      'P1 1',
      'P2 1',
      'P3 1',
    ]);
  });

  it('gives every run and every continuation bar a space of its own: a wrapped study of 6 feeders of 8 motors', () => {
    const [levelHeight, leafHeight, continuedHeight] = [10, 4, 3];
    const layout = layoutOneLine(fannedNetwork(6, 8), hundred, {
      maxWidth: 900,
      linkLane: 20,
      levelHeight,
      leafHeight,
      continuedHeight,
    });
    expect(layout.width).toBeLessThanOrEqual(900);
    expect(layout.continuations.length).toBeGreaterThan(0);
    // A run owns its column from its top down to where its bus's runs start (or its motor ends); a
    // continuation bar owns its bus's column across the gap above the runs it carries.
    const spaces = [
      ...layout.drops.map((drop: Drop) => ({
        what: drop.elementId,
        x: drop.x,
        width: drop.width,
        top: drop.top,
        bottom: drop.top + (drop.childBus === undefined ? leafHeight : levelHeight),
      })),
      ...layout.continuations.map((c) => ({
        what: `${c.busDrop.childBus} bar ${c.barRow}`,
        x: c.busDrop.x,
        width: c.busDrop.width,
        top: c.top - continuedHeight,
        bottom: c.top,
      })),
    ];
    const clashes: string[] = [];
    for (let i = 0; i < spaces.length; i++)
      for (let j = i + 1; j < spaces.length; j++) {
        const [a, b] = [spaces[i], spaces[j]];
        const apart = a.x + a.width <= b.x || b.x + b.width <= a.x || a.bottom <= b.top || b.bottom <= a.top;
        if (!apart) clashes.push(`${a.what} × ${b.what}`);
      }
    expect(clashes).toEqual([]);
  });
});
