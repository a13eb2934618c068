import { analyseStudy, type Analysis } from '../../engine/analysis.ts';
import { expectedGot, InputError } from '../../engine/errors.ts';
import { hasScenarios, scenarioLabel, scenarioPartsOf, scenariosOf } from '../../engine/scenario/index.ts';
import type { Scenario, Study } from '../../engine/study/index.ts';
import { sheetOf } from '../../plot/sheet.ts';
import { PNG_LARGEST_PIXELS, PNG_SCALE, pngPixelsOf, resolveSheetOptions } from '../../plot/sheetOptions.ts';
import { svgOf } from '../../plot/svg.ts';
import { viewInputOf } from '../../plot/viewInput.ts';
import { flagText, parseArgs, positiveFlag } from '../args.ts';
import type { Command } from '../command.ts';
import { scenarioFlag } from '../scenarioFlag.ts';
import { loadStudyFile } from '../studyFile.ts';

const HELP = `discern plot <study.json> --out FILE — one view of a study as a TCC figure

  --out FILE        fig.svg, fig.png or fig.pdf (the format follows the ending)
  --view ID         which view (default: the study's first view)
  --width PX        sheet width in px (default 960; at least 480)
  --height PX       sheet height in px (default 720; at least 360)
  --paper SIZE      PDF paper: letter, a4, tabloid or a3 (default letter)
  --orientation O   PDF page landscape or portrait (default landscape), as the workbench prints it
  --scale N         PNG pixels per sheet px, 0.1 to 10 (default 2)
  --scenario NAME   the operating scenario to draw, by id or name (default: the first scenario in
                    which the view's devices are energised); the sheet is the tree of the source
                    feeding them, its title naming the scenario

Every figure carries the caution line: for review by a qualified engineer. What the sheet leaves
undrawn (outside its ranges) or unnamed (no room on the plot or in its key) is told on standard
error after the file is written, one "note: …" line each; the exit code stays 0.
`;

/**
 * `discern plot <study> --out fig.svg|png|pdf`: analyses the study and writes one view as the same
 * figure the workbench exports (`viewInputOf` → `sheetOf`, then `svgOf`, resvg's PNG or `pdfOf`).
 *
 * @example await plotCommand.run(['demo/harrowmere-selective.json', '--view', 'primary', '--out', 'out/primary.pdf'], io)
 */
export const plotCommand: Command = {
  verb: 'plot',
  summary: 'a view of a study as an SVG, PNG or PDF figure',
  help: HELP,
  async run(args, io) {
    const parsed = parseArgs(args, {
      out: 'value',
      view: 'value',
      width: 'value',
      height: 'value',
      orientation: 'value',
      paper: 'value',
      scale: 'value',
      scenario: 'value',
      help: 'switch',
    });
    if (parsed.flags.has('help')) {
      io.stdout(HELP);
      return 0;
    }
    const [path, extra] = parsed.positionals;
    if (extra !== undefined) throw new InputError('plot', expectedGot('one study file', extra));
    const out = flagText(parsed, 'out');
    const format = /\.(svg|png|pdf)$/i.exec(out ?? '')?.[1].toLowerCase();
    if (!out || !format) throw new InputError('--out', expectedGot('a file name ending .svg, .png or .pdf', out));
    const width = numberFlag(flagText(parsed, 'width'), '--width');
    const height = numberFlag(flagText(parsed, 'height'), '--height');
    sheetSizeOf(width, height);
    const scale = numberFlag(flagText(parsed, 'scale'), '--scale');
    if (scale !== undefined && !(scale >= PNG_SCALE.smallest && scale <= PNG_SCALE.largest))
      throw new InputError('--scale', expectedGot(`a zoom from ${PNG_SCALE.smallest} to ${PNG_SCALE.largest}`, scale));
    // Each flag within its bounds can still ask for an image no memory holds: named by the flag given last
    // of scale, height and width.
    if (format === 'png' && pngPixelsOf(width, height, scale) > PNG_LARGEST_PIXELS) {
      const [flag, given] =
        scale !== undefined ? ['--scale', scale] : height !== undefined ? ['--height', height] : ['--width', width];
      throw new InputError(
        flag,
        expectedGot(`a PNG of at most ${PNG_LARGEST_PIXELS / 1e6} million pixels (width × height × scale²)`, given),
      );
    }
    const paper = flagText(parsed, 'paper') ?? 'letter';
    if (paper !== 'letter' && paper !== 'a4' && paper !== 'tabloid' && paper !== 'a3')
      throw new InputError('--paper', expectedGot('letter, a4, tabloid or a3', paper));
    const orientation = flagText(parsed, 'orientation') ?? 'landscape';
    if (orientation !== 'portrait' && orientation !== 'landscape')
      throw new InputError('--orientation', expectedGot('portrait or landscape', orientation));

    const study = loadStudyFile(path, io, 'plot');
    const viewId = flagText(parsed, 'view') ?? study.views[0]?.id;
    if (!viewId) throw new InputError('study.views', expectedGot('at least one view to plot', 'none'));
    if (!study.views.some((view) => view.id === viewId)) {
      throw new InputError('--view', expectedGot(`one of ${study.views.map((v) => v.id).join(', ')}`, viewId));
    }
    const scenario = scenarioFlag(parsed, study);
    const { analysis, label } = hasScenarios(study)
      ? viewTreeOf(study, viewId, scenario)
      : { analysis: analyseStudy(study), label: undefined };
    const sheet = sheetOf(viewInputOf(analysis, viewId), { width, height, idPrefix: `tcc-${viewId}` });
    // The PNG and PDF writers load a native module and the font reader: only when asked for.
    if (format === 'svg') io.writeFile(out, svgOf(sheet));
    else if (format === 'png') io.writeFile(out, (await import('../../plot/png.ts')).pngOf(svgOf(sheet), { scale }));
    else io.writeFile(out, await (await import('../../plot/pdf.ts')).pdfOf(sheet, { paper, orientation }));
    io.stdout(`${viewId}${label ? ` (${label})` : ''}: wrote ${out}\n`);
    // The figure cannot say what it left undrawn or unnamed; the workbench lists these beside the sheet.
    for (const note of sheet.diagnostics) io.stderr(`note: ${oneLine(note)}\n`);
    return 0;
  },
};

/** Checks `--width` and `--height` against the sheet's own bounds before the study is read, naming the flag. */
function sheetSizeOf(width: number | undefined, height: number | undefined): void {
  try {
    resolveSheetOptions({ width, height });
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    const flag = error.path === 'options.width' ? '--width' : '--height';
    throw new InputError(flag, error.message.slice(error.path.length + 2));
  }
}

/**
 * The analysed tree that draws a view in a study that can be switched: in `scenario` (else the first
 * scenario energising any of the view's devices), the source's tree holding most of them. A view
 * de-energised in the scenario asked for is a one-line error naming `--scenario`.
 */
function viewTreeOf(study: Study, viewId: string, scenario?: Scenario): { analysis: Analysis; label: string } {
  for (const candidate of scenario ? [scenario] : scenariosOf(study)) {
    const shown = (tree: Study) => tree.views.find((view) => view.id === viewId)?.devices.length ?? 0;
    const trees = scenarioPartsOf(study, candidate).map((part) => part.study);
    const best = trees.reduce<Study | undefined>((a, b) => (shown(b) > (a ? shown(a) : 0) ? b : a), undefined);
    if (best) return { analysis: analyseStudy(best), label: scenarioLabel(candidate) };
  }
  if (scenario)
    throw new InputError(
      '--scenario',
      expectedGot(`a scenario in which view "${viewId}" has devices energised`, scenario.id),
    );
  throw new InputError('--view', expectedGot('a view with devices energised in some scenario', viewId));
}

/** A drawing note on one line: a device name from the study may hold a line break. */
function oneLine(note: string): string {
  return note.replace(/\s*[\r\n]+\s*/g, ' ');
}

/** A positive decimal number flag (not "0x400"), or undefined when absent. */
function numberFlag(text: string | undefined, flag: string): number | undefined {
  return text === undefined ? undefined : positiveFlag(text, flag.replace(/^--/, ''));
}
