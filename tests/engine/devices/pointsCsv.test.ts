import { describe, expect, it } from 'vitest';
import { parsePointsCsv } from '../../../src/engine/devices/pointsCsv.ts';
import { fuseSchema } from '../../../src/engine/devices/fuseSchema.ts';

function rejection(text: string): string {
  try {
    parsePointsCsv(text);
  } catch (error) {
    return (error as Error).message;
  }
  return 'accepted';
}

describe('pointsCsv', () => {
  it('has the expected defaults', () => {
    expect(parsePointsCsv('200,300\n2000,0.01')).toEqual({
      points: [
        [200, 300],
        [2000, 0.01],
      ],
    });
  });

  it('parsePointsCsv reads a header, comments, blank lines and other separators', () => {
    const text = '# digitised from an invented curve\ncurrent,time\n\n200, 300\n400;10  # knee\n2000\t0.01\n';
    expect(parsePointsCsv(text).points).toEqual([
      [200, 300],
      [400, 10],
      [2000, 0.01],
    ]);
  });

  it('parsePointsCsv splits three-column files into the fast and slow edges, fit for a fuse', () => {
    const text = [
      'curve,current,time',
      'minimum-melting,200,100',
      'minimum-melting,4000,0.01',
      'total-clearing,200,120',
      'total-clearing,4000,0.02',
    ].join('\n');
    const { minimum, maximum } = parsePointsCsv(text);
    const fuse = fuseSchema.parse({ kind: 'fuse', minimumMelting: minimum, totalClearing: maximum });
    expect(fuse.totalClearing).toEqual([
      [200, 120],
      [4000, 0.02],
    ]);
    expect(parsePointsCsv('min,1.05,3600\nmin,10,1\nMAX,1.35,3600\nmax,10,5').maximum).toEqual([
      [1.35, 3600],
      [10, 5],
    ]);
  });

  it('parsePointsCsv names the row of a bad value', () => {
    const lines = ['# header follows', 'current,time', '200,300', '400,10', '', '# comment', 'abc,1'];
    expect(rejection(lines.join('\n'))).toMatch(/^row 7: expected a current in amperes greater than 0, got "abc"$/);
    expect(rejection('200,300\n400,-1')).toMatch(/^row 2: expected a time in seconds greater than 0, got "-1"$/);
    expect(rejection('200,300\n150,10')).toMatch(
      /^row 2: expected a current above the previous point's 200, got "150"$/,
    );
    expect(rejection('200,300\n400,300')).toMatch(
      /^row 2: expected a time below the previous point's 300 s, got "300"$/,
    );
    expect(rejection('200,300\n400,10,5')).toMatch(/^row 2: expected 2 fields \(current,time\), got "400,10,5"$/);
    expect(rejection('melt,200,300')).toMatch(
      /^row 1: expected a curve "minimum-melting", "total-clearing", "min" or "max", got "melt"$/,
    );
    expect(rejection('200,300')).toMatch(/^row 1: expected at least 2 points on this curve, got 1$/);
    expect(rejection('# nothing here\n')).toMatch(
      /^row 1: expected rows of current,time or curve,current,time, got no points$/,
    );
  });

  it('parsePointsCsv reads the units a header gives, in kA or ms, so a file is never read a thousand times off', () => {
    // 0.2 kA at 300,000 ms is 200 A at 300 s; 2 kA at 10 ms is 2000 A at 0.01 s.
    expect(parsePointsCsv('current (kA),time (ms)\n0.2,300000\n2,10').points).toEqual([
      [200, 300],
      [2000, 0.01],
    ]);
    expect(parsePointsCsv('current_A,time ms\n200,300000\n2000,10').points).toEqual([
      [200, 300],
      [2000, 0.01],
    ]);
    // Amperes rms, seconds, and multiples of a rating (a thermal band) are read as they are.
    expect(parsePointsCsv('current (A rms),time [s]\n200,300\n2000,0.01').points).toEqual([
      [200, 300],
      [2000, 0.01],
    ]);
    expect(parsePointsCsv('curve,current (× In),time (s)\nmin,1.1,300\nmin,10,1').minimum).toEqual([
      [1.1, 300],
      [10, 1],
    ]);
  });

  it('parsePointsCsv refuses a unit it does not read, and never takes a row of numbers with units for a header', () => {
    expect(rejection('current (A),time (cycles)\n200,30\n2000,1')).toMatch(
      /^row 1: expected a column in s or ms, got "time \(cycles\)"$/,
    );
    expect(rejection('current (mA),time\n200,300\n2000,0.01')).toMatch(
      /^row 1: expected a column in A, kA or multiples \(×\), got "current \(mA\)"$/,
    );
    // The first point, written with its units, is not dropped as a header: it is refused, naming it.
    expect(rejection('200 A,300 s\n2000,0.01\n3000,0.005')).toMatch(
      /^row 1: expected a current in amperes greater than 0, got "200 A"$/,
    );
  });

  it('parsePointsCsv says why a decimal comma or a thousands separator splits a row', () => {
    const hint = '(a decimal comma or a thousands separator? write numbers as 1.5 and 1500, without separators)';
    // "1,5;300" is 1.5 A at 300 s written with a decimal comma; "1,500,300" is 1500 A with a thousands separator.
    expect(rejection('1,5;300\n20;0,01')).toBe(
      `row 1: expected a curve "minimum-melting", "total-clearing", "min" or "max", got "1" ${hint}`,
    );
    expect(rejection('current,time\n200,300\n1,500,0.5')).toBe(
      `row 3: expected 2 fields (current,time), got "1,500,0.5" ${hint}`,
    );
    expect(rejection('current,time\n200,300\n1,234.5,0.2')).toBe(
      `row 3: expected 2 fields (current,time), got "1,234.5,0.2" ${hint}`,
    );
    // A row with too many fields and no group of three digits after a comma gets no hint.
    expect(rejection('200,300\n400,10,5')).not.toMatch(/decimal comma/);
  });

  it('parsePointsCsv splits lines ended by CR alone, as older spreadsheet exports write them', () => {
    expect(parsePointsCsv('current,time\r200,300\r2000,0.01').points).toEqual([
      [200, 300],
      [2000, 0.01],
    ]);
  });
});
