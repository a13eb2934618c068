import { CAUTION } from '../../engine/caution.ts';
import { expectedGot, InputError } from '../../engine/errors.ts';
import { significant } from '../../engine/quantity/index.ts';
import { settingText, settingWindowOf, type SettingWindow } from '../../engine/window/index.ts';
import { flagText, parseArgs } from '../args.ts';
import { scenarioFlag } from '../scenarioFlag.ts';
import type { Command } from '../command.ts';
import { loadStudyFile } from '../studyFile.ts';
import { formatTable } from '../table.ts';

const HELP = `discern window <study.json> --device ID — what one device may be set to, and why

  --device ID       the device (its id in the study)
  --scenario NAME   a study with operating scenarios: the window in that scenario's tree (default: the
                    first scenario that energises the device)
  --json            print the window as JSON: each setting's intervals with their binding constraints,
                    the 2-D maps, every constraint with its margin, the recommendation or the conflict

Each setting's feasible interval is found with the rest of the study held as it is; each edge names
the constraint that sets it. The recommendation is the fastest-clearing setting that keeps every
constraint. Exit code: 0 when a window exists; 1 when none does (the conflict and what would open one
are printed); 2 on bad input.
`;

/**
 * `discern window <study> --device ID`: the device's setting window (`settingWindowOf`) as tables —
 * each setting's feasible interval with the constraint at each edge, every constraint at the present
 * setting, then the recommendation with its margins, or the conflict and its remedies.
 *
 * @example await windowCommand.run(['demo/harrowmere-overlap.json', '--device', 'MAIN'], io)
 */
export const windowCommand: Command = {
  verb: 'window',
  summary: "a device's setting window: feasible settings, binding constraints, recommendation",
  help: HELP,
  async run(args, io) {
    const parsed = parseArgs(args, { device: 'value', json: 'switch', help: 'switch', scenario: 'value' });
    if (parsed.flags.has('help')) {
      io.stdout(HELP);
      return 0;
    }
    const [path, extra] = parsed.positionals;
    if (extra !== undefined) throw new InputError('window', expectedGot('one study file', extra));
    const deviceId = flagText(parsed, 'device');
    if (deviceId === undefined) throw new InputError('--device', expectedGot('a device id', undefined));
    const study = loadStudyFile(path, io, 'window');
    if (!study.devices.some((d) => d.id === deviceId)) {
      throw new InputError('--device', expectedGot(`one of ${study.devices.map((d) => d.id).join(', ')}`, deviceId));
    }
    const scenario = scenarioFlag(parsed, study)?.id;
    const window = windowNamingFlags(() =>
      settingWindowOf(study, deviceId, { maps: parsed.flags.has('json'), scenario }),
    );
    if (parsed.flags.has('json')) io.stdout(`${JSON.stringify(window, jsonValue, 2)}\n`);
    else io.stdout(`${windowText(window)}\n${CAUTION}\n`);
    return window.exists ? 0 : 1;
  },
};

/** The window, with a device the engine refuses (not energised in the scenario asked) named by its flag. */
function windowNamingFlags(work: () => SettingWindow): SettingWindow {
  try {
    return work();
  } catch (error) {
    if (error instanceof InputError && error.path === 'device') throw new InputError('--device', error.reason);
    throw error;
  }
}

/**
 * A constraint's state in words: FAIL where it fails, warn where it holds with a negative margin (a
 * generator's damage curve, the minimum fault's clearing time: bounds the checks only warn about, which
 * the recommendation may miss), else ok.
 */
function statusOf(result: { ok: boolean; margin: number }): string {
  return !result.ok ? 'FAIL' : result.margin < 0 ? 'warn' : 'ok';
}

/** JSON has no Infinity: unbounded margins print as the strings "Infinity" / "-Infinity". */
function jsonValue(_key: string, value: unknown): unknown {
  if (typeof value === 'number' && !Number.isFinite(value)) return String(value);
  return value;
}

/** The window as text: settings table, constraints, then recommendation or conflict. */
function windowText(window: SettingWindow): string {
  const lines: string[] = [`${window.deviceName} (${window.deviceId}, ${window.kind}) — setting window`, ''];
  if (!window.adjustable) {
    lines.push(`${window.deviceName} has no adjustable settings; it constrains the devices around it.`, '');
  } else {
    const rows = window.settings.map((s) => {
      const unit = s.unit;
      if (s.intervals.length === 0) {
        return [s.label, settingText(s.key, s.current, unit), 'none', s.blocked.map((b) => b.label).join('; '), ''];
      }
      const i = s.intervals[0];
      const range = `${significant(i.from, 4)}–${significant(i.to, 4)}${unit ? ` ${unit}` : ''}`;
      return [
        s.label,
        `${settingText(s.key, s.current, unit)}${s.inside ? '' : ' (outside)'}`,
        range,
        i.lower.label,
        i.upper.label,
      ];
    });
    lines.push(
      'Each setting with the others held as they are:',
      formatTable(['setting', 'now', 'window', 'lower edge set by', 'upper edge set by'], rows),
      '',
    );
    for (const s of window.switches) {
      const states = s.options
        .map((o, k) => `${settingText(s.key, o)} ${s.feasible[k] ? 'keeps every constraint' : 'does not'}`)
        .join('; ');
      lines.push(`${s.label}: now ${settingText(s.key, s.current)}; ${states}`);
    }
    if (window.switches.length > 0) lines.push('');
  }
  lines.push(
    'Constraints at the present setting:',
    formatTable(
      ['', 'constraint', 'margin', 'source'],
      window.constraints.map((c) => [
        `${statusOf(c.result)}${c.favours === 'fixed' ? '*' : ''}`,
        c.label,
        c.result.text,
        c.source,
      ]),
    ),
    '(* reported, not a setting; warn: a bound the checks only warn about, missed here)',
    '',
  );
  const rec = window.recommendation;
  if (rec) {
    lines.push(
      `Recommended${rec.changed ? '' : ' (the present setting is already the fastest)'}:`,
      formatTable(
        ['setting', 'now', 'recommended', 'held there by'],
        rec.settings.map((s) => [
          s.label,
          settingText(s.key, s.from, s.unit),
          settingText(s.key, s.to, s.unit),
          s.binding?.label ?? '',
        ]),
      ),
      '',
      'Margins at the recommended setting:',
      formatTable(
        ['', 'constraint', 'margin'],
        rec.margins.filter((m) => m.favours !== 'fixed').map((m) => [statusOf(m.result), m.label, m.result.text]),
      ),
      '',
      `How ties are broken: ${rec.tieBreak}`,
    );
  } else if (window.noWindow) {
    lines.push('No setting keeps every constraint.', window.noWindow.explanation, '');
    if (window.noWindow.remedies.length > 0) {
      lines.push('What would open a window:');
      for (const r of window.noWindow.remedies) lines.push(`- ${r.text}${r.verified ? ' (tried: it opens one)' : ''}`);
    }
  }
  return lines.join('\n');
}
