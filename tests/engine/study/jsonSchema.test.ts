import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { STUDY_SCHEMA_PATH, studyJsonSchemaText } from '../../../scripts/write-json-schema.ts';

describe('schema/study.schema.json', () => {
  it('has the expected defaults', () => {
    const schema = JSON.parse(studyJsonSchemaText());
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    // Fields with defaults are optional in the file; the required ones are the study's core.
    expect(schema.required).toEqual(['discern', 'name', 'source', 'buses']);
  });

  it('is up to date with the zod study schema (run `npm run schema` to refresh)', () => {
    expect(readFileSync(STUDY_SCHEMA_PATH, 'utf8')).toBe(studyJsonSchemaText());
  });

  it('describes quantities as a number or text, as they are written', () => {
    const schema = JSON.parse(studyJsonSchemaText());
    const voltage = schema.properties.buses.items.properties.voltage;
    expect(JSON.stringify(voltage)).toMatch(/"number"/);
    expect(JSON.stringify(voltage)).toMatch(/"string"/);
    expect(schema.properties.buses.items.additionalProperties).toBe(false);
  });
});
