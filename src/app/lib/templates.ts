import { curveTemplates, TEMPLATE_FILES, type CurveTemplate } from '../../engine/templates/index.ts';

/** A template as offered in the workbench, with its characteristic as written in `curves/`. */
export interface TemplateChoice {
  id: string;
  label: string;
  family: CurveTemplate['family'];
  note: string;
  /** The device's ampere rating as the template file writes it ("65 A"), for the NEC checks; none for a relay. */
  rating?: string;
  /** The characteristic in file form (units and wording as the template file writes them). */
  characteristic: Record<string, unknown>;
}

type TemplateFile = { templates: { id: string; rating?: string; characteristic: Record<string, unknown> }[] };

/**
 * Every template of `curves/` (already validated by the engine), with its device rating and the
 * characteristic in its file form, so a device made from one saves as readably as the template reads.
 *
 * @example templateChoices().filter((t) => t.family === 'fuse').length // ≥ 1
 */
export function templateChoices(): TemplateChoice[] {
  const written = new Map<string, Record<string, unknown>>();
  const ratings = new Map<string, string>();
  for (const file of Object.values(TEMPLATE_FILES) as TemplateFile[]) {
    for (const template of file.templates) {
      written.set(template.id, template.characteristic);
      if (template.rating) ratings.set(template.id, template.rating);
    }
  }
  return curveTemplates.map((t) => ({
    id: t.id,
    label: t.label,
    family: t.family,
    note: t.note,
    ...(ratings.has(t.id) ? { rating: ratings.get(t.id) } : {}),
    characteristic: structuredClone(written.get(t.id) ?? (t.characteristic as Record<string, unknown>)),
  }));
}

/**
 * A device id not yet used in the study, from the element it feeds: `D-T1`, `D-T1-2`, …
 * @example freeDeviceId(['D-T1'], 'T1') // 'D-T1-2'
 */
export function freeDeviceId(taken: Iterable<string>, elementId: string): string {
  const used = new Set(taken);
  const stem = `D-${elementId}`.slice(0, 60);
  if (!used.has(stem)) return stem;
  let n = 2;
  while (used.has(`${stem}-${n}`)) n++;
  return `${stem}-${n}`;
}
