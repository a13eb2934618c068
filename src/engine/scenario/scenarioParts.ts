import type { Scenario, Source, Study, Switch } from '../study/index.ts';
import { energisedTrees, feedersIn, type Connection } from './connections.ts';
import { hasScenarios, scenarioLabel, scenariosOf } from './scenarios.ts';

/** One source's radial tree in a scenario, as a study of its own that today's single-source analysis reads. */
export interface ScenarioPart {
  /** The source at its root: the utility source or a generator. */
  sourceId: string;
  study: Study;
}

/**
 * The radial studies a scenario splits into, one per source in service that energises anything: each
 * holds the buses its source reaches through the transformers and cables in service and the switches
 * closed in the scenario, with their motors, the devices feeding them, the views and per-pair margins
 * that concern them, and its source as `source` (a generator keeps its machine data). Closed switches
 * appear as closed ties (a transfer switch from the side it is on). Buses no source reaches are
 * de-energised and appear in no part. A study that cannot be switched is its own single part,
 * unchanged: its results are exactly those of the study itself.
 *
 * Expects a study that `readStudy` accepted (each bus energised at most once in every scenario).
 *
 * @example scenarioPartsOf(study, scenariosOf(study)[1]).map((p) => p.sourceId) // ['G1']
 */
export function scenarioPartsOf(study: Study, scenario: Scenario): ScenarioPart[] {
  if (!hasScenarios(study)) return [{ sourceId: study.source.id, study }];
  return splitScenario(study, scenario);
}

/** `scenarioPartsOf` without the shortcut for a study that cannot be switched (its results must be the same). */
export function splitScenario(study: Study, scenario: Scenario): ScenarioPart[] {
  return energisedTrees(feedersIn(study, scenario).feederOf).map((tree) => {
    const [root, ...below] = tree;
    const buses = new Set(tree.map((c) => c.to));
    const branches = new Set(below.filter((c) => c.kind !== 'switch').map((c) => c.id));
    const links = below.filter((c) => c.kind === 'switch');
    const part = partStudy(study, rootSource(study, root.id), buses, branches, links, scenarioLabel(scenario));
    return { sourceId: root.id, study: part };
  });
}

// Accepts a source id in service; the study's source, or the generator as a source of kind "generator".
function rootSource(study: Study, id: string): Source {
  if (study.source.id === id) return study.source;
  const generator = study.generators.find((g) => g.id === id)!;
  return { kind: 'generator', ...generator };
}

// Accepts what one source reaches and the scenario's label; the study restricted to it, in study order.
function partStudy(
  study: Study,
  source: Source,
  buses: Set<string>,
  branches: Set<string>,
  links: Connection[],
  label: string,
): Study {
  const motors = study.motors.filter((m) => buses.has(m.bus));
  const fed = new Set<string>([...buses, ...branches, ...motors.map((m) => m.id)]);
  const devices = study.devices.filter((d) => fed.has(d.feeds));
  const deviceIds = new Set(devices.map((d) => d.id));
  const switches: Switch[] = links.map((link) => ({
    kind: 'tie',
    id: link.id,
    name: link.switch!.name,
    from: link.from!,
    to: link.to,
    normally: 'closed',
  }));
  const views = study.views.flatMap((view) => {
    const shown = view.devices.filter((id) => deviceIds.has(id));
    if (shown.length === 0) return [];
    return [
      {
        ...view,
        // Each scenario's sheet says which scenario it draws.
        title: `${view.title ?? view.id} — ${label}`,
        devices: shown,
        faults: view.faults?.filter((id) => buses.has(id)),
        withstand: view.withstand.filter((id) => branches.has(id) || id === source.id),
        motors: view.motors.filter((id) => fed.has(id)),
      },
    ];
  });
  return {
    ...study,
    source,
    generators: [],
    switches,
    scenarios: [],
    buses: study.buses.filter((b) => buses.has(b.id)),
    transformers: study.transformers.filter((t) => branches.has(t.id)),
    cables: study.cables.filter((c) => branches.has(c.id)),
    motors,
    devices,
    views,
    coordination: {
      ...study.coordination,
      pairs: study.coordination.pairs.filter((p) => deviceIds.has(p.upstream) && deviceIds.has(p.downstream)),
    },
  };
}

/**
 * The radial study in which a device is worked on alone (its setting window, its band's location):
 * the study itself when it cannot be switched, else the part holding the device in `scenarioId`, or
 * in the first scenario that energises it. `undefined` when no scenario energises it.
 *
 * @example settingWindowOf(treeHolding(study, 'EM-BR', 'on-generator')!, 'EM-BR')
 */
export function treeHolding(study: Study, deviceId: string, scenarioId?: string): Study | undefined {
  if (!hasScenarios(study)) return study;
  const scenarios = scenariosOf(study).filter((s) => scenarioId === undefined || s.id === scenarioId);
  for (const scenario of scenarios)
    for (const part of splitScenario(study, scenario))
      if (part.study.devices.some((d) => d.id === deviceId)) return part.study;
  return undefined;
}
