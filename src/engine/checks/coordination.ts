import { scaleBand, type Band } from '../band.ts';
import { cachedFastestOf, cachedGroundBandOf } from '../bandCache.ts';
import { isPhaseShifting, primaryConnectionOf, secondaryWindingOf, throughFaultOf } from '../fault/index.ts';
import { locationBusOf, transformersBetween } from '../network/index.ts';
import { findOverlaps, type OverlapInterval, type OverlapOptions, type WorstPoint } from '../overlap.ts';
import { rememberedOverlaps } from '../overlapMemo.ts';
import { hiddenSlot } from '../hiddenSlot.ts';
import { sharedBuilders, withLazyText } from '../lazyText.ts';
import { formatAmps, formatSeconds, significant } from '../quantity/format.ts';
import type { CoordinationSettings, Device, Transformer } from '../study/index.ts';
import { capitalise, describeRange, nameOf, rangeOf, type CheckContext } from './context.ts';
import type { CurrentRange, Finding, Severity } from './finding.ts';
import { marginRuleOf, type MarginRule } from './margins.ts';

/**
 * Which fault a pair case models: on a three-phase bus the three-phase, line-to-line (across a Δ–Y or
 * Y–Δ transformer) and ground faults; on a single-phase bus the full-winding fault and the
 * line-to-neutral (half-winding) fault of a centre-tapped secondary.
 */
export type PairFault =
  'three-phase' | 'line-to-line' | 'ground-fault' | 'line-to-ground' | 'single-phase' | 'line-to-neutral';

/** One fault case of a pair, on the downstream device's voltage base. */
export interface PairCase {
  fault: PairFault;
  /** Voltage base of the intervals: the downstream device's own voltage. */
  referenceVolts: number;
  /** Upstream current per downstream current on the sheet for this fault (2/√3 for a secondary L-L fault across Δ–Y). */
  upstreamShift: number;
  intervals: OverlapInterval[];
}

/** The full result of checking one series pair. */
export interface PairCheck {
  upstream: string;
  downstream: string;
  kind: string;
  rule: MarginRule;
  cases: PairCase[];
}

const SEVERITY: Record<OverlapInterval['status'], Severity> = {
  selective: 'ok',
  'thin margin': 'warning',
  overlap: 'fail',
  'not provable from curves': 'warning',
};

/**
 * Checks one upstream/downstream pair over the current range it can see (DEVELOPERS.md, bands and overlaps): from the lowest
 * current either device can operate up to the largest current that flows through both for a fault just
 * below the downstream device (`throughFaultOf`: the source side plus the motors whose contribution
 * passes through both), on the downstream device's voltage base.
 *
 * - Three-phase bus: the three-phase case; across an odd number of Δ–Y / Y–Δ transformers the secondary
 *   line-to-line case too, in which a primary line carries 1.0 pu while the secondary lines carry √3/2,
 *   so the upstream device sees exactly 2/√3 times the downstream per-unit current (symmetrical
 *   components; the IEEE C37.91 / C57.109 shift factor); an even number of 30° shifts cancels. Where the
 *   upstream device has a ground-fault element and no transformer lies between them, the ground-fault
 *   case up to the line-to-ground current through both (zero-sequence network); elsewhere, with no
 *   Δ–Y unit between them, the ground-fault case from the three-phase current up to the line-to-ground
 *   one where that is larger (the phase elements carry it).
 * - Single-phase bus: the full-winding fault, the upstream device across a single-phase transformer
 *   connected line to neutral seeing √3 times (its winding is at V_LL/√3); and on a centre-tapped
 *   secondary the line-to-neutral fault, of which a device above the transformer sees half (half the turns).
 *
 * @example checkPair(context, { upstream: main, downstream: feeder }, study.coordination)
 */
export function checkPair(
  context: CheckContext,
  pair: { upstream: Device; downstream: Device },
  settings: CoordinationSettings,
): { check: PairCheck; findings: Finding[] } {
  const { network, faults, bands } = context;
  const { upstream, downstream } = pair;
  const upBus = locationBusOf(network, upstream);
  const downBus = locationBusOf(network, downstream);
  const referenceVolts = downBus.voltage;
  const rule = marginRuleOf(upstream.characteristic.kind, downstream.characteristic.kind, settings, upstream.margin, {
    upstream: upstream.id,
    downstream: downstream.id,
  });
  const kind = `${upstream.characteristic.kind}/${downstream.characteristic.kind}`;
  const upBand = scaleBand(bands.get(upstream.id)!, upBus.voltage / referenceVolts);
  const downBand = bands.get(downstream.id)!;
  const busFault = faults.buses.get(downBus.id)!;
  const through = throughFaultOf(network, faults, upstream, downBus.id);

  const between = transformersBetween(network, upBus.id, downBus.id);
  // Written out, not spread from a shared object: V8 gives each object made by `{ ...base, toAmps }` a
  // hidden class of its own, which made every read of the options in the finder a slow generic one.
  // (`fromAmps` undefined: the finder's default, the lowest current either device operates at.)
  const optionsBetween = (fromAmps: number | undefined, toAmps: number): OverlapOptions => ({
    fromAmps,
    margin: rule.margin,
    timeRatio: rule.timeRatio,
    thinMargin: settings.thinMargin,
    halfCycle: settings.halfCycle,
    horizon: settings.horizon,
    toAmps,
  });
  const optionsUpTo = (toAmps: number) => optionsBetween(undefined, toAmps);
  const caseOf = (fault: PairFault, upstreamShift: number, toAmps: number): PairCase => ({
    fault,
    referenceVolts,
    upstreamShift,
    intervals: overlapsIn(
      context,
      upstreamShift === 1 ? upBand : scaleBand(upBand, 1 / upstreamShift),
      downBand,
      optionsUpTo(toAmps),
    ),
  });
  const cases: PairCase[] = [];
  if (busFault.phases === 1) {
    const singles = between.filter((t) => t.phases === 1);
    const fullShift = singlePhaseShift(context, between);
    cases.push(caseOf('single-phase', fullShift, through.threePhase));
    const centreTapped = singles.some((t) => secondaryWindingOf(t) === 'centre-tapped');
    if (through.lineToGround > 0 && busFault.system.includes('centre-tapped'))
      cases.push(caseOf('line-to-neutral', fullShift * (centreTapped ? 0.5 : 1), through.lineToGround));
  } else {
    cases.push(caseOf('three-phase', 1, through.threePhase));
    // Each Δ–Y or Y–Δ unit shifts the sequence currents by 30°: an odd count loads one primary line fully.
    const shifts = between.filter((t) => t.phases === 3 && isPhaseShifting(t.connection)).length;
    if (shifts % 2 === 1) cases.push(caseOf('line-to-line', 2 / Math.sqrt(3), through.lineToLine));
    // A ground-fault element above sees ground current the devices below clear with their phase
    // elements (or their own ground element); it does not cross a transformer.
    const upGround = cachedGroundBandOf(upstream.characteristic);
    // The downstream device on a ground fault: its own ground element too, if it has one (read only
    // for the pairs that have a ground-fault case, not for every pair).
    const downOnGround = () => {
      const downGround = cachedGroundBandOf(downstream.characteristic);
      return downGround ? cachedFastestOf(downBand, downGround) : downBand;
    };
    if (upGround && between.length === 0 && through.lineToGround > 0) {
      const up = cachedFastestOf(bands.get(upstream.id)!, upGround);
      cases.push({
        fault: 'ground-fault',
        referenceVolts,
        upstreamShift: 1,
        intervals: overlapsIn(context, up, downOnGround(), optionsUpTo(through.lineToGround)),
      });
    } else if (shifts === 0 && through.lineToGround > through.threePhase) {
      // The faulted line carries the whole line-to-ground current, and so does every phase element on
      // the way up where no Δ–Y unit splits it (a Yg–Yg unit passes it on; symmetrical components):
      // where it exceeds the three-phase current (a solidly grounded wye close to its transformer),
      // the pair is checked from the one up to the other too. The upstream ground element, if any,
      // counted as seeing it (the cautious side where a wye-wye unit lies between): a ground-fault case;
      // else a line-to-ground case of the phase elements.
      const phaseUp = upGround ? cachedFastestOf(bands.get(upstream.id)!, upGround) : bands.get(upstream.id)!;
      const up = upBus.voltage === referenceVolts ? phaseUp : scaleBand(phaseUp, upBus.voltage / referenceVolts);
      cases.push({
        fault: upGround ? 'ground-fault' : 'line-to-ground',
        referenceVolts,
        upstreamShift: 1,
        intervals: overlapsIn(context, up, downOnGround(), optionsBetween(through.threePhase, through.lineToGround)),
      });
    }
  }

  // The cases as an exact-size copy (an array grown by `push` keeps room for 17 items; a study keeps thousands).
  const check: PairCheck = { upstream: upstream.id, downstream: downstream.id, kind, rule, cases: cases.slice() };
  return { check, findings: findingsOf(check, upstream, downstream, [upBus.voltage, referenceVolts]) };
}

/** The finder's answer, given once per question where the context keeps them (`CheckContext.overlaps`). */
function overlapsIn(context: CheckContext, up: Band, down: Band, options: OverlapOptions): OverlapInterval[] {
  return context.overlaps ? rememberedOverlaps(context.overlaps, up, down, options) : findOverlaps(up, down, options);
}

/** How a finding's title names its fault case. */
const FAULT_TEXT: Record<PairCase['fault'], string> = {
  'three-phase': '',
  'line-to-line': ' for a secondary line-to-line fault',
  'ground-fault': ' for a ground fault',
  'line-to-ground': ' for a line-to-ground fault',
  'single-phase': '',
  'line-to-neutral': ' for a line-to-neutral fault',
};

/** One finding per interval that is not selective, or one "selective" finding for a clean pair. */
function findingsOf(check: PairCheck, upstream: Device, downstream: Device, voltages: number[]): Finding[] {
  const findings: Finding[] = [];
  const up = nameOf(upstream);
  const down = nameOf(downstream);
  // One list of subjects for the pair's findings (findings are read-only data), by which their range,
  // worst point and sentences find the pair.
  const subjects = [check.upstream, check.downstream];
  const illustrative = [upstream, downstream].filter(isIllustrative).map(nameOf);
  pairOfSubjects.set(subjects, {
    check,
    up,
    down,
    voltages,
    illustrative: illustrative.length > 0 ? illustrative : NONE,
  });
  for (const pairCase of check.cases) {
    const faultText = FAULT_TEXT[pairCase.fault];
    for (let index = 0; index < pairCase.intervals.length; index++) {
      const interval = pairCase.intervals[index];
      if (interval.status === 'selective' || isSliver(interval)) continue;
      // The range, the worst point and the sentences are made when first read, from the pair's check
      // (a large study's findings are seldom all read, and a range at each voltage was half of what a
      // finding kept); they come in their place in the key order, so every finding has the same shape.
      // The id and title are joined into flat strings: a template literal keeps one object per piece.
      const finding = withLazyText<Finding>(
        {
          id: ['coordination:', check.upstream, '/', check.downstream, ':', pairCase.fault, ':', index].join(''),
          kind: 'coordination',
          severity: SEVERITY[interval.status],
          status: interval.status,
          title: [up, ' over ', down, ': ', interval.status, faultText].join(''),
          subjects,
        },
        INTERVAL_FIELDS,
        { basis: check.rule.basis, referenceVolts: pairCase.referenceVolts },
      );
      findings.push(finding);
    }
  }
  // The range told is the first case's that has one: a three-phase fault may stay below both pickups where
  // the ground-fault elements still see a ground fault.
  const first = check.cases.find((c) => c.intervals.length > 0);
  if (findings.length === 0 && first) {
    const finding = withLazyText<Finding>(
      {
        id: ['coordination:', check.upstream, '/', check.downstream].join(''),
        kind: 'coordination',
        // A selective pair on an illustrative curve is told, not claimed (a curve of invented data says
        // nothing of a product): an info, not an ok.
        severity: illustrative.length > 0 ? 'info' : 'ok',
        status: 'selective',
        title: [up, ' over ', down, ': selective', illustrative.length > 0 ? ' on illustrative curves' : ''].join(''),
        subjects,
      },
      SELECTIVE_FIELDS,
      { basis: check.rule.basis, referenceVolts: first.referenceVolts },
    );
    findings.push(finding);
  }
  return findings;
}

/** What a finding's sentences read of its interval: the status, the worst point and where it ends. */
type IntervalFacts = Pick<OverlapInterval, 'status' | 'worst' | 'toAmps'>;

/** What a pair's findings read of it: the check, the two devices' names and their voltages (upstream first). */
interface PairSentenceFacts {
  check: PairCheck;
  up: string;
  down: string;
  voltages: number[];
  /** The names of the pair's devices whose curves are illustrative (invented data). */
  illustrative: readonly string[];
}

const NONE: readonly string[] = [];

/** Whether a device's curve is marked illustrative: invented data, on which no selectivity claim may rest. */
export function isIllustrative(device: Device): boolean {
  const { characteristic } = device;
  return (characteristic.kind === 'fuse' || characteristic.kind === 'thermal-magnetic') && characteristic.illustrative;
}

/**
 * Each pair's facts, by the subjects list its findings share: the sentence builders are module
 * functions shared by every coordination finding, and read the pair from here when first asked (a
 * closure or two per fault case, with what they held, was a tenth of what a large study's analysis
 * keeps). Kept as long as the findings are.
 */
const pairOfSubjects = hiddenSlot<PairSentenceFacts>();

/**
 * The fault case and interval a finding that is not selective is about, as its id names them
 * (`coordination:UP/DOWN:fault:index`; ids hold no colon).
 */
function caseOfFinding(finding: Finding): { pairCase: PairCase; interval: OverlapInterval } {
  const { check } = pairOfSubjects.get(finding.subjects)!;
  const [, , fault, index] = finding.id.split(':');
  const pairCase = check.cases.find((c) => c.fault === fault)!;
  return { pairCase, interval: pairCase.intervals[Number(index)] };
}

/** The interval's currents at the sheet's voltage and at each device's own (the upstream one's shifted for its case). */
function rangeOfFinding(finding: Finding): CurrentRange {
  const { voltages } = pairOfSubjects.get(finding.subjects)!;
  const { pairCase, interval } = caseOfFinding(finding);
  // The upstream device's shift, where it has one: most cases have none, and need no map.
  const shifts = pairCase.upstreamShift === 1 ? undefined : new Map([[voltages[0], pairCase.upstreamShift]]);
  return rangeOf(interval.fromAmps, interval.toAmps, pairCase.referenceVolts, voltages, shifts);
}

function worstOfFinding(finding: Finding): WorstPoint {
  return caseOfFinding(finding).interval.worst;
}

/** The explanation of a finding on an interval that is not selective. */
function explanationOf(finding: Finding): string {
  const { check, up, down } = pairOfSubjects.get(finding.subjects)!;
  const { pairCase, interval } = caseOfFinding(finding);
  return explain(interval, up, down, describeRange(finding.range!), check.rule, FAULT_TEXT[pairCase.fault]);
}

/** The suggestion of a finding on an interval that is not selective. */
function suggestionOf(finding: Finding): string {
  const { check, up, down } = pairOfSubjects.get(finding.subjects)!;
  const { pairCase, interval } = caseOfFinding(finding);
  return pairCase.fault === 'ground-fault'
    ? suggestGround(interval, up, down)
    : suggest(interval, up, down, check.rule, check.kind);
}

/** A selective pair's range: the first case that has intervals, from its first to its last. */
function selectiveRangeOf(finding: Finding): CurrentRange {
  const { check, voltages } = pairOfSubjects.get(finding.subjects)!;
  const first = check.cases.find((c) => c.intervals.length > 0)!;
  const { intervals } = first;
  return rangeOf(intervals[0].fromAmps, intervals[intervals.length - 1].toAmps, first.referenceVolts, voltages);
}

/** A selective pair's least separation over every case. */
function leastWorstOf(finding: Finding): WorstPoint {
  const { check } = pairOfSubjects.get(finding.subjects)!;
  const all = check.cases.flatMap((c) => c.intervals);
  return all.reduce((a, b) => (b.worst.ratio < a.worst.ratio ? b : a)).worst;
}

/** The explanation of a selective pair's one finding: the least separation, at its worst point. */
function selectiveExplanationOf(finding: Finding): string {
  const { check, up, down, illustrative } = pairOfSubjects.get(finding.subjects)!;
  const { marginSeconds, amps } = finding.worst!;
  const waits = `${capitalise(describeRange(finding.range!))} ${up} always waits for ${down}: the least separation is ${marginText(marginSeconds)} beyond the required ${check.rule.margin} s, at ${formatAmps(amps, 3)}.`;
  return illustrative.length === 0 ? waits : `${waits} ${illustrativeSentence(illustrative)}`;
}

/** Why a result on illustrative curves is no claim, naming the devices. */
export function illustrativeSentence(names: readonly string[]): string {
  return `The curve${names.length > 1 ? 's' : ''} of ${names.join(' and ')} ${names.length > 1 ? 'are' : 'is'} illustrative (invented data, not a product), so this is no claim of selectivity: digitise the manufacturer's published curves to make one.`;
}

/** What every coordination finding makes when first read, shared by them all (`sharedBuilders`). */
const INTERVAL_FIELDS = sharedBuilders({
  range: rangeOfFinding,
  worst: worstOfFinding,
  explanation: explanationOf,
  suggestion: suggestionOf,
});
const SELECTIVE_FIELDS = sharedBuilders({
  range: selectiveRangeOf,
  worst: leastWorstOf,
  explanation: selectiveExplanationOf,
});

/**
 * A thin-margin interval narrower than 1 % in current is the crossing of a steep curve through the
 * thin band on its way into or out of an overlap; it is reported with that overlap, not on its own.
 */
function isSliver(interval: OverlapInterval): boolean {
  return interval.status === 'thin margin' && interval.toAmps < interval.fromAmps * 1.01;
}

function explain(
  interval: IntervalFacts,
  up: string,
  down: string,
  where: string,
  rule: MarginRule,
  faultText: string,
): string {
  const { worst } = interval;
  const at = `At ${formatAmps(worst.amps, 3)}`;
  switch (interval.status) {
    case 'overlap':
      if (worst.downTime === Infinity) {
        return `${capitalise(where)}${faultText} ${up} may operate (from ${formatSeconds(worst.upTime)}) on a current that ${down} carries indefinitely: ${up} picks up below ${down}.`;
      }
      return `${capitalise(where)}${faultText} ${up} may open before ${down} has cleared. ${at} ${up} may operate in ${formatSeconds(worst.upTime)}; ${down} may take up to ${formatSeconds(worst.downTime)} to clear${rule.margin > 0 ? `, and ${rule.margin} s more is required between them` : ''}${rule.timeRatio < 1 ? ` (its clearing must stay under ${rule.timeRatio * 100} % of ${up}'s melting time)` : ''}.`;
    case 'thin margin':
      return `${capitalise(where)}${faultText} ${up} waits for ${down}, but only ${marginText(worst.marginSeconds)} beyond the required ${rule.margin} s (${at}: ${formatSeconds(worst.upTime)} against ${formatSeconds(worst.downTime)}).`;
    case 'not provable from curves':
      return `${capitalise(where)}${faultText} both devices operate within about the first half-cycle, or one is current-limiting: a time-current curve cannot show selectivity here. Use tested series-selectivity data or an I²t comparison.`;
    default:
      return `${capitalise(where)} ${up} waits for ${down}.`;
  }
}

function suggest(interval: IntervalFacts, up: string, down: string, rule: MarginRule, kind: string): string {
  const [upKind, downKind] = kind.split('/');
  const { worst } = interval;
  if (interval.status === 'not provable from curves') {
    return `Confirm with the manufacturers' tested selectivity tables for ${up} above ${down}, or compare let-through and melting I²t.`;
  }
  if (worst.downTime === Infinity) {
    return upKind === 'fuse'
      ? `Use a larger fuse for ${up}, one that does not melt below the highest pickup edge of ${down}, or lower ${down}'s pickup.`
      : `Raise the pickup of ${up} above the highest pickup edge of ${down}, or lower ${down}'s pickup.`;
  }
  if (worst.upTime < 0.1 && upKind === 'fuse') {
    return `Use a larger fuse for ${up}, one that melts later than ${down} clears up to ${formatAmps(interval.toAmps, 3)}, or give ${down} a faster trip there.`;
  }
  if (worst.upTime < 0.1) {
    return `Raise ${up}'s instantaneous pickup above ${formatAmps(interval.toAmps, 3)} (the fault current here), or give ${up} a short-time delay instead of an instantaneous trip.`;
  }
  // The slack is the upstream time times the ratio less the rest: the upstream time itself must rise by
  // the shortfall over the ratio.
  const needed = (-worst.marginSeconds + (interval.status === 'thin margin' ? 0.1 : 0)) / rule.timeRatio;
  const slower = upKind === 'fuse' ? 'a larger fuse' : 'a higher time dial or delay band';
  return `Slow ${up} by at least ${significant(Math.max(needed, 0.01), 2)} s at ${formatAmps(worst.amps, 3)} (${slower}), or speed up ${down}${downKind === 'fuse' ? ' (a smaller fuse)' : ''}.`;
}

// A ground-fault element has a pickup and a delay band (with I²t in or out), nothing more: propose only those.
function suggestGround(interval: IntervalFacts, up: string, down: string): string {
  const { worst } = interval;
  if (interval.status === 'not provable from curves')
    return `Confirm with tested selectivity data for ground faults between ${up} and ${down}, or give ${up}'s ground-fault element a longer delay band.`;
  if (worst.downTime === Infinity)
    return `Raise ${up}'s ground-fault pickup above the current ${down} carries, or give ${down} a ground-fault element of its own.`;
  const needed = -worst.marginSeconds + (interval.status === 'thin margin' ? 0.1 : 0);
  return `Lengthen ${up}'s ground-fault delay by at least ${significant(Math.max(needed, 0.01), 2)} s at ${formatAmps(worst.amps, 3)} (a longer delay band, or I²t in), or raise its ground-fault pickup; or give ${down} a faster ground-fault element.`;
}

function marginText(seconds: number): string {
  return seconds === Infinity ? 'unlimited time' : `${significant(seconds, 3)} s`;
}

/**
 * How much harder (per unit, on the sheet) the upstream device is hit than a device on a single-phase
 * bus below, for a full-winding fault: the single-phase unit's primary current as a three-phase
 * line-current pattern (across two lines: `I1 = −I2 = j/√3`; line to neutral, √3 times the bus-ratio
 * current in one line: `I0 = I1 = I2 = 1/√3`), carried up through each three-phase transformer above
 * it (Δ–Y and Y–Δ shift I1 by +30° and I2 by −30° and trap I0; Δ–Δ traps I0; Yg–Yg passes all), then
 * the largest line current there (symmetrical components, IEEE 399).
 */
function singlePhaseShift(context: CheckContext, between: Transformer[]): number {
  const top = between.findIndex((t) => t.phases === 1);
  if (top < 0) return 1;
  const unit = between[top];
  const k = 1 / Math.sqrt(3);
  let [i0, i1, i2]: [number, number][] = isLineToNeutral(context, unit)
    ? [
        [k, 0],
        [k, 0],
        [k, 0],
      ]
    : [
        [0, 0],
        [0, k],
        [0, -k],
      ];
  const rotate = ([r, x]: [number, number], degrees: number): [number, number] => {
    const a = (degrees * Math.PI) / 180;
    return [r * Math.cos(a) - x * Math.sin(a), r * Math.sin(a) + x * Math.cos(a)];
  };
  for (const t of between.slice(0, top).reverse()) {
    if (t.connection !== 'wye-wye') i0 = [0, 0];
    if (isPhaseShifting(t.connection)) {
      i1 = rotate(i1, 30);
      i2 = rotate(i2, -30);
    }
  }
  const line = (shift: number) => {
    const a = rotate(i1, shift);
    const b = rotate(i2, -shift);
    return Math.hypot(i0[0] + a[0] + b[0], i0[1] + a[1] + b[1]);
  };
  const shift = Math.max(line(0), line(-120), line(120));
  return Math.abs(shift - 1) < 1e-12 ? 1 : shift; // a plain ratio stays exactly 1 despite rounding
}

/** Whether a single-phase transformer's primary winding is connected line to neutral on a three-phase bus. */
function isLineToNeutral(context: CheckContext, t: Transformer): boolean {
  const primary = context.faults.buses.get(t.from)!;
  return primary.phases === 3 && primaryConnectionOf(t, primary.volts) === 'line-to-neutral';
}
