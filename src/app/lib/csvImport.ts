import type { PointsCsv } from '../../engine/devices/index.ts';

type Table = [number, number][];

/** Where imported points can go in a device's characteristic, by family. */
export interface PointsTarget {
  /** e.g. 'minimum melting and total clearing'. */
  label: string;
  /** Field paths inside the characteristic: the fast edge, then (for two-curve files) the slow edge. */
  fields: [string[]] | [string[], string[]];
}

const FUSE_BOTH: PointsTarget = {
  label: 'minimum melting and total clearing',
  fields: [['minimumMelting'], ['totalClearing']],
};
const BREAKER_BOTH: PointsTarget = {
  label: 'thermal band, minimum and maximum (× rating)',
  fields: [
    ['thermal', 'minimum'],
    ['thermal', 'maximum'],
  ],
};

/**
 * The places a CSV of points fits in a characteristic of `kind`: for a two-curve file both edges
 * at once; for a one-curve file either edge. An empty list means the family takes no point tables.
 *
 * @example pointsTargetsOf('fuse', { minimum: [...], maximum: [...] })[0].label // 'minimum melting and total clearing'
 */
export function pointsTargetsOf(kind: string, points: PointsCsv): PointsTarget[] {
  const both = points.minimum && points.maximum;
  if (kind === 'fuse') {
    return both
      ? [FUSE_BOTH]
      : [
          { label: 'minimum melting', fields: [['minimumMelting']] },
          { label: 'total clearing', fields: [['totalClearing']] },
        ];
  }
  if (kind === 'thermal-magnetic') {
    return both
      ? [BREAKER_BOTH]
      : [
          { label: 'thermal band minimum (× rating)', fields: [['thermal', 'minimum']] },
          { label: 'thermal band maximum (× rating)', fields: [['thermal', 'maximum']] },
        ];
  }
  return [];
}

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

function setIn(object: Record<string, unknown>, path: string[], value: unknown): Record<string, unknown> {
  const [key, ...rest] = path;
  if (rest.length === 0) return { ...object, [key]: value };
  const child = object[key];
  return {
    ...object,
    [key]: setIn(child !== null && typeof child === 'object' ? (child as Record<string, unknown>) : {}, rest, value),
  };
}
