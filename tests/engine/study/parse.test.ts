import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseStudy, readStudy, formatProblem, type StudyInput } from '../../../src/engine/study/index.ts';
import { readStudyParsed } from '../../../src/engine/study/parse.ts';

const demoText = readFileSync('demo/harrowmere-selective.json', 'utf8');
const demo = () => JSON.parse(demoText) as StudyInput & Record<string, unknown>;
const firstProblem = (input: unknown) => {
  const { study, problems } = readStudy(input);
  expect(study).toBeUndefined();
  return formatProblem(problems[0]);
};

describe('readStudy', () => {
  it('has the expected defaults', () => {
    const study = parseStudy(demoText);
    expect(study.frequency).toBe(60);
    expect(study.transformers[0].connection).toBe('delta-wye');
    expect(study.transformers[0].impedanceTolerance).toBe(false);
    expect(study.motors[0].contribution).toBe(4);
    expect(study.cables[0].insulation).toBe('xlpe');
    expect(study.coordination.halfCycle).toBe(0.01);
  });

  it('reads the demo study in SI units', () => {
    const study = parseStudy(demoText);
    expect(study.buses[0].voltage).toBe(12470);
    expect(study.transformers[0].rating).toBe(1.5e6);
    expect(study.transformers[0].impedance).toBe(5.75);
    expect(study.source.kind === 'utility' && study.source.max.available.va).toBe(250e6);
    expect(study.cables[0].length).toBeCloseTo(30.48, 12);
  });

  it('rejects a bus fed twice (not a tree)', () => {
    const input = demo();
    const i = input.cables!.push({ id: 'C-X', from: 'DOCK', to: 'MCC', size: '4/0', length: 10 }) - 1;
    expect(firstProblem(input)).toMatch(
      at(
        `study.cables[${i}].to`,
        /: expected a bus fed only once in a radial system \(C-MCC already feeds it\), got "MCC"$/,
      ),
    );
  });

  it('rejects an orphan bus', () => {
    const input = demo();
    const i = input.buses.push({ id: 'LOST', voltage: 480 }) - 1;
    expect(firstProblem(input)).toMatch(
      at(
        `study.buses[${i}]`,
        /: expected a bus connected to the source through transformers and cables \(this one is an orphan or in a loop\), got "LOST"$/,
      ),
    );
  });

  it('rejects a loop cut off from the source', () => {
    const input = demo();
    const i = input.buses.push({ id: 'A', voltage: 480 }, { id: 'B', voltage: 480 }) - 2;
    input.cables!.push(
      { id: 'AB', from: 'A', to: 'B', size: '4/0', length: 10 },
      { id: 'BA', from: 'B', to: 'A', size: '4/0', length: 10 },
    );
    expect(firstProblem(input)).toMatch(
      at(`study.buses[${i}]`, /: expected a bus connected to the source .*orphan or in a loop\), got "A"$/),
    );
  });

  it('rejects a winding voltage that does not match its bus', () => {
    const input = demo();
    input.transformers![0].secondary = '600 V';
    expect(firstProblem(input)).toMatch(
      /^study\.transformers\[0\]\.secondary: expected the voltage of bus SWBD \(480 V\), got "600 V"$/,
    );
  });

  it('rejects a duplicate id', () => {
    const input = demo();
    input.cables![1].id = 'T2';
    expect(firstProblem(input)).toMatch(
      /^study\.cables\[1\]\.id: expected an id not already used \(a transformer has it\), got "T2"$/,
    );
  });

  it('rejects a bad quantity', () => {
    const input = demo();
    input.buses[1].voltage = '480 kA';
    expect(firstProblem(input)).toMatch(
      /^study\.buses\[1\]\.voltage: expected a voltage such as "13\.8 kV", got "480 kA"$/,
    );
    const negative = demo();
    negative.transformers![1].impedance = '-5';
    expect(firstProblem(negative)).toMatch(
      /^study\.transformers\[1\]\.impedance: expected a percentage of at least 0\.5, got "-5"$/,
    );
  });

  it('refuses a per-unit transformer impedance written where a percentage goes: 0.0575 is not 5.75 %', () => {
    // Read as 0.0575 %, it gave the demo's switchboard 276 kA where 5.75 % gives 30 kA.
    const input = demo();
    input.transformers![0].impedance = 0.0575;
    expect(firstProblem(input)).toMatch(
      /^study\.transformers\[0\]\.impedance: expected a percentage of at least 0\.5, got "0\.0575"$/,
    );
  });

  it('rejects a bad enum', () => {
    const input = demo();
    (input.transformers![0] as Record<string, unknown>).connection = 'zigzag';
    expect(firstProblem(input)).toMatch(
      /^study\.transformers\[0\]\.connection: expected one of "delta-wye", "delta-delta", "wye-wye", "wye-delta", got "zigzag"$/,
    );
  });

  it('rejects a field it does not know and text that is not JSON', () => {
    const input = demo();
    input.colour = 'blue';
    expect(firstProblem(input)).toMatch(/^study: expected no field "colour" here, got one$/);
    expect(firstProblem('{ nope')).toMatch(/^study: expected a field name in double quotes at line 1:3, got "nope"$/);
  });

  it('reads a file that starts with a UTF-8 byte-order mark, as the workbench does', () => {
    expect(readStudy(`\uFEFF${demoText}`).study?.name).toBe(parseStudy(demoText).name);
  });

  it('reports a JSON syntax error on one line with its line and column', () => {
    const broken = demoText.replace('"voltage": 480', '"voltage": 480,,');
    const message = firstProblem(broken);
    expect(message).not.toContain('\n');
    expect(message).toMatch(/^study\.buses\[1\]: expected a field name in double quotes at line \d+:\d+, got ","$/);
  });

  it('refuses a field given twice in one object (JSON.parse would keep the last silently)', () => {
    const twice = demoText.replace('"voltage": 480', '"voltage": 480, "voltage": 600');
    expect(firstProblem(twice)).toMatch(
      /^study\.buses\[1\]\.voltage: expected the field once in its object, got it twice \(again at line \d+:\d+\)$/,
    );
  });

  it('names the first out-of-range number deep in a document, and stops a cycle at the nesting limit', () => {
    const document = JSON.parse(demoText) as { devices: { characteristic: Record<string, unknown> }[] };
    document.devices[1].characteristic.extra = [
      [1, 2],
      [3, 1e-300],
    ];
    expect(readStudy(document).problems[0]).toEqual({
      path: 'study.devices[1].characteristic.extra[1][1]',
      message: 'expected 0 or a number between 1e-9 and 1000000000000 in size, got "1e-300"',
    });
    // A document built in memory can refer to itself; JSON text cannot.
    const cyclic: Record<string, unknown> = { discern: 1 };
    cyclic.self = cyclic;
    expect(readStudy(cyclic).problems[0].message).toBe('expected at most 32 levels of nesting, got more');
  });

  it.each([
    [
      'a denormal',
      1e-310,
      /^study\.buses\[1\]\.voltage: expected 0 or a number between 1e-9 and 1000000000000 in size, got "1e-310"$/,
    ],
    ['an overflowed JSON number', '1e400', /^study\.buses\[1\]\.voltage: expected 0 or a number .*, got "Infinity"$/],
    ['a unit that overflows', '1e400 kV', /^study\.buses\[1\]\.voltage: expected a finite voltage, got "1e400 kV"$/],
    [
      'an absurd voltage',
      '1e308 V',
      /^study\.buses\[1\]\.voltage: expected a voltage between 1 V and 2000000 V, got "1e308 V"$/,
    ],
  ])('refuses %s where a voltage belongs', (_, value, message) => {
    const text = demoText.replace(
      '"voltage": 480',
      `"voltage": ${typeof value === 'string' && !value.includes(' ') ? value : JSON.stringify(value)}`,
    );
    expect(firstProblem(text)).toMatch(message);
  });

  it('refuses a real power where an apparent power belongs (no power factor is assumed)', () => {
    const input = demo();
    input.transformers![0].rating = '1500 kW';
    expect(firstProblem(input)).toMatch(
      /^study\.transformers\[0\]\.rating: expected an apparent power in VA, kVA or MVA/,
    );
  });

  it('refuses a 1000 % transformer impedance', () => {
    const input = demo();
    input.transformers![0].impedance = '1000 %';
    expect(firstProblem(input)).toMatch(
      /^study\.transformers\[0\]\.impedance: expected a percentage of at most 25, got "1000 %"$/,
    );
  });

  it('refuses a denormal transformer impedance written as text, as it refuses a denormal number', () => {
    // "1e-310 %" once passed "greater than 0" and gave an infinite bus of Infinity amperes.
    const input = demo();
    input.transformers![0].impedance = '1e-310 %';
    expect(firstProblem(input)).toMatch(
      /^study\.transformers\[0\]\.impedance: expected a percentage .*, got "1e-310 %"$/,
    );
  });

  it('refuses a minimum source stronger than the maximum', () => {
    const input = demo();
    if (input.source.kind !== 'utility') throw new Error('the demo has a utility source');
    input.source.min = { available: '300 MVA', xr: 10 };
    expect(firstProblem(input)).toMatch(
      /^study\.source\.min\.available: expected a minimum fault no stronger than the maximum \(250 MVA\), got "300 MVA"$/,
    );
  });

  it('refuses a device listed twice in a view, and a view longer than a sheet can show', () => {
    const input = demo();
    input.views![0].devices.push(input.views![0].devices[0]);
    expect(firstProblem(input)).toMatch(
      /^study\.views\[0\]\.devices\[4\]: expected each device once in a view, got "R-T1"$/,
    );
    input.views![0].devices = Array.from({ length: 100_000 }, () => 'MAIN');
    expect(firstProblem(input)).toMatch(
      /^study\.views\[0\]\.devices: expected at most 100 item\(s\), got "100000 items"$/,
    );
  });

  it('refuses names with control characters, U+FFFE, or longer than 200 characters', () => {
    const input = demo();
    input.buses[0].name = 'Main\u000bbus';
    expect(firstProblem(input)).toMatch(
      /^study\.buses\[0\]\.name: expected text without control characters or U\+FFFE\/U\+FFFF, got "Main\\u000bbus"$/,
    );
    input.buses[0].name = 'x\uFFFE';
    expect(firstProblem(input)).toMatch(/^study\.buses\[0\]\.name: expected text without control characters/);
    input.buses[0].name = 'x'.repeat(5_000_000);
    expect(firstProblem(input)).toMatch(
      /^study\.buses\[0\]\.name: expected at most 200 characters, got "5000000 characters"$/,
    );
  });

  it('refuses a cable size the impedance and withstand curves cannot read', () => {
    const input = demo();
    input.cables![0].size = '2000 kcmil';
    expect(firstProblem(input)).toMatch(/^study\.cables\[0\]\.size: expected a size in NEC Table 9/);
  });

  it('finds a cable loop before anything walks the tree, even with per-pair margins', () => {
    const input = demo();
    const i = input.cables!.push({ id: 'C-LOOP', from: 'MCC', to: 'SWBD', size: '4/0', length: 10 }) - 1;
    input.coordination = { pairs: [{ upstream: 'MAIN', downstream: 'FDR-MCC', margin: 0.2 }] };
    expect(firstProblem(input)).toMatch(
      at(
        `study.cables[${i}].to`,
        /: expected a bus fed only once in a radial system \(T1 already feeds it\), got "SWBD"$/,
      ),
    );
  });

  it('refuses a per-pair margin naming something that is not a device', () => {
    const input = demo();
    input.coordination = { pairs: [{ upstream: 'MAIN', downstream: 'NOPE', margin: 0.2 }] };
    expect(firstProblem(input)).toMatch(
      /^study\.coordination\.pairs\[0\]\.downstream: expected the id of a device, got "NOPE"$/,
    );
  });

  it("refuses conductor temperatures out of their span or a minimum fault's below the maximum's, naming the field", () => {
    const input = demo();
    input.conductorTemperatures = { maximumFault: 40, minimumFault: 30 };
    expect(firstProblem(input)).toMatch(
      /^study\.conductorTemperatures: expected a minimum-fault temperature at or above the maximum-fault one .*, got 30 °C below 40 °C$/,
    );
    // Out of its span, a temperature is told alone: not also as below the other one.
    input.conductorTemperatures = { maximumFault: 300 };
    expect(readStudy(input).problems.map((p) => p.path)).toEqual(['study.conductorTemperatures.maximumFault']);
    input.conductorTemperatures = { minimumFault: 300 };
    expect(firstProblem(input)).toMatch(/^study\.conductorTemperatures\.minimumFault: .*250/);
    input.conductorTemperatures = { maximumFault: -10 };
    expect(parseStudy(input).conductorTemperatures).toEqual({ maximumFault: -10, minimumFault: 90 });
  });

  it('reads a radial chain 250 levels deep (no recursion anywhere)', () => {
    const input = demo();
    let above = 'EMP';
    for (let k = 0; k < 250; k++) {
      input.buses.push({ id: `D${k}`, voltage: 480 });
      input.cables!.push({ id: `CD${k}`, from: above, to: `D${k}`, size: '4/0', length: 10 });
      above = `D${k}`;
    }
    input.coordination = { pairs: [{ upstream: 'MAIN', downstream: 'FDR-EM', margin: 0.2 }] };
    expect(readStudy(input).problems).toEqual([]);
  });

  it('gives the document back unless asked not to, with the same study and problems either way', () => {
    const kept = readStudyParsed(demoText);
    const dropped = readStudyParsed(demoText, false);
    expect(kept.reading.document).toEqual(demo());
    expect(dropped.reading.document).toBeUndefined();
    expect(dropped.reading.study).toEqual(kept.reading.study);
    // A document given as an object is the caller's own, and is given back.
    const document = demo();
    expect(readStudyParsed(document, false).reading.document).toBe(document);
    // A study the tree rules refuse: the same problems.
    const orphan = JSON.stringify({ ...demo(), buses: [...demo().buses, { id: 'ORPHAN', voltage: 480 }] });
    expect(readStudyParsed(orphan, false).reading.problems).toEqual(readStudy(orphan).problems);
    expect(readStudyParsed(orphan, false).reading.problems[0].path).toBe(`study.buses[${demo().buses.length}]`);
  });

  it('parseStudy throws the first problem as an InputError with its path', () => {
    const input = demo();
    input.buses[1].voltage = 'high';
    expect(() => parseStudy(input)).toThrow(/^study\.buses\[1\]\.voltage: expected a voltage/);
  });

  it('reads cycles at the study frequency: "5 cycles" is 0.1 s at 50 Hz', () => {
    const input = demo();
    input.frequency = 50;
    input.motors![0].accelerationTime = '5 cycles';
    expect(parseStudy(input).motors[0].accelerationTime).toBeCloseTo(0.1, 12);
  });
});

/** A regex for `path` followed by `rest` (whose source must not start with ^). */
function at(path: string, rest: RegExp): RegExp {
  return new RegExp(`^${path.replace(/[.[\]]/g, '\\$&')}${rest.source}`);
}
