// The setting window's trials: a device put in place of another of its id, with trial settings, is the
// one every check of the trial finds (DEVELOPERS.md, the window). Invented data (`fixtures.ts`).
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { protectingDevice } from '../../../src/engine/checks/context.ts';
import { nec450Findings } from '../../../src/engine/checks/nec450.ts';
import { upstreamDeviceOf } from '../../../src/engine/network/index.ts';
import { parseStudy, type StudyInput } from '../../../src/engine/study/index.ts';
import { trialOf } from '../../../src/engine/window/trial.ts';
import { workedStudy } from './fixtures.ts';

/** The worked study with the service relay's time-overcurrent pickup (A secondary, CT 100:5) set to `pickup`. */
function withRelayPickup(pickup: number): StudyInput {
  const input = workedStudy();
  return {
    ...input,
    devices: input.devices!.map((device) =>
      device.id === 'R-T1' && device.characteristic.kind === 'relay'
        ? {
            ...device,
            characteristic: {
              ...device.characteristic,
              timeOvercurrent: { ...device.characteristic.timeOvercurrent!, pickup },
            },
          }
        : device,
    ),
  };
}

const sentences = (findings: { severity: string; explanation: string }[]) =>
  findings.map(({ severity, explanation }) => [severity, explanation]);

describe("a trial setting of the service transformer's primary relay", () => {
  const study = parseStudy(workedStudy());
  const trial = trialOf(study);
  const raised = parseStudy(withRelayPickup(10)).devices.find((device) => device.id === 'R-T1')!;
  const before = nec450Findings(trial, study.transformers[0], study.coordination.edition);
  trial.place(raised);

  it('is the device protecting the transformer and the one above the main', () => {
    expect(protectingDevice(trial, 'T1')).toBe(raised);
    expect(upstreamDeviceOf(trial.network, trial.deviceOf('MAIN'))).toBe(raised);
  });

  it('is the setting NFPA 70 450.3 reads: 200 A primary, as in the study re-read with that pickup', () => {
    const tried = nec450Findings(trial, study.transformers[0], study.coordination.edition);
    const reread = analyseStudy(parseStudy(withRelayPickup(10))).findings.filter(
      (finding) => finding.kind === 'nec-450.3' && finding.subjects.includes('T1'),
    );
    expect(sentences(tried)).toEqual(sentences(reread));
    expect(sentences(tried)).not.toEqual(sentences(before));
  });
});
