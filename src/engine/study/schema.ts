import { z } from 'zod';
import { createCharacteristicSchema } from '../devices/characteristic.ts';
import {
  availableFaultField,
  axisRangeField,
  boundedNumber,
  idField,
  MAX_ELEMENTS,
  MAX_VIEW_ITEMS,
  nameField,
  notesField,
  percentField,
  quantityField,
  xrRatio,
} from './fields.ts';

/** A pair kind key: upstream family / downstream family. */
const PAIR_KIND = /^(relay|trip-unit|thermal-magnetic|fuse)\/(relay|trip-unit|thermal-magnetic|fuse)$/;

/** The study file format version this code reads and writes. */
export const STUDY_VERSION = 1;

/**
 * Builds the study schema for a system frequency, so that times written in cycles ("5 cycles") parse
 * to seconds at that frequency. `studySchema` is the 60 Hz instance used for types and the JSON Schema.
 */
export function createStudySchema(frequency = 60) {
  const voltage = (description: string) =>
    quantityField('voltage', {
      min: 0,
      exclusiveMin: true,
      description: `${description} (V, or text such as "12.47 kV")`,
    });

  const sourceLevel = z
    .object({
      available: availableFaultField,
      xr: xrRatio('X/R ratio at the source; omit for all-reactance').optional(),
      x0x1: boundedNumber(
        0,
        100,
        'zero-sequence X0/X1 of the source; default 1 (Z0 = Z1, a solidly grounded source)',
        'published ratios stay below about 10',
      ).optional(),
      r0r1: boundedNumber(
        0,
        100,
        'zero-sequence R0/R1 of the source; default: x0x1',
        'published ratios stay below about 10',
      ).optional(),
      lineToGround: availableFaultField.optional().meta({
        description:
          'available line-to-ground fault at the source bus ("10 kA"), its neutral grounding included; sets Z0 instead of x0x1/r0r1',
      }),
    })
    .strict();

  const grounding = z
    .object({
      kind: z.enum(['solid', 'resistance', 'reactance', 'ungrounded']),
      ohms: boundedNumber(
        0,
        100_000,
        'neutral resistor or reactor (Ω)',
        'neutral resistors run from a fraction of an ohm to a few kΩ',
      ).optional(),
    })
    .strict()
    .refine((g) => g.kind === 'solid' || g.kind === 'ungrounded' || g.ohms !== undefined, {
      message: 'expected "ohms" with a resistance or reactance grounding',
      path: ['ohms'],
    })
    .meta({ description: 'neutral grounding: solid, through a resistor or reactor of `ohms`, or ungrounded' });

  const perUnit = (description: string, min: number, max: number, why: string) =>
    boundedNumber(min, max, `${description}, per unit on the machine rating`, why);

  /** A synchronous generator: its rating, reactances and time constants (IEEE Std 551, IEC 60909-0). */
  const generatorFields = {
    id: idField,
    name: nameField.optional(),
    bus: idField.meta({ description: 'the bus the generator feeds (its terminals)' }),
    rating: quantityField('power', {
      plainUnit: 'kVA',
      min: 0,
      exclusiveMin: true,
      description: 'rated apparent power (kVA, or "2 MVA")',
    }),
    voltage: voltage('rated line-to-line voltage'),
    powerFactor: boundedNumber(0.5, 1, 'rated power factor (0.8 for most standby sets)', 'between 0.5 and 1').default(
      0.8,
    ),
    xdSubtransient: perUnit('subtransient reactance X″d', 0.01, 1, 'published X″d run from about 0.05 to 0.35 pu'),
    xdTransient: perUnit('transient reactance X′d', 0.01, 2, 'published X′d run from about 0.1 to 0.5 pu'),
    xd: perUnit('synchronous reactance Xd', 0.1, 10, 'published Xd run from about 0.5 to 4 pu'),
    x0: perUnit('zero-sequence reactance X0', 0.001, 1, 'published X0 run from about 0.01 to 0.2 pu').optional(),
    tdSubtransient: quantityField('time', { frequency, min: 0, exclusiveMin: true, max: 1 }).meta({
      description: 'subtransient short-circuit time constant T″d, s (about 0.01 to 0.05 s)',
    }),
    tdTransient: quantityField('time', { frequency, min: 0, exclusiveMin: true, max: 20 }).meta({
      description: 'transient short-circuit time constant T′d, s (about 0.1 to 2 s)',
    }),
    xr: xrRatio('X″d / Ra of the machine; omit for the default').optional(),
    sustained: boundedNumber(
      0.1,
      10,
      'excitation support: the short-circuit current it sustains, as a multiple of rated current (about 3 × for a permanent-magnet or auxiliary-winding exciter, common practice); omit when the current decays toward E/Xd',
      'sustained fault currents run from below 1 × to about 4 × rated',
    ).optional(),
    grounding: grounding.default({ kind: 'solid' }).meta({ description: 'neutral grounding of the generator' }),
    damage: z
      .array(
        z
          .object({
            current: quantityField('current', { min: 0, exclusiveMin: true }),
            time: quantityField('time', { frequency, min: 0, exclusiveMin: true }),
          })
          .strict(),
      )
      .min(2)
      .max(50)
      .optional()
      .meta({
        description:
          "the machine's thermal damage curve from its data, current rising and time falling; default: the IEEE C50.13 armature short-time capability",
      }),
  };
  const generator = z.object(generatorFields).strict();

  const source = z.discriminatedUnion('kind', [
    z
      .object({
        kind: z.literal('utility'),
        id: idField,
        bus: idField.meta({ description: 'the bus the source feeds' }),
        max: sourceLevel.meta({ description: 'maximum available fault (for interrupting duty and coordination)' }),
        min: sourceLevel.optional().meta({ description: 'minimum available fault (for sensitivity); defaults to max' }),
        grounding: grounding.default({ kind: 'solid' }).meta({ description: 'neutral grounding of the source' }),
      })
      .strict(),
    z.object({ kind: z.literal('infinite'), id: idField, bus: idField }).strict(),
    z.object({ kind: z.literal('generator'), ...generatorFields }).strict(),
  ]);

  const switchDevice = z.discriminatedUnion('kind', [
    z
      .object({
        kind: z.literal('transfer'),
        id: idField,
        name: nameField.optional(),
        normal: idField.meta({ description: 'the bus on the normal side' }),
        emergency: idField.meta({ description: 'the bus on the emergency (standby) side' }),
        to: idField.meta({ description: 'the load bus the switch feeds from one side or the other' }),
      })
      .strict(),
    z
      .object({
        kind: z.literal('tie'),
        id: idField,
        name: nameField.optional(),
        from: idField,
        to: idField,
        normally: z
          .enum(['open', 'closed'])
          .default('open')
          .meta({ description: 'position outside any scenario: open for a tie, closed for a bus coupler' }),
      })
      .strict(),
  ]);

  const scenario = z
    .object({
      id: idField,
      name: nameField.optional(),
      sources: z.array(idField).min(1).max(MAX_VIEW_ITEMS).optional().meta({
        description: 'the sources in service (the utility source and generators by id); default: every source',
      }),
      switches: z
        .record(idField, z.enum(['normal', 'emergency', 'open', 'closed']))
        .default({})
        .meta({
          description:
            'switch positions by id: "normal" or "emergency" for a transfer switch, "open" or "closed" for a tie; others stay in their normal position',
        }),
      outOfService: z
        .array(idField)
        .max(MAX_ELEMENTS)
        .default([])
        .meta({ description: 'transformers and cables switched out (e.g. one main of a main-tie-main)' }),
    })
    .strict();

  const bus = z
    .object({
      id: idField,
      name: nameField.optional(),
      voltage: voltage('nominal line-to-line voltage'),
      shortCircuitRating: quantityField('current', { min: 0, exclusiveMin: true }).optional().meta({
        description: 'equipment short-circuit rating of the bus (switchboard, panelboard, MCC), A symmetrical',
      }),
    })
    .strict();

  const transformer = z
    .object({
      id: idField,
      name: nameField.optional(),
      from: idField.meta({ description: 'primary bus' }),
      to: idField.meta({ description: 'secondary bus' }),
      rating: quantityField('power', {
        plainUnit: 'kVA',
        min: 0,
        exclusiveMin: true,
        description: 'self-cooled rating (kVA, or "1.5 MVA")',
      }),
      primary: voltage('rated primary voltage'),
      secondary: voltage('rated secondary voltage'),
      impedance: percentField({
        // At least 0.5 %: a per-unit figure typed as a percentage ("0.0575" for 5.75 %) would give a
        // hundred times the fault current, and minimum-fault checks would pass that should not.
        min: 0.5,
        max: 25,
        description:
          'nameplate impedance in percent on its own rating, from 0.5 % to 25 % (nameplates run from about 1 % for small dry-types to about 20 % for the largest units; a per-unit 0.0575 is written 5.75 %; the IEEE C57.109 curves need at least 2 pu through-fault current)',
      }),
      xr: xrRatio('X/R ratio; omit for all-reactance').optional(),
      connection: z
        .enum(['delta-wye', 'delta-delta', 'wye-wye', 'wye-delta'])
        .default('delta-wye')
        .meta({ description: 'winding connection, primary first; wye secondaries are solidly grounded' }),
      phases: z.union([z.literal(1), z.literal(3)]).default(3),
      grounding: grounding
        .default({ kind: 'solid' })
        .meta({ description: 'secondary neutral grounding (wye, or the centre tap of a single-phase unit)' }),
      primaryConnection: z.enum(['line-to-line', 'line-to-neutral']).optional().meta({
        description:
          'single-phase units: primary winding across two lines or line to neutral; default from the rated primary against the bus voltage',
      }),
      secondaryWinding: z.enum(['two-wire', 'centre-tapped']).optional().meta({
        description: 'single-phase units: default centre-tapped (120/240 V) for a 240 V secondary, else two-wire',
      }),
      halfWinding: z
        .object({ r: z.number().min(0.1).max(10), x: z.number().min(0.1).max(10) })
        .strict()
        .optional()
        .meta({
          description:
            'centre-tapped units: half-winding R and X as multiples of the full-winding per-unit values (default 1.5 and 1.2, common practice)',
        }),
      construction: z.enum(['liquid', 'dry']).default('liquid'),
      category: z
        .enum(['I', 'II', 'III', 'IV'])
        .optional()
        .meta({ description: 'IEEE C57.12.00 through-fault category; inferred from kVA when omitted' }),
      faultFrequency: z
        .enum(['frequent', 'infrequent'])
        .default('infrequent')
        .meta({ description: 'through-fault duty for the IEEE C57.109 curve' }),
      impedanceTolerance: z
        .boolean()
        .default(false)
        .meta({ description: 'use 92.5 % of nameplate %Z for maximum duty (common practice)' }),
      supervised: z
        .boolean()
        .default(false)
        .meta({ description: 'NEC 450.3: supervised location (qualified persons only)' }),
    })
    .strict();

  const cable = z
    .object({
      id: idField,
      name: nameField.optional(),
      from: idField,
      to: idField,
      size: z.string().max(40).meta({ description: 'conductor size: "4/0", "500 kcmil", "12 AWG"' }),
      material: z.enum(['copper', 'aluminium']).default('copper'),
      conduit: z.enum(['pvc', 'aluminium', 'steel']).default('steel'),
      insulation: z
        .enum(['thermoplastic', 'xlpe', 'epr-105'])
        .default('xlpe')
        .meta({ description: 'sets the ICEA P-32-382 temperature limits' }),
      length: quantityField('length', { min: 0, exclusiveMin: true, description: 'one-way length (ft, or "30 m")' }),
      sets: z
        .number()
        .int()
        .min(1)
        .max(100)
        .default(1)
        .meta({ description: 'parallel sets per phase; range 1 to 100 (large services run about 20 sets)' }),
      ampacity: quantityField('current', { min: 0, exclusiveMin: true }).optional().meta({
        description:
          'ampacity of one conductor as installed, A; overrides NFPA 70 Table 310.16 at 75 °C (another ambient, more conductors, 60 °C terminations)',
      }),
      resistance: z.number().min(0).max(100).optional().meta({
        description:
          'ohms per 1000 ft per conductor; overrides NEC Table 9 (MV cables); range 0 to 100 (14 AWG copper is about 3)',
      }),
      reactance: z
        .number()
        .min(0)
        .max(100)
        .optional()
        .meta({ description: 'ohms per 1000 ft per conductor; overrides NEC Table 9; range 0 to 100' }),
      zeroSequence: z
        .object({ resistance: z.number().min(0).max(300), reactance: z.number().min(0).max(300) })
        .strict()
        .optional()
        .meta({ description: 'zero-sequence R0 and X0, ohms per 1000 ft; default 3 × Z1 (common practice)' }),
    })
    .strict();

  const motor = z
    .object({
      id: idField,
      name: nameField.optional(),
      bus: idField,
      hp: boundedNumber(
        0.01,
        200_000,
        'rated horsepower (or give rating)',
        'from fractional-horsepower motors to beyond the largest built (about 100 000 hp)',
      ).optional(),
      rating: quantityField('power', { plainUnit: 'kVA', min: 0, exclusiveMin: true }).optional(),
      fullLoadAmps: quantityField('current', { min: 0, exclusiveMin: true }).optional(),
      phases: z
        .union([z.literal(1), z.literal(3)])
        .default(3)
        .meta({ description: 'three-phase (NFPA 70 Table 430.250) or single-phase (Table 430.248) motor' }),
      contribution: boundedNumber(
        0.1,
        20,
        'first-cycle fault contribution as a multiple of FLA (common practice: 4)',
        'no motor feeds a fault with more than its locked-rotor current',
      ).default(4),
      lockedRotor: boundedNumber(
        1,
        30,
        'locked-rotor current as a multiple of FLA (common practice: 6)',
        'NEMA code letters stop at about 22 kVA/hp, some 25 × FLA',
      ).default(6),
      accelerationTime: quantityField('time', { frequency, min: 0, exclusiveMin: true }).default(5),
      xr: xrRatio('X/R ratio of the motor; omit for the default').optional(),
    })
    .strict();

  const device = z
    .object({
      id: idField,
      name: nameField.optional(),
      feeds: idField.meta({
        description: 'the element just below the device: a transformer, cable, motor, or a bus (for a main)',
      }),
      characteristic: createCharacteristicSchema(frequency),
      rating: quantityField('current', { min: 0, exclusiveMin: true })
        .optional()
        .meta({ description: 'ampere rating (fuse, breaker frame or plug) used by NEC checks' }),
      interruptingRating: quantityField('current', { min: 0, exclusiveMin: true })
        .optional()
        .meta({ description: 'interrupting rating, A symmetrical at the device voltage' }),
      construction: z.enum(['moulded-case', 'insulated-case', 'power-breaker', 'mv-breaker']).optional().meta({
        description:
          'breaker construction, which sets its interrupting test X/R; default: mv-breaker above 1000 V, else moulded-case (power-breaker for a relay)',
      }),
      interruptingTestXr: z
        .number()
        .min(0.1)
        .max(1000)
        .optional()
        .meta({ description: 'X/R of the interrupting-rating test circuit from the listing; overrides the default' }),
      margin: quantityField('time', { frequency, min: 0 })
        .optional()
        .meta({ description: 'coordination margin required above the devices it backs up' }),
      system: z.enum(['emergency', 'legally-required', 'critical-operations', 'elevator']).optional().meta({
        description:
          'part of a system whose overcurrent devices must be selectively coordinated (NFPA 70 700.32, 701.32, 708.54, 620.62)',
      }),
      adjustable: z
        .record(
          z.string().regex(/^[a-zA-Z]+\.[a-zA-Z]+$/, 'expected a setting such as "timeOvercurrent.timeDial"'),
          z
            .object({
              min: z.number().positive().optional(),
              max: z.number().positive().optional(),
              step: z.number().positive().optional(),
              values: z.array(z.number().positive()).min(1).optional(),
            })
            .strict(),
        )
        .optional()
        .meta({
          description:
            'the settings the device offers, by setting ("longTime.pickup"): lowest, highest and step, or the list of values; the setting window uses them in place of the generic ranges',
        }),
    })
    .strict();

  const view = z
    .object({
      id: idField,
      title: nameField.optional(),
      referenceVoltage: voltage('voltage base of the sheet'),
      devices: z
        .array(idField)
        .min(1)
        .max(MAX_VIEW_ITEMS)
        .meta({
          description: `devices whose bands are drawn, each once, at most ${MAX_VIEW_ITEMS} (more cannot be read)`,
        }),
      faults: z
        .array(idField)
        .max(MAX_VIEW_ITEMS)
        .optional()
        .meta({ description: 'buses whose fault currents are drawn; default: the buses of the devices shown' }),
      withstand: z.array(idField).max(MAX_VIEW_ITEMS).default([]).meta({
        description:
          'transformers and cables whose withstand curves are drawn, and generators whose damage and decrement curves are drawn',
      }),
      motors: z
        .array(idField)
        .max(MAX_VIEW_ITEMS)
        .default([])
        .meta({ description: 'motors whose starting curves are drawn' }),
      groundFault: z.boolean().default(false).meta({
        description: 'a ground-fault sheet: ground-fault elements drawn, ground-fault findings hatched',
      }),
      currentRange: axisRangeField('A', 1e-3, 1e7, 'the span of the physical currents').optional(),
      timeRange: axisRangeField('s', 1e-4, 1e5, 'a sheet runs from 0.01 s to 1000 s').optional(),
      notes: notesField.optional(),
    })
    .strict();

  const coordination = z
    .object({
      thinMargin: quantityField('time', { frequency, min: 0 })
        .default(0.1)
        .meta({ description: 'a margin below this (beyond the required one) is "thin"' }),
      halfCycle: quantityField('time', { frequency, min: 0 }).default(0.01),
      horizon: quantityField('time', { frequency, min: 1 })
        .default(1000)
        .meta({ description: 'times beyond this count as never (the top of the sheet), s' }),
      margins: z
        .record(
          z.string().regex(PAIR_KIND, 'expected a pair kind such as "relay/fuse"'),
          z.number().nonnegative().max(5),
        )
        .default({})
        .meta({ description: 'required margin in seconds by pair kind, e.g. {"relay/relay": 0.3}' }),
      pairs: z
        .array(
          z
            .object({
              upstream: idField,
              downstream: idField,
              margin: quantityField('time', { frequency, min: 0, max: 5 }),
            })
            .strict(),
        )
        .default([])
        .meta({ description: 'required margin for one series pair, overriding every other rule' }),
      fuseRatio: z.number().positive().max(1).default(0.75).meta({
        description:
          'the fraction of an upstream fuse minimum melting the downstream device must clear within (preloading): fuse/fuse, and fuse over a relay or LV breaker',
      }),
      codeSelectivity: z.enum(['full-range', 'above-0.1-s']).default('full-range').meta({
        description:
          'what NFPA 70 selective coordination asks of marked systems: every current up to the available fault ("full-range"), or only where the devices take longer than 0.1 s ("above-0.1-s", which some authorities having jurisdiction accept); the authority having jurisdiction decides',
      }),
      edition: z
        .enum(['2017', '2020', '2023'])
        .default('2023')
        .meta({ description: 'NFPA 70 edition the code checks follow' }),
      sensitivity: z
        .object({
          maxTime: quantityField('time', { frequency, min: 0, exclusiveMin: true }).default(2).meta({
            description: 'latest clearing time allowed at the minimum fault in a zone, s (common practice: 2 s)',
          }),
          arcingFactor: z.number().positive().max(1).optional().meta({
            description: 'minimum faults multiplied by this to allow for arcing (e.g. 0.85); off when omitted',
          }),
        })
        .strict()
        .default({ maxTime: 2 }),
    })
    .strict()
    .default({
      thinMargin: 0.1,
      halfCycle: 0.01,
      horizon: 1000,
      margins: {},
      pairs: [],
      fuseRatio: 0.75,
      codeSelectivity: 'full-range',
      edition: '2023',
      sensitivity: { maxTime: 2 },
    });

  const revision = z
    .object({
      revision: nameField.min(1).meta({ description: 'revision mark, e.g. "A" or "2"' }),
      date: nameField.optional(),
      by: nameField.optional(),
      description: notesField.optional().meta({ description: 'what changed' }),
    })
    .strict();

  return z
    .object({
      discern: z.literal(STUDY_VERSION).meta({ description: 'study file format version' }),
      name: nameField.min(1),
      description: notesField.optional(),
      site: nameField.optional().meta({ description: 'where the system is: printed on every figure and report' }),
      client: nameField.optional().meta({ description: 'for whom the study is made' }),
      preparedBy: nameField.optional(),
      checkedBy: nameField.optional(),
      date: nameField.optional().meta({ description: 'the study date, printed as written (e.g. "2026-12-02")' }),
      revisions: z
        .array(revision)
        .default([])
        .meta({ description: 'revision log, oldest first; the last entry is the current revision' }),
      notes: notesField.optional().meta({ description: 'study notes for the report cover' }),
      frequency: z.union([z.literal(50), z.literal(60)]).default(60),
      source,
      generators: z
        .array(generator)
        .max(MAX_VIEW_ITEMS)
        .default([])
        .meta({ description: 'standby and other generators, each feeding its own bus when in service' }),
      switches: z
        .array(switchDevice)
        .max(MAX_ELEMENTS)
        .default([])
        .meta({ description: 'transfer switches, ties and bus couplers (no impedance)' }),
      scenarios: z.array(scenario).max(MAX_VIEW_ITEMS).default([]).meta({
        description:
          'operating scenarios, each fixing every switch and the sources in service so the network is radial; default: "normal" and, with generators and transfer switches, "on generator"',
      }),
      buses: z.array(bus).min(1).max(MAX_ELEMENTS),
      transformers: z.array(transformer).max(MAX_ELEMENTS).default([]),
      cables: z.array(cable).max(MAX_ELEMENTS).default([]),
      motors: z.array(motor).max(MAX_ELEMENTS).default([]),
      devices: z.array(device).max(MAX_ELEMENTS).default([]),
      views: z.array(view).max(MAX_ELEMENTS).default([]),
      coordination,
    })
    .strict();
}

/** The 60 Hz study schema: the single source of the study types and of `schema/study.schema.json`. */
export const studySchema = createStudySchema(60);

/** A parsed study: every quantity in SI base units (V, A, VA, m, s), every default filled in. */
export type Study = z.output<typeof studySchema>;
/** A study as written in a file, before parsing (numbers or text with units). */
export type StudyInput = z.input<typeof studySchema>;
export type Source = Study['source'];
export type Generator = Study['generators'][number];
export type Switch = Study['switches'][number];
export type Scenario = Study['scenarios'][number];
export type Bus = Study['buses'][number];
export type Transformer = Study['transformers'][number];
export type Cable = Study['cables'][number];
export type Motor = Study['motors'][number];
export type Device = Study['devices'][number];
export type View = Study['views'][number];
export type CoordinationSettings = Study['coordination'];
export type Revision = Study['revisions'][number];
