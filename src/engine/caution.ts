/**
 * The short caution every page, figure and report carries (the cautions in README.md, the cautions of practice).
 * @example svg footer, report header, CLI output
 */
export const CAUTION =
  'For review by a qualified engineer. Local codes, the authority having jurisdiction and licensed practice govern; manufacturers’ published curves and tested selectivity data govern over generic curves. Arc flash is a separate study.';

/** The longer form, for the README, reports and the app's reading guide. */
export const CAUTIONS = [
  'Results are for review by a qualified engineer; they support, and never replace, a coordination study signed by the responsible engineer.',
  'Local codes, the edition of NFPA 70 adopted where the work is done, the authority having jurisdiction and licensed engineering practice govern over anything discern reports.',
  'Manufacturers’ published time-current curves, tolerances and tested selectivity tables govern over generic, parametric or digitised curves. Generic curves here are illustrative.',
  'Curves say nothing reliable below about 0.01 s; instantaneous and current-limiting selectivity needs tested data.',
  'Fault currents depend on the data entered: check both maximum and minimum conditions.',
  'Arc-flash incident energy is a separate study (IEEE 1584, NFPA 70E); discern does not compute it.',
] as const;
