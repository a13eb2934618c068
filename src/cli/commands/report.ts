import { expectedGot, InputError } from '../../engine/errors.ts';
import { analyseScenarios } from '../../engine/scenario/index.ts';
import { flagText, parseArgs } from '../args.ts';
import type { Command, CommandIO } from '../command.ts';
import { scenarioFlag } from '../scenarioFlag.ts';
import { loadStudyFile } from '../studyFile.ts';
import { type Output, writeOutputs } from '../writeAll.ts';

const HELP = `discern report <study.json> --out FILE — the whole coordination study report

  --out FILE          study.pdf, study.html or study.md (the format follows the ending; Markdown
                      writes its figures beside it as FILE-figure-N.svg, and removes those an
                      earlier, longer report of the same name left numbered past its last)
  --paper SIZE        letter, a4, tabloid or a3 (default letter)
  --orientation O     portrait or landscape (default portrait)
  --date TEXT         the date printed on the report (default: the study's date); the same study and
                      date give the same bytes
  --scenario NAME     one operating scenario only, by id or name (default: every scenario)
  --all-scenarios     every scenario (the default)

Sections: cover (study details, revision log, cautions), contents, scope and method, one-line
diagram, fault currents, device settings, every time-current sheet, findings, and the worked fault
calculation of every bus. A study with generators, switches or scenarios gets a scenario table and
its fault currents, sheets and findings worked out per scenario.
`;

/**
 * `discern report <study> --out study.pdf|html|md`: analyses the study (in every scenario, or the one
 * `--scenario` names) and writes the deliverable.
 * @example await reportCommand.run(['demo/harrowmere-selective.json', '--out', 'out/study.pdf'], io)
 */
export const reportCommand: Command = {
  verb: 'report',
  summary:
    'the whole study report: one-line diagram, fault and settings tables, sheets, findings (PDF, HTML, Markdown)',
  help: HELP,
  async run(args, io) {
    const parsed = parseArgs(args, {
      out: 'value',
      paper: 'value',
      orientation: 'value',
      date: 'value',
      scenario: 'value',
      'all-scenarios': 'switch',
      help: 'switch',
    });
    if (parsed.flags.has('help')) {
      io.stdout(HELP);
      return 0;
    }
    const [path, extra] = parsed.positionals;
    if (extra !== undefined) throw new InputError('report', expectedGot('one study file', extra));
    const out = flagText(parsed, 'out');
    const format = /\.(pdf|html|md)$/i.exec(out ?? '')?.[1].toLowerCase();
    if (!out || !format) throw new InputError('--out', expectedGot('a file name ending .pdf, .html or .md', out));
    const paper = flagText(parsed, 'paper') ?? 'letter';
    if (paper !== 'letter' && paper !== 'a4' && paper !== 'tabloid' && paper !== 'a3')
      throw new InputError('--paper', expectedGot('letter, a4, tabloid or a3', paper));
    const orientation = flagText(parsed, 'orientation') ?? 'portrait';
    if (orientation !== 'portrait' && orientation !== 'landscape')
      throw new InputError('--orientation', expectedGot('portrait or landscape', orientation));
    const date = flagText(parsed, 'date');
    if (date !== undefined && (date.length > 40 || [...date].some((c) => c < ' ' || c === '\u007f')))
      throw new InputError('--date', expectedGot('a date of at most 40 printable characters', date));
    // A date written the ISO way must be one the calendar has (not 2026-02-30, which would print as typed).
    if (date !== undefined && /^\d{4}-\d{2}-\d{2}$/.test(date) && !isCalendarDate(date))
      throw new InputError('--date', expectedGot('a calendar date (YYYY-MM-DD) or other text', date));

    const study = loadStudyFile(path, io, 'report');
    // The report's modules (and the PDF writer) load only when asked for.
    const { studyReportOf, markdownOfReport, htmlOfReport, pdfOfReport } = await import('../../report/index.ts');
    const only = scenarioFlag(parsed, study)?.id;
    const report = studyReportOf(analyseScenarios(study, { only }), { date });
    const setup = { paper, orientation } as const;
    const outputs: Output[] = [];
    if (format === 'pdf') {
      // A calendar date (YYYY-MM-DD) also becomes the PDF's creation date; other text, a fixed one.
      const created = date !== undefined && isCalendarDate(date) ? date : undefined;
      outputs.push({ path: out, data: await pdfOfReport(report, setup, { date: created }) });
    } else if (format === 'html') outputs.push({ path: out, data: htmlOfReport(report, setup) });
    else {
      const stem = out.replace(/^.*[\\/]/, '').replace(/\.md$/i, '');
      const { text, figures } = markdownOfReport(report, stem);
      const folder = out.slice(0, out.length - out.replace(/^.*[\\/]/, '').length);
      for (const figure of figures) outputs.push({ path: `${folder}${figure.name}`, data: figure.svg });
      outputs.push({ path: out, data: text });
    }
    // Everything is made before anything is written, and written all or nothing: a failed figure must
    // not leave the old report pointing at new figures, nor replace any figure of the last good report.
    writeOutputs(io, outputs);
    io.stdout(`${study.name}: wrote ${out}\n`);
    if (format === 'md') removeLaterFigures(io, out, outputs.length - 1);
    return 0;
  },
};

/**
 * Removes the figures a longer earlier Markdown report of the same name left beside `out`, numbered on
 * from this one's last (`<stem>-figure-N.svg`) up to the first number with nothing there, which a reader
 * would take for this report's own, and says which on standard output. A figure that cannot be removed
 * (one the user may not write, a folder, the study read) is named on standard error and passed over; the
 * report itself is written either way.
 */
function removeLaterFigures(io: CommandIO, out: string, figures: number): void {
  const base = out.replace(/\.md$/i, '');
  const removed: string[] = [];
  for (let n = figures + 1; ; n++) {
    const path = `${base}-figure-${n}.svg`;
    try {
      if (!io.removeFile?.(path)) break;
      removed.push(path);
    } catch (error) {
      // A removal fails on the file system (permissions, a folder), or refuses the study this run read.
      const reason = (error as NodeJS.ErrnoException).code ?? 'the study read';
      io.stderr(`${path}: left in place (${reason}); it is not a figure of this report\n`);
    }
  }
  if (removed.length === 1) io.stdout(`removed ${removed[0]}, a figure of an earlier, longer report\n`);
  else if (removed.length > 1)
    io.stdout(`removed ${removed.length} figures of an earlier, longer report: ${removed.join(', ')}\n`);
}

/** Whether text is a date the calendar has, written YYYY-MM-DD (years 0001 to 9999). @example isCalendarDate('2026-02-30') // false */
function isCalendarDate(text: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(text) || text.startsWith('0000')) return false;
  const time = Date.parse(`${text}T00:00:00Z`);
  return !Number.isNaN(time) && new Date(time).toISOString().startsWith(text);
}
