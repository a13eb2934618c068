import type { Finding } from '../../engine/checks/finding.ts';
import { formatSeconds } from '../../engine/quantity/index.ts';

/**
 * The two times at a finding's worst point, each named by what it belongs to: for a pair (at constant
 * currents or on a generator's decaying current) its two devices, the upstream one first; for a
 * withstand check the damage curve and the device that must clear before it. Accepts a finding with
 * `worst` and a lookup of display names by id.
 *
 * @example worstTimesOf(finding, nameOf) // 'Main may operate from 0.35 s; Feeder clears by 0.1 s'
 */
export function worstTimesOf(finding: Finding, nameOf: (id: string) => string): string {
  const { upTime, downTime } = finding.worst!;
  const [first, second] = finding.subjects;
  if (finding.kind === 'coordination' || finding.kind === 'generator-decrement') {
    const up = Number.isFinite(upTime) ? `may operate from ${formatSeconds(upTime)}` : 'does not operate';
    return `${nameOf(first)} ${up}; ${nameOf(second)} clears by ${formatSeconds(downTime)}`;
  }
  if (['transformer-withstand', 'cable-withstand', 'generator-withstand'].includes(finding.kind))
    return `${nameOf(second)}'s damage curve at ${formatSeconds(upTime)}; ${nameOf(first)} clears by ${formatSeconds(downTime)}`;
  return `${nameOf(second ?? first)} at ${formatSeconds(upTime)}; ${nameOf(first)} at ${formatSeconds(downTime)}`;
}
