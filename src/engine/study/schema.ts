import { z } from 'zod/mini';
import { createCharacteristicSchema } from '../devices/characteristic.ts';
import {
  CONDUCTOR_TEMPERATURE_SPAN,
  MAXIMUM_FAULT_TEMPERATURE,
  MINIMUM_FAULT_TEMPERATURE,
} from '../fault/conductorTemperatures.ts';
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
  // A field is described with `.check(z.meta({ description }))`, but a default with
  // `.register(z.globalRegistry, { description })`: `.check()` copies the schema's definition, and a
  // default's copy would hold one value (`[]`, `{ kind: 'solid' }`) that every reading shared, where
  // the default itself gives each reading a copy of its own.
  const voltage = (description: string) =>
    quantityField('voltage', {
      min: 0,
      exclusiveMin: true,
      description: `${description} (V, or text such as "12.47 kV")`,
    });

  const sourceLevel = z.strictObject({
    available: availableFaultField,
    xr: z.optional(xrRatio('X/R ratio at the source; omit for all-reactance')),
    x0x1: z.optional(
      boundedNumber(
        0,
        100,
        'zero-sequence X0/X1 of the source; default 1 (Z0 = Z1, a solidly grounded source)',
        'published ratios stay below about 10',
      ),
    ),
    r0r1: z.optional(
      boundedNumber(0, 100, 'zero-sequence R0/R1 of the source; default: x0x1', 'published ratios stay below about 10'),
    ),
    lineToGround: z.optional(availableFaultField).check(
      z.meta({
        description:
          'available line-to-ground fault at the source bus ("10 kA"), its neutral grounding included; sets Z0 instead of x0x1/r0r1',
      }),
    ),
  });

  const grounding = z
    .strictObject({
      kind: z.enum(['solid', 'resistance', 'reactance', 'ungrounded']),
      ohms: z.optional(
        boundedNumber(
          0,
          100_000,
          'neutral resistor or reactor (Ω)',
          'neutral resistors run from a fraction of an ohm to a few kΩ',
        ),
      ),
    })
    .check(
      z.refine((g) => g.kind === 'solid' || g.kind === 'ungrounded' || g.ohms !== undefined, {
        message: 'expected "ohms" with a resistance or reactance grounding',
        path: ['ohms'],
      }),
      z.meta({ description: 'neutral grounding: solid, through a resistor or reactor of `ohms`, or ungrounded' }),
    );

  const perUnit = (description: string, min: number, max: number, why: string) =>
    boundedNumber(min, max, `${description}, per unit on the machine rating`, why);

  /** A synchronous generator: its rating, reactances and time constants (IEEE Std 551, IEC 60909-0). */
  const generatorFields = {
    id: idField,
    name: z.optional(nameField),
    bus: idField.check(z.meta({ description: 'the bus the generator feeds (its terminals)' })),
    rating: quantityField('power', {
      plainUnit: 'kVA',
      min: 0,
      exclusiveMin: true,
      description: 'rated apparent power (kVA, or "2 MVA")',
    }),
    voltage: voltage('rated line-to-line voltage'),
    powerFactor: z._default(
      boundedNumber(0.5, 1, 'rated power factor (0.8 for most standby sets)', 'between 0.5 and 1'),
      0.8,
    ),
    xdSubtransient: perUnit('subtransient reactance X″d', 0.01, 1, 'published X″d run from about 0.05 to 0.35 pu'),
    xdTransient: perUnit('transient reactance X′d', 0.01, 2, 'published X′d run from about 0.1 to 0.5 pu'),
    xd: perUnit('synchronous reactance Xd', 0.1, 10, 'published Xd run from about 0.5 to 4 pu'),
    x0: z.optional(perUnit('zero-sequence reactance X0', 0.001, 1, 'published X0 run from about 0.01 to 0.2 pu')),
    tdSubtransient: quantityField('time', { frequency, min: 0, exclusiveMin: true, max: 1 }).check(
      z.meta({ description: 'subtransient short-circuit time constant T″d, s (about 0.01 to 0.05 s)' }),
    ),
    tdTransient: quantityField('time', { frequency, min: 0, exclusiveMin: true, max: 20 }).check(
      z.meta({ description: 'transient short-circuit time constant T′d, s (about 0.1 to 2 s)' }),
    ),
    xr: z.optional(xrRatio('X″d / Ra of the machine; omit for the default')),
    sustained: z.optional(
      boundedNumber(
        0.1,
        10,
        'excitation support: the short-circuit current it sustains, as a multiple of rated current (about 3 × for a permanent-magnet or auxiliary-winding exciter, common practice); omit when the current decays toward E/Xd',
        'sustained fault currents run from below 1 × to about 4 × rated',
      ),
    ),
    grounding: z
      ._default(grounding, { kind: 'solid' })
      .register(z.globalRegistry, { description: 'neutral grounding of the generator' }),
    damage: z
      .optional(
        z
          .array(
            z.strictObject({
              current: quantityField('current', { min: 0, exclusiveMin: true }),
              time: quantityField('time', { frequency, min: 0, exclusiveMin: true }),
            }),
          )
          .check(z.minLength(2), z.maxLength(50)),
      )
      .check(
        z.meta({
          description:
            "the machine's thermal damage curve from its data, current rising and time falling; default: the IEEE C50.13 armature short-time capability",
        }),
      ),
  };
  const generator = z.strictObject(generatorFields);

  const source = z.discriminatedUnion('kind', [
    z.strictObject({
      kind: z.literal('utility'),
      id: idField,
      bus: idField.check(z.meta({ description: 'the bus the source feeds' })),
      max: sourceLevel.check(
        z.meta({ description: 'maximum available fault (for interrupting duty and coordination)' }),
      ),
      min: z
        .optional(sourceLevel)
        .check(z.meta({ description: 'minimum available fault (for sensitivity); defaults to max' })),
      grounding: z
        ._default(grounding, { kind: 'solid' })
        .register(z.globalRegistry, { description: 'neutral grounding of the source' }),
    }),
    z.strictObject({ kind: z.literal('infinite'), id: idField, bus: idField }),
    z.strictObject({ kind: z.literal('generator'), ...generatorFields }),
  ]);

  const switchDevice = z.discriminatedUnion('kind', [
    z.strictObject({
      kind: z.literal('transfer'),
      id: idField,
      name: z.optional(nameField),
      normal: idField.check(z.meta({ description: 'the bus on the normal side' })),
      emergency: idField.check(z.meta({ description: 'the bus on the emergency (standby) side' })),
      to: idField.check(z.meta({ description: 'the load bus the switch feeds from one side or the other' })),
    }),
    z.strictObject({
      kind: z.literal('tie'),
      id: idField,
      name: z.optional(nameField),
      from: idField,
      to: idField,
      normally: z._default(z.enum(['open', 'closed']), 'open').register(z.globalRegistry, {
        description: 'position outside any scenario: open for a tie, closed for a bus coupler',
      }),
    }),
  ]);

  const scenario = z.strictObject({
    id: idField,
    name: z.optional(nameField),
    sources: z.optional(z.array(idField).check(z.minLength(1), z.maxLength(MAX_VIEW_ITEMS))).check(
      z.meta({
        description: 'the sources in service (the utility source and generators by id); default: every source',
      }),
    ),
    switches: z
      ._default(z.record(idField, z.enum(['normal', 'emergency', 'open', 'closed'])), {})
      .register(z.globalRegistry, {
        description:
          'switch positions by id: "normal" or "emergency" for a transfer switch, "open" or "closed" for a tie; others stay in their normal position',
      }),
    outOfService: z._default(z.array(idField).check(z.maxLength(MAX_ELEMENTS)), []).register(z.globalRegistry, {
      description: 'transformers and cables switched out (e.g. one main of a main-tie-main)',
    }),
  });

  const bus = z.strictObject({
    id: idField,
    name: z.optional(nameField),
    voltage: voltage('nominal line-to-line voltage'),
    shortCircuitRating: z.optional(quantityField('current', { min: 0, exclusiveMin: true })).check(
      z.meta({
        description: 'equipment short-circuit rating of the bus (switchboard, panelboard, MCC), A symmetrical',
      }),
    ),
  });

  const transformer = z.strictObject({
    id: idField,
    name: z.optional(nameField),
    from: idField.check(z.meta({ description: 'primary bus' })),
    to: idField.check(z.meta({ description: 'secondary bus' })),
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
    xr: z.optional(xrRatio('X/R ratio; omit for all-reactance')),
    connection: z
      ._default(z.enum(['delta-wye', 'delta-delta', 'wye-wye', 'wye-delta']), 'delta-wye')
      .register(z.globalRegistry, {
        description: 'winding connection, primary first; wye secondaries are solidly grounded',
      }),
    phases: z._default(z.union([z.literal(1), z.literal(3)]), 3),
    grounding: z._default(grounding, { kind: 'solid' }).register(z.globalRegistry, {
      description: 'secondary neutral grounding (wye, or the centre tap of a single-phase unit)',
    }),
    primaryConnection: z.optional(z.enum(['line-to-line', 'line-to-neutral'])).check(
      z.meta({
        description:
          'single-phase units: primary winding across two lines or line to neutral; default from the rated primary against the bus voltage',
      }),
    ),
    secondaryWinding: z.optional(z.enum(['two-wire', 'centre-tapped'])).check(
      z.meta({
        description: 'single-phase units: default centre-tapped (120/240 V) for a 240 V secondary, else two-wire',
      }),
    ),
    halfWinding: z
      .optional(
        z.strictObject({
          r: z.number().check(z.minimum(0.1), z.maximum(10)),
          x: z.number().check(z.minimum(0.1), z.maximum(10)),
        }),
      )
      .check(
        z.meta({
          description:
            'centre-tapped units: half-winding R and X as multiples of the full-winding per-unit values (default 1.5 and 1.2, common practice)',
        }),
      ),
    construction: z._default(z.enum(['liquid', 'dry']), 'liquid'),
    category: z
      .optional(z.enum(['I', 'II', 'III', 'IV']))
      .check(z.meta({ description: 'IEEE C57.12.00 through-fault category; inferred from kVA when omitted' })),
    faultFrequency: z
      ._default(z.enum(['frequent', 'infrequent']), 'infrequent')
      .register(z.globalRegistry, { description: 'through-fault duty for the IEEE C57.109 curve' }),
    impedanceTolerance: z
      ._default(z.boolean(), false)
      .register(z.globalRegistry, { description: 'use 92.5 % of nameplate %Z for maximum duty (common practice)' }),
    supervised: z
      ._default(z.boolean(), false)
      .register(z.globalRegistry, { description: 'NEC 450.3: supervised location (qualified persons only)' }),
  });

  const cable = z.strictObject({
    id: idField,
    name: z.optional(nameField),
    from: idField,
    to: idField,
    size: z.string().check(z.maxLength(40), z.meta({ description: 'conductor size: "4/0", "500 kcmil", "12 AWG"' })),
    material: z._default(z.enum(['copper', 'aluminium']), 'copper'),
    conduit: z._default(z.enum(['pvc', 'aluminium', 'steel']), 'steel'),
    insulation: z
      ._default(z.enum(['thermoplastic', 'xlpe', 'epr-105']), 'xlpe')
      .register(z.globalRegistry, { description: 'sets the ICEA P-32-382 temperature limits' }),
    length: quantityField('length', { min: 0, exclusiveMin: true, description: 'one-way length (ft, or "30 m")' }),
    sets: z._default(z.number().check(z.int(), z.minimum(1), z.maximum(100)), 1).register(z.globalRegistry, {
      description: 'parallel sets per phase; range 1 to 100 (large services run about 20 sets)',
    }),
    ampacity: z.optional(quantityField('current', { min: 0, exclusiveMin: true })).check(
      z.meta({
        description:
          'ampacity of one conductor as installed, A; overrides NFPA 70 Table 310.16 at 75 °C (another ambient, more conductors, 60 °C terminations)',
      }),
    ),
    resistance: z.optional(z.number().check(z.minimum(0), z.maximum(100))).check(
      z.meta({
        description:
          'ohms per 1000 ft per conductor; overrides NEC Table 9 (MV cables) and is used as given for both the maximum and the minimum fault, with no temperature correction; range 0 to 100 (14 AWG copper is about 3)',
      }),
    ),
    reactance: z
      .optional(z.number().check(z.minimum(0), z.maximum(100)))
      .check(z.meta({ description: 'ohms per 1000 ft per conductor; overrides NEC Table 9; range 0 to 100' })),
    zeroSequence: z
      .optional(
        z.strictObject({
          resistance: z.number().check(z.minimum(0), z.maximum(300)),
          reactance: z.number().check(z.minimum(0), z.maximum(300)),
        }),
      )
      .check(z.meta({ description: 'zero-sequence R0 and X0, ohms per 1000 ft; default 3 × Z1 (common practice)' })),
  });

  const motor = z
    .strictObject({
      id: idField,
      name: z.optional(nameField),
      bus: idField,
      hp: z.optional(
        boundedNumber(
          0.01,
          200_000,
          'rated horsepower (or give rating)',
          'from fractional-horsepower motors to beyond the largest built (about 100 000 hp)',
        ),
      ),
      rating: z.optional(quantityField('power', { plainUnit: 'kVA', min: 0, exclusiveMin: true })),
      fullLoadAmps: z.optional(quantityField('current', { min: 0, exclusiveMin: true })),
      phases: z._default(z.union([z.literal(1), z.literal(3)]), 3).register(z.globalRegistry, {
        description: 'three-phase (NFPA 70 Table 430.250) or single-phase (Table 430.248) motor',
      }),
      contribution: z._default(
        boundedNumber(
          0.1,
          20,
          'first-cycle fault contribution as a multiple of FLA (common practice: 4)',
          'no motor feeds a fault with more than its locked-rotor current',
        ),
        4,
      ),
      lockedRotor: z._default(
        boundedNumber(
          1,
          30,
          'locked-rotor current as a multiple of FLA (common practice: 6)',
          'NEMA code letters stop at about 22 kVA/hp, some 25 × FLA',
        ),
        6,
      ),
      // V has no upper value in the table, so its motors give their locked-rotor multiple instead.
      codeLetter: z
        .optional(z.enum(['A', 'B', 'C', 'D', 'E', 'F', 'G', 'H', 'J', 'K', 'L', 'M', 'N', 'P', 'R', 'S', 'T', 'U']))
        .check(
          z.meta({
            description:
              'locked-rotor code letter from the nameplate, A to U (NFPA 70 Table 430.7(B)); with hp, sets the locked-rotor current from the letter’s upper kVA per hp in place of lockedRotor',
          }),
        ),
      accelerationTime: z._default(quantityField('time', { frequency, min: 0, exclusiveMin: true }), 5),
      xr: z.optional(xrRatio('X/R ratio of the motor; omit for the default')),
    })
    .check(
      z.refine((m) => m.codeLetter === undefined || m.hp !== undefined, {
        message: 'expected the horsepower a code letter is read with (its kVA per hp)',
        path: ['hp'],
      }),
    );

  const device = z.strictObject({
    id: idField,
    name: z.optional(nameField),
    feeds: idField.check(
      z.meta({
        description: 'the element just below the device: a transformer, cable, motor, or a bus (for a main)',
      }),
    ),
    characteristic: createCharacteristicSchema(frequency),
    rating: z
      .optional(quantityField('current', { min: 0, exclusiveMin: true }))
      .check(z.meta({ description: 'ampere rating (fuse, breaker frame or plug) used by NEC checks' })),
    interruptingRating: z
      .optional(quantityField('current', { min: 0, exclusiveMin: true }))
      .check(z.meta({ description: 'interrupting rating, A symmetrical at the device voltage' })),
    construction: z.optional(z.enum(['moulded-case', 'insulated-case', 'power-breaker', 'mv-breaker'])).check(
      z.meta({
        description:
          'breaker construction, which sets its interrupting test X/R; default: mv-breaker above 1000 V, else moulded-case (power-breaker for a relay)',
      }),
    ),
    interruptingTestXr: z
      .optional(z.number().check(z.minimum(0.1), z.maximum(1000)))
      .check(
        z.meta({ description: 'X/R of the interrupting-rating test circuit from the listing; overrides the default' }),
      ),
    margin: z
      .optional(quantityField('time', { frequency, min: 0 }))
      .check(z.meta({ description: 'coordination margin required above the devices it backs up' })),
    system: z.optional(z.enum(['emergency', 'legally-required', 'critical-operations', 'elevator'])).check(
      z.meta({
        description:
          'part of a system whose overcurrent devices must be selectively coordinated (NFPA 70 700.32, 701.32, 708.54, 620.62)',
      }),
    ),
    adjustable: z
      .optional(
        z.record(
          z.string().check(z.regex(/^[a-zA-Z]+\.[a-zA-Z]+$/, 'expected a setting such as "timeOvercurrent.timeDial"')),
          z.strictObject({
            min: z.optional(z.number().check(z.positive())),
            max: z.optional(z.number().check(z.positive())),
            step: z.optional(z.number().check(z.positive())),
            values: z.optional(z.array(z.number().check(z.positive())).check(z.minLength(1))),
          }),
        ),
      )
      .check(
        z.meta({
          description:
            'the settings the device offers, by setting ("longTime.pickup"): lowest, highest and step, or the list of values; the setting window uses them in place of the generic ranges',
        }),
      ),
  });

  const view = z.strictObject({
    id: idField,
    title: z.optional(nameField),
    referenceVoltage: voltage('voltage base of the sheet'),
    devices: z.array(idField).check(
      z.minLength(1),
      z.maxLength(MAX_VIEW_ITEMS),
      z.meta({
        description: `devices whose bands are drawn, each once, at most ${MAX_VIEW_ITEMS} (more cannot be read)`,
      }),
    ),
    faults: z
      .optional(z.array(idField).check(z.maxLength(MAX_VIEW_ITEMS)))
      .check(z.meta({ description: 'buses whose fault currents are drawn; default: the buses of the devices shown' })),
    withstand: z._default(z.array(idField).check(z.maxLength(MAX_VIEW_ITEMS)), []).register(z.globalRegistry, {
      description:
        'transformers and cables whose withstand curves are drawn, and generators whose damage and decrement curves are drawn',
    }),
    motors: z
      ._default(z.array(idField).check(z.maxLength(MAX_VIEW_ITEMS)), [])
      .register(z.globalRegistry, { description: 'motors whose starting curves are drawn' }),
    groundFault: z._default(z.boolean(), false).register(z.globalRegistry, {
      description: 'a ground-fault sheet: ground-fault elements drawn, ground-fault findings hatched',
    }),
    currentRange: z.optional(axisRangeField('A', 1e-3, 1e7, 'the span of the physical currents')),
    timeRange: z.optional(axisRangeField('s', 1e-4, 1e5, 'a sheet runs from 0.01 s to 1000 s')),
    notes: z.optional(notesField),
  });

  const coordination = z._default(
    z.strictObject({
      thinMargin: z
        ._default(quantityField('time', { frequency, min: 0 }), 0.1)
        .register(z.globalRegistry, { description: 'a margin below this (beyond the required one) is "thin"' }),
      halfCycle: z._default(quantityField('time', { frequency, min: 0 }), 0.01),
      horizon: z
        ._default(quantityField('time', { frequency, min: 1 }), 1000)
        .register(z.globalRegistry, { description: 'times beyond this count as never (the top of the sheet), s' }),
      margins: z
        ._default(
          z.record(
            z.string().check(z.regex(PAIR_KIND, 'expected a pair kind such as "relay/fuse"')),
            z.number().check(z.nonnegative(), z.maximum(5)),
          ),
          {},
        )
        .register(z.globalRegistry, {
          description: 'required margin in seconds by pair kind, e.g. {"relay/relay": 0.3}',
        }),
      pairs: z
        ._default(
          z.array(
            z.strictObject({
              upstream: idField,
              downstream: idField,
              margin: quantityField('time', { frequency, min: 0, max: 5 }),
            }),
          ),
          [],
        )
        .register(z.globalRegistry, {
          description: 'required margin for one series pair, overriding every other rule',
        }),
      fuseRatio: z._default(z.number().check(z.positive(), z.maximum(1)), 0.75).register(z.globalRegistry, {
        description:
          'the fraction of an upstream fuse minimum melting the downstream device must clear within (preloading): fuse/fuse, and fuse over a relay or LV breaker',
      }),
      codeSelectivity: z._default(z.enum(['full-range', 'above-0.1-s']), 'full-range').register(z.globalRegistry, {
        description:
          'what NFPA 70 selective coordination asks of marked systems: every current up to the available fault ("full-range"), or only where the devices take longer than 0.1 s ("above-0.1-s", which some authorities having jurisdiction accept); the authority having jurisdiction decides',
      }),
      edition: z
        ._default(z.enum(['2017', '2020', '2023']), '2023')
        .register(z.globalRegistry, { description: 'NFPA 70 edition the code checks follow' }),
      sensitivity: z._default(
        z.strictObject({
          maxTime: z
            ._default(quantityField('time', { frequency, min: 0, exclusiveMin: true }), 2)
            .register(z.globalRegistry, {
              description: 'latest clearing time allowed at the minimum fault in a zone, s (common practice: 2 s)',
            }),
          arcingFactor: z.optional(z.number().check(z.positive(), z.maximum(1))).check(
            z.meta({
              description: 'minimum faults multiplied by this to allow for arcing (e.g. 0.85); off when omitted',
            }),
          ),
        }),
        { maxTime: 2 },
      ),
    }),
    {
      thinMargin: 0.1,
      halfCycle: 0.01,
      horizon: 1000,
      margins: {},
      pairs: [],
      fuseRatio: 0.75,
      codeSelectivity: 'full-range',
      edition: '2023',
      sensitivity: { maxTime: 2 },
    },
  );

  // The conductor temperatures of the two fault conditions, to which NFPA 70 Chapter 9 Table 9's 75 °C
  // resistances are taken (a cable's own resistance is used as entered).
  const temperature = (description: string) =>
    boundedNumber(
      CONDUCTOR_TEMPERATURE_SPAN.min,
      CONDUCTOR_TEMPERATURE_SPAN.max,
      description,
      "°C, from a cold site's ambient to the short-circuit limit of XLPE and EPR insulation (ICEA P-32-382)",
    );
  const conductorTemperatures = z._default(
    z
      .strictObject({
        maximumFault: z._default(
          temperature(
            'conductor temperature for the maximum fault, °C (IEC 60909-0:2016 takes 20 °C for the maximum short-circuit currents)',
          ),
          MAXIMUM_FAULT_TEMPERATURE,
        ),
        minimumFault: z._default(
          temperature(
            'conductor temperature for the minimum fault, °C (common practice: 90 °C, operating temperature; IEC 60909-0:2016 takes the temperature at the end of the fault)',
          ),
          MINIMUM_FAULT_TEMPERATURE,
        ),
      })
      .check(
        // Said of the pair, once each reads: either may be the one to change.
        z.superRefine(
          ({ maximumFault, minimumFault }, ctx) => {
            if (!(minimumFault < maximumFault)) return;
            ctx.addIssue({
              code: 'custom',
              message: `expected a minimum-fault temperature at or above the maximum-fault one (a hotter conductor carries less), got ${minimumFault} °C below ${maximumFault} °C`,
            });
          },
          { when: ({ issues }) => issues.length === 0 },
        ),
      ),
    { maximumFault: MAXIMUM_FAULT_TEMPERATURE, minimumFault: MINIMUM_FAULT_TEMPERATURE },
  );

  const revision = z.strictObject({
    revision: nameField.check(z.minLength(1), z.meta({ description: 'revision mark, e.g. "A" or "2"' })),
    date: z.optional(nameField),
    by: z.optional(nameField),
    description: z.optional(notesField).check(z.meta({ description: 'what changed' })),
  });

  return z.strictObject({
    discern: z.literal(STUDY_VERSION).check(z.meta({ description: 'study file format version' })),
    name: nameField.check(z.minLength(1)),
    description: z.optional(notesField),
    site: z
      .optional(nameField)
      .check(z.meta({ description: 'where the system is: printed on every figure and report' })),
    client: z.optional(nameField).check(z.meta({ description: 'for whom the study is made' })),
    preparedBy: z.optional(nameField),
    checkedBy: z.optional(nameField),
    date: z
      .optional(nameField)
      .check(z.meta({ description: 'the study date, printed as written (e.g. "2026-12-02")' })),
    revisions: z._default(z.array(revision), []).register(z.globalRegistry, {
      description: 'revision log, oldest first; the last entry is the current revision',
    }),
    notes: z.optional(notesField).check(z.meta({ description: 'study notes for the report cover' })),
    frequency: z._default(z.union([z.literal(50), z.literal(60)]), 60),
    source,
    generators: z._default(z.array(generator).check(z.maxLength(MAX_VIEW_ITEMS)), []).register(z.globalRegistry, {
      description: 'standby and other generators, each feeding its own bus when in service',
    }),
    switches: z._default(z.array(switchDevice).check(z.maxLength(MAX_ELEMENTS)), []).register(z.globalRegistry, {
      description: 'transfer switches, ties and bus couplers (no impedance)',
    }),
    scenarios: z._default(z.array(scenario).check(z.maxLength(MAX_VIEW_ITEMS)), []).register(z.globalRegistry, {
      description:
        'operating scenarios, each fixing every switch and the sources in service so the network is radial; default: "normal" and, with generators and transfer switches, "on generator"',
    }),
    buses: z.array(bus).check(z.minLength(1), z.maxLength(MAX_ELEMENTS)),
    transformers: z._default(z.array(transformer).check(z.maxLength(MAX_ELEMENTS)), []),
    cables: z._default(z.array(cable).check(z.maxLength(MAX_ELEMENTS)), []),
    motors: z._default(z.array(motor).check(z.maxLength(MAX_ELEMENTS)), []),
    devices: z._default(z.array(device).check(z.maxLength(MAX_ELEMENTS)), []),
    views: z._default(z.array(view).check(z.maxLength(MAX_ELEMENTS)), []),
    coordination,
    conductorTemperatures,
  });
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
