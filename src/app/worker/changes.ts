import type { Analysis } from '../../engine/analysis.ts';
import type { PairCheck } from '../../engine/checks/coordination.ts';
import type { Finding, Severity } from '../../engine/checks/finding.ts';

/**
 * What changed in the checks' results since the previous reply: new or changed findings and pair
 * checks, the keys of those gone, and the order of all of them when it changed. An edit of one device
 * in a 2,000-device study changes a handful of findings, and only those cross from the worker.
 */
export interface AnalysisChanges {
  /** Findings new or changed, each with its key (its id; a repeated id gets `#n`). */
  findings: { key: string; finding: Finding }[];
  /** Keys of findings no longer found. */
  removed: string[];
  /** Every finding's key in order, when the order changed since the previous reply. */
  order?: string[];
  /** Pair checks new or changed, keyed `upstream/downstream`. */
  pairs: PairCheck[];
  /** Keys of pair checks gone. */
  removedPairs: string[];
  /** Every pair's key in order, when it changed. */
  pairOrder?: string[];
  counts: Record<Severity, number>;
}

/** The checks' results as the main thread holds them, rebuilt from changes. */
export interface CheckResults {
  findings: Finding[];
  pairs: PairCheck[];
  counts: Record<Severity, number>;
  /** Findings and pairs by key, and their order: what the next changes apply to. */
  byKey: Map<string, Finding>;
  order: string[];
  pairsByKey: Map<string, PairCheck>;
  pairOrder: string[];
}

const pairKeyOf = (pair: PairCheck) => `${pair.upstream}/${pair.downstream}`;

/** Keys for findings: the id, and `id#n` for the n-th repeat of an id. */
function keysOf(findings: readonly Finding[]): string[] {
  const seen = new Map<string, number>();
  return findings.map(({ id }) => {
    const n = seen.get(id) ?? 0;
    seen.set(id, n + 1);
    return n === 0 ? id : `${id}#${n}`;
  });
}

function sameOrder(a: readonly string[], b: readonly string[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/**
 * True when `a` and `b` read the same as JSON (what crossing to the page keeps of them): equal
 * numbers, strings and booleans; `null`, `NaN` and infinities alike (JSON writes them all as `null`);
 * object fields holding `undefined` or a function as if absent; key order ignored. A walk of both,
 * with no string built: a large study's thousands of findings that an edit left as they were are
 * told apart from changed ones without writing each out.
 *
 * @example sameJson({ a: 1, b: undefined }, { a: 1 }) // true
 */
export function sameJson(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  const ta = jsonKindOf(a);
  if (ta !== jsonKindOf(b)) return false;
  if (ta === 'null' || ta === 'absent') return true;
  if (ta !== 'array' && ta !== 'object') return a === b;
  if (ta === 'array') {
    const x = a as unknown[];
    const y = b as unknown[];
    if (x.length !== y.length) return false;
    for (let i = 0; i < x.length; i++) {
      // In an array, what an object would leave out is written as null.
      const kx = jsonKindOf(x[i]);
      const ky = jsonKindOf(y[i]);
      if ((kx === 'absent' || kx === 'null') && (ky === 'absent' || ky === 'null')) continue;
      if (!sameJson(x[i], y[i])) return false;
    }
    return true;
  }
  const x = a as Record<string, unknown>;
  const y = b as Record<string, unknown>;
  let count = 0;
  for (const key in x) {
    if (!Object.hasOwn(x, key) || jsonKindOf(x[key]) === 'absent') continue;
    count++;
    if (!Object.hasOwn(y, key) || !sameJson(x[key], y[key])) return false;
  }
  for (const key in y) if (Object.hasOwn(y, key) && jsonKindOf(y[key]) !== 'absent') count--;
  return count === 0;
}

// Accepts any value; what JSON makes of it, as far as comparing goes.
function jsonKindOf(value: unknown): 'absent' | 'null' | 'number' | 'string' | 'boolean' | 'array' | 'object' {
  if (value === undefined || typeof value === 'function' || typeof value === 'symbol') return 'absent';
  if (value === null || (typeof value === 'number' && !Number.isFinite(value))) return 'null';
  if (Array.isArray(value)) return 'array';
  const kind = typeof value;
  return kind === 'bigint' ? 'number' : (kind as 'number' | 'string' | 'boolean' | 'object');
}

/**
 * Remembers what was last sent and works out the changes of the next analysis. A finding object the
 * analysis reused (an unchanged pair's) is unchanged by identity; any other is compared as JSON
 * (`sameJson`).
 *
 * @example const tracker = new ChangeTracker(); postMessage({ seq, ok: true, changes: tracker.changesOf(analysis) })
 */
export class ChangeTracker {
  #findings = new Map<string, Finding>();
  #order: string[] = [];
  #pairs = new Map<string, PairCheck>();
  #pairOrder: string[] = [];

  changesOf(analysis: Pick<Analysis, 'findings' | 'pairs' | 'counts'>): AnalysisChanges {
    const order = keysOf(analysis.findings);
    const findings: AnalysisChanges['findings'] = [];
    const next = new Map<string, Finding>();
    analysis.findings.forEach((finding, i) => {
      const key = order[i];
      const known = this.#findings.get(key);
      next.set(key, finding);
      if (known === undefined || !sameJson(known, finding)) findings.push({ key, finding });
    });
    const removed = [...this.#findings.keys()].filter((key) => !next.has(key));
    const pairOrder = analysis.pairs.map(pairKeyOf);
    const pairs = analysis.pairs.filter((pair, i) => this.#pairs.get(pairOrder[i]) !== pair);
    const nextPairs = new Map(analysis.pairs.map((pair, i) => [pairOrder[i], pair]));
    const removedPairs = [...this.#pairs.keys()].filter((key) => !nextPairs.has(key));
    const changes: AnalysisChanges = { findings, removed, pairs, removedPairs, counts: analysis.counts };
    if (!sameOrder(order, this.#order)) changes.order = order;
    if (!sameOrder(pairOrder, this.#pairOrder)) changes.pairOrder = pairOrder;
    this.#findings = next;
    this.#order = order;
    this.#pairs = nextPairs;
    this.#pairOrder = pairOrder;
    return changes;
  }
}

/**
 * The results after applying `changes` to `previous` (undefined before the first reply). Unchanged
 * findings keep their objects, so what renders them can tell what changed.
 *
 * @example results = resultsWith(results, reply.changes)
 */
export function resultsWith(previous: CheckResults | undefined, changes: AnalysisChanges): CheckResults {
  const byKey = new Map(previous?.byKey);
  for (const key of changes.removed) byKey.delete(key);
  for (const { key, finding } of changes.findings) byKey.set(key, finding);
  const order = changes.order ?? previous?.order ?? [];
  const pairsByKey = new Map(previous?.pairsByKey);
  for (const key of changes.removedPairs) pairsByKey.delete(key);
  for (const pair of changes.pairs) pairsByKey.set(pairKeyOf(pair), pair);
  const pairOrder = changes.pairOrder ?? previous?.pairOrder ?? [];
  return {
    findings: order.map((key) => byKey.get(key)!),
    pairs: pairOrder.map((key) => pairsByKey.get(key)!),
    counts: changes.counts,
    byKey,
    order,
    pairsByKey,
    pairOrder,
  };
}
