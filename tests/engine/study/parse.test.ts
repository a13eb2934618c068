import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseStudy, readStudy, formatProblem, type StudyInput } from '../../../src/engine/study/index.ts';

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
      /^study\.transformers\[1\]\.impedance: expected a percentage greater than 0, got "-5"$/,
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
    expect(firstProblem('{ nope')).toMatch(/^study: expected JSON text, got a syntax error/);
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
