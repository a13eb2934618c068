import { describe, it, expect } from 'vitest';
import {
  asOwnCurve,
  importProblemOf,
  pointsCsvProblems,
  pointsTargetsOf,
  previewTablesOf,
  withPoints,
} from '../../../src/app/lib/csvImport.ts';
import { parsePointsCsv } from '../../../src/engine/devices/index.ts';

// Invented, illustrative points (not a product).
const both = parsePointsCsv(
  'minimum-melting,150,300\nminimum-melting,2000,0.01\ntotal-clearing,170,300\ntotal-clearing,2200,0.02',
);
const one = parsePointsCsv('current,time\n2,1000\n10,5');

describe('csvImport', () => {
  it('has the expected defaults', () => {
    expect(pointsTargetsOf('relay', both)).toEqual([]);
    expect(previewTablesOf({})).toEqual([]);
  });

  it('pointsTargetsOf() puts a two-curve file on both edges and a one-curve file on either', () => {
    expect(pointsTargetsOf('fuse', both).map((t) => t.label)).toEqual(['minimum melting and total clearing']);
    expect(pointsTargetsOf('fuse', one).map((t) => t.label)).toEqual(['minimum melting', 'total clearing']);
    expect(pointsTargetsOf('thermal-magnetic', one)[1].fields).toEqual([['thermal', 'maximum']]);
  });

  it('pointsTargetsOf() puts a file whose rows name one curve on that edge alone', () => {
    // A file of total-clearing rows is never offered as minimum melting (it would move the fast edge).
    const clearing = parsePointsCsv('total-clearing,170,300\ntotal-clearing,2200,0.02');
    expect(pointsTargetsOf('fuse', clearing).map((t) => t.fields)).toEqual([[['totalClearing']]]);
    const melting = parsePointsCsv('min,1.1,300\nmin,10,1');
    expect(pointsTargetsOf('thermal-magnetic', melting).map((t) => t.fields)).toEqual([[['thermal', 'minimum']]]);
    const fuse = {
      kind: 'fuse',
      minimumMelting: [
        [150, 300],
        [2000, 0.01],
      ],
      totalClearing: [],
    };
    expect(withPoints(fuse, clearing, pointsTargetsOf('fuse', clearing)[0])).toEqual({
      ...fuse,
      totalClearing: [
        [170, 300],
        [2200, 0.02],
      ],
    });
  });

  it('importProblemOf() refuses points the study would refuse, naming the edge', () => {
    // Invented points: a total-clearing curve imported to the left of the fuse's minimum melting curve.
    const fuse = {
      kind: 'fuse',
      minimumMelting: [
        [150, 300],
        [2000, 0.01],
      ],
      totalClearing: [
        [100, 200],
        [1000, 0.005],
      ],
    };
    expect(importProblemOf(fuse)).toMatch(/^With these points the curve would not be accepted: totalClearing/);
    expect(importProblemOf({ ...fuse, totalClearing: both.maximum })).toBeUndefined();
  });

  it('withPoints() replaces the tables and keeps every other setting', () => {
    const fuse = {
      kind: 'fuse',
      label: 'Illustrative 200 A (illustrative, not a product)',
      minimumMelting: [],
      totalClearing: [],
    };
    const next = withPoints(fuse, both, pointsTargetsOf('fuse', both)[0]);
    expect(next).toEqual({
      ...fuse,
      minimumMelting: [
        [150, 300],
        [2000, 0.01],
      ],
      totalClearing: [
        [170, 300],
        [2200, 0.02],
      ],
    });
    const breaker = { kind: 'thermal-magnetic', rating: 400, thermal: { minimum: [[1, 1]], maximum: [[1, 2]] } };
    const edited = withPoints(breaker, one, pointsTargetsOf('thermal-magnetic', one)[1]) as typeof breaker;
    expect(edited.thermal.minimum).toEqual([[1, 1]]);
    expect(edited.thermal.maximum).toEqual([
      [2, 1000],
      [10, 5],
    ]);
  });

  it('previewTablesOf() names each curve of the file', () => {
    expect(previewTablesOf(both).map((t) => [t.name, t.rows.length])).toEqual([
      ['minimum (fast edge)', 2],
      ['maximum (slow edge)', 2],
    ]);
  });
});

describe('pointsCsvProblems', () => {
  it('lists every problem of a bad file, each with its row, in row order', () => {
    expect(pointsCsvProblems('current,time\n200,300\nabc,1\n100,10\n300\n400,0.5\n500,1')).toEqual([
      'row 3: expected a current in amperes greater than 0, got "abc"',
      'row 4: expected a current above the previous point\'s 200, got "100"',
      'row 5: expected 2 fields (current,time), got "300"',
      'row 7: expected a time below the previous point\'s 0.5 s, got "1"',
    ]);
  });

  it('finds nothing wrong with a good file of one or two curves', () => {
    expect(pointsCsvProblems('current,time\n200,300\n2000,0.1')).toEqual([]);
    expect(pointsCsvProblems('curve,current,time\nmin,200,300\nmax,250,400\nmin,2000,0.1\nmax,2500,0.2')).toEqual([]);
  });
});

describe('asOwnCurve', () => {
  it('relabels an imported curve as the user’s own and drops the illustrative mark', () => {
    const own = asOwnCurve(
      { kind: 'fuse', label: 'Illustrative fuse, 65 A', illustrative: true, minimumMelting: [] },
      'F1',
    );
    expect(own).toEqual({ kind: 'fuse', label: 'F1: digitised points imported by the user', minimumMelting: [] });
  });
});
