import type { Analysis } from '../analysis.ts';
import { addImpedance, ZERO_IMPEDANCE, type Impedance } from '../fault/impedance.ts';
import { reflectImpedance } from '../fault/reflect.ts';
import { edgeOperationOnCurrent, generatorDecrement, type GeneratorDecrement } from '../generator/index.ts';
import { locationBusOf, pathTo, type Network } from '../network/index.ts';
import { formatAmps, formatSeconds, formatVolts, significant } from '../quantity/format.ts';
import type { Source } from '../study/index.ts';
import { nameOf } from './context.ts';
import { illustrativeSentence, isIllustrative } from './coordination.ts';
import type { Finding } from './finding.ts';
import type { MarginRule } from './margins.ts';

type Generator = Extract<Source, { kind: 'generator' }>;

/** How long (s) the decaying current is followed: `decrementOperatingTime`'s horizon. */
const HORIZON_SECONDS = 1000;

/** What the check reads of an analysis: the tree, its fault levels, bands and pairs. */
type AnalysedTree = Pick<Analysis, 'study' | 'network' | 'faults' | 'bands' | 'pairs'>;

/**
 * Coordination on a decaying source. A tree fed by a generator sees a fault current that falls from
 * the subtransient value toward the sustained one, so each pair is also checked for a bolted
 * three-phase fault at the downstream device's bus with the current following the generator's
 * decrement behind the impedance of the path (`generatorDecrement`, IEEE Std 551): the downstream
 * device's latest clearing and the upstream device's earliest operation are each found element by
 * element (`edgeTimeOnCurrent`): an inverse-time element integrates 1 / t(I(t)) to 1 over the decaying
 * current (the time-varying-current method of IEEE C37.112), a definite-time element operates only if
 * the current stays above its pickup for its delay, an instantaneous trip if it does for the opening time
 * (a relay's operating time), the breaker then clearing by its clearing time, and the device acts on the first;
 * the two times must meet the pair's rule as the overlap
 * finder applies it: `opens × timeRatio ≥ clears + margin` (for a fuse pair the downstream total
 * clearing within 75 % of the upstream minimum melting, common practice). A downstream device that
 * never operates on the decaying current fails. Motor contribution is left out (it decays within a few
 * cycles). An upstream inverse-time element that gains on the decaying current while the downstream
 * device's definite-time element never completes fails here, though the two are selective at every
 * constant current. A pair on a single-phase bus is told not worked out (an info). Findings
 * only for a tree whose source is a generator.
 *
 * @example decrementFindings(analysisOfGeneratorTree)
 */
export function decrementFindings(analysis: AnalysedTree): Finding[] {
  const source = analysis.study.source;
  if (source.kind !== 'generator') return [];
  const { network } = analysis;
  const findings: Finding[] = [];
  for (const pair of analysis.pairs) {
    const down = network.devices.get(pair.downstream)!;
    const up = network.devices.get(pair.upstream)!;
    const bus = locationBusOf(network, down);
    // The decrement is the machine's three-phase one: a single-phase bus's loop is not worked on it.
    if (analysis.faults.buses.get(bus.id)?.phases === 1) {
      findings.push({
        id: `decrement:${up.id}/${down.id}`,
        kind: 'generator-decrement',
        severity: 'info',
        title: `${nameOf(up)} over ${nameOf(down)} on the generator's decaying current: not worked out`,
        subjects: [up.id, down.id],
        explanation: `${bus.name ?? bus.id} is a single-phase bus: its fault is a single-phase loop, and the decaying current here is worked out for a three-phase fault only, so the pair is checked at constant currents alone.`,
        basis: 'generator decrement (IEEE Std 551), three-phase faults',
        referenceVolts: bus.voltage,
      });
      continue;
    }
    const {
      current,
      sustainedAmps,
      upperSustainedAmps,
      clears,
      opens,
      clearsBy,
      opensBy,
      clearsAtSustained,
      clearsAtStart,
    } = decrementTimesOf(analysis, source, pair, bus.id);
    // Past the integral's horizon a device may still clear on the sustained current, only too late to follow.
    const tooSlow = !Number.isFinite(clears) && Number.isFinite(clearsAtSustained);
    const { rule } = pair;
    // The finder's slack and ratio (`up.minTime · timeRatio` against `down.maxTime + margin`).
    const slack = opens === Infinity ? Infinity : opens * rule.timeRatio - (clears + rule.margin);
    const ok = Number.isFinite(clears) && slack >= 0;
    const sustained = formatAmps(sustainedAmps, 3);
    // The support may raise the current above its start: the upstream device is read on that.
    const raised = formatAmps(upperSustainedAmps, 3) !== sustained;
    // Below what the downstream device needs from the start: no support (held at most at the start) lifts it.
    const belowFromStart = !Number.isFinite(clearsAtStart);
    const at = `a fault at ${bus.name ?? bus.id} (${formatVolts(bus.voltage)}) fed by ${source.name ?? source.id}, ${decayText(current(0), sustainedAmps, upperSustainedAmps)}`;
    // More support lifts the current the downstream device is read on only while its floor is below the start.
    const orSupport =
      belowFromStart || upperSustainedAmps > sustainedAmps * (1 + 1e-9)
        ? ''
        : source.sustained === undefined
          ? ', or give the generator excitation support'
          : ', or give the generator more excitation support';
    const neverClears = belowFromStart
      ? `the current, ${formatAmps(current(0), 3)} from the start, is below what it needs to operate`
      : 'the current decays below what it needs before it can operate';
    // As the pair check: selective on an illustrative curve is told (info), not claimed.
    const illustrative = [up, down].filter(isIllustrative).map(nameOf);
    const told = ok && illustrative.length > 0;
    findings.push({
      id: `decrement:${up.id}/${down.id}`,
      kind: 'generator-decrement',
      severity: !ok ? 'fail' : told ? 'info' : 'ok',
      title: `${nameOf(up)} over ${nameOf(down)} on the generator's decaying current: ${ok ? `selective${told ? ' on illustrative curves' : ''}` : Number.isFinite(clears) ? 'margin not met' : tooSlow ? `downstream does not clear within ${HORIZON_SECONDS} s` : 'downstream never clears'}`,
      subjects: [up.id, down.id],
      explanation: tooSlow
        ? `For ${at}, ${nameOf(down)} does not clear within the ${HORIZON_SECONDS} s the check follows: at the sustained ${sustained} it takes ${formatSeconds(clearsAtSustained)}.`
        : !Number.isFinite(clears)
          ? `For ${at}, ${nameOf(down)} never clears: ${neverClears}.`
          : `For ${at}, ${nameOf(down)} clears by ${formatSeconds(clears)}${onElement(clearsBy)} and ${nameOf(up)} ${Number.isFinite(opens) ? `can operate from ${formatSeconds(opens)}${raised ? ' on the raised current' : ''}${onElement(opensBy)}: ${separationText(clears, opens, rule, nameOf(down), nameOf(up))}` : `does not operate on ${raised ? 'the raised current' : "the generator's current"}`}.${told ? ` ${illustrativeSentence(illustrative)}` : ''}`,
      suggestion: ok
        ? undefined
        : Number.isFinite(clears)
          ? `Delay ${nameOf(up)} or make ${nameOf(down)} faster at the generator's currents.`
          : tooSlow
            ? `Make ${nameOf(down)} faster at the generator's sustained current${orSupport}.`
            : `Lower ${nameOf(down)}'s pickup below ${belowFromStart ? `the ${formatAmps(current(0), 3)} the fault starts at` : "the generator's sustained current"}${orSupport}.`,
      basis: `generator decrement (IEEE Std 551) with time-varying-current integration (IEEE C37.112); ${pair.rule.basis}`,
      referenceVolts: bus.voltage,
      worst: Number.isFinite(clears)
        ? {
            amps: current(clears),
            marginSeconds: slack,
            ratio: opens === Infinity ? Infinity : (opens * rule.timeRatio) / (clears + rule.margin),
            upTime: opens,
            downTime: clears,
          }
        : undefined,
    });
  }
  return findings;
}

/**
 * A pair on the generator's decaying current for a bolted three-phase fault at a bus of its tree: the
 * current there (A at the bus) against time, its sustained value, the downstream device's latest clearing
 * and the upstream device's earliest operation (s; `Infinity` where never) with the element of each that
 * acts first, each device's band read element by element on the current at its own voltage
 * (`edgeOperationOnCurrent`).
 *
 * @example decrementTimesOf(analysis, generator, { upstream: 'GEN-CB', downstream: 'F1' }, 'PNL').clears // s
 */
export function decrementTimesOf(
  analysis: AnalysedTree,
  generator: Generator,
  pair: { upstream: string; downstream: string },
  busId: string,
) {
  const { network } = analysis;
  const volts = network.buses.get(busId)!.voltage;
  const decrement = decrementAt(analysis, generator, busId);
  const toBus = generator.voltage / volts;
  const current = (seconds: number) => decrement.ampsAt(seconds) * toBus;
  const upperCurrent = (seconds: number) => decrement.upperAmpsAt(seconds) * toBus;
  // Each device reads its own band, element by element, on the current at its own voltage.
  const operationOf = (id: string, edge: 'min' | 'max', amps: (seconds: number) => number) => {
    const toDevice = volts / locationBusOf(network, network.devices.get(id)!).voltage;
    // Both readings of the decrement never rise (X″d ≤ X′d ≤ Xd, then a constant floor).
    return edgeOperationOnCurrent(analysis.bands.get(id)!, edge, (seconds) => amps(seconds) * toDevice, {
      fallingFrom: amps(0) * toDevice,
    });
  };
  // The downstream device clears on the lower reading, the upstream one operates on the upper: where the
  // support may raise a distant fault's current, each is read the way that is worse for the pair.
  const down = operationOf(pair.downstream, 'max', current);
  const up = operationOf(pair.upstream, 'min', upperCurrent);
  const downVolts = locationBusOf(network, network.devices.get(pair.downstream)!).voltage;
  return {
    current,
    sustainedAmps: decrement.sustainedAmps * toBus,
    /** What the support may raise the current to, where that is more than `sustainedAmps` (A at the bus). */
    upperSustainedAmps: decrement.upperSustainedAmps * toBus,
    clears: down.seconds,
    opens: up.seconds,
    /** The elements that clear and operate first, where the families name them ('long-time'…). */
    clearsBy: down.element,
    opensBy: up.element,
    /** The downstream device's clearing at the sustained current, at a constant current (s). */
    clearsAtSustained: analysis.bands
      .get(pair.downstream)!
      .maxTime((decrement.sustainedAmps * toBus * volts) / downVolts),
    /** The downstream device's clearing at the current the fault starts at, held constant (s). */
    clearsAtStart: analysis.bands.get(pair.downstream)!.maxTime((current(0) * volts) / downVolts),
  };
}

/**
 * Which element of a device acts first, as a parenthesis after its time: ` (on its long-time element)`;
 * nothing where the family names none (a fuse, one curve).
 *
 * @example onElement('short-time') // ' (on its short-time element)'
 */
export function onElement(label: string | undefined): string {
  return label ? ` (on its ${label} element)` : '';
}

/**
 * The decaying current in words, from its start to what it settles at: "2690 A falling to 1200 A", or
 * "a steady 2890 A" where it does not fall (the excitation support holds its start);
 * with what the support may raise it to, where that is more (`upperSustainedAmps`).
 *
 * @example decayText(2694, 1203) // '2690 A falling to 1200 A'
 */
export function decayText(initialAmps: number, sustainedAmps: number, upperSustainedAmps = sustainedAmps): string {
  const initial = formatAmps(initialAmps, 3);
  const sustained = formatAmps(sustainedAmps, 3);
  const upper = formatAmps(upperSustainedAmps, 3);
  const raised =
    upper === sustained
      ? ''
      : ` (the excitation support may raise it toward ${upper}, on which the upstream device is read)`;
  return (initial === sustained ? `a steady ${initial}` : `${initial} falling to ${sustained}`) + raised;
}

/**
 * The separation of a pair's two times on a decaying current against its rule, in words: the margin, or
 * for a fuse rule the downstream clearing as a share of the upstream operation. Accepts finite times (s).
 *
 * @example separationText(0.2, 0.35, rule, 'F1', 'MAIN') // 'a margin of 0.15 s against the required 0.2 s'
 */
export function separationText(clears: number, opens: number, rule: MarginRule, down: string, up: string): string {
  if (rule.timeRatio === 1)
    return `a margin of ${formatSeconds(opens - clears)} against the required ${formatSeconds(rule.margin)}`;
  const needed =
    rule.margin > 0 ? `${down}'s clearing plus the required ${formatSeconds(rule.margin)}` : `${down}'s clearing`;
  const share = `${significant((100 * (clears + rule.margin)) / opens, 3)} %`;
  return `${needed} is ${share} of ${up}'s earliest operation, against at most ${significant(rule.timeRatio * 100, 3)} % required`;
}

// Accepts a generator tree and a bus; the decrement for a fault there, behind the path's impedance in per unit on the machine base.
function decrementAt(analysis: AnalysedTree, generator: Generator, busId: string): GeneratorDecrement {
  const z = pathImpedance(analysis.network, analysis.faults.trees.max.branchZ, busId);
  const volts = analysis.network.buses.get(busId)!.voltage;
  const base = (volts * volts) / generator.rating;
  return generatorDecrement(generator, {
    external: { r: z.r / base, x: z.x / base },
    frequency: analysis.study.frequency,
  });
}

// Accepts a network, each branch's impedance and a bus; the series impedance from the source bus down to it, at its voltage.
function pathImpedance(network: Network, branchZ: Map<string, Impedance>, busId: string): Impedance {
  let z = ZERO_IMPEDANCE;
  let volts = network.buses.get(network.study.source.bus)!.voltage;
  for (const id of pathTo(network, busId)) {
    const element = network.elements.get(id)!;
    if (element.type === 'bus') continue;
    if (element.type === 'transformer') {
      const to = network.buses.get(element.item.to)!.voltage;
      z = reflectImpedance(z, volts, to);
      volts = to;
    }
    z = addImpedance(z, branchZ.get(id) ?? ZERO_IMPEDANCE);
  }
  return z;
}
