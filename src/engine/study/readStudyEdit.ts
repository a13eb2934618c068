import type { z } from 'zod/mini';
import {
  describeIssue,
  documentProblemAt,
  readStudyParsed,
  studySchemaFor,
  type StudyProblem,
  type StudyReading,
} from './parse.ts';
import type { Device, Study } from './schema.ts';
import { structureProblems } from './structure.ts';

/**
 * A study's reading that also remembers what the reading of an edited copy can reuse: the last
 * document the schema accepted (this one, or an earlier one while edits leave it invalid) and the
 * schema's output for it.
 */
export interface EditableReading extends StudyReading {
  accepted?: {
    document: Readonly<Record<string, unknown>>;
    parsed: Study;
    /** What the tree rules found in `parsed`. */
    structure: StudyProblem[];
  };
}

/**
 * Reads a whole study as `readStudy` does, remembering the schema's output for `readStudyEdit`.
 * @example let reading = readEditableStudy(document); reading = readStudyEdit(reading, edited)
 */
export function readEditableStudy(input: unknown): EditableReading {
  const { reading, parsed } = readStudyParsed(input);
  if (!parsed) return reading;
  return {
    ...reading,
    accepted: { document: reading.document as Record<string, unknown>, parsed, structure: reading.problems },
  };
}

/**
 * Reads `next`, an edited copy of a document read before, giving exactly what `readStudy(next)`
 * gives (the same study, the same problems in the same order) while reading with the schema only
 * what the edit changed. The editor copies a document only along the edited path, so a field or
 * list item left alone keeps its identity: it keeps its parsed value from the last document the
 * schema accepted, and only the others are parsed (a list item with its list's item schema, any
 * other top-level field with its own). The tree rules then run on the whole study, as they must: an
 * id or a reference changed in one item can break another; only an edit of devices' settings, which
 * leaves every device's id and `feeds` as they were (all the tree rules read of a device), keeps
 * what they found before.
 *
 * Anything else falls back on the whole reading: no accepted document yet, text, a top-level field
 * added or removed, another frequency.
 *
 * @example reading = readStudyEdit(reading, withValueAt(reading.document, ['devices', 4, 'rating'], '400 A'))
 */
export function readStudyEdit(previous: EditableReading, next: unknown): EditableReading {
  const accepted = previous.accepted;
  if (!accepted || !isRecord(next) || !sameKeys(accepted.document, next)) return readEditableStudy(next);
  if (next.frequency !== accepted.document.frequency) return readEditableStudy(next);
  const shape = studySchemaFor(next.frequency).shape as Record<string, z.ZodMiniType>;
  const before = accepted.document;

  // Numbers out of range and absurd nesting, first in document order, as the whole walk finds them:
  // the accepted document had none, so only what changed can.
  for (const key of Object.keys(next)) {
    const value = next[key];
    if (value === before[key]) continue;
    const problem = sameLength(before[key], value)
      ? firstOf(changedIndexes(before[key], value), (i) => documentProblemAt(value[i], [key, i]))
      : documentProblemAt(value, [key]);
    if (problem) return { document: next, problems: [problem], accepted };
  }

  // The schema, field by field in the schema's order (the order of the whole reading's problems).
  const parsed: Record<string, unknown> = { ...accepted.parsed };
  const issues: z.core.$ZodIssue[] = [];
  let settingsOnly = true;
  for (const key of Object.keys(shape)) {
    if (!(key in next) || next[key] === before[key]) continue;
    const value = next[key];
    const item = listItemSchemaOf(shape[key]);
    const old = before[key];
    if (item && sameLength(old, value)) {
      // Same length, so the list's own length limits pass as they did: only changed items are read.
      const items = (accepted.parsed[key as keyof Study] as unknown[]).slice();
      for (const i of changedIndexes(old, value)) {
        const result = item.safeParse(value[i], { reportInput: true });
        if (result.success) {
          settingsOnly &&= key === 'devices' && sameDevicePlace(items[i] as Device, result.data as Device);
          items[i] = result.data;
        } else issues.push(...result.error.issues.map((issue) => ({ ...issue, path: [key, i, ...issue.path] })));
      }
      parsed[key] = items;
      continue;
    }
    settingsOnly = false;
    const result = shape[key].safeParse(value, { reportInput: true });
    if (result.success) parsed[key] = result.data;
    else issues.push(...result.error.issues.map((issue) => ({ ...issue, path: [key, ...issue.path] })));
  }
  if (issues.length > 0) return { document: next, problems: issues.map(describeIssue), accepted };

  // The tree rules, over the whole study (what they found before, for an edit of settings only).
  const study = parsed as Study;
  const problems = settingsOnly ? accepted.structure : structureProblems(study);
  const reading: StudyReading =
    problems.length > 0 ? { document: next, problems: [...problems] } : { study, document: next, problems: [] };
  return { ...reading, accepted: { document: next, parsed: study, structure: problems } };
}

// Accepts two parsed devices; true when the tree rules see them alike.
function sameDevicePlace(before: Device, after: Device): boolean {
  return before.id === after.id && before.feeds === after.feeds;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return value !== null && typeof value === 'object' && !Array.isArray(value);
}

// Accepts two objects; true when they have the same own keys in the same order (the walk's order).
function sameKeys(a: Readonly<Record<string, unknown>>, b: Readonly<Record<string, unknown>>): boolean {
  const keysA = Object.keys(a);
  const keysB = Object.keys(b);
  return keysA.length === keysB.length && keysA.every((key, i) => key === keysB[i]);
}

// Accepts anything; true when both are arrays of one length. A hole reads as \`undefined\` both ways,
// by the number walk (nothing to find) and by the schema (an item missing).
function sameLength(a: unknown, b: unknown): b is unknown[] {
  return Array.isArray(a) && Array.isArray(b) && a.length === b.length;
}

// Accepts two arrays of one length; the indexes whose items are not the same object or value.
function changedIndexes(a: unknown, b: readonly unknown[]): number[] {
  const before = a as readonly unknown[];
  const indexes: number[] = [];
  for (let i = 0; i < b.length; i++) if (b[i] !== before[i]) indexes.push(i);
  return indexes;
}

function firstOf<T>(indexes: readonly number[], find: (i: number) => T | undefined): T | undefined {
  for (const i of indexes) {
    const found = find(i);
    if (found) return found;
  }
  return undefined;
}

// Accepts a field's schema; the item schema of a list field (through a default), else undefined.
function listItemSchemaOf(schema: z.ZodMiniType): z.ZodMiniType | undefined {
  let def = schema._zod.def as { type: string; innerType?: z.ZodMiniType; element?: z.ZodMiniType };
  if (def.type === 'default' && def.innerType) def = def.innerType._zod.def as typeof def;
  return def.type === 'array' ? def.element : undefined;
}
