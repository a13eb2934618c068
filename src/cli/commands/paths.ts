import { expectedGot, InputError } from '../../engine/errors.ts';
import { networkOf } from '../../engine/network/index.ts';
import { pathViewsOf } from '../../engine/views/index.ts';
import { flagText, parseArgs } from '../args.ts';
import type { Command } from '../command.ts';
import { loadStudyFile } from '../studyFile.ts';
import { isSameFile } from '../sameFile.ts';

const HELP = `discern paths <study.json> --out FILE.json — one sheet per protective path, added to a copy

  --out FILE        the new study file (never the input itself)

Each load-side device gets a sheet with every device above it up to the source (paths that share all
devices but the last share a sheet), with the withstand curves of the transformers and cables the path
runs through and the starting curves of the motors it feeds. Sheets the study already has are kept.
`;

/**
 * `discern paths <study> --out new.json`: writes the study with one view per protective path added.
 * @example await pathsCommand.run(['demo/harrowmere-full.json', '--out', 'out/with-paths.json'], io)
 */
export const pathsCommand: Command = {
  verb: 'paths',
  summary: 'a copy of the study with one time-current sheet per protective path',
  help: HELP,
  async run(args, io) {
    const parsed = parseArgs(args, { out: 'value', help: 'switch' });
    if (parsed.flags.has('help')) {
      io.stdout(HELP);
      return 0;
    }
    const [path, extra] = parsed.positionals;
    if (extra !== undefined) throw new InputError('paths', expectedGot('one study file', extra));
    const out = flagText(parsed, 'out');
    if (!out || !/\.json$/i.test(out)) throw new InputError('--out', expectedGot('a file name ending .json', out));
    if (path !== undefined && isSameFile(out, path))
      throw new InputError('--out', expectedGot('a file other than the input', out));
    const study = loadStudyFile(path, io, 'paths');
    const views = pathViewsOf(networkOf(study));
    // The study is written as the user wrote it, with the new views appended: nothing else changes.
    const raw = JSON.parse(io.readText(path!).replace(/^\uFEFF/, '')) as { views?: unknown[] };
    raw.views = [...(raw.views ?? []), ...views];
    io.writeFile(out, `${JSON.stringify(raw, null, 2)}\n`);
    io.stdout(`${study.name}: ${views.length} sheets added, wrote ${out}\n`);
    return 0;
  },
};
