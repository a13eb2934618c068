import type { Analysis } from '../analysis.ts';
import { formatAmps, formatSeconds, formatVolts } from '../quantity/format.ts';
import type { Bus, Device, Study } from '../study/index.ts';
import { locationBusOf } from '../network/index.ts';
import { decayText, decrementTimesOf, onElement, separationText } from './decrementCoordination.ts';
import { checkPair, illustrativeSentence, isIllustrative, type PairCase } from './coordination.ts';
import { nameOf } from './context.ts';
import { inSeriesAlone } from './seriesException.ts';
import type { Finding } from './finding.ts';

/**
 * The NFPA 70 article that asks each kind of system for selective coordination, and whether it carries
 * the Exception for two devices in series with no load in parallel with the downstream one (`inSeriesAlone`:
 * 708.54's wording confirmed in a public reproduction of the code text, 700.32's and 701.32's from memory).
 */
export const SELECTIVITY_ARTICLE: Record<
  NonNullable<Device['system']>,
  { article: string; system: string; seriesException: boolean }
> = {
  emergency: { article: '700.32', system: 'emergency system', seriesException: true },
  'legally-required': { article: '701.32', system: 'legally required standby system', seriesException: true },
  'critical-operations': { article: '708.54', system: 'critical operations power system', seriesException: true },
  elevator: { article: '620.62', system: 'elevator feeders and branch circuits', seriesException: false },
};

/** The edition of NFPA 70 whose 700.32(A) adds the load-side devices to the supply-side ones. */
const LOAD_SIDE_EDITION = '2023';

/** Time below which the "above-0.1-s" option accepts two devices operating together (as some authorities do). */
export const AHJ_SELECTIVITY_SECONDS = 0.1;

/** What one scenario contributes: its label and its analysed trees. */
export interface ScenarioPairs {
  label: string;
  parts: Analysis[];
}

/**
 * The selective-coordination requirement of NFPA 70 for the devices the study marks as part of an
 * emergency (700.32), legally required standby (701.32) or critical operations (708.54) system, or
 * elevator circuits (620.62): each marked device with every supply-side device, in every scenario,
 * over the full range of available fault currents. A chain of selective pairs is selective, so the
 * marked device's pair and each pair above it up to the source are checked, every fault case, at
 * the currents a fault in the marked device's zone drives through them (up to the largest fault at
 * its bus, referred to each pair's voltage); a pair the article's Exception leaves out is named, and the
 * device above it paired with the devices below instead (`withException`). In the 2023 edition an
 * emergency device is also read against the devices on its load side (700.32(A), `loadSidePairs`). An
 * interval classed "overlap" or "not provable from curves" is not shown selective (a selectivity
 * table from the manufacturers may show it is, but the curves cannot). With the study option
 * `codeSelectivity: "above-0.1-s"` an interval is accepted where the downstream device clears within
 * 0.1 s at its lowest current, as some authorities having jurisdiction accept; the authority having
 * jurisdiction decides which reading applies. `labelled` lists the scenarios checked on each finding.
 * On a tree fed by a generator the chain is also read on the decaying current of a fault at the marked
 * device's bus (`decayProblems`): each device element by element, where an upstream inverse-time element
 * can gain while a downstream definite-time element resets, so a pair selective at every constant current
 * can still fail there.
 *
 * @example codeSelectivityFindings(study, [{ label: 'Normal', parts: [analysis] }])
 */
export function codeSelectivityFindings(
  study: Study,
  scenarios: ScenarioPairs[],
  { labelled = true }: { labelled?: boolean } = {},
): Finding[] {
  const option = study.coordination.codeSelectivity;
  const findings: Finding[] = [];
  const decayTimes: DecayTimes = new Map();
  // The emergency devices, whose own findings read their load sides (2023).
  const emergency = new Set(study.devices.filter((device) => device.system === 'emergency').map((d) => d.id));
  for (const device of study.devices) {
    if (!device.system) continue;
    const { article, system, seriesException } = SELECTIVITY_ARTICLE[device.system];
    // NFPA 70 (2023) 700.32(A) asks an emergency system's devices to be selective with their load-side
    // devices too.
    const loadSide = article === '700.32' && study.coordination.edition === LOAD_SIDE_EDITION;
    const problems: string[] = [];
    // The pairs the article's Exception leaves out (two devices in series, no load in parallel), by name.
    const exempt = new Set<string>();
    // Whether any pair was checked in place of one the Exception leaves out.
    let replaced = false;
    const checked: string[] = [];
    const failing: string[] = [];
    // The devices whose illustrative curves the verdict would rest on.
    const illustrative = new Set<string>();
    let referenceVolts = 0;
    for (const scenario of scenarios)
      for (const part of scenario.parts) {
        if (!part.network.devices.has(device.id)) continue;
        // The pair with the device just above, and every device above that in series (the supply side),
        // the pairs the article's Exception leaves out replaced by the pairs they stand for (`withException`).
        const supplySide = upstreamChain(part, device.id);
        if (supplySide.length > 0) checked.push(scenario.label);
        const kept = seriesException
          ? withException(part, supplySide, exempt, chainLowerOf(part, supplySide))
          : { pairs: supplySide, replaced: false };
        const chain = kept.pairs;
        replaced ||= kept.replaced;
        for (const id of [device.id, ...chain.map((pair) => pair.upstream)]) {
          const each = part.network.devices.get(id)!;
          if (isIllustrative(each)) illustrative.add(nameOf(each));
        }
        const here = locationBusOf(part.network, device);
        const largest = part.faults.buses.get(here.id)?.max.largest ?? Infinity;
        // The pairs found wanting at constant currents, which the decaying current need not name again.
        const wanting = new Set<string>();
        for (const pair of chain)
          for (const fault of pair.cases) {
            referenceVolts = fault.referenceVolts;
            // Only the currents a fault in the marked device's zone drives through the pair.
            const limit = (largest * here.voltage) / fault.referenceVolts;
            for (const interval of fault.intervals) {
              if (interval.status === 'selective' || interval.status === 'thin margin') continue;
              if (interval.fromAmps > limit * (1 + 1e-9)) continue;
              // The marked device's clearing time at the lowest current of the interval, that current
              // taken at the marked device's own voltage (the pair may sit across a transformer).
              const atDevice = (interval.fromAmps * fault.referenceVolts) / here.voltage;
              const lowest = part.bands.get(device.id)?.maxTime(atDevice) ?? Infinity;
              if (option === 'above-0.1-s' && lowest <= AHJ_SELECTIVITY_SECONDS) continue;
              failing.push(scenario.label);
              wanting.add(pair.upstream);
              const below = pair.downstream === device.id ? '' : ` (on the supply side of ${nameOf(device)})`;
              problems.push(
                `${scenario.label}: ${notShownText(pair.upstreamName, `${pair.downstreamName}${below}`, interval, Math.min(interval.toAmps, limit), fault)}`,
              );
            }
          }
        if (loadSide) {
          const loadLinks = loadSidePairs(part, device.id, emergency);
          const keptBelow = seriesException
            ? withException(part, loadLinks, exempt, treeLowerOf(part))
            : { pairs: loadLinks, replaced: false };
          const below = keptBelow.pairs;
          replaced ||= keptBelow.replaced;
          if (below.length > 0 && supplySide.length === 0) checked.push(scenario.label);
          for (const pair of below) {
            const lower = part.network.devices.get(pair.downstream)!;
            if (isIllustrative(lower)) illustrative.add(nameOf(lower));
            const side = `(${pair.downstreamName} on the load side of ${nameOf(device)})`;
            let shown = false;
            for (const fault of pair.cases)
              for (const interval of fault.intervals) {
                if (interval.status === 'selective' || interval.status === 'thin margin') continue;
                // The load-side device is the one to clear: with "above-0.1-s", accepted where it clears
                // within 0.1 s (its intervals are on its own voltage).
                const clears = part.bands.get(pair.downstream)?.maxTime(interval.fromAmps) ?? Infinity;
                if (option === 'above-0.1-s' && clears <= AHJ_SELECTIVITY_SECONDS) continue;
                failing.push(scenario.label);
                shown = true;
                referenceVolts ||= fault.referenceVolts;
                problems.push(
                  `${scenario.label}: ${notShownText(pair.upstreamName, `${pair.downstreamName} ${side}`, interval, interval.toAmps, fault)}`,
                );
              }
            if (shown) continue;
            // On a generator, the pair on the decaying current of a fault at the load-side device's bus too.
            const at = locationBusOf(part.network, lower);
            const decaying = decayProblems(part, lower, [pair], at, option === 'above-0.1-s', decayTimes);
            if (decaying.length > 0) failing.push(scenario.label);
            problems.push(
              ...decaying.map((problem) => `${scenario.label}: on the load side of ${nameOf(device)}, ${problem}`),
            );
          }
        }
        const unproven = chain.filter((pair) => !wanting.has(pair.upstream));
        const decaying = decayProblems(part, device, unproven, here, option === 'above-0.1-s', decayTimes);
        if (decaying.length > 0) failing.push(scenario.label);
        problems.push(...decaying.map((problem) => `${scenario.label}: ${problem}`));
      }
    if (checked.length === 0) continue;
    const scope =
      option === 'above-0.1-s'
        ? 'for faults lasting longer than 0.1 s (the study option "above-0.1-s")'
        : 'over the full range of available fault currents';
    const sides = loadSide ? 'supply-side and load-side' : 'supply-side';
    const exception =
      exempt.size > 0
        ? ` Not asked of ${[...exempt].join(', ')}: the Exception to ${article} (two devices in series with no load connected in parallel with the downstream device: as modelled, each downstream device named is the main of the bus that its upstream device's transformer or cable alone supplies)${replaced ? ', the two standing as one with the devices above and below them' : ''}. Confirm that no load is tapped between them.${article === '708.54' ? '' : ` The Exception's wording for ${article} is recalled here, not quoted: check it against the edition you work to.`}`
        : '';
    const authority =
      'The authority having jurisdiction decides what selective coordination means where the work is done; some accept it above 0.1 s only.';
    findings.push({
      id: `code-selectivity:${device.id}`,
      kind: 'code-selectivity',
      // Shown on illustrative curves only, the requirement is not shown met: a warning, not an ok.
      severity: problems.length > 0 ? 'fail' : illustrative.size > 0 ? 'warning' : 'ok',
      title: `${nameOf(device)}: NFPA 70 ${article} selective coordination (${system})`,
      subjects: [device.id],
      explanation:
        problems.length > 0
          ? `${nameOf(device)} is part of the ${system}, whose overcurrent devices must be selectively coordinated with every ${sides} device ${scope}, in every scenario. Not shown: ${problems.join('; ')}.${exception} ${authority}`
          : `${nameOf(device)} is part of the ${system}; ${illustrative.size > 0 ? 'on its curves ' : ''}it is selective with every ${sides} device ${scope} in every scenario checked (${[...new Set(checked)].join(', ')}).${illustrative.size > 0 ? ` ${illustrativeSentence([...illustrative])}` : ''}${exception} ${authority}`,
      suggestion:
        problems.length > 0
          ? "Separate the overlapping devices (raise or delay the upstream device, lower the downstream instantaneous), or show selectivity from the manufacturers' tested selectivity tables."
          : undefined,
      basis: `NFPA 70 (${study.coordination.edition}) ${article}`,
      referenceVolts,
      // Where it holds: the scenarios that fail it, or every scenario checked.
      ...(labelled ? { scenarios: [...new Set(failing.length > 0 ? failing : checked)] } : {}),
    });
  }
  return findings;
}

/**
 * On a generator's tree, where the chain's pairs meet on the decaying current of a bolted three-phase fault at
 * the marked device's bus (`decrementTimesOf`, each element of a device on its own): an upstream device that
 * can operate before the downstream one clears. Its inverse-time element may gain there while the downstream
 * device's definite-time element resets, which the constant currents do not show. With `aboveTenthSecond`, a
 * pair is accepted where the marked device clears within 0.1 s on that current. None on a single-phase bus,
 * whose decrement is not worked out. `chain` holds the pairs still to be shown (those found wanting at
 * constant currents are named already).
 */
function decayProblems(
  part: Analysis,
  device: Device,
  chain: Chain,
  here: Bus,
  aboveTenthSecond: boolean,
  decayTimes: DecayTimes,
): string[] {
  const source = part.study.source;
  if (source.kind !== 'generator' || part.faults.buses.get(here.id)?.phases !== 3 || chain.length === 0) return [];
  const problems: string[] = [];
  let markedClears: number | undefined;
  // A panel's marked devices share the pairs above it: each pair is read once per bus.
  const timesOf = (pair: { upstream: string; downstream: string }) => {
    let byPair = decayTimes.get(part);
    if (!byPair) decayTimes.set(part, (byPair = new Map()));
    const key = `${here.id}|${pair.upstream}|${pair.downstream}`;
    let times = byPair.get(key);
    if (!times) byPair.set(key, (times = decrementTimesOf(part, source, pair, here.id)));
    return times;
  };
  for (const pair of chain) {
    const { clears, opens, current, sustainedAmps, upperSustainedAmps, clearsBy, opensBy } = timesOf(pair);
    const { rule } = pair;
    // An upstream device that never operates, or only once the pair's rule is met, is selective (the
    // overlap finder's reading: `opens · timeRatio ≥ clears + margin`).
    if (opens === Infinity || opens * rule.timeRatio >= clears + rule.margin) continue;
    if (aboveTenthSecond) {
      markedClears ??= timesOf({ upstream: pair.upstream, downstream: device.id }).clears;
      if (markedClears <= AHJ_SELECTIVITY_SECONDS) continue;
    }
    const below = pair.downstream === device.id ? '' : ` (on the supply side of ${nameOf(device)})`;
    const times = Number.isFinite(clears)
      ? `${pair.downstreamName}${below} clears by ${formatSeconds(clears)}${onElement(clearsBy)} and ${pair.upstreamName} can operate from ${formatSeconds(opens)}${onElement(opensBy)}: ${separationText(clears, opens, rule, pair.downstreamName, pair.upstreamName)}`
      : `${pair.downstreamName}${below} never clears and ${pair.upstreamName} can operate from ${formatSeconds(opens)}${onElement(opensBy)}`;
    problems.push(
      `on the generator's decaying current (a fault at ${here.name ?? here.id} (${formatVolts(here.voltage)}), ${decayText(current(0), sustainedAmps, upperSustainedAmps)}), ${times}`,
    );
  }
  return problems;
}

/** Pairs with their two devices' names, as findings write them. */
type Chain = (Analysis['pairs'][number] & { upstreamName: string; downstreamName: string })[];

/**
 * The pairs a selectivity requirement asks for along `links` (pairs of a device and the device just above
 * it), with the Exception for two devices in series with no load in parallel with the downstream one
 * (`inSeriesAlone`): such a link is not asked for (its name goes to `exempt`), but the two devices serve
 * the same loads and stand as one. So for each link kept, every device joined to its upstream device from
 * above by such links is paired with its downstream device and with every device joined to that one from
 * below (`lowerOf`: on the supply side, down the marked device's path to it; on the load side, down the
 * tree) — a transformer's primary relay with the feeders under its one secondary main, a service main with
 * a marked panel main its feeder alone supplies. Leaving the link out alone would break the chain by which
 * selective pairs make a selective path. `replaced` says whether any pair was made so.
 */
function withException(
  part: Analysis,
  links: Chain,
  exempt: Set<string>,
  lowerOf: (deviceId: string) => readonly string[],
): { pairs: Chain; replaced: boolean } {
  const pairAbove = pairsAboveOf(part);
  const alone = (upstream: string, downstream: string) => inSeriesAlone(part.network, upstream, downstream);
  const pairs: Chain = [];
  let replaced = false;
  for (const link of links) {
    if (alone(link.upstream, link.downstream)) {
      exempt.add(`${link.upstreamName} over ${link.downstreamName}`);
      continue;
    }
    const uppers = [link.upstream];
    for (
      let upper = pairAbove.get(link.upstream)?.upstream;
      upper !== undefined && alone(upper, uppers.at(-1)!);
      upper = pairAbove.get(upper)?.upstream
    )
      uppers.push(upper);
    for (const upper of uppers)
      for (const lower of lowerOf(link.downstream)) {
        const same = upper === link.upstream && lower === link.downstream;
        if (!same) replaced = true;
        pairs.push(same ? link : pairBetween(part, upper, lower));
      }
  }
  return { pairs, replaced };
}

/**
 * On a supply-side chain (nearest first, from the marked device up), each device's group below it: itself
 * and the devices joined to it from below by links the Exception leaves out, down to the marked device.
 */
function chainLowerOf(part: Analysis, chain: Chain): (deviceId: string) => readonly string[] {
  const groups = new Map<string, string[]>();
  let group = chain.length > 0 ? [chain[0].downstream] : [];
  for (const link of chain) {
    groups.set(link.downstream, group);
    group = inSeriesAlone(part.network, link.upstream, link.downstream) ? [link.upstream, ...group] : [link.upstream];
  }
  return (deviceId) => groups.get(deviceId) ?? [deviceId];
}

/**
 * On the load side, a device's group below it: itself and the device (at most one) each joins from below
 * by a link the Exception leaves out (the main of the bus its transformer or cable alone supplies).
 */
function treeLowerOf(part: Analysis): (deviceId: string) => readonly string[] {
  const belowOf = belowsOf(part);
  return (deviceId) => {
    const group = [deviceId];
    for (let found = true; found;) {
      found = false;
      for (const pair of belowOf.get(group.at(-1)!) ?? [])
        if (inSeriesAlone(part.network, pair.upstream, pair.downstream)) {
          group.push(pair.downstream);
          found = true;
          break;
        }
    }
    return group;
  };
}

/**
 * `build` of a tree, worked out once per analysed tree and kept while the tree is: a study marks thousands
 * of devices, and each would otherwise build the same maps again.
 */
function perTree<T>(build: (part: Analysis) => T): (part: Analysis) => T {
  const kept = new WeakMap<Analysis, T>();
  return (part) => {
    let value = kept.get(part);
    if (value === undefined) kept.set(part, (value = build(part)));
    return value;
  };
}

/** Each device's pairs with the devices just below it, by its id. */
const belowsOf = perTree((part) => {
  const belowOf = new Map<string, Analysis['pairs']>();
  for (const pair of part.pairs) {
    const list = belowOf.get(pair.upstream);
    if (list) list.push(pair);
    else belowOf.set(pair.upstream, [pair]);
  }
  return belowOf;
});

/** Each device's pair with the device just above it, by its id. */
export const pairsAboveOf = perTree((part) => new Map(part.pairs.map((pair) => [pair.downstream, pair])));

/** The pairs already checked in a tree between devices that are not neighbours, by upstream and downstream id. */
const betweensOf = perTree(() => new Map<string, Chain[number]>());

/** Two devices in series that are not neighbours, checked as a pair is (`checkPair`), with their names; once per tree. */
function pairBetween(part: Analysis, upstreamId: string, downstreamId: string): Chain[number] {
  const byKey = betweensOf(part);
  const key = `${upstreamId}\n${downstreamId}`;
  let pair = byKey.get(key);
  if (!pair) {
    const upstream = part.network.devices.get(upstreamId)!;
    const downstream = part.network.devices.get(downstreamId)!;
    byKey.set(key, (pair = named(part, checkPair(part, { upstream, downstream }, part.study.coordination).check)));
  }
  return pair;
}

/** A pair with its two devices' names, as findings write them. */
function named(part: Analysis, pair: Analysis['pairs'][number]): Chain[number] {
  const upstreamName = nameOf(part.network.devices.get(pair.upstream)!);
  const downstreamName = nameOf(part.network.devices.get(pair.downstream)!);
  // `Object.assign`, not a spread followed by new fields (which gives each object a hidden class of its own in V8).
  return Object.assign({}, pair, { upstreamName, downstreamName });
}

/**
 * An interval not shown selective, in words: "UP and DOWN overlap from … to `toAmps` at … (three-phase
 * fault)"; `down` is the downstream device's name with whatever says where it stands.
 */
export function notShownText(
  up: string,
  down: string,
  interval: PairCase['intervals'][number],
  toAmps: number,
  fault: PairCase,
): string {
  const status = interval.status === 'overlap' ? 'overlap' : 'are not shown selective by their curves';
  return `${up} and ${down} ${status} from ${formatAmps(interval.fromAmps, 3)} to ${formatAmps(toAmps, 3)} at ${formatVolts(fault.referenceVolts)} (${fault.fault} fault)`;
}

/**
 * The pairs on the load side of an emergency device: each device below it with the device just above it,
 * down to the emergency devices below, whose own findings read their pairs above and below (a device of
 * another system marked below is passed through: its finding reads only its supply side).
 */
function loadSidePairs(part: Analysis, deviceId: string, emergency: ReadonlySet<string>): Chain {
  const pairs: Chain = [];
  const below = belowsOf(part);
  const pending = [deviceId];
  while (pending.length > 0) {
    for (const pair of below.get(pending.pop()!) ?? []) {
      if (emergency.has(pair.downstream)) continue;
      pairs.push(named(part, pair));
      pending.push(pair.downstream);
    }
  }
  return pairs;
}

/** Pairs already read on a decaying current, by tree, then by bus and pair. */
type DecayTimes = Map<Analysis, Map<string, ReturnType<typeof decrementTimesOf>>>;

// Accepts an analysed tree and a device; its pairs with each device above it, nearest first.
function upstreamChain(part: Analysis, deviceId: string): Chain {
  const pairs: Chain = [];
  const pairAbove = pairsAboveOf(part);
  for (let pair = pairAbove.get(deviceId); pair; pair = pairAbove.get(pair.upstream)) pairs.push(named(part, pair));
  return pairs;
}
