import type { z } from 'zod/mini';
import { sameContent } from '../sameContent.ts';

/** What a plain reader returns when zod must read the value itself (to name a problem, or a form it does not take). */
export const NOT_PLAIN: unique symbol = Symbol('not plain');

/** Reads a value as its schema would, or returns `NOT_PLAIN`. */
export type PlainReader = (value: unknown) => unknown;

/**
 * The reading zod gives a sound document, without its per-field bookkeeping. zod reads every field
 * through a result object and an issue list of its own (a study's devices alone hold a hundred
 * thousand fields), and four fifths of what it allocates reading a study is that. A plain reader,
 * compiled once from the schema's own definition, reads a value the same way, type by type and check
 * by check, and gives up (`NOT_PLAIN`) at the first thing it would have to report: the caller then
 * lets zod read the document, so every message is zod's. A part of the schema it has no reading for
 * (a transform, a tuple, a record) is read by zod itself, field by field.
 *
 * Each output is the value zod would give, with its keys in the same order; a test holds the two to
 * it on every study, template and curve the project ships and on thousands of broken ones.
 *
 * @example const study = plainReaderOf(studySchema)(document) // NOT_PLAIN when anything is wrong
 */
export function plainReaderOf(schema: z.core.$ZodType): PlainReader {
  let reader = compiled.get(schema);
  if (!reader) {
    reader = compile(schema);
    compiled.set(schema, reader);
  }
  return reader;
}

/**
 * Gives the part of a schema that a transform reads (a field helper's `z.pipe(z.union(…), z.transform(…))`)
 * its plain reading: `read` must return exactly what the transform would for a value the schema
 * accepts, and `NOT_PLAIN` for any other. A copy of the schema with checks added
 * (`schema.check(z.meta(…))`) shares it, and runs its own checks after it.
 *
 * @example withPlainReading(quantity, (value) => (typeof value === 'number' ? value * 1000 : NOT_PLAIN))
 */
export function withPlainReading<T extends z.core.$ZodType>(schema: T, read: PlainReader): T {
  declared.set(schema._zod.def, read);
  return schema;
}

/**
 * Lets values of a schema that hold the same content share one reading: a site's many breakers and
 * fuses of one kind, set alike, carry equal characteristics, and each is read once, not once per
 * device (with every unit, check and default), and the study holds it once. The plain reader keeps
 * the last few values it read, as copies of its own (a caller changing its document later changes
 * nothing here), with their readings; a value with the same content as one of them (`sameContent`)
 * is given that reading again. A parsed study is read, never written to, so sharing is safe, as it is
 * for the point tables (`pointTableSchema`). zod alone gives each reading its own objects.
 *
 * @example withSharedReadings(z.discriminatedUnion('kind', [relay, tripUnit, breaker, fuse]))
 */
export function withSharedReadings<T extends z.core.$ZodType>(schema: T): T {
  sharing.add(schema._zod.def);
  return schema;
}

const compiled = new WeakMap<z.core.$ZodType, PlainReader>();
const declared = new WeakMap<object, PlainReader>();
const sharing = new WeakSet<object>();

/** The context zod's `safeParse` gives a schema: synchronous, forward. */
const CONTEXT = { async: false } as z.core.ParseContext<z.core.$ZodIssue>;

type Check = z.core.$ZodCheck;
type AnyDef = z.core.$ZodTypeDef & Record<string, unknown>;
/** A check's definition, with the fields of the kinds read here (bounds, lengths, patterns). */
type CheckDef = z.core.$ZodCheckDef & Record<string, unknown>;

function compile(schema: z.core.$ZodType): PlainReader {
  const def = schema._zod.def as AnyDef;
  const own = declaredReading(schema);
  // A schema that is its own check (a string or number format: z.email(), z.int()) is zod's to read.
  const selfChecked = schema._zod.traits.has('$ZodCheck');
  const read = own ?? (def.coerce || selfChecked ? undefined : typeReader(schema, def));
  if (!read) return zodReading(schema);
  // A check that only describes the schema (`z.meta(…)`, `z.describe(…)`) reads nothing.
  const checks = ((def.checks ?? []) as Check[]).filter((check) => !DESCRIBING.has(check._zod.def.check));
  const checked = checks.length === 0 ? read : withChecks(read, checks, def.type);
  return sharing.has(def) ? sharedReader(checked) : checked;
}

/** The kinds of check that only describe a schema (they register metadata, and pass every value). */
const DESCRIBING = new Set(['meta', 'describe']);

/**
 * The reading `withPlainReading` gave `schema`, or the schema it was copied from with checks added
 * (`.check(…)` keeps every other part of the definition): the copy parses as the original does.
 */
function declaredReading(schema: z.core.$ZodType): PlainReader | undefined {
  for (let at: z.core.$ZodType | undefined = schema; at; at = at._zod.parent) {
    const read = declared.get(at._zod.def);
    if (read) return read;
    const parent = at._zod.parent;
    if (!parent || !sameButChecks(at._zod.def as AnyDef, parent._zod.def as AnyDef)) return undefined;
  }
  return undefined;
}

/** Whether two definitions hold the same parts, their checks aside. */
function sameButChecks(def: AnyDef, other: AnyDef): boolean {
  const keys = Object.keys(def).filter((key) => key !== 'checks');
  const otherKeys = Object.keys(other).filter((key) => key !== 'checks');
  return keys.length === otherKeys.length && keys.every((key) => Object.hasOwn(other, key) && def[key] === other[key]);
}

/** Values whose readings a sharing reader keeps: a study's few kinds of device, and more. */
const RECENT_READINGS = 16;

/** `read`, giving a value with the same content as a recent one that recent value's reading (see `withSharedReadings`). */
function sharedReader(read: PlainReader): PlainReader {
  const recent: { value: unknown; reading: unknown }[] = [];
  return (value) => {
    for (let i = 0; i < recent.length; i++) {
      const entry = recent[i];
      if (!sameContent(entry.value, value)) continue;
      recent.copyWithin(1, 0, i);
      recent[0] = entry;
      return entry.reading;
    }
    const reading = read(value);
    const copy = reading === NOT_PLAIN ? NOT_PLAIN : copyOfPlain(value);
    if (copy !== NOT_PLAIN) {
      recent.unshift({ value: copy, reading });
      if (recent.length > RECENT_READINGS) recent.pop();
    }
    return reading;
  };
}

/** A deep copy of a value made of plain objects, arrays, strings, numbers, booleans and null; else `NOT_PLAIN`. */
function copyOfPlain(value: unknown): unknown {
  if (value === null || typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean')
    return value;
  if (Array.isArray(value)) {
    const copy = new Array(value.length);
    for (let i = 0; i < value.length; i++) if ((copy[i] = copyOfPlain(value[i])) === NOT_PLAIN) return NOT_PLAIN;
    return copy;
  }
  if (typeof value !== 'object') return NOT_PLAIN;
  const prototype = Object.getPrototypeOf(value);
  if (prototype !== Object.prototype && prototype !== null) return NOT_PLAIN;
  const copy: Record<string, unknown> = {};
  for (const key of Object.keys(value)) {
    // A field named `__proto__` would set the copy's prototype, not a field: such a value is not kept.
    if (key === '__proto__') return NOT_PLAIN;
    const item = copyOfPlain((value as Record<string, unknown>)[key]);
    if (item === NOT_PLAIN) return NOT_PLAIN;
    copy[key] = item;
  }
  return copy;
}

/** zod's own reading of one value, as its object reader does for each field. */
function zodReading(schema: z.core.$ZodType): PlainReader {
  return (value) => {
    const result = schema._zod.run({ value, issues: [] }, CONTEXT);
    return result instanceof Promise || result.issues.length > 0 ? NOT_PLAIN : result.value;
  };
}

function typeReader(schema: z.core.$ZodType, def: AnyDef): PlainReader | undefined {
  switch (def.type) {
    case 'number':
      return (value) => (typeof value === 'number' && Number.isFinite(value) ? value : NOT_PLAIN);
    case 'string':
      return (value) => (typeof value === 'string' ? value : NOT_PLAIN);
    case 'boolean':
      return (value) => (typeof value === 'boolean' ? value : NOT_PLAIN);
    case 'enum':
    case 'literal': {
      const values = schema._zod.values!;
      return (value) => (values.has(value as never) ? value : NOT_PLAIN);
    }
    case 'optional':
      return optionalReader(def as unknown as z.core.$ZodOptionalDef);
    case 'nullable': {
      const inner = plainReaderOf((def as unknown as z.core.$ZodNullableDef).innerType);
      return (value) => (value === null ? null : inner(value));
    }
    case 'default':
      return defaultReader(def as unknown as z.core.$ZodDefaultDef);
    case 'prefault': {
      // A prefault is read like any value given: zod puts it in place of absence and reads it.
      const prefault = def as unknown as z.core.$ZodPrefaultDef;
      const inner = plainReaderOf(prefault.innerType);
      return (value) => inner(value === undefined ? prefault.defaultValue : value);
    }
    case 'array':
      return arrayReader(plainReaderOf((def as unknown as z.core.$ZodArrayDef).element));
    case 'object':
      return objectReader(def as unknown as z.core.$ZodObjectDef);
    case 'union':
      return unionReader(def as unknown as z.core.$ZodDiscriminatedUnionDef);
    default:
      return undefined;
  }
}

function optionalReader(def: z.core.$ZodOptionalDef): PlainReader | undefined {
  // An optional around a default fills it in: zod's reading of absence is then the default's.
  if (def.innerType._zod.optin === 'defaulted') return undefined;
  const inner = plainReaderOf(def.innerType);
  return (value) => (value === undefined ? undefined : inner(value));
}

function defaultReader(def: z.core.$ZodDefaultDef): PlainReader {
  const inner = plainReaderOf(def.innerType);
  // `defaultValue` is a getter that gives each reading its own copy, as zod's does.
  return (value) => {
    if (value === undefined) return def.defaultValue;
    const read = inner(value);
    return read === undefined ? def.defaultValue : read;
  };
}

function arrayReader(element: PlainReader): PlainReader {
  return (value) => {
    if (!Array.isArray(value)) return NOT_PLAIN;
    const read = new Array(value.length);
    for (let i = 0; i < value.length; i++) {
      const item = element(value[i]);
      if (item === NOT_PLAIN) return NOT_PLAIN;
      read[i] = item;
    }
    return read;
  };
}

/** A field of an object and how zod's object reader treats it (by its schema's `optin` and `optout`). */
interface FieldReading {
  key: string;
  read: PlainReader;
  /** The schema's input may be absent (`optin`: "optional" or "defaulted"). */
  optin: 'optional' | 'defaulted' | undefined;
  /** The schema's output may be absent (`z.optional(…)` outside). */
  optionalOut: boolean;
}

function objectReader(def: z.core.$ZodObjectDef): PlainReader | undefined {
  const catchall = def.catchall?._zod.def.type;
  // Unknown keys are dropped (no catchall) or refused (`z.strictObject`); any other catchall is zod's.
  if (catchall !== undefined && catchall !== 'never') return undefined;
  const shape = def.shape as Record<string, z.core.$ZodType>;
  if (Object.getOwnPropertySymbols(shape).length > 0) return undefined;
  const keys = Object.keys(shape).filter((key) => key !== '__proto__');
  const keySet = new Set(Object.keys(shape));
  const strict = catchall === 'never';
  const fields: FieldReading[] = keys.map((key) => {
    const { optin, optout } = shape[key]._zod;
    return { key, read: plainReaderOf(shape[key]), optin, optionalOut: optout === 'optional' };
  });
  return (value) => {
    if (typeof value !== 'object' || value === null || Array.isArray(value)) return NOT_PLAIN;
    const input = value as Record<string, unknown>;
    if (strict) for (const key in input) if (!keySet.has(key)) return NOT_PLAIN;
    const read: Record<string, unknown> = {};
    for (let i = 0; i < fields.length; i++) {
      const { key, read: readField, optin, optionalOut } = fields[i];
      const present = key in input;
      // Absent: a problem for a required field; nothing at all for an optional one.
      if (!present && (optin === undefined || (optin === 'optional' && optionalOut))) {
        if (optin === undefined) return NOT_PLAIN;
        continue;
      }
      const item = readField(input[key]);
      if (item === NOT_PLAIN) {
        // zod passes over a problem of an absent field whose output may be absent.
        if (!present && optionalOut) continue;
        return NOT_PLAIN;
      }
      if (present || item !== undefined || (optin === 'defaulted' && !optionalOut)) read[key] = item;
    }
    return read;
  };
}

function unionReader(def: z.core.$ZodDiscriminatedUnionDef): PlainReader | undefined {
  const options = def.options as z.core.$ZodType[];
  if (def.discriminator === undefined) {
    // A union of literals (`1 | 3`) is a set of values; any other union (or an exclusive one) is zod's.
    if (def.inclusive === false || !options.every((option) => option._zod.def.type === 'literal')) return undefined;
    const values = new Set(options.flatMap((option) => [...option._zod.values!]));
    return (value) => (values.has(value as never) ? value : NOT_PLAIN);
  }
  const key = def.discriminator;
  const byValue = new Map<unknown, PlainReader>();
  for (const option of options) {
    for (const tag of option._zod.propValues?.[key] ?? [])
      if (!byValue.has(tag)) byValue.set(tag, plainReaderOf(option));
  }
  return (value) => {
    if (typeof value !== 'object' || value === null || Array.isArray(value)) return NOT_PLAIN;
    const tag = (value as Record<string, unknown>)[key];
    const read = tag === undefined ? undefined : byValue.get(tag);
    return read ? read(value) : NOT_PLAIN;
  };
}

/**
 * `read` followed by the schema's checks, in order: bounds and lengths compared here, any other check
 * (a refinement) run as zod runs it, on a result of its own.
 */
function withChecks(read: PlainReader, checks: Check[], type: string): PlainReader {
  const steps = checks.map((check) => checkStep(check, type));
  return (value) => {
    let result = read(value);
    for (let i = 0; i < steps.length && result !== NOT_PLAIN; i++) result = steps[i](result);
    return result;
  };
}

function checkStep(check: Check, type: string): PlainReader {
  const def = check._zod.def as CheckDef;
  const generic = checkedByZod(check);
  if (type === 'number' && def.when === undefined) {
    const bound = def.value as number;
    if (def.check === 'greater_than') {
      return def.inclusive
        ? (value) => ((value as number) >= bound ? value : NOT_PLAIN)
        : (value) => ((value as number) > bound ? value : NOT_PLAIN);
    }
    if (def.check === 'less_than') {
      return def.inclusive
        ? (value) => ((value as number) <= bound ? value : NOT_PLAIN)
        : (value) => ((value as number) < bound ? value : NOT_PLAIN);
    }
  }
  if ((type === 'string' || type === 'array') && def.check === 'max_length') {
    // Within the limit in UTF-16 units is within it in code points too; zod decides the rest.
    const maximum = def.maximum as number;
    return (value) => ((value as { length: number }).length <= maximum ? value : generic(value));
  }
  if (type === 'string' && def.check === 'string_format' && def.format === 'regex' && def.when === undefined) {
    const pattern = def.pattern as RegExp;
    return (value) => {
      pattern.lastIndex = 0;
      return pattern.test(value as string) ? value : NOT_PLAIN;
    };
  }
  return generic;
}

/** One check run as zod runs it (its `when` first), on a result of its own; the value it leaves, or `NOT_PLAIN`. */
function checkedByZod(check: Check): PlainReader {
  const def = check._zod.def as CheckDef;
  const when = def.when as ((payload: z.core.ParsePayload) => boolean) | undefined;
  return (value) => {
    const payload: z.core.ParsePayload = { value, issues: [] };
    if (when && !when(payload)) return value;
    const outcome = check._zod.check(payload as z.core.ParsePayload<never>);
    return outcome instanceof Promise || payload.issues.length > 0 ? NOT_PLAIN : payload.value;
  };
}
