import { defaultMarginRule, marginRuleOf } from '../../engine/checks/margins.ts';
import { seriesPairs, type Network } from '../../engine/network/index.ts';
import { z } from 'zod/mini';
import { studySchema } from '../../engine/study/index.ts';
import { valueAt, type DocumentPath } from './documentPath.ts';

/** One study-wide option as the options dialog offers it: where it is in the study file, and its label. */
export interface StudyOption {
  path: DocumentPath;
  label: string;
}

/**
 * The study-wide options, grouped as an engineer reads them: the study file's `coordination` settings
 * (the margins by pair kind and for single pairs aside, which the dialog lists as tables) and its
 * conductor temperatures. A test holds the list to the schema, so an option added there is offered here.
 */
export const STUDY_OPTION_GROUPS: readonly { title: string; options: readonly StudyOption[] }[] = [
  {
    title: 'Coordination',
    options: [
      { path: ['coordination', 'thinMargin'], label: 'thin margin below, s' },
      { path: ['coordination', 'halfCycle'], label: 'half-cycle (not provable below), s' },
      { path: ['coordination', 'fuseRatio'], label: 'fuse melting fraction (preloading)' },
      { path: ['coordination', 'horizon'], label: 'never beyond, s' },
    ],
  },
  {
    title: 'Code checks',
    options: [
      { path: ['coordination', 'edition'], label: 'NFPA 70 edition' },
      { path: ['coordination', 'codeSelectivity'], label: 'selective coordination of marked systems' },
    ],
  },
  {
    title: 'Sensitivity',
    options: [
      { path: ['coordination', 'sensitivity', 'maxTime'], label: 'latest clearing at minimum fault, s' },
      { path: ['coordination', 'sensitivity', 'arcingFactor'], label: 'arcing factor on minimum faults' },
    ],
  },
  {
    title: 'Fault currents',
    options: [
      { path: ['conductorTemperatures', 'maximumFault'], label: 'conductor temperature at maximum fault, °C' },
      { path: ['conductorTemperatures', 'minimumFault'], label: 'conductor temperature at minimum fault, °C' },
    ],
  },
];

/** The options a study that sets none takes, read once from the schema (its defaults, in seconds and °C). */
let defaults: Record<string, unknown> | undefined;

/**
 * The value an option takes when the study leaves it out (the schema's default), or undefined for one
 * that is off unless set (the arcing factor).
 *
 * @example optionDefault({ path: ['conductorTemperatures', 'minimumFault'], label: '' }) // 90
 */
export function optionDefault(option: StudyOption): unknown {
  defaults ??= {
    coordination: z.parse(studySchema.shape.coordination, undefined),
    conductorTemperatures: z.parse(studySchema.shape.conductorTemperatures, undefined),
  };
  return valueAt(defaults, option.path);
}

/** The device families a pair kind is written with, upstream first ("relay/fuse"). */
const FAMILIES = ['relay', 'trip-unit', 'thermal-magnetic', 'fuse'] as const;

/** Every pair kind `coordination.margins` takes, upstream family first. */
export const PAIR_KINDS: readonly string[] = FAMILIES.flatMap((up) => FAMILIES.map((down) => `${up}/${down}`));

/**
 * The margin a new entry starts at: the one the checks apply now to that kind of pair (IEEE 242 ch. 15
 * and common practice, as `defaultMarginRule` gives it), so adding an entry changes nothing until it is edited.
 *
 * @example startingMargin('relay/relay') // 0.12
 */
export function startingMargin(kind: string): number {
  const [up, down] = kind.split('/');
  return defaultMarginRule(up, down).margin;
}

/**
 * The margin a new entry for one pair starts at: the one the checks apply now to that pair (the
 * device's own margin, the study's for its kind, or the default), so adding it changes nothing until
 * it is edited. 0.2 s for a device the study does not have yet.
 *
 * @example startingPairMargin(network, 'MAIN', 'FDR-MCC') // 0 (LV breakers: no overlap of the bands)
 */
export function startingPairMargin(network: Network, upstream: string, downstream: string): number {
  const up = network.devices.get(upstream);
  const down = network.devices.get(downstream);
  if (!up || !down) return 0.2;
  const settings = { ...network.study.coordination, pairs: [] };
  return marginRuleOf(up.characteristic.kind, down.characteristic.kind, settings, up.margin).margin;
}

/**
 * The pairs a margin for one pair may name, as `UP over DOWN` choices: each device with the device just
 * above it (the tree's series pairs), less those the study lists already (a pair is listed once).
 *
 * @example pairChoices(network, [{ upstream: 'MAIN', downstream: 'FDR-MCC' }]) // every other series pair
 */
export function pairChoices(
  network: Network,
  listed: readonly { upstream?: unknown; downstream?: unknown }[],
): { upstream: string; downstream: string }[] {
  const taken = new Set(listed.map((pair) => `${String(pair.upstream)}\n${String(pair.downstream)}`));
  const choices: { upstream: string; downstream: string }[] = [];
  for (const { upstream, downstream } of seriesPairs(network))
    if (!taken.has(`${upstream.id}\n${downstream.id}`))
      choices.push({ upstream: upstream.id, downstream: downstream.id });
  return choices;
}
