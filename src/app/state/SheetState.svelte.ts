import { viewInputOf } from '../../plot/viewInput.ts';
import { sheetOf, type Sheet } from '../../plot/sheet.ts';
import { svgOf } from '../../plot/svg.ts';
import type { SheetInput } from '../../plot/sheetInput.ts';
import { probeAt, type Probe } from '../../engine/probe.ts';
import type { StudyState } from './StudyState.svelte.ts';
import type { AnalysisState } from './AnalysisState.svelte.ts';
import type { ProbeState } from './ProbeState.svelte.ts';
import { lookupOf } from '../lib/lookups.ts';
import { scenarioViewOf } from '../lib/scenarioParts.ts';
import { scenarioFaultLinesOf } from '../lib/scenarioFaultLines.ts';

/** The size exported figures are laid out at (px), the plot layer's default sheet. */
export const FIGURE_SIZE = { width: 960, height: 720 } as const;

/**
 * The current view as a sheet: the plot layer's input and geometry for the space the Sheet region
 * has, the probe's readout, and the standalone SVG for export (laid out at the figure size, so an
 * exported figure matches the one the command line draws).
 *
 * @example sheet.width = 900; sheet.sheet?.layers // the geometry the Sheet component renders
 */
export class SheetState {
  /** Space the Sheet region gives the drawing (px); the plot layer needs at least 480 × 360. */
  width = $state(960);
  height = $state(640);
  /** Larger type on the page and the sheet, for a projector. */
  largeText = $state(false);
  /** For a study with scenarios: draw the maximum fault line of every scenario, each headed by its name. */
  everyScenario = $state(false);
  #study: StudyState;
  #analysis: AnalysisState;
  #probe: ProbeState;

  /** The view's devices the chosen scenario leaves off the sheet (de-energised, or on another source's tree). */
  readonly left: string[] = $derived.by(() => {
    const view = this.#study.view;
    return view ? this.#analysis.viewAnalysis(view.id).left : [];
  });
  /** Set when the chosen scenario energises none of the view's devices: the sheet says so instead of drawing. */
  readonly dark: string | undefined = $derived.by(() => {
    const view = this.#study.view;
    const scenario = this.#analysis.scenario;
    if (!view || !scenario || this.input.input || this.input.error) return undefined;
    return `Every device on this sheet is de-energised in the scenario "${scenario.label}".`;
  });
  /** What the view draws, on its reference voltage (or the reason it cannot be drawn). */
  readonly input = $derived.by((): { input?: SheetInput; error?: string } => {
    const view = this.#study.view;
    if (this.#analysis.baseError) return { error: this.#analysis.baseError };
    if (!view) return {};
    const { analysis, error } = this.#analysis.viewAnalysis(view.id);
    if (error) return { error };
    if (!analysis) return {};
    try {
      const input = viewInputOf(analysis, view.id);
      const scenario = this.#analysis.scenario;
      if (!scenario) return { input };
      // The engine's part titles the view with its scenario and names in its notes what it leaves out.
      const faultLines = this.everyScenario ? this.#everyScenarioFaultLines(view) : input.faultLines;
      return { input: { ...input, faultLines } };
    } catch (error) {
      return { error: (error as Error).message };
    }
  });
  // The sheet's geometry, or why the plot layer could not lay it out.
  readonly #laidOut = $derived.by((): { sheet?: Sheet; error?: string } => {
    const { input } = this.input;
    if (!input) return {};
    const width = Math.max(480, this.width);
    const height = Math.max(360, this.height);
    try {
      return {
        // The page prints the caution in its footer, so the live sheet's strip leaves it to the exported figure.
        sheet: sheetOf(input, {
          width,
          height,
          fontSize: this.largeText ? 14 : 11,
          idPrefix: 'live',
          studyDetails: 'brief',
        }),
      };
    } catch (error) {
      return { error: (error as Error).message };
    }
  });
  /** The sheet's geometry at the region's size. */
  readonly sheet: Sheet | undefined = $derived.by(() => this.#laidOut.sheet);
  /** Why the current view cannot be drawn, if it cannot. */
  readonly error: string | undefined = $derived.by(() => this.input.error ?? this.#laidOut.error);
  /** The colour each curve got on the sheet, by curve id. */
  readonly colours = $derived.by(() =>
    lookupOf(
      this.sheet?.curves ?? [],
      (c) => c.id,
      (c) => c.colour,
    ),
  );
  /** The engine's probe at the pointer's current, or undefined off the sheet. */
  readonly probe: Probe | undefined = $derived.by(() => this.probeAt(this.#probe.amps));
  /** The engine's probe at each pinned current. */
  readonly pinned: Probe[] = $derived.by(() =>
    this.#probe.pinned.map((amps) => this.probeAt(amps)).filter((p): p is Probe => p !== undefined),
  );

  constructor(study: StudyState, analysis: AnalysisState, probe: ProbeState) {
    this.#study = study;
    this.#analysis = analysis;
    this.#probe = probe;
  }

  /** The engine's probe of the current view at `amps` (A at the reference voltage), in the chosen scenario. */
  probeAt(amps: number | undefined): Probe | undefined {
    const view = this.#study.view;
    const analysis = view && this.#analysis.viewAnalysis(view.id).analysis;
    if (amps === undefined || !analysis || !view) return undefined;
    return probeAt(analysis, view.id, amps);
  }

  // Every scenario's maximum fault lines at the view's fault buses, each headed by its scenario.
  #everyScenarioFaultLines(view: NonNullable<StudyState['view']>): SheetInput['faultLines'] {
    const study = this.#study.study;
    const network = this.#study.network;
    if (!study || !network) return [];
    return scenarioFaultLinesOf(
      network,
      view,
      this.#study.scenarios.map((scenario) => scenarioViewOf(study, scenario)),
    );
  }

  /** The current view laid out at the figure size, as the command line's figure (throws when there is no sheet). */
  figureSheet(): Sheet {
    const { input, error } = this.input;
    if (!input) throw new Error(error ?? this.#noSheetReason());
    return sheetOf(input, { ...FIGURE_SIZE, idPrefix: 'tcc' });
  }

  // Why there is no sheet to export: a sheet dark in the chosen scenario, a study with problems, no view.
  #noSheetReason(): string {
    if (this.dark) return `there is no sheet to export: ${this.dark.charAt(0).toLowerCase()}${this.dark.slice(1)}`;
    if (!this.#study.study) return 'there is no sheet to export: the study has problems to mend first';
    return this.#study.view ? 'there is no sheet to export' : 'there is no sheet to export: the study has no view';
  }

  /** The current view as a standalone SVG at the figure size (throws when there is no sheet). */
  figureSvg(): string {
    return svgOf(this.figureSheet());
  }
}
