import { NEC_TABLE_9, parseConductorSize, TABLE_9_SPAN } from '../conductors/index.ts';
import { expectedGot, InputError } from '../errors.ts';
import { networkOf, upstreamDeviceOf } from '../network/network.ts';
import { formatSI } from '../quantity/format.ts';
import { energisedTrees, feedersIn } from '../scenario/connections.ts';
import { scenarioPartsOf } from '../scenario/scenarioParts.ts';
import { hasScenarios, scenarioLabel, scenariosOf } from '../scenario/scenarios.ts';
import type { StudyProblem } from './parse.ts';
import type { Study } from './schema.ts';

/** Winding voltages may differ from their bus's nominal voltage by this fraction (rounding of 480 vs 480Y/277). */
const VOLTAGE_MATCH = 0.01;

/**
 * The rules a schema cannot state: ids unique across the study, every reference resolves (branches,
 * motors, devices' `feeds`, views, per-pair margins), the system is one radial tree fed from the
 * source (no orphans, no loops, no bus fed twice), winding voltages match their buses, the minimum
 * source is no stronger than the maximum, each element has at most one device feeding it, and a view
 * names each thing once. Everything is checked iteratively, without walking the network, and only a
 * study that passes all of it has its per-pair margins checked against the tree (which walks it):
 * a loop can never reach code that assumes a tree.
 *
 * @example structureProblems(studyWithALoop) // [{ path: 'study.cables[4].to', message: 'expected a bus fed only once …' }]
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
  study.generators.forEach((g, i) => claim(`study.generators[${i}]`, g.id, 'generator'));
  study.switches.forEach((w, i) => claim(`study.switches[${i}]`, w.id, 'switch'));
  study.buses.forEach((bus, i) => claim(`study.buses[${i}]`, bus.id, 'bus'));
  study.transformers.forEach((t, i) => claim(`study.transformers[${i}]`, t.id, 'transformer'));
  study.cables.forEach((c, i) => claim(`study.cables[${i}]`, c.id, 'cable'));
  study.motors.forEach((m, i) => claim(`study.motors[${i}]`, m.id, 'motor'));
  study.devices.forEach((d, i) => claim(`study.devices[${i}]`, d.id, 'device'));
  const viewIds = new Set<string>();
  study.views.forEach((v, i) => {
    if (viewIds.has(v.id)) problem(`study.views[${i}].id`, 'a view id not already used', v.id);
    viewIds.add(v.id);
  });
  const scenarioIds = new Set<string>();
  study.scenarios.forEach((s, i) => {
    if (scenarioIds.has(s.id)) problem(`study.scenarios[${i}].id`, 'a scenario id not already used', s.id);
    scenarioIds.add(s.id);
  });

  // References: branches, switches and generators join buses; scenarios name what they switch.
  const voltageOf = new Map(study.buses.map((bus) => [bus.id, bus.voltage]));
  const isBus = (id: string) => kindOf.get(id) === 'bus';
  if (!isBus(study.source.bus)) problem('study.source.bus', 'the id of a bus', study.source.bus);
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
  }
  study.generators.forEach((g, i) => {
    const path = `study.generators[${i}]`;
    if (!isBus(g.bus)) problem(`${path}.bus`, 'the id of a bus', g.bus);
    else if (!matches(g.voltage, voltageOf.get(g.bus)!))
      problem(`${path}.voltage`, `the voltage of bus ${g.bus} (${voltageOf.get(g.bus)} V)`, `${g.voltage} V`);
    g.damage?.forEach((point, k) => {
      const before = g.damage![k - 1];
      if (before && !(point.current > before.current && point.time < before.time))
        problem(
          `${path}.damage[${k}]`,
          'a point at a higher current and a shorter time than the one before',
          `${point.current} A, ${point.time} s`,
        );
    });
  });
  study.switches.forEach((w, i) => {
    const path = `study.switches[${i}]`;
    const ends = w.kind === 'transfer' ? (['normal', 'emergency', 'to'] as const) : (['from', 'to'] as const);
    const ids = ends.map((end) => (w as Record<string, string>)[end]);
    ends.forEach((end, k) => {
      if (!isBus(ids[k])) problem(`${path}.${end}`, 'the id of a bus', ids[k]);
    });
    if (!ids.every(isBus)) return;
    ends.forEach((end, k) => {
      if (k > 0 && ids.indexOf(ids[k]) < k)
        problem(`${path}.${end}`, "a bus other than the switch's other ends", ids[k]);
      else if (k > 0 && !matches(voltageOf.get(ids[k])!, voltageOf.get(ids[0])!))
        problem(`${path}.${end}`, `a bus at the voltage of ${ids[0]} (${voltageOf.get(ids[0])} V)`, ids[k]);
    });
    if (ids.at(-1) === study.source.bus)
      problem(`${path}.to`, 'a bus below the source (the source bus is fed by the source)', ids.at(-1));
  });
  study.scenarios.forEach((s, i) => {
    const path = `study.scenarios[${i}]`;
    s.sources?.forEach((id, j) => {
      const kind = kindOf.get(id);
      if (kind !== 'source' && kind !== 'generator')
        problem(`${path}.sources[${j}]`, 'the id of the source or of a generator', id);
    });
    for (const [id, position] of Object.entries(s.switches)) {
      const item = study.switches.find((w) => w.id === id);
      if (!item) problem(`${path}.switches.${id}`, 'the id of a switch', id);
      else if (
        item.kind === 'transfer'
          ? position !== 'normal' && position !== 'emergency'
          : position !== 'open' && position !== 'closed'
      )
        problem(
          `${path}.switches.${id}`,
          item.kind === 'transfer' ? '"normal" or "emergency" for a transfer switch' : '"open" or "closed" for a tie',
          position,
        );
    }
    s.outOfService.forEach((id, j) => {
      const kind = kindOf.get(id);
      if (kind !== 'transformer' && kind !== 'cable')
        problem(`${path}.outOfService[${j}]`, 'the id of a transformer or cable', id);
    });
  });

  // The tree, scenario by scenario: each bus energised at most once, every bus reached in some
  // scenario (walked breadth first: any depth of tree).
  const switched = hasScenarios(study);
  const reached = new Set<string>();
  const reported = new Set<string>();
  for (const scenario of scenariosOf(study)) {
    const { feederOf, doubles } = feedersIn(study, scenario);
    for (const { first, second } of doubles) {
      if (second.kind !== 'source' && second.to === study.source.bus && first.id === study.source.id) continue;
      if (reported.has(second.path)) continue;
      reported.add(second.path);
      const where = switched ? `in scenario "${scenarioLabel(scenario)}"` : 'in a radial system';
      problem(second.path, `a bus fed only once ${where} (${first.id} already feeds it)`, second.to);
    }
    for (const tree of energisedTrees(feederOf)) for (const connection of tree) reached.add(connection.to);
  }
  study.buses.forEach((bus, i) => {
    if (!reached.has(bus.id))
      problem(
        `study.buses[${i}]`,
        switched
          ? 'a bus connected to a source through transformers, cables and switches in some scenario (this one is an orphan or in a loop)'
          : 'a bus connected to the source through transformers and cables (this one is an orphan or in a loop)',
        bus.id,
      );
  });

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
  // A cable's size sets its withstand (always) and its impedance (unless given per 1000 ft).
  study.cables.forEach((c, i) => {
    const path = `study.cables[${i}].size`;
    try {
      const size = parseConductorSize(c.size, path);
      if ((c.resistance === undefined || c.reactance === undefined) && !NEC_TABLE_9[size])
        problem(path, `a size in NEC Table 9 (${TABLE_9_SPAN}), or "resistance" and "reactance" per 1000 ft`, c.size);
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      problems.push({ path, message: error.message.slice(path.length + 2) });
    }
  });
  study.cables.forEach((c, i) => {
    if (isBus(c.from) && isBus(c.to) && !matches(voltageOf.get(c.from)!, voltageOf.get(c.to)!)) {
      problem(`study.cables[${i}].to`, `a bus at the voltage of ${c.from} (${voltageOf.get(c.from)} V)`, c.to);
    }
  });

  // The minimum source (for sensitivity) cannot deliver more than the maximum (for duty).
  const source = study.source;
  if (source.kind === 'utility' && source.min && isBus(source.bus)) {
    const volts = voltageOf.get(source.bus)!;
    const va = (level: { va?: number; amps?: number }) => level.va ?? Math.sqrt(3) * volts * level.amps!;
    const max = va(source.max.available);
    if (va(source.min.available) > max * (1 + 1e-9))
      problem(
        'study.source.min.available',
        `a minimum fault no stronger than the maximum (${formatSI(max, 'VA')})`,
        formatSI(va(source.min.available), 'VA'),
      );
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
    if (!kind || kind === 'device' || kind === 'source' || kind === 'generator' || kind === 'switch')
      problem(`study.devices[${i}].feeds`, 'the id of a bus, transformer, cable or motor', d.feeds);
    else if (fedBy.has(d.feeds))
      problem(
        `study.devices[${i}].feeds`,
        `an element no other device feeds (${fedBy.get(d.feeds)} feeds it)`,
        d.feeds,
      );
    else fedBy.set(d.feeds, d.id);
  });

  // Views: every reference resolves to the right kind, each named once.
  study.views.forEach((v, i) => {
    const path = `study.views[${i}]`;
    const list = (field: string, ids: readonly string[] | undefined, kinds: string[], expected: string) => {
      const seen = new Set<string>();
      ids?.forEach((id, j) => {
        if (!kinds.includes(kindOf.get(id) ?? '')) problem(`${path}.${field}[${j}]`, expected, id);
        else if (seen.has(id)) problem(`${path}.${field}[${j}]`, `each ${kinds.join(' or ')} once in a view`, id);
        seen.add(id);
      });
    };
    list('devices', v.devices, ['device'], 'the id of a device');
    list('faults', v.faults, ['bus'], 'the id of a bus');
    list(
      'withstand',
      v.withstand,
      ['transformer', 'cable', 'generator'],
      'the id of a transformer, cable or generator',
    );
    list('motors', v.motors, ['motor'], 'the id of a motor');
  });

  // Per-pair margins name two devices in series, the first just above the second.
  const pairSeen = new Set<string>();
  study.coordination.pairs.forEach((pair, i) => {
    const path = `study.coordination.pairs[${i}]`;
    if (kindOf.get(pair.upstream) !== 'device') problem(`${path}.upstream`, 'the id of a device', pair.upstream);
    else if (kindOf.get(pair.downstream) !== 'device')
      problem(`${path}.downstream`, 'the id of a device', pair.downstream);
    else if (pairSeen.has(`${pair.upstream}\n${pair.downstream}`))
      problem(`${path}`, 'each pair once', `${pair.upstream} above ${pair.downstream}`);
    pairSeen.add(`${pair.upstream}\n${pair.downstream}`);
  });
  if (problems.length > 0 || study.coordination.pairs.length === 0) return problems;

  // Only now is every scenario a forest of trees, so the networks can be walked: a per-pair margin
  // names a device just above another in some scenario (a study without one builds no network here).
  const networks = scenariosOf(study).flatMap((scenario) =>
    scenarioPartsOf(study, scenario).map((part) => networkOf(part.study)),
  );
  study.coordination.pairs.forEach((pair, i) => {
    const inSeries = networks.some((network) => {
      const downstream = network.devices.get(pair.downstream);
      return downstream !== undefined && upstreamDeviceOf(network, downstream)?.id === pair.upstream;
    });
    if (!inSeries)
      problem(`study.coordination.pairs[${i}].upstream`, `the device just above ${pair.downstream}`, pair.upstream);
  });
  return problems;
}

function matches(a: number, b: number): boolean {
  return Math.abs(a - b) <= VOLTAGE_MATCH * Math.max(a, b);
}
