import type { Scenario, Study, Switch } from '../study/index.ts';
import { sourcesInService } from './scenarios.ts';

/** One thing that energises a bus in a scenario: a source at its bus, or a branch or closed switch from a bus above. */
export interface Connection {
  /** The source, transformer, cable or switch id. */
  id: string;
  kind: 'source' | 'transformer' | 'cable' | 'switch';
  /** The bus above (absent for a source). */
  from?: string;
  /** The bus it energises. */
  to: string;
  /** The field that names `to`, for messages: `study.cables[3].to`. */
  path: string;
  /** The switch, for a closed switch (a transfer switch on either side, or a tie). */
  switch?: Switch;
}

/** The position of a switch in a scenario: the scenario's, else its normal one. */
export function switchPosition(item: Switch, scenario: Scenario): 'normal' | 'emergency' | 'open' | 'closed' {
  return scenario.switches[item.id] ?? (item.kind === 'transfer' ? 'normal' : item.normally);
}

/**
 * Everything that energises a bus in `scenario`, in study order: the sources in service, the
 * transformers and cables not switched out, and the switches closed in it (a transfer switch from the
 * side it is on; a tie when closed). A radial scenario energises each bus at most once.
 *
 * @example connectionsOf(study, scenario).filter((c) => c.to === 'EP') // [{ id: 'ATS', kind: 'switch', from: 'GEN', … }]
 */
export function connectionsOf(study: Study, scenario: Scenario): Connection[] {
  const inService = new Set(sourcesInService(study, scenario));
  const out = new Set(scenario.outOfService);
  const connections: Connection[] = [];
  if (inService.has(study.source.id))
    connections.push({ id: study.source.id, kind: 'source', to: study.source.bus, path: 'study.source.bus' });
  study.generators.forEach((g, i) => {
    if (inService.has(g.id))
      connections.push({ id: g.id, kind: 'source', to: g.bus, path: `study.generators[${i}].bus` });
  });
  study.transformers.forEach((t, i) => {
    if (!out.has(t.id))
      connections.push({ id: t.id, kind: 'transformer', from: t.from, to: t.to, path: `study.transformers[${i}].to` });
  });
  study.cables.forEach((c, i) => {
    if (!out.has(c.id))
      connections.push({ id: c.id, kind: 'cable', from: c.from, to: c.to, path: `study.cables[${i}].to` });
  });
  study.switches.forEach((item, i) => {
    const position = switchPosition(item, scenario);
    const path = `study.switches[${i}].to`;
    if (item.kind === 'transfer' && (position === 'normal' || position === 'emergency'))
      connections.push({ id: item.id, kind: 'switch', from: item[position], to: item.to, path, switch: item });
    if (item.kind === 'tie' && position === 'closed')
      connections.push({ id: item.id, kind: 'switch', from: item.from, to: item.to, path, switch: item });
  });
  return connections;
}

/** A bus energised twice in a scenario: the connection that came second, and the one already feeding it. */
export interface DoubleFeed {
  second: Connection;
  first: Connection;
}

/**
 * The first connection energising each bus in `scenario`, and every bus energised twice (a loop, two
 * sources in parallel, a tie closed with both mains in).
 */
export function feedersIn(
  study: Study,
  scenario: Scenario,
): { feederOf: Map<string, Connection>; doubles: DoubleFeed[] } {
  const feederOf = new Map<string, Connection>();
  const doubles: DoubleFeed[] = [];
  for (const connection of connectionsOf(study, scenario)) {
    const first = feederOf.get(connection.to);
    if (first) doubles.push({ second: connection, first });
    else feederOf.set(connection.to, connection);
  }
  return { feederOf, doubles };
}

/**
 * What each source in service energises, walking down from its bus over the first connection feeding
 * each bus (`feedersIn`): one list per source, the source's own connection first, then breadth first.
 * Linear in the connections.
 *
 * @example energisedTrees(feedersIn(study, scenario).feederOf).map((tree) => tree[0].id) // ['UTIL']
 */
export function energisedTrees(feederOf: Map<string, Connection>): Connection[][] {
  const childrenOf = new Map<string, Connection[]>();
  for (const connection of feederOf.values()) {
    if (connection.from === undefined) continue;
    const children = childrenOf.get(connection.from);
    if (children) children.push(connection);
    else childrenOf.set(connection.from, [connection]);
  }
  return [...feederOf.values()]
    .filter((connection) => connection.kind === 'source')
    .map((root) => {
      const tree = [root];
      const seen = new Set([root.to]);
      for (let i = 0; i < tree.length; i++)
        for (const child of childrenOf.get(tree[i].to) ?? [])
          if (!seen.has(child.to)) {
            seen.add(child.to);
            tree.push(child);
          }
      return tree;
    });
}
