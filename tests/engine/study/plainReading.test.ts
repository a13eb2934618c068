import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { z } from 'zod/mini';
import { radialStudy } from '../../../bench/radialStudy.ts';
import { characteristicSchema, createCharacteristicSchema } from '../../../src/engine/devices/characteristic.ts';
import { quantityField, textField } from '../../../src/engine/study/fields.ts';
import { NOT_PLAIN, plainReaderOf } from '../../../src/engine/study/plainReading.ts';
import { createStudySchema, studySchema } from '../../../src/engine/study/schema.ts';
import { expectSameReading, hostileDocuments } from './sameReading.ts';

const studies = readdirSync('demo')
  .map((name) => `demo/${name}`)
  .concat(readdirSync('tests/fixtures/studies').map((name) => `tests/fixtures/studies/${name}`));

describe('plain reading of a study', () => {
  it.each(studies)('reads %s exactly as zod does, without zod', (path) => {
    const document = JSON.parse(readFileSync(path, 'utf8'));
    expect(expectSameReading(studySchema, document)).toBe('plain');
  });

  it('reads generated studies of every device family exactly as zod does', () => {
    for (const devices of [25, 300]) expect(expectSameReading(studySchema, radialStudy(devices))).toBe('plain');
  });

  it('reads a 50 Hz study with the 50 Hz schema (times in cycles at 50 Hz)', () => {
    const document = { ...JSON.parse(readFileSync('demo/harrowmere-selective.json', 'utf8')), frequency: 50 };
    expect(expectSameReading(createStudySchema(50), document)).toBe('plain');
  });

  it('gives up on every broken or hostile study that zod refuses, and agrees on the rest', () => {
    const outcomes = { plain: 0, zod: 0 };
    for (const document of hostileDocuments(20261203, 600)) outcomes[expectSameReading(studySchema, document)]++;
    // Both kinds of case occur: mutants zod accepts (a renamed id, a moved device) and ones it refuses.
    expect(outcomes.plain).toBeGreaterThan(50);
    expect(outcomes.zod).toBeGreaterThan(50);
  });
});

describe('plain reading of fields', () => {
  const voltage = quantityField('voltage', { min: 0, exclusiveMin: true });

  it('reads a quantity given as a number or as text with a unit, as the field does', () => {
    for (const value of [480, '12.47 kV', '480 V', 0.48e3]) expect(expectSameReading(voltage, value)).toBe('plain');
  });

  it.each([0, -480, '12 furlongs', '', Number.NaN, Infinity, null, true, [480]])(
    'leaves the quantity %s to zod, which refuses it',
    (value) => {
      expect(plainReaderOf(voltage)(value)).toBe(NOT_PLAIN);
      expect(voltage.safeParse(value).success).toBe(false);
    },
  );

  it('reads a value it has read before the same way, refused or not', () => {
    // The field remembers each value's reading: the second reading must be the first.
    const time = quantityField('time', { max: 10 });
    for (let round = 0; round < 2; round++) {
      expect(plainReaderOf(time)('3 cycles')).toBeCloseTo(0.05, 15);
      expect(plainReaderOf(time)(-0)).toBe(0);
      expect(plainReaderOf(time)('11 s')).toBe(NOT_PLAIN);
      expect(plainReaderOf(time)(12)).toBe(NOT_PLAIN);
    }
    // Past what it remembers, a value is still read, only not kept.
    for (let seconds = 1; seconds < 600; seconds++)
      expect(plainReaderOf(time)(`${seconds / 100} s`)).toBe(seconds / 100);
  });

  it('leaves a name over its length, or with a control character, to zod', () => {
    const name = textField(5, 'name');
    expect(expectSameReading(name, 'Main')).toBe('plain');
    expect(plainReaderOf(name)('Main breaker')).toBe(NOT_PLAIN);
    expect(plainReaderOf(name)('Ma\u0007n')).toBe(NOT_PLAIN);
  });

  it('leaves a schema that is its own check (a number or string format) to zod', () => {
    expect(plainReaderOf(z.int())(1.5)).toBe(NOT_PLAIN);
    expect(z.int().safeParse(1.5).success).toBe(false);
    expect(plainReaderOf(z.email())('not an address')).toBe(NOT_PLAIN);
    expect(expectSameReading(z.int(), 3)).toBe('plain');
  });

  it('reads a union of literals as a set of values, and leaves an exclusive union to zod', () => {
    expect(expectSameReading(z.union([z.literal(1), z.literal(3)]), 3)).toBe('plain');
    expect(plainReaderOf(z.union([z.literal(1), z.literal(3)]))(2)).toBe(NOT_PLAIN);
    // Both options match 1, which an exclusive union refuses.
    expect(plainReaderOf(z.xor([z.literal(1), z.literal(1)]))(1)).toBe(NOT_PLAIN);
  });

  it('fills defaults and prefaults and leaves out absent optional fields, as zod does', () => {
    const schema = z.strictObject({
      required: z.number().check(z.minimum(1)),
      optional: z.optional(z.number()),
      defaulted: z._default(z.enum(['a', 'b']), 'a'),
      optionalDefault: z.optional(z._default(z.number(), 3)),
      list: z._default(z.array(z.number().check(z.maximum(10))), []),
      // A prefault is read as if given: "3 cycles" becomes 0.05 s.
      prefaulted: z.prefault(quantityField('time'), '3 cycles'),
      // Absent allowed, but a value kept only when there is one (an optional input, no optional output).
      piped: z.pipe(
        z.optional(z.number()),
        z.transform((value) => value),
      ),
    });
    expect(expectSameReading(schema, { required: 2 })).toBe('plain');
    expect(plainReaderOf(schema)({ required: 2 })).toMatchObject({ prefaulted: 0.05 });
    expect(expectSameReading(schema, { required: 2, optional: 1, defaulted: 'b', list: [1, 2] })).toBe('plain');
    expect(plainReaderOf(schema)({ required: 0 })).toBe(NOT_PLAIN);
    expect(plainReaderOf(schema)({ required: 2, extra: 1 })).toBe(NOT_PLAIN);
    expect(plainReaderOf(schema)({ optional: 1 })).toBe(NOT_PLAIN);
    expect(plainReaderOf(schema)({ required: 2, list: [11] })).toBe(NOT_PLAIN);
  });
});

describe('shared readings of characteristics', () => {
  const read = plainReaderOf(characteristicSchema);
  const breaker = () => ({
    kind: 'trip-unit',
    sensor: 800,
    longTime: { pickup: 1, delay: 4 },
    shortTime: { pickup: 6, delay: '12 cycles', i2t: true },
  });

  it("gives devices set alike one reading, whatever their fields' order, and any other device its own", () => {
    const first = read(breaker());
    const { sensor, ...rest } = breaker();
    expect(read({ ...rest, sensor })).toBe(first);
    expect(first).toStrictEqual(characteristicSchema.parse(breaker()));

    const otherDelay = { ...breaker(), longTime: { pickup: 1, delay: 4.0000001 } };
    expect(read(otherDelay)).not.toBe(first);
    expect(read(otherDelay)).toStrictEqual(characteristicSchema.parse(otherDelay));
    expect(read({ ...breaker(), label: 'Feeder' })).not.toBe(first);
  });

  it('reads a document changed in place after an earlier reading as it now is', () => {
    const document = breaker();
    const before = read(document) as { longTime: { pickup: number } };
    document.longTime.pickup = 0.8;
    const after = read(document) as { longTime: { pickup: number } };
    expect(after.longTime.pickup).toBe(0.8);
    expect(before.longTime.pickup).toBe(1);
    expect(read(breaker())).toBe(before);
  });

  it("reads times in cycles at each schema's own frequency", () => {
    const at60 = read(breaker()) as { shortTime: { delay: number } };
    const at50 = plainReaderOf(createCharacteristicSchema(50))(breaker()) as { shortTime: { delay: number } };
    expect(at60.shortTime.delay).toBeCloseTo(0.2, 12);
    expect(at50.shortTime.delay).toBeCloseTo(0.24, 12);
  });
});

describe('plain reading of characteristic files', () => {
  // Every characteristic the project ships (the illustrative curves and the templates' settings).
  const characteristics = readdirSync('curves').flatMap((name) => {
    const file = JSON.parse(readFileSync(`curves/${name}`, 'utf8')) as Record<string, unknown>;
    const found: unknown[] = [];
    const walk = (value: unknown) => {
      if (Array.isArray(value)) value.forEach(walk);
      else if (value && typeof value === 'object') {
        if ('kind' in value && characteristicSchema.safeParse(value).success) found.push(value);
        else Object.values(value).forEach(walk);
      }
    };
    walk(file);
    return found.map((characteristic) => [name, characteristic] as const);
  });

  it('finds characteristics in the shipped curve files', () => {
    expect(characteristics.length).toBeGreaterThan(3);
  });

  it.each(characteristics)('reads a characteristic of %s exactly as zod does', (_name, characteristic) => {
    expect(expectSameReading(characteristicSchema, characteristic)).toBe('plain');
  });
});
