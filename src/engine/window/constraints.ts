import type { Band } from '../band.ts';
import { AHJ_SELECTIVITY_SECONDS, SELECTIVITY_ARTICLE } from '../checks/codeSelectivity.ts';
import { inSeriesAlone } from '../checks/seriesException.ts';
import { cableAmpacityFindings } from '../checks/cableAmpacity.ts';
import { ratingOf } from '../checks/deviceRating.ts';
import { cableFindings } from '../checks/cableProtection.ts';
import { generatorDevicesOf, generatorFindings } from '../checks/generatorProtection.ts';
import { nameOf, protectingDevice } from '../checks/context.ts';
import { checkPair } from '../checks/coordination.ts';
import { decrementFindings } from '../checks/decrementCoordination.ts';
import type { Finding } from '../checks/finding.ts';
import { interruptingDutyOf } from '../checks/interruptingDuty.ts';
import { marginRuleOf, type MarginRule } from '../checks/margins.ts';
import { carriesLoad, fullLoadOf, pickupAmpsOf } from '../checks/loadBelow.ts';
import { motorFindings } from '../checks/motorStarting.ts';
import { nec450Findings } from '../checks/nec450.ts';
import { sensitivityCasesOf } from '../checks/sensitivity.ts';
import { transformerFindings } from '../checks/transformerProtection.ts';
import { locationBusOf } from '../network/index.ts';
import { inrushMarkersOf, type Marker } from '../withstand/index.ts';
import { formatAmps, formatSeconds, significant } from '../quantity/format.ts';
import type { Trial } from './trial.ts';
import type { Device } from '../study/index.ts';

/** What a constraint is about (DEVELOPERS.md, names "constraint"). */
export type ConstraintKind =
  | 'coordinate-below'
  | 'coordinate-above'
  | 'transformer-withstand'
  | 'cable-withstand'
  | 'generator-withstand'
  | 'cable-ampacity'
  | 'inrush'
  | 'motor-starting'
  | 'carry-load'
  | 'nec-450.3'
  | 'sensitivity'
  | 'interrupting-duty';

/**
 * Which way a constraint pushes the settings: `slower` is met by a slower device (it sets a lower
 * edge of the window: coordinate with the devices below, ride through inrush and motor starting,
 * carry load); `faster` by a faster one (an upper edge: coordinate with the device above, clear
 * below withstand curves, NEC limits, sensitivity); `fixed` does not depend on the settings
 * (interrupting duty, a code limit on a rating) and is reported, never a window edge.
 */
export type Favours = 'slower' | 'faster' | 'fixed';

/** How a constraint stands for one trial setting. */
export interface ConstraintResult {
  /** The constraint holds (for coordination: no overlap interval; the check would not fail). */
  ok: boolean;
  /** It holds with room: no thin-margin interval either. */
  clean: boolean;
  /** The margin in `unit` (negative when violated); `Infinity` when unlimited. */
  margin: number;
  unit: 's' | 'A' | '%';
  /** The margin in words: "0.23 s at 18 kA". */
  text: string;
}

/** One reason a setting is allowed or not, with its source (DEVELOPERS.md, names). */
export interface Constraint {
  /**
   * Stable id: 'below:FDR-MCC', 'above:R-T1', 'decrement-below:FDR-1', 'withstand:T1', 'withstand:G1',
   * 'inrush:T1', 'load', 'sensitivity', …
   */
  id: string;
  kind: ConstraintKind;
  /** Plain words: "coordinate with MCC feeder 600 A below (0 s margin)". */
  label: string;
  /** Published source or "common practice". */
  source: string;
  favours: Favours;
  /** The other devices and elements involved (ids). */
  subjects: string[];
  /** For a coordination constraint: the pair's margin rule. */
  rule?: MarginRule;
  /** Evaluates the constraint for the device as it stands in the trial. */
  evaluate(trial: Trial): ConstraintResult;
}

/** Options of `constraintsOf`. */
export interface ConstraintsOptions {
  /**
   * Include coordination with the device above. A proposal leaves it out when the device above is
   * itself being set afterwards (it will be set to wait for this one).
   * @default true
   */
  includeAbove?: boolean;
}

/**
 * Every constraint on one device's settings, the rest of the trial fixed: coordinate with each
 * device below and the one above (the study's margin rules, IEEE 242 practice) and, fed by a
 * generator, also on its decaying current (`decrementFindings`); clear below the withstand curves of
 * the transformers and cables it protects up to their maximum fault (IEEE C57.109, ICEA P-32-382) and,
 * nearest a generator, below the generator's damage curve (NFPA 70 445.12(A)); ride through transformer inrush and motor starting, carry the load below,
 * stay within NEC 450.3, operate on the minimum fault at the end of its zone, and (reported only)
 * interrupt the maximum fault where it sits.
 *
 * @example constraintsOf(trial, 'MAIN').map((c) => c.label)
 */
export function constraintsOf(trial: Trial, deviceId: string, options: ConstraintsOptions = {}): Constraint[] {
  const { includeAbove = true } = options;
  const device = trial.deviceOf(deviceId);
  const constraints: Constraint[] = [];
  for (const belowId of trial.belowOf.get(deviceId) ?? [])
    constraints.push(coordination(trial, deviceId, belowId, 'below'));
  const aboveId = trial.aboveOf.get(deviceId);
  if (aboveId && includeAbove) constraints.push(coordination(trial, aboveId, deviceId, 'above'));
  const source = trial.study.source;
  if (source.kind === 'generator') {
    // The full check also holds each pair of a generator's tree to its decaying current.
    for (const belowId of trial.belowOf.get(deviceId) ?? [])
      constraints.push(decrement(trial, deviceId, belowId, 'below'));
    if (aboveId && includeAbove) constraints.push(decrement(trial, aboveId, deviceId, 'above'));
  }

  const protects = trial.protects.get(deviceId) ?? { transformers: [], cables: [], motors: [] };
  const horizon = trial.settings.horizon;
  for (const transformer of protects.transformers) {
    const name = transformer.name ?? transformer.id;
    const toAmps = trial.faults.transformers.get(transformer.id)?.reflectedToPrimary ?? 0;
    constraints.push({
      id: `withstand:${transformer.id}`,
      kind: 'transformer-withstand',
      label: `clear below ${name}'s through-fault curve up to ${formatAmps(toAmps, 3)}`,
      source: transformer.construction === 'dry' ? 'IEEE C57.12.59' : 'IEEE C57.109',
      favours: 'faster',
      subjects: [transformer.id],
      // The unbalanced cases only warn in the check (the secondary main clears them), so only the
      // three-phase case bounds the window.
      evaluate: (t) =>
        withstandResult(
          transformerFindings(t, transformer, horizon).filter(
            (f) => f.kind === 'transformer-withstand' && f.id.includes(':three-phase'),
          ),
        ),
    });
    const markers = inrushMarkersOf(transformer);
    constraints.push({
      id: `inrush:${transformer.id}`,
      kind: 'inrush',
      label: `ride through ${name}'s magnetising inrush (${markers.map((m) => `${formatAmps(m.amps, 3)} at ${m.seconds} s`).join(', ')})`,
      source: 'inrush 8–12 × full-load current at 0.1 s (common practice)',
      favours: 'slower',
      subjects: [transformer.id],
      evaluate: (t) => inrushResult(t.bands.get(deviceId)!, markers),
    });
  }
  for (const cable of protects.cables) {
    const name = cable.name ?? cable.id;
    constraints.push({
      id: `withstand:${cable.id}`,
      kind: 'cable-withstand',
      label: `clear below ${name}'s short-circuit limit up to ${formatAmps(trial.faults.buses.get(cable.from)!.max.largest, 3)}`,
      source: 'ICEA P-32-382',
      favours: 'faster',
      subjects: [cable.id],
      evaluate: (t) => withstandResult(cableFindings(t, cable, horizon)),
    });
  }
  if (source.kind === 'generator' && generatorDevicesOf(trial.network).some((d) => d.id === deviceId)) {
    constraints.push({
      id: `withstand:${source.id}`,
      kind: 'generator-withstand',
      label: `clear below ${source.name ?? source.id}'s damage curve up to ${formatAmps(trial.faults.buses.get(source.bus)!.max.largest, 3)}`,
      source: 'NFPA 70 445.12(A); IEEE C50.13',
      favours: 'faster',
      subjects: [source.id],
      // The check warns, not fails (NFPA 70 445.12(A) also accepts a machine's inherent protection): a
      // setting that leaves the armature unprotected is allowed but not clean.
      evaluate: (t) => {
        const findings = generatorFindings(t, source, horizon).filter((f) => f.subjects[0] === deviceId);
        const result = withstandResult(findings);
        return { ...result, ok: true, clean: findings.every((f) => f.severity === 'ok') };
      },
    });
  }
  for (const cable of protects.cables) {
    const name = cable.name ?? cable.id;
    // The check reads nothing of the trial but the device's rating: a trial with the same rating (every
    // trial but a relay's pickup) has the same result, worked out once.
    let last: { amps: number | undefined; result: ConstraintResult } | undefined;
    constraints.push({
      id: `ampacity:${cable.id}`,
      kind: 'cable-ampacity',
      label: `protect ${name} at its ampacity`,
      source: 'NFPA 70 240.4, Table 310.16',
      favours: ratingFavours(trial, device, (t) => cableAmpacityFindings(t, cable)[0]?.severity !== 'fail'),
      subjects: [cable.id],
      evaluate: (t) => {
        const amps = ratingOf(t.deviceOf(deviceId))?.amps;
        if (last && last.amps === amps) return last.result;
        const finding = cableAmpacityFindings(t, cable)[0];
        const ok = finding?.severity !== 'fail';
        const text = finding?.explanation ?? 'nothing to compare';
        last = { amps, result: { ok, clean: ok, margin: ok ? 0 : -1, unit: 'A', text } };
        return last.result;
      },
    });
  }
  for (const motor of protects.motors) {
    constraints.push({
      id: `starting:${motor.id}`,
      kind: 'motor-starting',
      label: `ride through ${motor.name ?? motor.id}'s start`,
      source: 'motor starting curve (common practice)',
      favours: 'slower',
      subjects: [motor.id],
      evaluate: (t) => {
        const failed = motorFindings(t, motor).find((f) => f.severity === 'fail');
        return failed
          ? { ok: false, clean: false, margin: -1, unit: 's', text: failed.explanation }
          : { ok: true, clean: true, margin: Infinity, unit: 's', text: 'stays above the starting curve' };
      },
    });
  }

  const load = fullLoadOf(trial.network, device);
  if (load) {
    constraints.push({
      id: 'load',
      kind: 'carry-load',
      label: `carry ${load.label}: pickup at least ${formatAmps(load.requiredAmps, 3)}`,
      source: load.source,
      favours: 'slower',
      subjects: load.subjects,
      evaluate: (t) => {
        const pickup = pickupAmpsOf(t.deviceOf(deviceId));
        if (pickup === undefined)
          return { ok: true, clean: true, margin: Infinity, unit: 'A', text: 'no rating given' };
        const ok = carriesLoad(pickup, load.requiredAmps);
        return {
          ok,
          clean: ok,
          margin: pickup - load.requiredAmps,
          unit: 'A',
          text: `pickup ${formatAmps(pickup, 3)} against ${formatAmps(load.requiredAmps, 3)}`,
        };
      },
    });
  }

  for (const transformer of trial.study.transformers) {
    const primary = protectingDevice(trial, transformer.id)?.id === deviceId;
    const secondary = trial.network.deviceFeeding.get(transformer.to)?.id === deviceId;
    if (!primary && !secondary) continue;
    const side = primary ? 'primary' : 'secondary';
    const limitOf = (t: Trial) =>
      nec450Findings(t, transformer, t.settings.edition).find(
        (f) => f.subjects[0] === deviceId && f.id.endsWith(`:${side}`),
      );
    const favours = ratingFavours(trial, device, (t) => limitOf(t)?.severity !== 'fail');
    constraints.push({
      id: `nec:${transformer.id}`,
      kind: 'nec-450.3',
      label: `stay within NEC 450.3 for ${transformer.name ?? transformer.id} (${side})`,
      source: `NFPA 70 ${trial.settings.edition}, Table 450.3`,
      favours,
      subjects: [transformer.id],
      evaluate: (t) => {
        const finding = limitOf(t);
        const ok = finding?.severity !== 'fail';
        return {
          ok,
          clean: ok,
          margin: ok ? 0 : -1,
          unit: 'A',
          text: finding ? finding.explanation : 'no rating to compare',
        };
      },
    });
  }

  const sensitivity = sensitivityCasesOf(trial, device, trial.settings.sensitivity);
  if (sensitivity.length > 0) {
    const least = sensitivity.reduce((a, b) => (b.deviceAmps < a.deviceAmps ? b : a));
    const bus = trial.network.buses.get(least.busId)!;
    constraints.push({
      id: 'sensitivity',
      kind: 'sensitivity',
      label: `operate on the minimum faults in its zone (${least.fault} at ${bus.name ?? bus.id}: ${formatAmps(least.deviceAmps, 3)} through it)`,
      source: 'sensitivity to the minimum fault at the end of the zone (common practice)',
      favours: 'faster',
      subjects: [...new Set(sensitivity.map((c) => c.busId))],
      evaluate: (t) => {
        const cases = sensitivityCasesOf(t, t.deviceOf(deviceId), t.settings.sensitivity);
        const slowest = cases.reduce((a, b) => (b.clearingTime > a.clearingTime ? b : a), cases[0]);
        const ok = cases.every((c) => c.clearingTime < Infinity);
        const text = ok
          ? `clears the least of them within ${formatSeconds(slowest.clearingTime)}`
          : `may not operate on ${formatAmps(slowest.deviceAmps, 3)} (${slowest.fault})`;
        return {
          ok,
          clean: ok,
          margin: ok ? t.settings.sensitivity.maxTime - slowest.clearingTime : -Infinity,
          unit: 's',
          text,
        };
      },
    });
  }

  // The duty the NFPA 70 110.9 check holds the rating to: the largest fault where it sits, multiplied
  // up for X/R above the rating's test X/R. Without a rating there is no test X/R: the symmetrical fault.
  const present = interruptingDutyOf(trial, device, trial.study.frequency);
  const fault = trial.faults.buses.get(locationBusOf(trial.network, device).id)!.max;
  constraints.push({
    id: 'interrupting',
    kind: 'interrupting-duty',
    label: present
      ? `interrupt ${formatAmps(present.worst.dutyAmps, 3)}, the largest fault where it sits corrected for X/R`
      : `interrupt ${formatAmps(fault.largest, 3)}, the largest symmetrical fault where it sits`,
    source: present ? `NFPA 70 110.9; ${present.basis.source}` : 'NFPA 70 110.9',
    favours: 'fixed',
    subjects: [],
    evaluate: (t) => {
      const duty = interruptingDutyOf(t, t.deviceOf(deviceId), t.study.frequency);
      if (duty === undefined)
        return { ok: true, clean: true, margin: Infinity, unit: 'A', text: 'no interrupting rating given' };
      const { rating, worst } = duty;
      const rated = `rated ${formatAmps(rating, 3)}`;
      // As the check: an infinite source leaves the duty unbounded, a warning rather than a failure.
      if (!Number.isFinite(worst.symmetricalAmps))
        return { ok: true, clean: false, margin: -Infinity, unit: 'A', text: `${rated}; the fault here is unbounded` };
      const ok = !(worst.dutyAmps > rating);
      return {
        ok,
        clean: ok,
        margin: rating - worst.dutyAmps,
        unit: 'A',
        text: `${rated}, duty ${formatAmps(worst.dutyAmps, 3)}`,
      };
    },
  });
  return constraints;
}

/** A pair constraint; `which` says whether the window's device is the upper ('below' rows) or lower one. */
function coordination(trial: Trial, upId: string, downId: string, which: 'below' | 'above'): Constraint {
  const other = trial.deviceOf(which === 'below' ? downId : upId);
  const upstream = trial.deviceOf(upId);
  // The pair's rule as `checkPair` finds it: it depends on the two families and the study, not the settings.
  const rule = marginRuleOf(
    upstream.characteristic.kind,
    trial.deviceOf(downId).characteristic.kind,
    trial.settings,
    upstream.margin,
    {
      upstream: upId,
      downstream: downId,
    },
  );
  const ratio = `${rule.timeRatio * 100} % time ratio`;
  const separation =
    rule.timeRatio === 1 ? `${rule.margin} s margin` : rule.margin > 0 ? `${rule.margin} s margin, ${ratio}` : ratio;
  // A pair on the supply side of a device of an emergency (or like) system, or in the 2023 edition on the
  // load side of an emergency device, must be shown selective: curves
  // that cannot prove it do not do; but for a pair every such article's Exception leaves out (two devices in
  // series, no load in parallel), which an elevator circuit's (620.62) does not.
  const articles = [...markedAtOrBelow(trial, downId), ...loadSideOf(trial, upId)].map(
    (system) => SELECTIVITY_ARTICLE[system],
  );
  const exempt = articles.every((article) => article.seriesException) && inSeriesAlone(trial.network, upId, downId);
  const code = articles.length > 0 && !exempt ? [...new Set(articles.map((a) => a.article))].join(', ') : undefined;
  const fullRange = trial.settings.codeSelectivity === 'full-range';
  return {
    id: `${which}:${other.id}`,
    kind: which === 'below' ? 'coordinate-below' : 'coordinate-above',
    label: `coordinate with ${nameOf(other)} ${which === 'below' ? 'below' : 'above'} (${separation}${code ? `; must be shown selective, NFPA 70 ${code}` : ''})`,
    source: code ? `${rule.basis}; NFPA 70 ${code}` : rule.basis,
    favours: which === 'below' ? 'slower' : 'faster',
    subjects: [other.id],
    rule,
    evaluate: (t) => {
      const result = checkPair(t, { upstream: t.deviceOf(upId), downstream: t.deviceOf(downId) }, t.settings).check;
      let ok = true;
      let clean = true;
      let margin = Infinity;
      let at = 0;
      for (const pairCase of result.cases) {
        for (const interval of pairCase.intervals) {
          if (interval.status === 'overlap') ok = false;
          if (code && interval.status === 'not provable from curves') {
            const clears = t.bands.get(downId)?.maxTime(interval.fromAmps) ?? Infinity;
            if (fullRange || clears > AHJ_SELECTIVITY_SECONDS) ok = false;
          }
          // A sliver of thin margin (under 1 % wide) is a steep curve crossing, reported with its overlap.
          if (interval.status === 'thin margin' && interval.toAmps >= interval.fromAmps * 1.01) clean = false;
          if (interval.status !== 'not provable from curves' && interval.worst.marginSeconds < margin) {
            margin = interval.worst.marginSeconds;
            at = interval.worst.amps;
          }
        }
      }
      const text =
        margin === Infinity
          ? 'never overlaps'
          : margin === -Infinity
            ? `operates where ${nameOf(t.deviceOf(downId))} never clears (${formatAmps(at, 3)})`
            : `${significant(margin, 3)} s at ${formatAmps(at, 3)}`;
      return { ok, clean: ok && clean, margin, unit: 's', text };
    },
  };
}

/**
 * In the 2023 edition, the emergency systems a device is at or below: NFPA 70 (2023) 700.32(A) asks their
 * devices to be selective with their load-side devices too.
 */
function loadSideOf(trial: Trial, deviceId: string): NonNullable<Device['system']>[] {
  if (trial.settings.edition !== '2023') return [];
  const systems: NonNullable<Device['system']>[] = [];
  for (let id: string | undefined = deviceId; id !== undefined; id = trial.aboveOf.get(id))
    if (trial.deviceOf(id).system === 'emergency') systems.push('emergency');
  return systems;
}

/** The systems marked on a device and on every device below it (those whose supply side it is on). */
function markedAtOrBelow(trial: Trial, deviceId: string): NonNullable<Device['system']>[] {
  const systems: NonNullable<Device['system']>[] = [];
  const pending = [deviceId];
  while (pending.length > 0) {
    const id = pending.pop()!;
    const system = trial.deviceOf(id).system;
    if (system) systems.push(system);
    pending.push(...(trial.belowOf.get(id) ?? []));
  }
  return systems;
}

/**
 * A pair on a generator's decaying current, as `decrementFindings` checks it (IEEE Std 551 decrement,
 * IEEE C37.112 integration); `which` as in `coordination`. The rule is read from the trial's settings
 * at each evaluation, as the check reads the study's.
 */
function decrement(trial: Trial, upId: string, downId: string, which: 'below' | 'above'): Constraint {
  const other = trial.deviceOf(which === 'below' ? downId : upId);
  return {
    id: `decrement-${which}:${other.id}`,
    kind: which === 'below' ? 'coordinate-below' : 'coordinate-above',
    label: `coordinate with ${nameOf(other)} ${which} on the generator's decaying current`,
    source: 'generator decrement (IEEE Std 551) with time-varying-current integration (IEEE C37.112)',
    favours: which === 'below' ? 'slower' : 'faster',
    subjects: [other.id],
    evaluate: (t) => {
      const up = t.deviceOf(upId);
      const ids = { upstream: upId, downstream: downId };
      const rule = marginRuleOf(
        up.characteristic.kind,
        t.deviceOf(downId).characteristic.kind,
        t.settings,
        up.margin,
        ids,
      );
      const [finding] = decrementFindings({ ...t, pairs: [{ ...ids, kind: '', rule, cases: [] }] });
      const ok = finding.severity !== 'fail';
      const worst = finding.worst;
      const text = worst
        ? `${formatSeconds(worst.marginSeconds)} at ${formatAmps(worst.amps, 3)} on the decaying current`
        : finding.explanation;
      // Without a worst point: the downstream device never clears (a failure), or the pair is not worked
      // out on the decaying current (a single-phase bus), which limits no setting.
      return { ok, clean: ok, margin: worst?.marginSeconds ?? (ok ? Infinity : -Infinity), unit: 's', text };
    },
  };
}

/** A withstand check's findings as a constraint result: no failure, the least separation as margin. */
function withstandResult(findings: Finding[]): ConstraintResult {
  let ok = true;
  let margin = Infinity;
  let at = 0;
  for (const finding of findings) {
    if (finding.severity === 'fail') ok = false;
    if (finding.worst && finding.worst.upTime - finding.worst.downTime < margin) {
      margin = finding.worst.upTime - finding.worst.downTime;
      at = finding.worst.amps;
    }
  }
  const text = margin === Infinity ? 'clears below the curve' : `${formatSeconds(margin)} at ${formatAmps(at, 3)}`;
  return { ok, clean: ok, margin, unit: 's', text };
}

/** The time left between each inrush point and the device's earliest operation there (the check's own rule). */
function inrushResult(band: Band, markers: Marker[]): ConstraintResult {
  let margin = Infinity;
  let text = 'does not operate on inrush';
  for (const marker of markers) {
    const left = band.minTime(marker.amps) - marker.seconds!;
    if (left < margin) {
      margin = left;
      text = `${formatSeconds(left)} to spare at ${formatAmps(marker.amps, 3)}`;
    }
  }
  const ok = margin > 0;
  return {
    ok,
    clean: ok,
    margin,
    unit: 's',
    text: ok
      ? text
      : `may operate ${formatSeconds(-margin)} before the inrush at ${formatAmps(markers[0].amps, 3)} has decayed`,
  };
}

/**
 * Which way an NEC rating limit (240.4, 450.3) pulls a device's settings: lower for a relay without a
 * rating given, whose pickup is its rating, and for a trip unit with a rating given that meets the
 * limit (set above that rating it is rated at its setting, NEC 240.6(C), which the limit then bounds);
 * nowhere otherwise, and the limit is only reported: no setting mends a rating given too large.
 * `holds` asks the limit of a trial; the device is put back as it was.
 */
function ratingFavours(trial: Trial, device: Device, holds: (t: Trial) => boolean): Favours {
  const c = device.characteristic;
  if (device.rating === undefined) return c.kind === 'relay' ? 'faster' : 'fixed';
  if (c.kind !== 'trip-unit') return 'fixed';
  const placed = trial.deviceOf(device.id);
  const pickup = Math.min(c.longTime.pickup, device.rating / c.sensor);
  trial.place({ ...device, characteristic: { ...c, longTime: { ...c.longTime, pickup } } });
  const ok = holds(trial);
  trial.place(placed);
  return ok ? 'faster' : 'fixed';
}
