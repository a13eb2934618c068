import { readFileSync } from 'node:fs';

/**
 * A seeded generator of malformed and hostile study files, made by mutating the demo studies the way
 * a careless user or an attacker would: fields deleted, types swapped, numbers huge, tiny, denormal
 * or not numbers at all, units that overflow or have the wrong dimension, loops and buses fed twice,
 * chains hundreds of levels deep, fields given twice, control characters and enormous names,
 * references repeated or dangling, a byte-order mark, broken JSON. The same seed always gives the
 * same cases, so a failure is reproduced by its seed and index.
 *
 * @example for (const c of hostileStudies(1, 1000)) readStudy(c.text)
 */

/** One generated case: the study text, what was done to it, and which demo it came from. */
export interface HostileCase {
  index: number;
  mutation: string;
  base: string;
  text: string;
}

/** A small deterministic generator (mulberry32): the same seed, the same sequence. */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
type Doc = { [key: string]: Json };
type Random = () => number;

const DEMOS = ['selective', 'overlap', 'fused', 'full', 'standby', 'standby-overlap'].map((name) => ({
  name,
  doc: JSON.parse(readFileSync(`demo/harrowmere-${name}.json`, 'utf8')) as Doc,
}));

/**
 * The service path of the selective demo alone (one transformer, a main, a feeder, a motor and its
 * breaker, one view): small enough that analysing hundreds of its mutants stays quick.
 */
function smallBase(): Doc {
  const doc = structuredClone(DEMOS[0].doc) as Doc & Record<string, Json[]>;
  const keep = new Set(['MV', 'SWBD', 'MCC', 'T1', 'C-MCC', 'M-COMP1', 'R-T1', 'MAIN', 'FDR-MCC', 'MCC-M1']);
  for (const list of ['buses', 'transformers', 'cables', 'motors', 'devices'])
    doc[list] = (doc[list] ?? []).filter((item) => keep.has((item as { id: string }).id));
  doc.views = (doc.views ?? []).filter((v) => (v as { id: string }).id === 'service');
  return doc;
}

const BASES = [{ name: 'service path', doc: smallBase() }, ...DEMOS];

const pick = <T>(random: Random, list: readonly T[]): T => list[Math.floor(random() * list.length)];

/** Every leaf of a document with its path (arrays and objects walked with an explicit stack). */
function leaves(doc: Json): { path: (string | number)[]; value: Json }[] {
  const out: { path: (string | number)[]; value: Json }[] = [];
  const stack: { path: (string | number)[]; value: Json }[] = [{ path: [], value: doc }];
  while (stack.length > 0) {
    const { path, value } = stack.pop()!;
    if (value !== null && typeof value === 'object') {
      const entries = Array.isArray(value) ? value.map((v, i) => [i, v] as const) : Object.entries(value);
      for (const [key, child] of entries) stack.push({ path: [...path, key], value: child });
      if (path.length > 0) out.push({ path, value });
    } else out.push({ path, value });
  }
  return out;
}

function setAt(doc: Json, path: (string | number)[], value: Json | undefined): void {
  let at = doc as Record<string | number, Json>;
  for (const key of path.slice(0, -1)) at = at[key] as Record<string | number, Json>;
  const last = path[path.length - 1];
  if (value === undefined) {
    if (Array.isArray(at)) at.splice(last as number, 1);
    else delete at[last];
  } else at[last] = value;
}

const HOSTILE_NUMBERS = ['5e-324', '1e-310', '1e-300', '1e-200', '1e308', '1e400', '-1e400', '-1', '0', '-0', '1e15'];
const HOSTILE_TEXT = [
  'NaN',
  'Infinity',
  '-Infinity',
  '∞',
  '',
  ' ',
  '1e400',
  '1e400 MVA',
  '1e400 ft',
  '1e400 cycles',
  '1e-400 A',
  '1e-310 A',
  '1e308 V',
  '1500 kW',
  '100 hp',
  '5 A',
  '12 kV',
  '1000 %',
  '-5 %',
  '0x10',
  '1,5',
  '__proto__',
  'constructor',
];
const HOSTILE_NAMES = [
  'a\u000bb',
  'x\u0000y',
  'bell\u0007',
  'non-char \uFFFE',
  'non-char \uFFFF',
  'lone \uD800 surrogate',
  '<script>alert(1)</script>',
  '![x](http://example.invalid/x.png)',
  '[click](javascript:alert(1))',
  '=HYPERLINK("http://example.invalid")',
  '-1+2',
  '+cmd',
  '@SUM(A1)',
  '\tcmd',
  '\r=cmd',
  ']]>&amp;<!--',
  'line\nbreak',
];

type Mutation = (doc: Doc, random: Random) => string | void;

/** Adds `count` buses in a chain below `from`, each fed by a cable, with a breaker on every tenth. */
function chain(doc: Doc, from: string, count: number, withDevices: boolean): string {
  const buses = doc.buses as Json[];
  const cables = ((doc.cables ??= []) as Json[]) ?? [];
  const devices = (doc.devices ??= []) as Json[];
  const voltage = (buses.find((b) => (b as { id: string }).id === from) as { voltage: Json }).voltage;
  let above = from;
  for (let k = 0; k < count; k++) {
    buses.push({ id: `DEEP${k}`, voltage });
    cables.push({ id: `CDEEP${k}`, from: above, to: `DEEP${k}`, size: '4/0', length: 10 });
    if (withDevices && k % 10 === 9)
      devices.push({
        id: `BDEEP${k}`,
        feeds: `CDEEP${k}`,
        characteristic: { kind: 'trip-unit', sensor: 250, longTime: { pickup: 1, delay: 4 } },
      });
    above = `DEEP${k}`;
  }
  return above;
}

const ids = (doc: Doc, list: string) => ((doc[list] ?? []) as { id: string }[]).map((item) => item.id);

const MUTATIONS: Record<string, Mutation> = {
  'delete a field'(doc, random) {
    const leaf = pick(random, leaves(doc));
    setAt(doc, leaf.path, undefined);
  },
  'swap a type'(doc, random) {
    const leaf = pick(random, leaves(doc));
    setAt(doc, leaf.path, pick(random, [null, true, [], {}, '7', 7, 'text', [1, 2]] as Json[]));
  },
  'hostile number'(doc, random) {
    const numbers = leaves(doc).filter((l) => typeof l.value === 'number');
    const leaf = pick(random, numbers.length > 0 ? numbers : leaves(doc));
    const marker = `"@@NUMBER${leaf.path.length}@@"`;
    setAt(doc, leaf.path, marker.slice(1, -1));
    return JSON.stringify(doc, null, 2).replace(marker, pick(random, HOSTILE_NUMBERS));
  },
  'hostile text in a value'(doc, random) {
    const texts = leaves(doc).filter((l) => typeof l.value === 'string' || typeof l.value === 'number');
    setAt(doc, pick(random, texts).path, pick(random, HOSTILE_TEXT));
  },
  'unit of the wrong size or dimension'(doc, random) {
    const quantities = leaves(doc).filter((l) => typeof l.value === 'string' && /^\d.*[a-zA-Z%]$/.test(l.value));
    if (quantities.length === 0) return;
    const leaf = pick(random, quantities);
    const [, unit] = /^[\d.eE+-]+\s*(.*)$/.exec(leaf.value as string) ?? [];
    const replacement = pick(random, [
      `1e400 ${unit}`,
      `1e-400 ${unit}`,
      `1e-310 ${unit}`,
      `1e300 ${unit}`,
      `5 ${pick(random, ['kW', 'MW', 'hp', 'ft', 'cycles', 'kA', 'kV', 'ohm', 'Hz', 'm/s', 'degC'])}`,
    ]);
    setAt(doc, leaf.path, replacement);
  },
  'quantity at the edge of its range'(doc, random) {
    // Values the study accepts, at the ends of each dimension's physical range (1 V and 2 MV, 1 mA and
    // 10 MA, 1 mm and 1000 km, 1 µs and 100 000 s...): accepted, so they must be analysed and drawn.
    const quantities = leaves(doc).filter((l) => typeof l.value === 'string' && /^\d.*[a-zA-Z%]$/.test(l.value));
    if (quantities.length === 0) return;
    const leaf = pick(random, quantities);
    const unit = /^[\d.eE+-]+\s*(.*)$/.exec(leaf.value as string)?.[1] ?? '';
    const ends = EDGE_VALUES.find(([units]) => units.test(unit))?.[1];
    if (ends) setAt(doc, leaf.path, pick(random, ends));
  },
  'cable with its own ampacity'(doc, random) {
    const cables = (doc.cables ?? []) as Record<string, Json>[];
    if (cables.length === 0) return;
    // Accepted values at both ends, a plain number, and ones the study must refuse by name.
    pick(random, cables).ampacity = pick(random, ['0.001 A', '10 MA', '300 A', 1, 0, -5, '1e400 A', '5 kV'] as Json[]);
  },
  'CT ratio out of range'(doc, random) {
    const relays = (doc.devices as Record<string, Json>[])
      .map((device) => device.characteristic as Record<string, Json>)
      .filter((characteristic) => typeof characteristic?.ct === 'string');
    if (relays.length === 0) return;
    // Digits alone, so the ratio's own pattern matches: four hundred of them read as Infinity.
    pick(random, relays).ct = pick(random, [`1${'0'.repeat(400)}:5`, '0.0000000001:5', '600:0.000001', '600:0']);
  },
  'cable loop with per-pair margins'(doc, random) {
    const buses = ids(doc, 'buses');
    (doc.cables as Json[]).push({
      id: 'C-LOOP',
      from: pick(random, buses),
      to: pick(random, buses),
      size: '4/0',
      length: 10,
    });
    const devices = ids(doc, 'devices');
    (doc.coordination as Record<string, Json>) ??= {};
    (doc.coordination as Record<string, Json>).pairs = [
      { upstream: devices[0], downstream: pick(random, devices), margin: 0.2 },
    ];
  },
  'loop cut off from the source'(doc) {
    (doc.buses as Json[]).push({ id: 'LA', voltage: 480 }, { id: 'LB', voltage: 480 });
    (doc.cables as Json[]).push(
      { id: 'C-LA', from: 'LA', to: 'LB', size: '4/0', length: 10 },
      { id: 'C-LB', from: 'LB', to: 'LA', size: '4/0', length: 10 },
    );
  },
  'deep chain'(doc, random) {
    const bottom = chain(doc, 'SWBD', 150 + Math.floor(random() * 100), random() < 0.5);
    if (random() < 0.5)
      (doc.views as Json[]).push({ id: 'deep', referenceVoltage: 480, faults: [bottom], devices: ['MAIN'] });
  },
  'field given twice'(doc, random) {
    const text = JSON.stringify(doc, null, 2);
    const keys = [...text.matchAll(/\n(\s*)"(\w+)": ([^\n]*?),?\n/g)];
    const match = pick(random, keys);
    const at = match.index + match[0].length;
    return `${text.slice(0, at)}${match[1]}"${match[2]}": ${match[3].replace(/,$/, '')},\n${text.slice(at)}`;
  },
  'hostile name'(doc, random) {
    const named = leaves(doc).filter((l) => ['name', 'title', 'label', 'description'].includes(String(l.path.at(-1))));
    if (named.length === 0) return;
    setAt(doc, pick(random, named).path, pick(random, HOSTILE_NAMES));
  },
  'long name'(doc, random) {
    const named = leaves(doc).filter((l) => ['name', 'title', 'label'].includes(String(l.path.at(-1))));
    setAt(doc, pick(random, named).path, 'Ж'.repeat(pick(random, [201, 5_000, 200_000])));
  },
  'device repeated in a view'(doc, random) {
    const view = pick(random, doc.views as { devices: string[] }[]);
    const times = pick(random, [2, 3, 100_000]);
    view.devices = [...view.devices, ...Array.from({ length: times }, () => view.devices[0])];
  },
  'dangling reference'(doc, random) {
    const references = leaves(doc).filter((l) =>
      ['feeds', 'bus', 'from', 'to', 'upstream', 'downstream', 'devices', 'withstand', 'motors', 'faults'].some((k) =>
        l.path.includes(k),
      ),
    );
    const leaf = pick(
      random,
      references.filter((l) => typeof l.value === 'string'),
    );
    setAt(doc, leaf.path, pick(random, ['NOPE', 'C-MCC', 'MV', 'UTIL', 'MAIN', 'service']));
  },
  'byte-order mark'(doc) {
    return `\uFEFF${JSON.stringify(doc, null, 2)}`;
  },
  'broken JSON'(doc, random) {
    const text = JSON.stringify(doc, null, 2);
    const at = Math.floor(random() * text.length);
    return pick(random, [
      () => text.slice(0, at),
      () =>
        `${text.slice(0, at)}${pick(random, [',', '}', ']', '"', ':', '\\', 'x', '\u0000', ',,'])}${text.slice(at)}`,
      () => `${text.slice(0, at)}${text.slice(at + 1)}`,
      () => `${text}${pick(random, ['}', ' x', '\n{}'])}`,
      () => '['.repeat(100_000),
      () => '',
    ])();
  },
  'minimum source stronger than the maximum'(doc) {
    const source = doc.source as Record<string, Json>;
    if (source.kind !== 'utility') return;
    source.min = { available: '100 GVA', xr: 10 };
  },
  'absurd axis range'(doc, random) {
    const view = pick(random, doc.views as Record<string, Json>[]);
    view[pick(random, ['currentRange', 'timeRange'])] = pick(random, [
      [100, 10],
      [0, 1e308],
      [1, 1],
      [1e-310, 1],
      [1, 2],
      ['a', 'b'],
      [1],
    ] as Json[]);
  },
  'frequency and version'(doc, random) {
    doc[pick(random, ['frequency', 'discern'])] = pick(random, [0, 50, 60, 61, '60', 2, null] as Json[]);
  },
  'empty lists'(doc, random) {
    doc[pick(random, ['buses', 'transformers', 'cables', 'devices', 'views', 'motors'])] = [];
  },
  'hostile reference voltage'(doc, random) {
    const view = pick(random, doc.views as Record<string, Json>[]);
    view.referenceVoltage = pick(random, [1e308, '1e308 V', 1e-310, '1 V', '2 MV', '480 kW', 0.5] as Json[]);
  },
  'several at once'(doc, random) {
    let text: string | void;
    for (let k = 0; k < 3; k++) {
      const name = pick(random, SIMPLE);
      text = MUTATIONS[name](doc, random);
      if (typeof text === 'string') return text;
    }
  },
};

/** The smallest and largest value a study accepts for each unit, by the unit a demo writes. */
const EDGE_VALUES: Array<[RegExp, string[]]> = [
  [/^k?V$/, ['1 V', '2 MV']],
  [/^k?A$/, ['0.001 A', '10 MA']],
  [/^[kM]?VA$/, ['1 VA', '1000000 MVA']],
  [/^(ft|m)$/, ['1 mm', '1000 km']],
  [/^(s|cycles)$/, ['0.000001 s', '100000 s']],
  [/^%$/, ['0.000000001 %', '100 %']],
];

const SIMPLE = [
  'delete a field',
  'swap a type',
  'hostile text in a value',
  'unit of the wrong size or dimension',
  'hostile name',
  'dangling reference',
];

/**
 * `count` hostile cases from `seed`. Most mutate the small service-path study (so analysing the
 * accepted ones stays quick); about one in five mutates a whole demo.
 */
export function hostileStudies(seed: number, count: number): HostileCase[] {
  const random = seededRandom(seed);
  const names = Object.keys(MUTATIONS);
  const cases: HostileCase[] = [];
  for (let index = 0; index < count; index++) {
    const base = random() < 0.8 ? BASES[0] : pick(random, BASES.slice(1));
    const mutation = names[index % names.length];
    const doc = structuredClone(base.doc);
    const text = MUTATIONS[mutation](doc, random);
    cases.push({
      index,
      mutation,
      base: base.name,
      text: typeof text === 'string' ? text : JSON.stringify(doc, null, 2),
    });
  }
  return cases;
}
