import { analyseStudy } from '../../engine/analysis.ts';
import { CAUTION } from '../../engine/caution.ts';
import { expectedGot, InputError } from '../../engine/errors.ts';
import { csvReport, findingRows, jsonReport, markdownReport, summaryText } from '../../engine/report/index.ts';
import { flagText, parseArgs } from '../args.ts';
import type { Command } from '../command.ts';
import { loadStudyFile } from '../studyFile.ts';
import { formatTable } from '../table.ts';

const HELP = `discern check <study.json> — every pair, transformer, cable, motor and code check

  --json            print the findings, pairs and fault levels as JSON
  --report FILE     also write a report: FILE ending .md (Markdown) or .csv
  --all             list passing checks too (default: only what needs attention, then a count)

Exit code: 0 when nothing fails (every pair selective or only thin / not provable from curves,
every transformer and cable protected, code limits met); 1 when any check fails; 2 on bad input.
`;

/**
 * `discern check <study>`: runs `analyseStudy` and prints the findings table, failures first, with the
 * summary and the caution; `--json` for machines, `--report out.md|.csv` for the study report.
 *
 * @example await checkCommand.run(['demo/harrowmere-overlap.json', '--report', 'out/findings.md'], io)
 */
export const checkCommand: Command = {
  verb: 'check',
  summary: 'coordination, transformer, cable, motor and NEC checks with a findings report',
  help: HELP,
  async run(args, io) {
    const parsed = parseArgs(args, { json: 'switch', report: 'value', all: 'switch', help: 'switch' });
    if (parsed.flags.has('help')) {
      io.stdout(HELP);
      return 0;
    }
    const [path, extra] = parsed.positionals;
    if (extra !== undefined) throw new InputError('check', expectedGot('one study file', extra));
    const report = flagText(parsed, 'report');
    if (report !== undefined && !/\.(md|csv)$/i.test(report)) {
      throw new InputError('--report', expectedGot('a file name ending .md or .csv', report));
    }
    const study = loadStudyFile(path, io, 'check');
    const analysis = analyseStudy(study);
    if (report !== undefined)
      io.writeFile(report, /\.csv$/i.test(report) ? csvReport(analysis) : markdownReport(analysis));
    if (parsed.flags.has('json')) {
      io.stdout(`${JSON.stringify(jsonReport(analysis), null, 2)}\n`);
    } else {
      const rows = findingRows(analysis).filter((row) => parsed.flags.has('all') || row.severity !== 'ok');
      const table = formatTable(
        ['severity', 'finding', 'current range', 'worst margin'],
        rows.map((row) => [row.severity, row.title, row.range, row.worst]),
      );
      const details = rows
        .filter((row) => row.severity === 'fail' || row.severity === 'warning')
        .map((row) => `- ${row.title}\n  ${row.explanation}${row.suggestion ? `\n  → ${row.suggestion}` : ''}`)
        .join('\n');
      io.stdout(
        `${study.name}\n${rows.length > 0 ? `${table}\n` : ''}\n${details ? `${details}\n\n` : ''}${summaryText(analysis)}${report ? `; report written to ${report}` : ''}\n${CAUTION}\n`,
      );
    }
    return analysis.counts.fail > 0 ? 1 : 0;
  },
};
