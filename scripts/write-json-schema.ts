// Writes schema/study.schema.json from the zod study schema, so editors can check study files.
// Run with `npm run schema`; tests/engine/study/jsonSchema.test.ts fails when the file is stale.
import { writeFileSync, realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { z } from 'zod/mini';
import { studySchema, STUDY_VERSION } from '../src/engine/study/index.ts';

/** Where the JSON Schema lives, relative to the repository root. */
export const STUDY_SCHEMA_PATH = 'schema/study.schema.json';

/**
 * The study JSON Schema as text. It describes the file as written (`io: 'input'`): quantity fields
 * accept a number or a string, since their unit checks happen in code; fields with defaults are
 * optional. Transforms cannot be stated in JSON Schema, so a quantity's string form is described,
 * not pattern-checked (`unrepresentable: 'any'` keeps any such part permissive rather than failing).
 */
export function studyJsonSchemaText(): string {
  const schema = z.toJSONSchema(studySchema, { io: 'input', unrepresentable: 'any', target: 'draft-2020-12' });
  const document = {
    ...schema,
    title: `discern study, format version ${STUDY_VERSION}`,
  };
  return `${JSON.stringify(document, null, 2)}\n`;
}

function isEntry(): boolean {
  try {
    return !!process.argv[1] && realpathSync(process.argv[1]) === fileURLToPath(import.meta.url);
  } catch {
    return false;
  }
}

if (isEntry()) {
  writeFileSync(STUDY_SCHEMA_PATH, studyJsonSchemaText());
  console.log(`wrote ${STUDY_SCHEMA_PATH}`);
}
