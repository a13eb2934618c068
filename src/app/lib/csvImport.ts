import { characteristicProblems, parsePointsCsv, type PointsCsv } from '../../engine/devices/index.ts';

type Table = [number, number][];

/** Where imported points can go in a device's characteristic, by family. */
export interface PointsTarget {
  /** e.g. 'minimum melting and total clearing'. */
  label: string;
  /** Field paths inside the characteristic: the fast edge, then (for two-curve files) the slow edge. */
  fields: [string[]] | [string[], string[]];
}

/**
 * The places a CSV of points fits in a characteristic of `kind`: for a two-curve file both edges at
 * once; for a file whose rows name one curve that edge alone (a file of total-clearing rows is never
 * offered as minimum melting); for an unnamed one-curve file either edge. An empty list means the
 * family takes no point tables.
 *
 * @example pointsTargetsOf('fuse', { minimum: [...], maximum: [...] })[0].label // 'minimum melting and total clearing'
 */
export function pointsTargetsOf(kind: string, points: PointsCsv): PointsTarget[] {
  const edges = EDGES[kind];
  if (!edges) return [];
  if (points.minimum && points.maximum) return [edges.both];
  if (points.minimum) return [edges.minimum];
  if (points.maximum) return [edges.maximum];
  return [edges.minimum, edges.maximum];
}

/** Each family's targets: both edges, the fast edge, the slow edge. */
const EDGES: Record<string, { both: PointsTarget; minimum: PointsTarget; maximum: PointsTarget }> = {
  fuse: {
    both: { label: 'minimum melting and total clearing', fields: [['minimumMelting'], ['totalClearing']] },
    minimum: { label: 'minimum melting', fields: [['minimumMelting']] },
    maximum: { label: 'total clearing', fields: [['totalClearing']] },
  },
  'thermal-magnetic': {
    both: {
      label: 'thermal band, minimum and maximum (× rating)',
      fields: [
        ['thermal', 'minimum'],
        ['thermal', 'maximum'],
      ],
    },
    minimum: { label: 'thermal band minimum (× rating)', fields: [['thermal', 'minimum']] },
    maximum: { label: 'thermal band maximum (× rating)', fields: [['thermal', 'maximum']] },
  },
};

/**
 * The characteristic (file form) with the imported tables put in place; everything else is kept.
 *
 * @example withPoints({ kind: 'fuse', … }, { minimum, maximum }, FUSE_BOTH) // { kind: 'fuse', minimumMelting: minimum, totalClearing: maximum, … }
 */
export function withPoints(
  characteristic: Record<string, unknown>,
  points: PointsCsv,
  target: PointsTarget,
): Record<string, unknown> {
  const tables: Table[] = [];
  if (target.fields.length === 2) tables.push(points.minimum ?? [], points.maximum ?? []);
  else tables.push(points.points ?? points.minimum ?? points.maximum ?? []);
  let next = { ...characteristic };
  target.fields.forEach((field, i) => {
    next = setIn(
      next,
      field,
      tables[i].map(([a, s]) => [a, s]),
    );
  });
  return next;
}

/** What the study would say of a characteristic after an import: a refusal, or a warning to read before importing. */
export interface ImportCheck {
  /** The points themselves would not be accepted: the dialog does not import them. */
  refusal?: string;
  /** The points are good, but the curve the import leaves in place (the other edge) no longer fits them. */
  warning?: string;
}

/**
 * Checks an import as the study would, and blames the points only for what they cause. The points are
 * refused where the study would refuse them even with both edges made of them (a curve it does not
 * accept on its own). Where they are accepted on their own but not against the other edge the import
 * leaves in place (a template's, about to be replaced by a second file), they are imported with a
 * warning, so a curve sent as two one-curve files can go in in either order. A problem the
 * characteristic had before the import is neither: the study already shows it.
 *
 * @example importCheckOf(fuse, parsePointsCsv('total-clearing,10,300\ntotal-clearing,20,0.01'), target).warning
 * // 'These points do not fit the minimum melting curve left in place: totalClearing: expected …'
 */
export function importCheckOf(
  characteristic: Record<string, unknown>,
  points: PointsCsv,
  target: PointsTarget,
  frequency = 60,
): ImportCheck {
  const problems = (candidate: Record<string, unknown>) => characteristicProblems(candidate, { path: '', frequency });
  const before = new Set(problems(characteristic));
  const made = (candidate: Record<string, unknown>) =>
    problems(candidate)
      .filter((problem) => !before.has(problem))
      // The path within the characteristic (".totalClearing: …"), or none (": …").
      .map((problem) => problem.replace(/^\.|^: /, ''));
  // A one-edge import of a family with two edges: checked on its own first, as both edges.
  const edges = target.fields.length === 1 ? EDGES[String(characteristic.kind)] : undefined;
  const table = points.points ?? points.minimum ?? points.maximum;
  const alone = edges && table ? made(withPoints(characteristic, { minimum: table, maximum: table }, edges.both)) : [];
  if (alone.length > 0) return { refusal: `These points would not be accepted: ${alone[0]}` };
  const placed = made(withPoints(characteristic, points, target));
  if (placed.length === 0) return {};
  if (!edges) return { refusal: `These points would not be accepted: ${placed[0]}` };
  const other = target.fields[0].join('.') === edges.minimum.fields[0].join('.') ? edges.maximum : edges.minimum;
  return {
    warning: `These points do not fit the ${other.label} curve left in place, so the study will show a problem until it is replaced too (import it next, or both curves in one curve,current,time file): ${placed[0]}`,
  };
}

/**
 * The tables of a parsed file, named for the preview.
 * @example previewTablesOf({ points: [[200, 300]] }) // [{ name: 'points', rows: [[200, 300]] }]
 */
export function previewTablesOf(points: PointsCsv): { name: string; rows: Table }[] {
  return [
    ...(points.points ? [{ name: 'points', rows: points.points as Table }] : []),
    ...(points.minimum ? [{ name: 'minimum (fast edge)', rows: points.minimum as Table }] : []),
    ...(points.maximum ? [{ name: 'maximum (slow edge)', rows: points.maximum as Table }] : []),
  ];
}

/**
 * Every problem in a CSV of points, not only the first: each row read on its own (a bad number, a
 * missing field), then each row against the one before it on the same curve (currents rising, times
 * falling), then the file as a whole; each message names its row as the file counts lines.
 * An empty list means the file reads.
 * @example pointsCsvProblems('200,300\nabc,1\n100,10') // ['row 2: expected a current …', 'row 3: expected a current above …']
 */
export function pointsCsvProblems(text: string): string[] {
  const problems: string[] = [];
  const rows: { row: number; line: string; curve: string }[] = [];
  const columns = columnsOf(text);
  text.split(/\r\n|\r|\n/).forEach((line, i) => {
    const trimmed = line.trim();
    if (trimmed === '' || trimmed.startsWith('#')) return;
    const message = problemOf(line, columns);
    // A lone good row fails only for having one point; a header row has none.
    if (message === undefined || /expected at least 2 points/.test(message))
      rows.push({
        row: i + 1,
        line,
        curve: trimmed.split(/[,;\t]/).length >= 3 ? trimmed.split(/[,;\t]/)[0].trim() : '',
      });
    else if (!/got no points$/.test(message)) problems.push(renumbered(message, i + 1));
  });
  const previous = new Map<string, { row: number; line: string }>();
  for (const r of rows) {
    const before = previous.get(r.curve);
    const message = before ? problemOf(`${before.line}\n${r.line}`, columns) : undefined;
    if (message !== undefined && !/expected at least 2 points/.test(message)) problems.push(renumbered(message, r.row));
    else previous.set(r.curve, r);
  }
  problems.sort((a, b) => rowOf(a) - rowOf(b));
  if (problems.length === 0) {
    const message = problemOf(text);
    if (message !== undefined) problems.push(message);
  }
  return problems;
}

// Accepts CSV text and the whole file's number of fields; the reader's message about it, or undefined when it reads.
function problemOf(text: string, columns?: 2 | 3): string | undefined {
  try {
    parsePointsCsv(text, { columns });
    return undefined;
  } catch (error) {
    return (error as Error).message;
  }
}

// Accepts CSV text; the number of fields its first row sets (a header's, or the first point's), as the
// reader counts them, so each row is judged against the file's shape rather than its own.
function columnsOf(text: string): 2 | 3 | undefined {
  const first = text
    .split(/\r\n|\r|\n/)
    .map((line) => line.replace(/#.*$/, '').trim())
    .find((line) => line !== '');
  if (first === undefined) return undefined;
  return first.split(/\s*[,;\t]\s*/).length === 3 ? 3 : 2;
}

// Accepts a message; the row it names (0 when none).
function rowOf(message: string): number {
  return Number(/^row (\d+):/.exec(message)?.[1] ?? 0);
}

// Accepts a reader's message about a piece of the file; the same naming the row's line in the whole file.
function renumbered(message: string, row: number): string {
  return message.replace(/^row \d+:/, `row ${row}:`);
}

/**
 * The characteristic relabelled as the user's own once points are imported into it: the template's
 * name and its "illustrative" mark no longer describe it.
 * @example asOwnCurve({ kind: 'fuse', label: 'Illustrative … fuse', illustrative: true }, 'F1').label // 'F1: digitised points imported by the user'
 */
export function asOwnCurve(characteristic: Record<string, unknown>, deviceId: string): Record<string, unknown> {
  const own: Record<string, unknown> = {
    ...characteristic,
    label: `${deviceId}: digitised points imported by the user`,
  };
  delete own.illustrative;
  return own;
}

function setIn(object: Record<string, unknown>, path: string[], value: unknown): Record<string, unknown> {
  const [key, ...rest] = path;
  if (rest.length === 0) return { ...object, [key]: value };
  const child = object[key];
  return {
    ...object,
    [key]: setIn(child !== null && typeof child === 'object' ? (child as Record<string, unknown>) : {}, rest, value),
  };
}
