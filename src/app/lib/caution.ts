/**
 * The caution every page, figure and report carries (the cautions in README.md), word for word.
 * @example `<p>{CAUTION}</p>`
 */
export const CAUTION =
  'For review by a qualified engineer. Local codes, the AHJ and licensed practice govern; ' +
  "manufacturers' published curves and tested data govern over generic curves. Not an arc-flash study.";
