import { expectedGot } from '../errors.ts';
import type { StudyProblem } from './parse.ts';
import { networkOf, upstreamDeviceOf } from '../network/network.ts';
import type { Study } from './schema.ts';

/** Winding voltages may differ from their bus's nominal voltage by this fraction (rounding of 480 vs 480Y/277). */
const VOLTAGE_MATCH = 0.01;

/**
 * The rules a schema cannot state: ids unique across the study, every reference resolves, the
 * system is one radial tree fed from the source (no orphans, no loops, no bus fed twice), winding
 * voltages match their buses, and each element has at most one device feeding it.
 */
export function structureProblems(study: Study): StudyProblem[] {
  const problems: StudyProblem[] = [];
  const problem = (path: string, expected: string, got: unknown) =>
    problems.push({ path, message: expectedGot(expected, got) });

  // Ids: one namespace for everything a device can feed or a view can show.
  const kindOf = new Map<string, string>();
  const claim = (path: string, id: string, kind: string) => {
    if (kindOf.has(id)) problem(`${path}.id`, `an id not already used (a ${kindOf.get(id)} has it)`, id);
    else kindOf.set(id, kind);
  };
  claim('study.source', study.source.id, 'source');
  study.buses.forEach((bus, i) => claim(`study.buses[${i}]`, bus.id, 'bus'));
  study.transformers.forEach((t, i) => claim(`study.transformers[${i}]`, t.id, 'transformer'));
  study.cables.forEach((c, i) => claim(`study.cables[${i}]`, c.id, 'cable'));
  study.motors.forEach((m, i) => claim(`study.motors[${i}]`, m.id, 'motor'));
  study.devices.forEach((d, i) => claim(`study.devices[${i}]`, d.id, 'device'));
  const viewIds = new Set<string>();
  // Per-pair margins name two devices in series, the first above the second.
  const deviceFeeds = new Map(study.devices.map((d) => [d.id, d.feeds]));
  const network = problems.length === 0 ? networkOf(study) : undefined;
  study.coordination.pairs.forEach((pair, i) => {
    const path = `study.coordination.pairs[${i}]`;
    if (!deviceFeeds.has(pair.upstream)) problem(`${path}.upstream`, 'the id of a device', pair.upstream);
    else if (!deviceFeeds.has(pair.downstream)) problem(`${path}.downstream`, 'the id of a device', pair.downstream);
    else if (network && upstreamDeviceOf(network, network.devices.get(pair.downstream)!)?.id !== pair.upstream) {
      problem(`${path}.upstream`, `the device just above ${pair.downstream}`, pair.upstream);
    }
  });

  study.views.forEach((v, i) => {
    if (viewIds.has(v.id)) problem(`study.views[${i}].id`, 'a view id not already used', v.id);
    viewIds.add(v.id);
  });

  // References and the tree: each bus but the source's is fed by exactly one branch.
  const voltageOf = new Map(study.buses.map((bus) => [bus.id, bus.voltage]));
  const isBus = (id: string) => kindOf.get(id) === 'bus';
  if (!isBus(study.source.bus)) problem('study.source.bus', 'the id of a bus', study.source.bus);
  const feederOf = new Map<string, string>();
  const childrenOf = new Map<string, string[]>();
  const branches = [
    ...study.transformers.map((t, i) => ({ item: t, path: `study.transformers[${i}]` })),
    ...study.cables.map((c, i) => ({ item: c, path: `study.cables[${i}]` })),
  ];
  for (const { item, path } of branches) {
    if (!isBus(item.from)) problem(`${path}.from`, 'the id of a bus', item.from);
    if (!isBus(item.to)) problem(`${path}.to`, 'the id of a bus', item.to);
    if (!isBus(item.from) || !isBus(item.to)) continue;
    if (item.from === item.to) problem(`${path}.to`, 'a bus other than its "from" bus', item.to);
    else if (item.to === study.source.bus)
      problem(`${path}.to`, 'a bus below the source (the source bus is fed by the source)', item.to);
    else if (feederOf.has(item.to))
      problem(
        `${path}.to`,
        `a bus fed only once in a radial system (${feederOf.get(item.to)} already feeds it)`,
        item.to,
      );
    else {
      feederOf.set(item.to, item.id);
      childrenOf.set(item.from, [...(childrenOf.get(item.from) ?? []), item.to]);
    }
  }
  study.transformers.forEach((t, i) => {
    const path = `study.transformers[${i}]`;
    // A single-phase unit may be connected line to neutral: its winding is at the bus voltage / √3.
    const toNeutral = t.phases === 1 && t.primaryConnection !== 'line-to-line';
    const primaryBus = voltageOf.get(t.from)!;
    if (
      isBus(t.from) &&
      !matches(t.primary, primaryBus) &&
      !(toNeutral && matches(t.primary, primaryBus / Math.sqrt(3)))
    )
      problem(`${path}.primary`, `the voltage of bus ${t.from} (${primaryBus} V)`, `${t.primary} V`);
    if (isBus(t.to) && !matches(t.secondary, voltageOf.get(t.to)!))
      problem(`${path}.secondary`, `the voltage of bus ${t.to} (${voltageOf.get(t.to)} V)`, `${t.secondary} V`);
  });
  study.cables.forEach((c, i) => {
    if (isBus(c.from) && isBus(c.to) && !matches(voltageOf.get(c.from)!, voltageOf.get(c.to)!)) {
      problem(`study.cables[${i}].to`, `a bus at the voltage of ${c.from} (${voltageOf.get(c.from)} V)`, c.to);
    }
  });
  if (problems.length === 0) {
    const reached = new Set<string>();
    const stack = [study.source.bus];
    while (stack.length > 0) {
      const bus = stack.pop()!;
      if (reached.has(bus)) continue;
      reached.add(bus);
      stack.push(...(childrenOf.get(bus) ?? []));
    }
    study.buses.forEach((bus, i) => {
      if (!reached.has(bus.id))
        problem(
          `study.buses[${i}]`,
          'a bus connected to the source through transformers and cables (this one is an orphan or in a loop)',
          bus.id,
        );
    });
  }

  study.motors.forEach((m, i) => {
    if (!isBus(m.bus)) problem(`study.motors[${i}].bus`, 'the id of a bus', m.bus);
    if (m.hp === undefined && m.rating === undefined && m.fullLoadAmps === undefined)
      problem(`study.motors[${i}]`, 'one of "hp", "rating" or "fullLoadAmps"', m.id);
  });

  // Devices: each feeds a real element, at most one per element.
  const fedBy = new Map<string, string>();
  study.devices.forEach((d, i) => {
    const kind = kindOf.get(d.feeds);
    if (!kind || kind === 'device' || kind === 'source')
      problem(`study.devices[${i}].feeds`, 'the id of a bus, transformer, cable or motor', d.feeds);
    else if (fedBy.has(d.feeds))
      problem(
        `study.devices[${i}].feeds`,
        `an element no other device feeds (${fedBy.get(d.feeds)} feeds it)`,
        d.feeds,
      );
    else fedBy.set(d.feeds, d.id);
  });

  study.views.forEach((v, i) => {
    const path = `study.views[${i}]`;
    v.devices.forEach(
      (id, j) => kindOf.get(id) !== 'device' && problem(`${path}.devices[${j}]`, 'the id of a device', id),
    );
    v.faults?.forEach((id, j) => !isBus(id) && problem(`${path}.faults[${j}]`, 'the id of a bus', id));
    v.withstand.forEach(
      (id, j) =>
        !['transformer', 'cable'].includes(kindOf.get(id) ?? '') &&
        problem(`${path}.withstand[${j}]`, 'the id of a transformer or cable', id),
    );
    v.motors.forEach((id, j) => kindOf.get(id) !== 'motor' && problem(`${path}.motors[${j}]`, 'the id of a motor', id));
  });
  return problems;
}

function matches(a: number, b: number): boolean {
  return Math.abs(a - b) <= VOLTAGE_MATCH * Math.max(a, b);
}
