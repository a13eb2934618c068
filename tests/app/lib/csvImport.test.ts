import { describe, it, expect } from 'vitest';
import {
  asOwnCurve,
  importCheckOf,
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

  // Invented, illustrative fuse curves: minimum melting 200–2000 A, total clearing 220–2200 A.
  const fuse = {
    kind: 'fuse',
    minimumMelting: [
      [200, 300],
      [2000, 0.01],
    ],
    totalClearing: [
      [220, 300],
      [2200, 0.02],
    ],
  };
  const check = (text: string) => {
    const points = parsePointsCsv(text);
    return importCheckOf(fuse, points, pointsTargetsOf('fuse', points)[0]);
  };

  it('importCheckOf() lets a curve sent as two one-curve files in, in either order, warning of the curve left in place', () => {
    // A new curve to the left of the old one: its minimum melting alone starts below the old total clearing.
    const melting = 'min,150,300\nmin,3000,0.01';
    const clearing = 'max,160,300\nmax,3200,0.02';
    expect(check(melting)).toEqual({
      warning: expect.stringMatching(
        /^These points do not fit the total clearing curve left in place, .*: totalClearing: expected total clearing no earlier than minimum melting/,
      ),
    });
    expect(check(clearing).refusal).toBeUndefined();
    // Both in one file, or the second after the first: accepted with no word.
    expect(check(`${melting}\n${clearing}`)).toEqual({});
    const first = withPoints(fuse, parsePointsCsv(melting), pointsTargetsOf('fuse', parsePointsCsv(melting))[0]);
    const points = parsePointsCsv(clearing);
    expect(importCheckOf(first, points, pointsTargetsOf('fuse', points)[0])).toEqual({});
  });

  it('importCheckOf() warns of the curve left in place even where the fuse has another problem already', () => {
    // A current-limiting threshold of 0 A is wrong on its own; the import has nothing to do with it.
    const flawed = { ...fuse, currentLimitingFrom: 0 };
    const points = parsePointsCsv('min,150,300\nmin,3000,0.01');
    expect(importCheckOf(flawed, points, pointsTargetsOf('fuse', points)[0])).toEqual({
      warning: expect.stringMatching(/^These points do not fit the total clearing curve left in place/),
    });
  });

  it('importCheckOf() refuses a two-curve file whose total clearing is faster than its minimum melting', () => {
    expect(check('min,150,300\nmin,3000,0.01\nmax,100,200\nmax,1000,0.005').refusal).toMatch(
      /^These points would not be accepted: totalClearing: expected total clearing to start at or above/,
    );
  });

  it('importCheckOf() does not blame the points for a problem the characteristic already had', () => {
    const breaker = {
      kind: 'thermal-magnetic',
      rating: 100,
      thermal: {
        minimum: [
          [1.1, 300],
          [10, 1],
        ],
        maximum: [
          [1.3, 600],
          [10, 4],
        ],
      },
      magnetic: { pickup: 200 },
    };
    const points = parsePointsCsv('min,1.05,400\nmin,10,2');
    expect(importCheckOf(breaker, points, pointsTargetsOf('thermal-magnetic', points)[0])).toEqual({});
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

  it("judges each row by the file's shape, its header's or first row's number of fields", () => {
    expect(pointsCsvProblems('curve,current,time\nmin,1,500,300\nmin,2000,0.1\nmin,3000,0.05')).toEqual([
      'row 2: expected 3 fields (curve,current,time), got "min,1,500,300" (a decimal comma or a thousands separator? write numbers as 1.5 and 1500, without separators)',
    ]);
    expect(pointsCsvProblems('current;time\n1,5;300\n20;0.01')).toEqual([
      'row 2: expected 2 fields (current,time), got "1,5;300" (a decimal comma or a thousands separator? write numbers as 1.5 and 1500, without separators)',
    ]);
  });

  it('names the rows of a file whose lines end in CR alone, as older spreadsheets write them', () => {
    expect(pointsCsvProblems('current,time\r200,300\rabc,1\r400,0.5')).toEqual([
      'row 3: expected a current in amperes greater than 0, got "abc"',
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
