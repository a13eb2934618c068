import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fieldNamesIn, jsonTextProblem } from '../../../src/engine/study/jsonText.ts';

const parses = (text: string) => {
  try {
    JSON.parse(text);
    return true;
  } catch {
    return false;
  }
};

describe('jsonTextProblem', () => {
  it('has the expected defaults: well-formed text has no problem', () => {
    expect(jsonTextProblem('{"name": "a", "buses": [{"id": "B1", "voltage": 480}]}')).toBeUndefined();
    expect(jsonTextProblem('{"na\\u006de": 1, "name": 2}')?.message).toMatch(/^expected the field once/);
  });

  // JSON.parse (ECMA-404 as the engine implements it) is the reference for what is well-formed.
  it('accepts every text JSON.parse reads, when no object repeats a field', () => {
    fc.assert(
      fc.property(fc.json({ depthSize: 'small' }), (text) => {
        expect(jsonTextProblem(text)).toBeUndefined();
      }),
      { numRuns: 300 },
    );
  });

  it('finds a problem in every text JSON.parse refuses, and in none it reads without repeats', () => {
    const mutated = fc
      .tuple(
        fc.json({ depthSize: 'small' }),
        fc.nat(),
        fc.constantFrom('', ',', '"', '{', ']', '\\', 'e', '-', ' ', '\u0001'),
      )
      .map(([text, at, insert]) => {
        const i = at % (text.length + 1);
        return text.slice(0, i) + insert + text.slice(i + (insert === '' ? 1 : 0));
      });
    fc.assert(
      fc.property(mutated, (text) => {
        const problem = jsonTextProblem(text);
        if (!parses(text)) expect(problem).toBeDefined();
        else if (!/"([^"\\]|\\.)*"\s*:/.test(text)) expect(problem).toBeUndefined();
      }),
      { numRuns: 2000 },
    );
  });
});

/** Every object field in a parsed JSON value. */
const fieldsOf = (value: unknown): number =>
  value === null || typeof value !== 'object'
    ? 0
    : Object.values(value).reduce<number>(
        (sum, child) => sum + fieldsOf(child),
        Array.isArray(value) ? 0 : Object.keys(value).length,
      );

describe('fieldNamesIn', () => {
  it('counts field names, not strings that hold quotes, colons or backslashes', () => {
    const text = String.raw`{"a": {"b": "c:"}, "d\\": ["e\\\":", "f"], "g" : 1}`;
    expect(fieldsOf(JSON.parse(text))).toBe(4);
    expect(fieldNamesIn(text)).toBe(4);
    expect(fieldNamesIn('["a", "b"]')).toBe(0);
  });

  it('counts a field given twice twice: more names than the parsed document has fields', () => {
    expect(fieldNamesIn('{"name": "a", "name": "b"}')).toBe(2);
    expect(fieldsOf(JSON.parse('{"name": "a", "name": "b"}'))).toBe(1);
  });

  // JSON.stringify writes each field once, so the names in the text are the parsed value's fields.
  it('agrees with the fields of every JSON value', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (value) => {
        expect(fieldNamesIn(JSON.stringify(value, null, 1))).toBe(fieldsOf(value));
      }),
      { numRuns: 500 },
    );
  });
});
