import { expectedGot, InputError } from '../engine/errors.ts';
import { scenariosOf } from '../engine/scenario/index.ts';
import type { Scenario, Study } from '../engine/study/index.ts';
import { flagText, type ParsedArgs } from './args.ts';

/**
 * The scenario `--scenario NAME` names (by id, else by name), or `undefined` when the flag is
 * absent. Throws `InputError` naming `--scenario` and listing the study's scenario ids when no
 * scenario matches, and when `--all-scenarios` is given as well.
 *
 * @example scenarioFlag(parsed, study)?.id // 'on-generator'
 */
export function scenarioFlag(parsed: ParsedArgs, study: Study): Scenario | undefined {
  const name = flagText(parsed, 'scenario');
  if (name === undefined) return undefined;
  if (parsed.flags.has('all-scenarios'))
    throw new InputError('--scenario', expectedGot('either --scenario or --all-scenarios', name));
  const all = scenariosOf(study);
  const found = all.find((s) => s.id === name) ?? all.find((s) => s.name === name);
  if (!found) throw new InputError('--scenario', expectedGot(`one of ${all.map((s) => `"${s.id}"`).join(', ')}`, name));
  return found;
}
