import { readFileSync } from 'node:fs';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { parseStudy } from '../../src/engine/study/index.ts';
import { sheetOf } from '../../src/plot/sheet.ts';
import { svgOf } from '../../src/plot/svg.ts';
import { viewInputOf } from '../../src/plot/viewInput.ts';

// Sheets of the shipped demo studies (the demo studies, invented site and illustrative curves), one per view worth reviewing.
const analysed = new Map<string, ReturnType<typeof analyseStudy>>();

function demoSheet(file: string, view: string): string {
  if (!analysed.has(file)) {
    const text = readFileSync(new URL(`../../demo/${file}.json`, import.meta.url), 'utf8');
    analysed.set(file, analyseStudy(parseStudy(text)));
  }
  return svgOf(sheetOf(viewInputOf(analysed.get(file)!, view), { width: 960, height: 720 }));
}

/** Named SVG sheets; each becomes `tests/output/<name>.svg`. */
export const demoPlots: Record<string, () => string> = {
  'selective-service': () => demoSheet('harrowmere-selective', 'service'),
  'selective-primary': () => demoSheet('harrowmere-selective', 'primary'),
  'overlap-service': () => demoSheet('harrowmere-overlap', 'service'),
  'overlap-emergency': () => demoSheet('harrowmere-overlap', 'emergency'),
  'fused-primary': () => demoSheet('harrowmere-fused', 'primary'),
  'fused-office': () => demoSheet('harrowmere-fused', 'office'),
};
