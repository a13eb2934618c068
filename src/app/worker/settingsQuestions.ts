import { treeHolding } from '../../engine/scenario/index.ts';
import type { Study } from '../../engine/study/index.ts';
import { proposeSettings, settingWindowOf, type SettingChange, type SettingWindow } from '../../engine/window/index.ts';

/**
 * What the Window panel asks of the settings' worker: one device's setting window (in a switched
 * study, in the chosen scenario's tree holding it, else the first scenario's that energises it), or
 * proposals for some devices (every device when `deviceIds` is left out).
 */
export type SettingsQuestion =
  { kind: 'window'; deviceId: string; scenarioId?: string } | { kind: 'proposal'; deviceIds?: string[] };

/**
 * What the Window panel shows of a proposal. The findings it clears, leaves and brings stay behind:
 * a large study has thousands, and each would have its sentences written only to cross the thread.
 */
export interface ProposalSummary {
  changes: SettingChange[];
  failsBefore: number;
  failsAfter: number;
  /** The devices that keep their settings, and why. */
  kept: { deviceId: string; deviceName: string; explanation?: string }[];
}

/** The answer to a question, as plain data that survives structured cloning. */
export type SettingsAnswer =
  { kind: 'window'; window?: SettingWindow } | { kind: 'proposal'; proposal: ProposalSummary };

/**
 * Answers a question about `study`. A window for a device the study does not have (deleted while
 * the question crossed) is no window; a proposal the proposer refuses throws with its reason.
 *
 * @example answerOf(study, { kind: 'window', deviceId: 'MAIN' })
 */
export function answerOf(study: Study, question: SettingsQuestion): SettingsAnswer {
  if (question.kind === 'proposal') {
    const proposal = proposeSettings(study, { deviceIds: question.deviceIds });
    return {
      kind: 'proposal',
      proposal: {
        changes: proposal.changes,
        failsBefore: proposal.failsBefore,
        failsAfter: proposal.failsAfter,
        kept: proposal.devices
          .filter((device) => !device.exists)
          .map(({ deviceId, deviceName, noWindow }) => ({ deviceId, deviceName, explanation: noWindow?.explanation })),
      },
    };
  }
  const { deviceId, scenarioId } = question;
  if (!study.devices.some((device) => device.id === deviceId)) return { kind: 'window' };
  const tree = treeHolding(study, deviceId, scenarioId) ?? treeHolding(study, deviceId);
  return { kind: 'window', window: tree && settingWindowOf(tree, deviceId) };
}
