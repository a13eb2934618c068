import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { radialStudy } from '../../../bench/radialStudy.ts';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { cableAmpacityFindings } from '../../../src/engine/checks/cableAmpacity.ts';
import { cableFindings } from '../../../src/engine/checks/cableProtection.ts';
import type { CheckContext } from '../../../src/engine/checks/context.ts';
import type { Finding } from '../../../src/engine/checks/finding.ts';
import { loadFindings } from '../../../src/engine/checks/loadCarrying.ts';
import { motorFindings } from '../../../src/engine/checks/motorStarting.ts';
import { sensitivityFindings } from '../../../src/engine/checks/sensitivity.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

/** What a finding says, every sentence read. */
const said = (findings: Finding[]) => JSON.parse(JSON.stringify(findings)) as unknown;

// An item that is not the network's own (a copy of it) gets findings writing their own sentences:
// the reference the shared builders are held to.
describe('shared sentence builders', () => {
  const studies = {
    'the full demo': parseStudy(readFileSync('demo/harrowmere-full.json', 'utf8')),
    'a generated 300-device study': parseStudy(radialStudy(300)),
  };

  it.each(Object.entries(studies))('write what each finding would write itself, in %s', (_name, study) => {
    const { network, faults, bands } = analyseStudy(study);
    const context: CheckContext = { network, faults, bands };
    const { horizon, sensitivity } = study.coordination;
    let compared = 0;
    const same = (shared: Finding[], own: Finding[]) => {
      expect(said(shared)).toEqual(said(own));
      compared += shared.length;
    };
    // Read in an order of their own: later findings first, then the first one again.
    for (const cable of [...study.cables].reverse()) {
      same(cableFindings(context, cable, horizon), cableFindings(context, { ...cable }, horizon));
      same(cableAmpacityFindings(context, cable), cableAmpacityFindings(context, { ...cable }));
    }
    for (const motor of study.motors) same(motorFindings(context, motor), motorFindings(context, { ...motor }));
    for (const device of study.devices) {
      same(loadFindings(network, device), loadFindings(network, { ...device }));
      same(sensitivityFindings(context, device, sensitivity), sensitivityFindings(context, { ...device }, sensitivity));
    }
    expect(compared).toBeGreaterThan(20);
  });

  it("reads each sentence and range of an analysis's findings, in any order, as the finding's own", () => {
    const study = studies['a generated 300-device study'];
    const first = analyseStudy(study).findings;
    const second = analyseStudy(study).findings;
    // One analysis's findings read back to front and basis first, the other's front to back.
    const backwards = [...first].reverse().map((f) => [f.basis, f.suggestion, f.explanation, f.range]);
    expect(backwards.reverse()).toEqual(second.map((f) => [f.basis, f.suggestion, f.explanation, f.range]));
    expect(first.every((f) => f.explanation.length > 0)).toBe(true);
  });
});
