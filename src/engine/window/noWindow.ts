import { nameOf } from '../checks/context.ts';
import type { Device } from '../study/index.ts';
import { constraintsOf, type Constraint } from './constraints.ts';
import { recommendationOf, type Attempt } from './recommendation.ts';
import type { Binding } from './settingInterval.ts';
import { adjustableSettingsOf, type SettingValue } from './settings.ts';
import { changesText } from './settingText.ts';
import { overridesOf, windowIn } from './settingWindow.ts';
import type { Trial } from './trial.ts';

/** A change elsewhere that would open a window, in words a new engineer follows. */
export interface Remedy {
  text: string;
  /** The change was tried in the study and a window opens with it. */
  verified: boolean;
  /** The setting changes on other devices, when the remedy computed them. */
  changes?: { deviceId: string; key: string; label: string; unit: string; from?: SettingValue; to?: SettingValue }[];
}

/** Why a device has no setting window. */
export interface NoWindow {
  /** The constraints that cannot all hold. */
  conflicts: Binding[];
  explanation: string;
  /** Changes elsewhere, the tried-and-verified ones first. */
  remedies: Remedy[];
}

/** Options of `noWindowOf`. */
export interface NoWindowOptions {
  /** Try changes on other devices and margins to find one that opens a window. @default true */
  remedies?: boolean;
  includeAbove?: boolean;
}

/**
 * Explains an empty window from the recommendation's attempts: which constraints clash (a constraint
 * not met even at the slowest setting, or a faster-favoured one failing where the devices below
 * already hold the settings), and the smallest changes elsewhere that open one — each tried in the
 * trial where it can be (speed up a device below to its own fastest window, slow the device above,
 * accept a thinner margin), else said in words (a smaller fuse, a breaker with a lower magnetic trip,
 * a larger sensor). Leaves the trial as it found it.
 *
 * @example noWindowOf(trial, 'MAIN', constraints, attempts).explanation
 */
export function noWindowOf(
  trial: Trial,
  deviceId: string,
  constraints: Constraint[],
  attempts: Attempt[],
  options: NoWindowOptions = {},
): NoWindow {
  const { remedies: search = true, includeAbove = true } = options;
  const device = trial.deviceOf(deviceId);
  const name = nameOf(device);
  // The attempt with the present on/off choices comes first; prefer one that at least waits for the devices below.
  const attempt = attempts.find((a) => a.blockedAtSlowest.length === 0) ?? attempts[0];
  const switchWords = Object.entries(attempt?.switches ?? {})
    .map(([key, on]) => (key === 'instantaneous' ? `instantaneous ${on ? 'on' : 'off'}` : `I²t ${on ? 'in' : 'out'}`))
    .join(', ');
  const withSwitches = switchWords ? ` (${switchWords})` : '';
  let conflicts: Binding[];
  let explanation: string;
  if (!attempt) {
    conflicts = [];
    explanation = `${name} has no adjustable settings.`;
  } else if (attempt.blockedAtSlowest.length > 0) {
    conflicts = attempt.blockedAtSlowest;
    explanation = `Even at its slowest settings${withSwitches}, ${name} cannot ${lowerFirst(conflicts.map((c) => c.label).join('; nor '))}. The device needs a change elsewhere, below it or to its own rating.`;
  } else if (attempt.holding.length === 0) {
    conflicts = attempt.failedAtFastest;
    explanation = `Even at its fastest settings${withSwitches}, ${name} cannot ${lowerFirst(conflicts.map((c) => c.label).join('; nor '))}.`;
  } else {
    conflicts = [...attempt.holding, ...attempt.failedAtFastest];
    explanation = `To ${attempt.holding.map((c) => lowerFirst(c.label)).join(' and ')}, ${name}'s settings cannot go any lower${withSwitches}; and there it can no longer ${attempt.failedAtFastest
      .map((c) => lowerFirst(c.label))
      .join(', nor ')}. Both cannot hold at once.`;
  }

  const remedies: Remedy[] = [];
  if (search && attempt) {
    for (const conflict of conflicts)
      remedies.push(...remediesFor(trial, device, conflict, constraints, attempt, includeAbove));
  }
  trial.place(device);
  const unique = [...new Map(remedies.map((r) => [r.text, r])).values()];
  unique.sort((a, b) => Number(b.verified) - Number(a.verified));
  return { conflicts, explanation, remedies: unique };
}

/** The remedies for one conflicting constraint. */
function remediesFor(
  trial: Trial,
  device: Device,
  conflict: Binding,
  constraints: Constraint[],
  attempt: Attempt,
  includeAbove: boolean,
): Remedy[] {
  const name = nameOf(device);
  const constraint = constraints.find((c) => c.id === conflict.id);
  // The same search as the window's own, with the device's own ranges: a remedy opens a window exactly
  // when the window would then say one exists.
  const opens = () => {
    const fresh = constraintsOf(trial, device.id, { includeAbove });
    return recommendationOf(trial, device.id, fresh, { overrides: overridesOf(device) }).recommendation !== undefined;
  };
  switch (conflict.kind) {
    case 'coordinate-below': {
      const other = trial.deviceOf(constraint!.subjects[0]);
      const out: Remedy[] = [];
      const family = other.characteristic.kind;
      if (family === 'fuse') {
        out.push({
          text: `Use a smaller or faster fuse for ${nameOf(other)} (a lower ampere rating, or a current-limiting class), so it clears sooner and ${name} can wait for it.`,
          verified: false,
        });
      } else if (family === 'thermal-magnetic') {
        out.push({
          text: `Use a breaker for ${nameOf(other)} with a lower magnetic (instantaneous) trip, or one with an adjustable electronic trip unit, so it clears sooner and ${name} can wait for it.`,
          verified: false,
        });
      } else {
        const own = windowIn(trial, other.id, { maps: false, includeAbove: false, remedies: false }).recommendation;
        if (own?.changed) {
          trial.place(own.device);
          const verified = opens();
          trial.place(other);
          out.push({
            text: `Speed up ${nameOf(other)} to the fastest setting its own devices below allow: ${changesText(own.settings)}.${verified ? ` Then ${name} has a window.` : ` That alone does not open a window for ${name}.`}`,
            verified,
            changes: own.settings
              .filter((s) => s.from !== s.to)
              .map((s) => ({ deviceId: other.id, key: s.key, label: s.label, unit: s.unit, from: s.from, to: s.to })),
          });
        } else {
          out.push({
            text: `Lower ${nameOf(other)}'s instantaneous or short-time settings (or use I²t out) so it clears sooner; its own window shows how far it may go.`,
            verified: false,
          });
        }
      }
      out.push(...thinnerMargin(trial, device.id, other.id, device.id, opens));
      return out;
    }
    case 'coordinate-above': {
      const other = trial.deviceOf(constraint!.subjects[0]);
      if (adjustableSettingsOf(other).length === 0) {
        return [
          {
            text: `Use a larger or slower device above (${nameOf(other)}), so that it waits for ${name}.`,
            verified: false,
          },
          ...thinnerMargin(trial, device.id, device.id, other.id, opens),
        ];
      }
      if (attempt.point) trial.place(attempt.point);
      const own = windowIn(trial, other.id, { maps: false, remedies: false }).recommendation;
      const out: Remedy[] = [];
      if (own?.changed) {
        trial.place(own.device);
        trial.place(device);
        const verified = opens();
        trial.place(other);
        out.push({
          text: `Slow ${nameOf(other)} above so that it waits for ${name}: ${changesText(own.settings)}.${verified ? ` Then ${name} has a window.` : ''}`,
          verified,
          changes: own.settings
            .filter((s) => s.from !== s.to)
            .map((s) => ({ deviceId: other.id, key: s.key, label: s.label, unit: s.unit, from: s.from, to: s.to })),
        });
      } else {
        out.push({
          text: `Slow ${nameOf(other)} above (a higher time dial, a longer delay or a higher pickup), so that it waits for ${name}.`,
          verified: false,
        });
      }
      trial.place(device);
      out.push(...thinnerMargin(trial, device.id, device.id, other.id, opens));
      return out;
    }
    case 'transformer-withstand':
    case 'cable-withstand':
      return [
        {
          text: `${name} cannot both wait for the devices below and clear before the equipment's limit (${conflict.label}). Make the devices below faster (a lower instantaneous, I²t out, a smaller fuse) so that ${name} can be set faster, or protect the equipment with a faster device.`,
          verified: false,
        },
      ];
    case 'carry-load':
      return [
        {
          text: `The load needs a pickup above ${name}'s range: use a larger sensor or rating plug (or CT ratio).`,
          verified: false,
        },
      ];
    case 'inrush':
    case 'motor-starting':
      return [
        {
          text: `${name} cannot ${lowerFirst(conflict.label)} even at its slowest: use a larger sensor or CT ratio, or a device with a higher instantaneous range.`,
          verified: false,
        },
      ];
    case 'sensitivity':
      return [
        {
          text: `${name} cannot see the smallest fault at the end of its zone once it waits for the devices below: lower their pickups so ${name} can come down, or note that the devices below alone clear that fault.`,
          verified: false,
        },
      ];
    case 'cable-ampacity':
      return [
        {
          text: `Use a larger conductor or more parallel sets below ${name} (or a smaller CT ratio), so it can be set within NEC 240.4 while it waits for the devices below.`,
          verified: false,
        },
      ];
    case 'nec-450.3':
      return [
        {
          text: `Choose a smaller CT ratio or pickup range so ${name} can be set within NEC 450.3 while it waits for the devices below.`,
          verified: false,
        },
      ];
    default:
      return [];
  }
}

/**
 * "Accept a thinner margin": the largest margin for the pair (between 0 and its rule's) that opens a
 * window, found by bisection on the study's per-pair margin. Only for plain-margin rules above 0.
 */
function thinnerMargin(trial: Trial, deviceId: string, upId: string, downId: string, opens: () => boolean): Remedy[] {
  const constraint = constraintsOf(trial, deviceId).find((c) => c.id === `below:${downId}` || c.id === `above:${upId}`);
  if (!constraint) return [];
  const required = constraint.rule && constraint.rule.timeRatio === 1 ? constraint.rule.margin : 0;
  if (!(required > 0)) return [];
  const original = trial.settings;
  const withMargin = (margin: number) => {
    trial.settings = {
      ...original,
      pairs: [
        ...original.pairs.filter((p) => !(p.upstream === upId && p.downstream === downId)),
        { upstream: upId, downstream: downId, margin },
      ],
    };
    const result = opens();
    trial.settings = original;
    return result;
  };
  if (!withMargin(0)) return [];
  let lo = 0;
  let hi = required;
  for (let i = 0; i < 7; i++) {
    const mid = (lo + hi) / 2;
    if (withMargin(mid)) lo = mid;
    else hi = mid;
  }
  const margin = Math.floor(lo * 100) / 100;
  const up = nameOf(trial.deviceOf(upId));
  const down = nameOf(trial.deviceOf(downId));
  return [
    {
      text: `Accept a thinner margin between ${up} and ${down}: ${margin} s instead of ${required} s (set it for this pair in the study's coordination settings), only where relay overtravel and breaker times are known to allow it.`,
      verified: true,
    },
  ];
}

function lowerFirst(text: string): string {
  return text.charAt(0).toLowerCase() + text.slice(1);
}
