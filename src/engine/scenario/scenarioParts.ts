import { hiddenSlot } from '../hiddenSlot.ts';
import type { Scenario, Source, Study, Switch } from '../study/index.ts';
import { energisedTrees, feedersIn, switchPosition, type Connection } from './connections.ts';
import { hasScenarios, scenarioLabel, scenariosOf } from './scenarios.ts';
import { addToList } from '../addToList.ts';

/** One source's radial tree in a scenario, as a study of its own that today's single-source analysis reads. */
export interface ScenarioPart {
  /** The source at its root: the utility source or a generator. */
  sourceId: string;
  study: Study;
}

/** A switch of the whole study as a scenario sets it: what a part's diagram draws (its own switches are all closed ties). */
export interface SwitchSetting {
  /** The switch as the study declares it (a transfer switch or a tie). */
  switch: Switch;
  /** Its position in the scenario. */
  position: 'normal' | 'emergency' | 'open' | 'closed';
}

// Kept off the part's own fields, so the network, the fault code and every comparison of parts read the closed ties alone.
const switchSettings = hiddenSlot<SwitchSetting[]>();

/**
 * The study's switches with an end on one of a part's buses, as the part's scenario sets them, in
 * study order: the closed ones the part holds as ties, and the open ones (an open tie, the idle side
 * of a transfer switch) the part does not hold at all. `undefined` for a study `scenarioPartsOf` did
 * not split.
 *
 * @example switchSettingsOf(scenarioPartsOf(study, onGenerator)[0].study) // [{ switch: ATS, position: 'emergency' }]
 */
export function switchSettingsOf(part: Study): readonly SwitchSetting[] | undefined {
  return switchSettings.get(part);
}

/**
 * The radial studies a scenario splits into, one per source in service that energises anything: each
 * holds the buses its source reaches through the transformers and cables in service and the switches
 * closed in the scenario, with their motors, the devices feeding them, the views and per-pair margins
 * that concern them, and its source as `source` (a generator keeps its machine data). Closed switches
 * appear as closed ties (a transfer switch from the side it is on); `switchSettingsOf` gives each
 * switch as declared, with its position. Buses no source reaches are de-energised and appear in no
 * part. A view keeps what its part holds, and its notes name what it leaves out (not energised, or fed
 * from another source). A study that cannot be switched is its own single part, unchanged: its
 * results are exactly those of the study itself.
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
  const trees = energisedTrees(feedersIn(study, scenario).feederOf);
  // Names are looked up only when a view leaves something out, once per scenario.
  let names: Map<string, string> | undefined;
  const nameOf = (id: string) => (names ??= namesOf(study)).get(id) ?? id;
  const context: PartContext = { label: scenarioLabel(scenario), rootOf: rootsOf(study, trees), nameOf };
  return trees.map((tree) => {
    const [root, ...below] = tree;
    const buses = new Set(tree.map((c) => c.to));
    const branches = new Set(below.filter((c) => c.kind !== 'switch').map((c) => c.id));
    const links = below.filter((c) => c.kind === 'switch');
    const part = partStudy(study, rootSource(study, root.id), buses, branches, links, context);
    switchSettings.set(
      part,
      study.switches
        .filter((item) => switchEnds(item).some((bus) => buses.has(bus)))
        .map((item) => ({ switch: item, position: switchPosition(item, scenario) })),
    );
    return { sourceId: root.id, study: part };
  });
}

// What a part's views need of the whole scenario: its label, and the source whose tree holds each element.
interface PartContext {
  label: string;
  /** Bus, branch, motor, device and source ids to the source at the root of the tree holding them. */
  rootOf: Map<string, string>;
  /** An element's name, else its id. */
  nameOf: (id: string) => string;
}

// Accepts a study and its scenario's trees; each energised element's source, devices by what they feed.
function rootsOf(study: Study, trees: Connection[][]): Map<string, string> {
  const rootOf = new Map<string, string>();
  for (const tree of trees)
    for (const c of tree) {
      // Ids are unique across a study, so buses and the elements energising them share one map.
      rootOf.set(c.id, tree[0].id);
      rootOf.set(c.to, tree[0].id);
    }
  for (const motor of study.motors) {
    const root = rootOf.get(motor.bus);
    if (root !== undefined) rootOf.set(motor.id, root);
  }
  for (const device of study.devices) {
    const root = rootOf.get(device.feeds);
    if (root !== undefined) rootOf.set(device.id, root);
  }
  return rootOf;
}

// Accepts a switch; the buses at its ends.
function switchEnds(item: Switch): string[] {
  return item.kind === 'transfer' ? [item.normal, item.emergency, item.to] : [item.from, item.to];
}

// Accepts a source id in service; the study's source, or the generator as a source of kind "generator".
function rootSource(study: Study, id: string): Source {
  if (study.source.id === id) return study.source;
  const generator = study.generators.find((g) => g.id === id)!;
  return { kind: 'generator', ...generator };
}

// Accepts what one source reaches and its scenario's context; the study restricted to it, in study order.
function partStudy(
  study: Study,
  source: Source,
  buses: Set<string>,
  branches: Set<string>,
  links: Connection[],
  context: PartContext,
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
    const kept = {
      devices: shown,
      faults: view.faults?.filter((id) => buses.has(id)),
      withstand: view.withstand.filter((id) => branches.has(id) || id === source.id),
      motors: view.motors.filter((id) => fed.has(id)),
    };
    // A sheet never drops a curve unsaid: its notes name what this tree leaves out, and why.
    const left = [
      ...view.devices.filter((id) => !deviceIds.has(id)),
      ...view.withstand.filter((id) => !kept.withstand.includes(id)),
      ...view.motors.filter((id) => !fed.has(id)),
      ...(view.faults ?? []).filter((id) => !buses.has(id)),
    ];
    const notes = [view.notes, ...leftOutNotes(left, context)].filter(Boolean).join(' ');
    return [
      {
        ...view,
        // Each scenario's sheet says which scenario it draws.
        title: `${view.title ?? view.id} — ${context.label}`,
        ...kept,
        ...(notes ? { notes } : {}),
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

// Accepts the ids a part's view leaves out; one sentence for those no source reaches, one per other source.
function leftOutNotes(left: string[], { label, rootOf, nameOf }: PartContext): string[] {
  const bySource = new Map<string | undefined, string[]>();
  for (const id of new Set(left)) {
    const root = rootOf.get(id);
    addToList(bySource, root, nameOf(id));
  }
  return [...bySource].map(([root, names]) =>
    root === undefined
      ? `Not energised in "${label}", so not drawn: ${names.join(', ')}.`
      : `Fed from ${root} in "${label}", so drawn on its sheet for that source: ${names.join(', ')}.`,
  );
}

// Accepts a study; the name of each named element a view may list, by id.
function namesOf(study: Study): Map<string, string> {
  const items: { id: string; name?: string }[] = [
    ...study.generators,
    ...study.buses,
    ...study.transformers,
    ...study.cables,
    ...study.motors,
    ...study.devices,
  ];
  return new Map(items.flatMap((item) => (item.name ? [[item.id, item.name] as const] : [])));
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
