import { CAUTION } from '../../engine/caution.ts';
import { expectedGot, InputError } from '../../engine/errors.ts';
import {
  classesText,
  countsText,
  csvReport,
  findingClassesOf,
  findingRows,
  jsonReport,
  markdownReport,
  scenarioCountsOf,
  summaryText,
} from '../../engine/report/index.ts';
import type { Analysis } from '../../engine/analysis.ts';
import { analyseScenarios } from '../../engine/scenario/index.ts';
import { flagText, parseArgs } from '../args.ts';
import type { Command } from '../command.ts';
import { scenarioFlag } from '../scenarioFlag.ts';
import { loadStudyFile } from '../studyFile.ts';
import { formatTable, wrapText } from '../table.ts';

/** Widest line the findings table and details print, in characters. */
const WIDTH = 120;

const HELP = `discern check <study.json> — every pair, transformer, cable, motor, duty, sensitivity and code check

  --json            print the findings, pairs and fault levels as JSON
  --report FILE     also write a report: FILE ending .md (Markdown) or .csv
  --all             list passing checks too (default: only what needs attention, then a count)
  --strict          also exit 1 on a thin margin or a region not provable from curves
  --all-scenarios   check every operating scenario (the default)
  --scenario NAME   check one scenario only, by id or name (e.g. on-generator)

A study with generators, switches or scenarios is checked in each scenario, each source's tree on
its own; a finding that holds in only some of them is marked with their names, [On generator].

Without --json, the last line counts each class for a review script:
  counts: F fail, T thin margin, N not provable, W warning, I info, K ok

Exit code: 0 when nothing fails (every pair selective or only thin / not provable from curves,
every transformer and cable protected, code limits and interrupting ratings met, every device
sensitive); with --strict, 0 only when there is also no thin margin and nothing unprovable;
1 otherwise (a failure in any scenario checked); 2 on bad input.
`;

/**
 * `discern check <study>`: runs `analyseScenarios` (every scenario, or `--scenario NAME`) and prints the findings table, failures first, with the
 * summary and the caution; `--json` for machines, `--report out.md|.csv` for the study report.
 *
 * @example await checkCommand.run(['demo/harrowmere-overlap.json', '--report', 'out/findings.md'], io)
 */
export const checkCommand: Command = {
  verb: 'check',
  summary: 'coordination, transformer, cable, motor and NEC checks with a findings report',
  help: HELP,
  async run(args, io) {
    const parsed = parseArgs(args, {
      json: 'switch',
      report: 'value',
      all: 'switch',
      strict: 'switch',
      'all-scenarios': 'switch',
      scenario: 'value',
      help: 'switch',
    });
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
    const only = scenarioFlag(parsed, study)?.id;
    const analysis = analyseScenarios(study, { only });
    if (report !== undefined)
      io.writeFile(report, /\.csv$/i.test(report) ? csvReport(analysis) : markdownReport(analysis));
    if (parsed.flags.has('json')) {
      io.stdout(`${JSON.stringify(jsonReport(analysis), null, 2)}\n`);
    } else {
      const rows = findingRows(analysis).filter((row) => parsed.flags.has('all') || row.severity !== 'ok');
      const table = formatTable(
        ['severity', 'finding', 'current range', 'worst margin'],
        rows.map((row) => [row.severity, titleOf(row), row.range, row.worst]),
        [],
        { maxWidth: WIDTH, wrapColumn: 1 },
      );
      const details = rows
        .filter((row) => row.severity === 'fail' || row.severity === 'warning')
        .map((row) =>
          [
            ...indented('- ', titleOf(row)),
            ...indented('  ', row.explanation),
            ...(row.suggestion ? indented('  → ', row.suggestion) : []),
          ].join('\n'),
        )
        .join('\n');
      io.stdout(
        `${study.name}\n${scenariosText(analysis)}${rows.length > 0 ? `${table}\n` : ''}\n${details ? `${details}\n\n` : ''}${summaryText(analysis)}${report ? `; report written to ${report}` : ''}\n${indented('', CAUTION).join('\n')}\n`,
      );
    }
    const classes = findingClassesOf(analysis);
    // The counts line ends the text output so a review script reads the last line; JSON stays pure JSON.
    if (!parsed.flags.has('json')) io.stdout(`${classesText(classes)}\n`);
    const doubtful = classes.thinMargin + classes.notProvable;
    return classes.fail > 0 || (parsed.flags.has('strict') && doubtful > 0) ? 1 : 0;
  },
};

/** A finding's title, with the scenarios it holds in when that is not every scenario checked. */
function titleOf(row: { title: string; onlyIn: string }): string {
  return row.onlyIn ? `${row.title} [${row.onlyIn}]` : row.title;
}

/** For a study with scenarios, one line per scenario checked: its name, id and counts; else "". */
function scenariosText(analysis: Analysis): string {
  if (!analysis.scenarios) return '';
  const ids = new Map(analysis.scenarios.map((s) => [s.label, s.scenario.id]));
  const lines = scenarioCountsOf(analysis).map(
    ({ label, counts }) => `  ${label} (${ids.get(label)}): ${countsText(counts)}`,
  );
  return `Scenarios checked (a finding marked [name] holds only in those named):\n${lines.join('\n')}\n\n`;
}

/** Text wrapped to the output width, its first line after `lead` and the rest indented to match. */
function indented(lead: string, text: string): string[] {
  const pad = ' '.repeat(lead.length);
  return wrapText(text, WIDTH - lead.length).map((line, i) => `${i === 0 ? lead : pad}${line}`);
}
