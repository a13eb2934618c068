import { quoteGot } from '../errors.ts';
import { formatIssuePath } from './issueMessage.ts';

/** One thing wrong with a study's JSON text: the field path where it is and a one-line message. */
export interface JsonTextProblem {
  path: string;
  message: string;
}

/**
 * How deeply objects and arrays may nest. The study format itself is at most 7 levels deep
 * (`study.devices[0].characteristic.thermal.minimum[0][0]`); anything far deeper is not a study,
 * and refusing it keeps every later reader (schema, messages) away from pathological nesting.
 */
export const MAX_NESTING = 32;

/** The byte-order mark some editors write at the start of a UTF-8 file; JSON does not allow it. */
const BOM = '\uFEFF';

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
const LITERAL = /true|false|null/y;
const HEX4 = /^[0-9a-fA-F]{4}$/;

type Frame = { kind: 'object'; keys: Set<string>; key?: string } | { kind: 'array'; index: number };
type Expect = 'value' | 'first-value' | 'key' | 'first-key' | 'colon' | 'after';

/**
 * The text of a study file as JSON reads it: a leading UTF-8 byte-order mark removed, so the command
 * line and the workbench (whose browser drops it) accept the same files.
 *
 * @example withoutBom('\uFEFF{"discern": 1}') // '{"discern": 1}'
 */
export function withoutBom(text: string): string {
  return text.startsWith(BOM) ? text.slice(1) : text;
}

/**
 * Checks JSON text in one iterative pass (no recursion, so nesting cannot overflow the stack) and
 * returns the first problem: a syntax error, a field given twice in one object (JSON.parse would
 * silently keep the last), or nesting deeper than `MAX_NESTING`. The problem names the field path
 * where it sits and the line and column: `study.buses[1]: expected "," or "}" at line 14:7, got "]"`.
 * Undefined when the text is well-formed.
 *
 * @example jsonTextProblem('{"name": "a", "name": "b"}') // { path: 'study.name', message: 'expected the field once in its object, got it twice (again at line 1:15)' }
 */
export function jsonTextProblem(text: string, base = 'study'): JsonTextProblem | undefined {
  const frames: Frame[] = [];
  let expect: Expect = 'value';
  let i = 0;
  const pathHere = (extra?: PropertyKey) => {
    const keys: PropertyKey[] = [];
    for (const frame of frames) {
      if (frame.kind === 'array') keys.push(frame.index);
      else if (frame.key !== undefined) keys.push(frame.key);
    }
    if (extra !== undefined) keys.push(extra);
    return formatIssuePath(base, keys);
  };
  const fail = (expected: string, at: number, got?: string): JsonTextProblem => ({
    path: pathHere(),
    message: `expected ${expected} at line ${lineColumn(text, at)}, got ${got === undefined ? 'the end of the text' : quoteGot(got)}`,
  });

  const length = text.length;
  for (;;) {
    let code = text.charCodeAt(i);
    // Space, tab, line feed, carriage return.
    while (code === 0x20 || code === 0x09 || code === 0x0a || code === 0x0d) code = text.charCodeAt(++i);
    if (i >= length) {
      if (frames.length === 0 && expect === 'after') return undefined;
      return fail(frames.length === 0 && expect === 'value' ? 'a JSON object' : 'more JSON text', i);
    }
    const c = text[i];
    const top = frames[frames.length - 1];
    if (expect === 'value' || expect === 'first-value') {
      if (expect === 'first-value' && c === ']') {
        frames.pop();
        expect = 'after';
        i++;
      } else if (c === '{' || c === '[') {
        if (frames.length >= MAX_NESTING) {
          return { path: pathHere(), message: `expected at most ${MAX_NESTING} levels of nesting, got more` };
        }
        frames.push(c === '{' ? { kind: 'object', keys: new Set() } : { kind: 'array', index: 0 });
        expect = c === '{' ? 'first-key' : 'first-value';
        i++;
      } else if (c === '"') {
        const end = stringEnd(text, i);
        if (typeof end !== 'number') return fail(end.expected, end.at, text.slice(end.at, end.at + 1) || undefined);
        i = end;
        expect = 'after';
      } else {
        const end = tokenEnd(text, i);
        if (end === undefined) return fail('a JSON value', i, snippet(text, i));
        i = end;
        expect = 'after';
      }
    } else if (expect === 'key' || expect === 'first-key') {
      if (expect === 'first-key' && c === '}') {
        frames.pop();
        expect = 'after';
        i++;
        continue;
      }
      if (c !== '"') return fail('a field name in double quotes', i, snippet(text, i));
      const end = stringEnd(text, i);
      if (typeof end !== 'number') return fail(end.expected, end.at, text.slice(end.at, end.at + 1) || undefined);
      // Only a name with an escape needs JSON's reading; most are their own text.
      const written = text.slice(i + 1, end - 1);
      const key = written.includes('\\') ? (JSON.parse(text.slice(i, end)) as string) : written;
      const object = top as Extract<Frame, { kind: 'object' }>;
      if (object.keys.has(key)) {
        return {
          path: pathHere(key),
          message: `expected the field once in its object, got it twice (again at line ${lineColumn(text, i)})`,
        };
      }
      object.keys.add(key);
      object.key = key;
      i = end;
      expect = 'colon';
    } else if (expect === 'colon') {
      if (c !== ':') return fail('":" after the field name', i, snippet(text, i));
      expect = 'value';
      i++;
    } else {
      if (!top) return fail('nothing after the study', i, snippet(text, i));
      if (c === ',') {
        if (top.kind === 'array') {
          top.index++;
          expect = 'value';
        } else {
          top.key = undefined;
          expect = 'key';
        }
        i++;
      } else if ((c === '}' && top.kind === 'object') || (c === ']' && top.kind === 'array')) {
        frames.pop();
        expect = 'after';
        i++;
      } else return fail(`"," or "${top.kind === 'object' ? '}' : ']'}"`, i, snippet(text, i));
    }
  }
}

/** The index just past the string starting at `start` (a `"`), or what is wrong with it. */
function stringEnd(text: string, start: number): number | { expected: string; at: number } {
  for (let j = start + 1; j < text.length; j++) {
    const code = text.charCodeAt(j);
    if (code === 0x22) return j + 1;
    if (code < 0x20) return { expected: 'a closing quote or an escaped control character', at: j };
    if (code === 0x5c) {
      const escape = text[j + 1];
      if (escape === 'u') {
        if (!HEX4.test(text.slice(j + 2, j + 6))) return { expected: 'four hex digits after \\u', at: j + 2 };
        j += 5;
      } else if (escape !== undefined && '"\\/bfnrt'.includes(escape)) j++;
      else return { expected: 'a valid escape after a backslash', at: j + 1 };
    }
  }
  return { expected: 'a closing quote', at: text.length };
}

/** The index just past a number or literal starting at `start`, or undefined if there is none. */
function tokenEnd(text: string, start: number): number | undefined {
  const first = text.charCodeAt(start);
  // A number starts with "-" or a digit; anything else may only be a literal.
  const pattern = first === 0x2d || (first >= 0x30 && first <= 0x39) ? NUMBER : LITERAL;
  pattern.lastIndex = start;
  if (!pattern.test(text) || pattern.lastIndex === start) return undefined;
  const end = pattern.lastIndex;
  // "truex" or "12abc" are not tokens: the next character must end the token.
  return end < text.length && WORD_CHARACTER.test(text[end]) ? undefined : end;
}

const WORD_CHARACTER = /[\w.+-]/;

/** A short piece of the text at `at` for the message: the token or character found there. */
function snippet(text: string, at: number): string {
  const word = /[\w.+-]+/y;
  word.lastIndex = at;
  return word.test(text) ? text.slice(at, Math.min(word.lastIndex, at + 20)) : text.slice(at, at + 1);
}

/** "line:column", both from 1, of an index into the text. */
function lineColumn(text: string, index: number): string {
  let line = 1;
  let lineStart = 0;
  for (let j = 0; j < index && j < text.length; j++) {
    if (text.charCodeAt(j) === 0x0a) {
      line++;
      lineStart = j + 1;
    }
  }
  return `${line}:${index - lineStart + 1}`;
}

/**
 * How many field names well-formed JSON text holds (strings followed by a colon), counting a name
 * given twice in one object twice: more than the parsed document's fields means a field was repeated.
 * Only for text `JSON.parse` accepts, where every quote outside a string opens one.
 *
 * @example fieldNamesIn('{"a": {"b": "c:"}, "a": 1}') // 3
 */
export function fieldNamesIn(text: string): number {
  let names = 0;
  for (let open = text.indexOf('"'); open >= 0;) {
    // The closing quote is the next one not escaped (preceded by an even number of backslashes).
    let close = text.indexOf('"', open + 1);
    for (;;) {
      if (close < 0) return -1; // not well-formed after all: no count matches it
      let backslashes = 0;
      while (text.charCodeAt(close - 1 - backslashes) === 0x5c) backslashes++;
      if (backslashes % 2 === 0) break;
      close = text.indexOf('"', close + 1);
    }
    let next = close + 1;
    let code = text.charCodeAt(next);
    while (code === 0x20 || code === 0x09 || code === 0x0a || code === 0x0d) code = text.charCodeAt(++next);
    if (code === 0x3a) names++;
    open = text.indexOf('"', next);
  }
  return names;
}
