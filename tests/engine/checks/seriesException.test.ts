import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { inSeriesAlone } from '../../../src/engine/checks/seriesException.ts';
import { networkOf } from '../../../src/engine/network/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

// The selective demo's tree: relay R-T1 on T1's primary, MAIN the one main on its secondary bus SWBD, the
// feeders FDR-* on SWBD, and the branch breaker EM-BR on the emergency panel.
const network = networkOf(parseStudy(readFileSync('demo/harrowmere-selective.json', 'utf8')));

describe('inSeriesAlone (NFPA 70 708.54 Exception: no load in parallel with the downstream device)', () => {
  it('holds for a transformer primary device over the one main on its secondary', () => {
    expect(inSeriesAlone(network, 'R-T1', 'MAIN')).toBe(true);
  });

  it('does not hold across a bus, where loads in parallel can be connected, nor the other way round', () => {
    expect(inSeriesAlone(network, 'MAIN', 'FDR-EM')).toBe(false);
    expect(inSeriesAlone(network, 'FDR-EM', 'EM-BR')).toBe(false);
    expect(inSeriesAlone(network, 'MAIN', 'R-T1')).toBe(false);
    expect(inSeriesAlone(network, 'R-T1', 'NOPE')).toBe(false);
  });
});
