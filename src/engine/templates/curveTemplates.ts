import { z } from 'zod/mini';
import fastActing from '../../../curves/fuse-illustrative-fast-acting.json' with { type: 'json' };
import mvPower from '../../../curves/fuse-illustrative-mv-power.json' with { type: 'json' };
import timeDelay from '../../../curves/fuse-illustrative-time-delay.json' with { type: 'json' };
import relays from '../../../curves/relay-templates.json' with { type: 'json' };
import thermalMagnetic from '../../../curves/thermal-magnetic-illustrative.json' with { type: 'json' };
import tripUnits from '../../../curves/trip-unit-templates.json' with { type: 'json' };
import { characteristicSchema, DEVICE_KINDS } from '../devices/characteristic.ts';
import { idField } from '../study/fields.ts';
import { issueMessage } from '../study/issueMessage.ts';

/**
 * Schema of a template file in `curves/`: the family (a device `kind`), a note shown with every
 * template, and the templates, each a characteristic of that family a user picks and then adjusts.
 */
export const curveTemplateFileSchema = z
  .strictObject({
    family: z.enum(DEVICE_KINDS),
    note: z.string().check(z.minLength(1)),
    templates: z
      .array(
        z.strictObject({
          id: idField,
          label: z.string().check(z.minLength(1)),
          note: z.optional(z.string()),
          rating: z.optional(z.string()).check(
            z.meta({
              description:
                'the device ampere rating a device made from the template gets, as a study writes it ("65 A")',
            }),
          ),
          characteristic: characteristicSchema,
        }),
      )
      .check(z.minLength(1)),
  })
  .check(
    z.superRefine((file, ctx) => {
      file.templates.forEach((template, i) => {
        if (template.characteristic.kind !== file.family) {
          ctx.addIssue({
            code: 'custom',
            path: ['templates', i, 'characteristic', 'kind'],
            message: `expected "${file.family}" like the file's family, got "${template.characteristic.kind}"`,
          });
        }
      });
    }),
  );

/** A template a user picks from: id, label, family, a note and the parsed characteristic (SI units). */
export interface CurveTemplate {
  id: string;
  label: string;
  family: (typeof DEVICE_KINDS)[number];
  note: string;
  characteristic: z.output<typeof characteristicSchema>;
}

/** The template files in `curves/`, by file name, as imported (raw JSON). */
export const TEMPLATE_FILES: Record<string, unknown> = {
  'relay-templates.json': relays,
  'trip-unit-templates.json': tripUnits,
  'thermal-magnetic-illustrative.json': thermalMagnetic,
  'fuse-illustrative-time-delay.json': timeDelay,
  'fuse-illustrative-fast-acting.json': fastActing,
  'fuse-illustrative-mv-power.json': mvPower,
};

/**
 * Validates the template files and flattens them into templates. Throws a `RangeError` naming the
 * file and field of the first problem (a bad template is a defect of the data, not of user input).
 *
 * @example readCurveTemplates({ 'x.json': { family: 'fuse', note: '…', templates: [...] } })
 */
export function readCurveTemplates(files: Record<string, unknown>): CurveTemplate[] {
  return Object.entries(files).flatMap(([name, data]) => {
    const parsed = curveTemplateFileSchema.safeParse(data, { reportInput: true });
    if (!parsed.success) {
      // In the words of a study problem: zod/mini loads no locale, so its own message is "Invalid input".
      const issue = parsed.error.issues[0];
      throw new RangeError(`curves/${name}: ${issue.path.join('.')}: ${issueMessage(issue)}`);
    }
    const { family, note, templates } = parsed.data;
    return templates.map(({ id, label, note: own, characteristic }) => ({
      id,
      label,
      family,
      note: own ?? note,
      characteristic,
    }));
  });
}

/** Every curve template shipped in `curves/`, relays first, then trip units, breakers and fuses. */
export const curveTemplates: CurveTemplate[] = readCurveTemplates(TEMPLATE_FILES);

/**
 * The template with an id, or undefined.
 * @example curveTemplateById('relay-ieee-very-inverse')?.characteristic.kind // 'relay'
 */
export function curveTemplateById(id: string): CurveTemplate | undefined {
  return curveTemplates.find((template) => template.id === id);
}
