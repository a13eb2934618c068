import { CAUTION } from '../../engine/caution.ts';
import { expectedGot, InputError } from '../../engine/errors.ts';
import { proposeSettings, settingText, withSettingChanges, type Proposal } from '../../engine/window/index.ts';
import { flagText, parseArgs } from '../args.ts';
import type { Command } from '../command.ts';
import { loadStudyFile, readJsonFile } from '../studyFile.ts';
import { formatTable } from '../table.ts';
import { isSameFile } from '../sameFile.ts';

const HELP = `discern propose <study.json> [--view ID | --all] [--out proposed.json] — proposed settings

  --view ID         set only the devices of one view (a sheet's path)
  --all             set every adjustable device of the study (the default)
  --out FILE.json   write the study with the proposed settings to a new file (never the input)
  --json            print the proposal as JSON

From the loads toward the source, each adjustable device is set to its fastest-clearing setting
that keeps every constraint, given the devices below it; fuses and thermal-magnetic breakers stay
as they are. Prints every change before and after and the findings it clears or leaves.
Exit code: 0 when the proposed study has no failing finding; 1 when some remain; 2 on bad input.
`;

/**
 * `discern propose <study>`: proposed settings for one view's devices or the whole study
 * (`proposeSettings`), printed as a list of changes with the findings they clear or leave, and
 * written with `--out` to a new study file (the input is never touched).
 *
 * @example await proposeCommand.run(['demo/harrowmere-overlap.json', '--out', 'out/proposed.json'], io)
 */
export const proposeCommand: Command = {
  verb: 'propose',
  summary: 'proposed settings for a path or the whole study, written to a new file',
  help: HELP,
  async run(args, io) {
    const parsed = parseArgs(args, { view: 'value', all: 'switch', out: 'value', json: 'switch', help: 'switch' });
    if (parsed.flags.has('help')) {
      io.stdout(HELP);
      return 0;
    }
    const [path, extra] = parsed.positionals;
    if (extra !== undefined) throw new InputError('propose', expectedGot('one study file', extra));
    const viewId = flagText(parsed, 'view');
    if (viewId !== undefined && parsed.flags.has('all')) {
      throw new InputError('--all', expectedGot('either --view or --all, not both', '--all'));
    }
    const out = flagText(parsed, 'out');
    if (out !== undefined && !/\.json$/i.test(out))
      throw new InputError('--out', expectedGot('a file name ending .json', out));
    if (out !== undefined && path !== undefined && isSameFile(out, path)) {
      throw new InputError('--out', expectedGot('a new file, not the input study', out));
    }
    const study = loadStudyFile(path, io, 'propose');
    let deviceIds: string[] | undefined;
    if (viewId !== undefined) {
      const view = study.views.find((v) => v.id === viewId);
      if (!view) {
        const known = study.views.map((v) => v.id).join(', ') || 'no views in this study';
        throw new InputError('--view', expectedGot(`one of ${known}`, viewId));
      }
      deviceIds = view.devices;
    }
    const proposal = proposeSettings(study, { deviceIds });
    if (out !== undefined) {
      const document = readJsonFile(path!, io.readText, 'study');
      const written = withSettingChanges(document, proposal.changes);
      io.writeFile(out, `${JSON.stringify(written, null, 2)}\n`);
    }
    if (parsed.flags.has('json')) io.stdout(`${JSON.stringify(jsonOf(proposal), null, 2)}\n`);
    else
      io.stdout(
        `${study.name}\n${proposalText(proposal)}${out ? `\nProposed study written to ${out}.` : ''}\n${CAUTION}\n`,
      );
    return proposal.failsAfter > 0 ? 1 : 0;
  },
};

/** The proposal for machines: without the parsed study, findings as id, severity and title. */
function jsonOf(proposal: Proposal) {
  const brief = (f: { id: string; severity: string; title: string }) => ({
    id: f.id,
    severity: f.severity,
    title: f.title,
  });
  const { study: _study, ...rest } = proposal;
  void _study;
  return {
    ...rest,
    cleared: proposal.cleared.map(brief),
    remaining: proposal.remaining.map(brief),
    introduced: proposal.introduced.map(brief),
  };
}

/** The proposal as text: changes, devices without a window, findings cleared and left. */
function proposalText(proposal: Proposal): string {
  const lines: string[] = [];
  if (proposal.changes.length === 0)
    lines.push('No setting changes: every adjustable device is already at its recommendation.');
  else {
    lines.push(
      `Proposed changes (${proposal.changes.length}, in the order set):`,
      formatTable(
        ['device', 'setting', 'now', 'proposed', 'held there by'],
        proposal.changes.map((c) => [
          c.deviceName,
          c.label,
          settingText(c.key, c.from, c.unit),
          settingText(c.key, c.to, c.unit),
          c.binding?.label ?? '',
        ]),
      ),
    );
  }
  for (const d of proposal.devices.filter((x) => !x.exists)) {
    lines.push(
      '',
      `${d.deviceName} keeps its settings: no setting keeps every constraint. ${d.noWindow?.explanation ?? ''}`,
    );
  }
  lines.push('', `Order: ${proposal.orderRule}`, `Ties: ${proposal.tieBreak}`, '');
  lines.push(`Failing findings: ${proposal.failsBefore} before, ${proposal.failsAfter} after.`);
  const list = (title: string, findings: Proposal['cleared']) => {
    if (findings.length === 0) return;
    lines.push(`${title}:`);
    for (const f of findings) lines.push(`- ${f.severity}: ${f.title}`);
  };
  list('Cleared', proposal.cleared);
  list('Left', proposal.remaining);
  list('New with the proposal', proposal.introduced);
  return lines.join('\n');
}
