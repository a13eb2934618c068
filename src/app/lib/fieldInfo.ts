import { z } from 'zod/mini';
import { studySchema } from '../../engine/study/index.ts';
import { valueAt, type DocumentPath } from './documentPath.ts';

/** A JSON Schema node, as far as the property editor reads one. */
export interface SchemaNode {
  type?: string | string[];
  description?: string;
  enum?: unknown[];
  const?: unknown;
  default?: unknown;
  properties?: Record<string, SchemaNode>;
  required?: string[];
  items?: SchemaNode;
  prefixItems?: SchemaNode[];
  oneOf?: SchemaNode[];
  anyOf?: SchemaNode[];
  minimum?: number;
  exclusiveMinimum?: number;
  maximum?: number;
}

/** How the property editor offers a field. */
export type FieldControl = 'choice' | 'boolean' | 'number' | 'quantity' | 'text' | 'object' | 'list' | 'fixed';

/** What the editor knows about one field of the study document. */
export interface FieldInfo {
  control: FieldControl;
  /** The schema's description, with its unit where the schema gives one. */
  description?: string;
  /** Allowed values of a choice. */
  choices?: unknown[];
  /** The value used when the field is left out. */
  defaultValue?: unknown;
  /** True when the schema requires the field (the editor offers no way to remove it). */
  required: boolean;
  /** The schema node, for nested objects and lists. */
  node: SchemaNode;
}

/**
 * The study schema as JSON Schema (input side: numbers or text with units), built once. It is the
 * same schema the engine validates with, so the editor's choices and help text never drift from it.
 */
export const STUDY_JSON_SCHEMA = z.toJSONSchema(studySchema, { io: 'input', unrepresentable: 'any' }) as SchemaNode;

/**
 * The schema node for the field at `path` of `document`, choosing each union member by the
 * document's own value (a device characteristic by its `kind`). `undefined` for unknown fields.
 *
 * @example schemaNodeAt(STUDY_JSON_SCHEMA, document, ['transformers', 0, 'connection']).enum // ['delta-wye', …]
 */
export function schemaNodeAt(root: SchemaNode, document: unknown, path: DocumentPath): SchemaNode | undefined {
  let node: SchemaNode | undefined = memberFor(root, document);
  for (let i = 0; i < path.length && node; i++) {
    const key = path[i];
    const value = valueAt(document, path.slice(0, i + 1));
    const child: SchemaNode | undefined =
      typeof key === 'number' ? (node.prefixItems?.[key] ?? node.items) : node.properties?.[key];
    node = child ? memberFor(child, value) : undefined;
  }
  return node;
}

/**
 * How to edit the field at `path`: a choice for enums and literal unions, a number, a quantity
 * (number or text with a unit), a switch, text, or a nested object or list.
 *
 * @example fieldInfoAt(document, ['buses', 0, 'voltage']).control // 'quantity'
 */
export function fieldInfoAt(document: unknown, path: DocumentPath, root = STUDY_JSON_SCHEMA): FieldInfo | undefined {
  const node = schemaNodeAt(root, document, path);
  if (!node) return undefined;
  const raw = rawNodeAt(root, document, path) ?? node;
  const choices = choicesOf(raw);
  const types = ([] as string[]).concat(node.type ?? []);
  const key = path[path.length - 1];
  const parent = path.length > 0 ? schemaNodeAt(root, document, path.slice(0, -1)) : undefined;
  const required = typeof key === 'string' && (parent?.required?.includes(key) ?? false);
  const base = {
    description: raw.description ?? node.description,
    defaultValue: raw.default ?? node.default,
    required,
    node,
  };
  if (node.const !== undefined) return { control: 'fixed', choices: [node.const], ...base };
  if (choices) return { control: 'choice', choices, ...base };
  if (types.includes('number') && types.includes('string')) return { control: 'quantity', ...base };
  if (types.includes('boolean')) return { control: 'boolean', ...base };
  if (types.includes('number') || types.includes('integer')) return { control: 'number', ...base };
  if (types.includes('object') || node.properties) return { control: 'object', ...base };
  if (types.includes('array')) return { control: 'list', ...base };
  return { control: 'text', ...base };
}

/**
 * The optional fields an object may have that the document leaves out, with their descriptions:
 * what the editor offers to add.
 *
 * @example missingFieldsAt(document, ['transformers', 0]) // [{ key: 'category', … }, …]
 */
export function missingFieldsAt(
  document: unknown,
  path: DocumentPath,
  root = STUDY_JSON_SCHEMA,
): { key: string; description?: string }[] {
  const node = schemaNodeAt(root, document, path);
  const value = valueAt(document, path);
  if (!node?.properties || value === null || typeof value !== 'object') return [];
  return Object.entries(node.properties)
    .filter(([key]) => !(key in value))
    .map(([key, child]) => ({ key, description: child.description }));
}

/**
 * The value an optional field is added with: its default where it has one; else a choice starts
 * unchosen (empty, which the study reports until a value is picked), since no first value is a safe
 * guess (a motor's code letter A would give the least locked-rotor current); a switch off; text empty.
 *
 * @example initialValueOf(fieldInfoAt(document, ['motors', 0, 'codeLetter'])) // ''
 */
export function initialValueOf(info: FieldInfo | undefined): unknown {
  if (info?.defaultValue !== undefined) return info.defaultValue;
  return info?.control === 'boolean' ? false : '';
}

// Accepts a node that may be a union; picks the member matching `value` (by `kind`, then by type).
function memberFor(node: SchemaNode, value: unknown): SchemaNode {
  const members = node.oneOf ?? node.anyOf;
  if (!members) return node;
  if (members.every((m) => m.const !== undefined)) return node;
  const kind = value !== null && typeof value === 'object' ? (value as { kind?: unknown }).kind : undefined;
  const byKind = members.find((m) => m.properties?.kind?.const === kind && kind !== undefined);
  if (byKind) return byKind;
  const byType = members.find((m) => ([] as string[]).concat(m.type ?? []).includes(typeOf(value)));
  return { ...(byType ?? members[0]), description: node.description ?? (byType ?? members[0]).description };
}

// The node before union resolution, so a union of literals reads as a choice.
function rawNodeAt(root: SchemaNode, document: unknown, path: DocumentPath): SchemaNode | undefined {
  if (path.length === 0) return root;
  const parent = schemaNodeAt(root, document, path.slice(0, -1));
  const key = path[path.length - 1];
  return typeof key === 'number' ? (parent?.prefixItems?.[key] ?? parent?.items) : parent?.properties?.[key];
}

// Accepts any node; returns its allowed values when it is an enum or a union of constants.
function choicesOf(node: SchemaNode): unknown[] | undefined {
  if (node.enum) return node.enum;
  const members = node.oneOf ?? node.anyOf;
  if (members && members.length > 0 && members.every((m) => m.const !== undefined)) return members.map((m) => m.const);
  return undefined;
}

function typeOf(value: unknown): string {
  if (Array.isArray(value)) return 'array';
  if (value === null) return 'null';
  return typeof value;
}
