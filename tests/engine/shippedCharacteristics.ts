import { readdirSync, readFileSync } from 'node:fs';
import type { Characteristic } from '../../src/engine/devices/characteristic.ts';
import { parseStudy } from '../../src/engine/study/parse.ts';
import { curveTemplates } from '../../src/engine/templates/index.ts';

const demoDirectory = new URL('../../demo/', import.meta.url);

/**
 * Every characteristic the project ships: each curve template and each device of the demo studies,
 * named for the test that fails on it.
 * @example shippedCharacteristics().find(([name]) => name.startsWith('template'))
 */
export function shippedCharacteristics(): Array<[string, Characteristic]> {
  const found: Array<[string, Characteristic]> = curveTemplates.map((template) => [
    `template ${template.id}`,
    template.characteristic,
  ]);
  for (const file of readdirSync(demoDirectory).filter((name) => name.endsWith('.json'))) {
    const study = parseStudy(readFileSync(new URL(file, demoDirectory), 'utf8'));
    for (const device of study.devices) found.push([`${file} ${device.id}`, device.characteristic]);
  }
  return found;
}
