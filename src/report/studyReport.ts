import type { Analysis } from '../engine/analysis.ts';
import { CAUTIONS } from '../engine/caution.ts';
import { MAXIMUM_FAULT_TEMPERATURE, MINIMUM_FAULT_TEMPERATURE } from '../engine/fault/index.ts';
import { formatAmps, formatVolts, significant } from '../engine/quantity/format.ts';
import type { Finding, Severity } from '../engine/checks/finding.ts';
import { findingRows, scenarioCountsOf } from '../engine/report/findingsTable.ts';
import { RECOMMENDATION_NOTE, settingsTableOf } from '../engine/report/settingsTable.ts';
import { settingsText } from '../engine/report/settingsText.ts';
import { locationBusOf } from '../engine/network/index.ts';
import { scenariosOf, switchPosition } from '../engine/scenario/index.ts';
import type { Study } from '../engine/study/index.ts';
import { formatWork } from '../engine/work.ts';
import type { Box } from '../plot/geometry.ts';
import { oneLineOf, type OneLine } from '../plot/oneLine/index.ts';
import { sheetOf } from '../plot/sheet.ts';
import type { Drawing } from '../plot/svg.ts';
import { viewInputOf } from '../plot/viewInput.ts';

/** One piece of a report section, rendered by each format in its own way. */
export type ReportBlock =
  | { type: 'paragraph'; text: string }
  | { type: 'list'; items: string[] }
  | { type: 'table'; columns: string[]; rows: string[][]; numeric?: boolean[] }
  | {
      type: 'figure';
      caption: string;
      drawing: Drawing;
      /**
       * What a reader looks for on the figure (a one-line's buses), each by name with the box of its
       * label in the drawing's px: where the figure prints in tiles, an index titled `of` ("bus")
       * follows them, giving the part and page that show each.
       */
      landmarks?: { of: string; places: { name: string; box: Box }[] };
    }
  | { type: 'work'; title: string; text: string };

/** A numbered section of the report. */
export interface ReportSection {
  id: string;
  title: string;
  blocks: ReportBlock[];
}

/** The whole deliverable, independent of format: cover details, cautions and the sections in order. */
export interface StudyReport {
  title: string;
  /** Cover rows `[label, value]`, empty values left out. */
  details: [string, string][];
  cautions: readonly string[];
  revisions: string[][];
  notes?: string;
  sections: ReportSection[];
}

/** Options of {@link studyReportOf}. */
export interface StudyReportOptions {
  /** The date printed on the report; defaults to the study's date. The report has no clock. */
  date?: string;
}

/**
 * Assembles a study's coordination report from its analysis: the cover (study details, revision log,
 * cautions), scope and method, the one-line diagram, the fault currents at every bus, the device
 * settings, every time-current sheet, the findings, and an appendix with the worked fault calculation
 * of every bus. Pure and deterministic: the same analysis and date give the same report.
 * @example markdownOfReport(studyReportOf(analyseStudy(study)))
 */
export function studyReportOf(analysis: Analysis, options: StudyReportOptions = {}): StudyReport {
  const { study } = analysis;
  const revision = study.revisions.at(-1);
  const details: [string, string][] = (
    [
      ['Study', study.name],
      ['Site', study.site],
      ['Client', study.client],
      ['Revision', revision ? `${revision.revision}${revision.date ? `, ${revision.date}` : ''}` : undefined],
      ['Date', options.date ?? study.date],
      ['Prepared by', study.preparedBy],
      ['Checked by', study.checkedBy],
      ['Description', study.description],
    ] as [string, string | undefined][]
  ).filter((row): row is [string, string] => Boolean(row[1]));
  return {
    title: `Protective device coordination study — ${study.name}`,
    details,
    cautions: CAUTIONS,
    revisions: study.revisions.map((r) => [r.revision, r.date ?? '', r.by ?? '', r.description ?? '']),
    notes: study.notes,
    sections: [
      { id: 'method', title: 'Scope and method', blocks: methodBlocks(analysis) },
      {
        id: 'one-line',
        title: 'One-line diagram',
        blocks: treesOf(analysis).map(({ label, scenario, tree }): ReportBlock => {
          const drawing = oneLineOf(scenario === undefined ? tree : withFindingsIn(tree, analysis.findings, scenario));
          return {
            type: 'figure',
            caption: `The system as modelled${label ? ` ${label}` : ''}, with maximum and minimum fault currents`,
            drawing,
            landmarks: { of: 'bus', places: busLandmarksOf(drawing, tree) },
          };
        }),
      },
      { id: 'faults', title: 'Fault currents', blocks: faultBlocks(analysis) },
      { id: 'settings', title: 'Device settings', blocks: settingsBlocks(analysis) },
      { id: 'sheets', title: 'Time-current sheets', blocks: sheetBlocks(analysis) },
      { id: 'findings', title: 'Findings', blocks: findingBlocks(analysis) },
      { id: 'appendix', title: 'Appendix: worked fault calculations', blocks: workBlocks(analysis) },
    ],
  };
}

// Accepts a one-line and the analysis it draws; each bus by its name (its id beside a name two buses
// share) and the box of its label, where a reader finds it.
function busLandmarksOf(drawing: OneLine, tree: Analysis): { name: string; box: Box }[] {
  const buses = drawing.places.filter((place) => place.type === 'bus');
  const nameOf = (id: string) => tree.network.buses.get(id)?.name ?? id;
  const uses = new Map<string, number>();
  for (const { id } of buses) uses.set(nameOf(id), (uses.get(nameOf(id)) ?? 0) + 1);
  return buses.map(({ id, label }) => {
    const name = nameOf(id);
    return { name: uses.get(name)! > 1 && name !== id ? `${name} (${id})` : name, box: label };
  });
}

/** How the pairs on a generator are checked on its decaying current, for the method section. */
const DECAY_METHOD =
  'On a generator, each pair is also checked on the decaying fault current, each element of a device on its own: an inverse-time element operates when the integral of 1 / t(I(t)) over its curve reaches 1 (the time-varying-current method of IEEE C37.112), a definite-time element once the current has stayed above its pickup for its delay, an instantaneous trip once it has for the opening time of its breaker (for a relay, its operating time), the breaker then clearing by its clearing time. Where the excitation support may raise the current above its start (far behind a cable or transformer, or a support above 1/X″d), the downstream device is read on the current held at its start and the upstream device on the raised one. The armature damage curve is (I² − 1) t = 37.5 per unit (IEEE C50.13, from memory) unless the machine data give one.';

/** How generators are modelled, for the method section of a switched study (its sources are listed there). */
const GENERATOR_METHOD = `Generators are modelled at maximum by their subtransient reactance and at minimum by the current they sustain, no more than the subtransient (IEEE Std 551). ${DECAY_METHOD}`;

// Accepts the analysis; the models and standards used and the assumptions behind the numbers.
function methodBlocks(analysis: Analysis): ReportBlock[] {
  const { study } = analysis;
  const source = study.source;
  const sourceText =
    source.kind === 'infinite'
      ? 'The source is taken as an infinite bus (no source impedance): the largest possible fault currents.'
      : source.kind === 'generator'
        ? `The source is generator ${source.id}, modelled at maximum by its subtransient reactance X″d and at minimum by its sustained current, no more than the subtransient (IEEE Std 551).`
        : `The utility source is modelled by its available fault level at maximum${source.min ? ' and at minimum' : ' (no separate minimum was given, so the minimum equals the maximum)'}, with its X/R ratio.`;
  const motors = study.motors.length;
  const margins = [...new Set(analysis.pairs.map((pair) => `${pair.kind}: ${pair.rule.basis}`))].sort();
  return [
    {
      type: 'paragraph',
      text: `This report checks the selective coordination of ${study.devices.length} protective devices on ${study.buses.length} buses, and the protection of ${study.transformers.length} transformers and ${study.cables.length} cables, for the system shown in the one-line diagram.`,
    },
    {
      type: 'list',
      items: [
        `Fault currents: symmetrical RMS bolted faults by the per-unit impedance method (IEEE 399, IEEE 141): three-phase, line-to-line and line-to-ground at every bus, at maximum and minimum conditions. ${sourceText}`,
        `Transformers: nameplate impedance on their own rating and X/R; cables: NFPA 70 Chapter 9 Table 9 resistance and reactance, the resistance (stated at 75 °C) taken to ${conductorTemperatureText(study)}, unless the study gives a cable's own values.`,
        motors > 0
          ? `Motor contribution: ${motors} motors as first-cycle sources at the multiples of full-load current entered in the study (common practice: 4 × for low-voltage induction motors); none at minimum conditions.`
          : 'Motor contribution: none modelled.',
        'Relays: IEEE C37.112 and IEC 60255-151 inverse-time characteristics with CT ratio, instantaneous element and breaker interrupting time; low-voltage trip units: long-time, short-time, instantaneous and ground-fault functions with tolerance bands; thermal-magnetic breakers and fuses: digitised curves from the device data.',
        'Withstand curves: IEEE C57.109 (liquid-immersed) and IEEE C57.12.59 (dry-type) transformer through-fault curves; ICEA P-32-382 conductor short-circuit limits; transformer magnetising inrush at 8–12 × full-load current for 0.1 s (common practice). The figures also mark each transformer’s full-load current and each low-voltage cable’s ampacity as dotted lines.',
        `Coordination: every series pair is checked over the currents both devices can see, up to the maximum fault at the downstream device, with the required margins below; below about one half-cycle (${significant(study.coordination.halfCycle, 3)} s, the study's setting) curves cannot prove selectivity, and such regions are reported as not provable from curves.`,
        `Code limits: NFPA 70 (${study.coordination.edition} edition) 450.3 for transformer overcurrent protection; 230.95(A) for the ground-fault settings of a service main (the first device of a 480 V class system, rated 1000 A or more: 1200 A at most, 1 s at most at 3000 A), told as a warning, since the rule binds a solidly grounded wye service, which the engineer confirms.`,
        'Cable ampacity: at 1000 V and below, each cable’s ampacity (NFPA 70 Table 310.16 at 75 °C unless the study gives one, times its parallel sets) against the rating of the device above it (240.4: the next standard rating up to 800 A, 240.4(D) for small conductors) and against its motor load (430.22, 430.24); a motor branch circuit’s device is left to 430.52 (240.4(G)), and conductors protected only on a transformer’s primary to 240.21(C).',
        'Load: each pickup is checked against the load it feeds: a transformer’s rated current for its primary device and its secondary main (common practice), 125 % of a motor’s full-load current (NFPA 70 430.22), for a feeder 125 % of the largest motor below plus the others’ (430.24) and the rated current of the transformers below. A pickup below it is a warning: where the load never runs all at once, a lower setting may be meant.',
      ],
    },
    ...(margins.length > 0
      ? [
          { type: 'paragraph' as const, text: 'Required margins by pair kind:' },
          { type: 'list' as const, items: margins },
        ]
      : []),
    // A study fed by a generator alone has no scenarios, but its pairs are checked on the decaying current too.
    ...(!analysis.scenarios && source.kind === 'generator' ? [{ type: 'paragraph' as const, text: DECAY_METHOD }] : []),
    ...scenarioBlocks(analysis),
  ];
}

// Accepts the analysis; for a switched study, what each scenario is and how generators are modelled.
function scenarioBlocks(analysis: Analysis): ReportBlock[] {
  const { study, scenarios } = analysis;
  if (!scenarios) return [];
  const generators = study.generators.map(
    (g) =>
      `${g.name ?? g.id}: ${significant(g.rating / 1000, 4)} kVA at ${formatVolts(g.voltage)}, X″d ${significant(g.xdSubtransient, 3)}, X′d ${significant(g.xdTransient, 3)}, Xd ${significant(g.xd, 3)} pu, T″d ${significant(g.tdSubtransient, 3)} s, T′d ${significant(g.tdTransient, 3)} s${g.sustained ? `, excitation support ${significant(g.sustained, 3)} × rated` : ', no excitation support'}.`,
  );
  return [
    {
      type: 'paragraph',
      text:
        scenarios.length === 1
          ? `This report checks the system in one operating scenario, "${scenarios[0].label}", of the ${scenariosOf(study).length} it can be fed in.`
          : `The system can be fed in ${scenarios.length} ways, each checked on its own: every fault level, pair and check below is worked out per scenario, and each finding says in which scenarios it holds.`,
    },
    {
      type: 'table',
      columns: ['scenario', 'sources in service', 'switches', 'not energised'],
      rows: scenarios.map((s) => [
        s.label,
        s.sources.join(', '),
        study.switches.map((w) => `${w.name ?? w.id}: ${switchPosition(w, s.scenario)}`).join('; ') || '—',
        s.deEnergised.join(', ') || '—',
      ]),
    },
    ...(generators.length > 0
      ? [
          {
            type: 'paragraph' as const,
            text: GENERATOR_METHOD,
          },
          { type: 'list' as const, items: generators },
        ]
      : []),
    ...(study.devices.some((d) => d.system)
      ? [
          {
            type: 'paragraph' as const,
            text: `Devices marked as part of an emergency, legally required standby or critical operations system, or elevator circuits, are checked for selective coordination with every supply-side device in every scenario (NFPA 70 700.32, 701.32, 708.54, 620.62), ${study.coordination.codeSelectivity === 'above-0.1-s' ? 'for faults lasting longer than 0.1 s (the study option "above-0.1-s")' : 'over the full range of available fault currents'}${study.coordination.edition === '2023' ? ', and the devices of an emergency system with their load-side devices too (NFPA 70 (2023) 700.32(A))' : ''}; two devices in series with no load connected in parallel with the downstream one (a feeder or transformer primary device over the one main it supplies, as modelled) are left out, as the Exception to 700.32, 701.32 and 708.54 leaves them (its wording for 700.32 and 701.32 recalled, not quoted), the upper device then checked with the devices below the main; on a generator also on its decaying current, for a fault at the marked device's bus.${study.coordination.edition === '2023' ? ' Following NFPA 70 (2023) 240.11, once a feeder device supplied directly by a service device must be selective with it, every feeder device that service device supplies directly is checked with it too; the service device is taken as one with no device above it in the utility’s tree.' : ''} The authority having jurisdiction decides what the requirement means where the work is done.`,
          },
        ]
      : []),
  ];
}

/**
 * Each energised tree the report draws and tabulates: the study itself, or every scenario's parts,
 * labelled, with the label of their scenario as its findings name it.
 */
function treesOf(analysis: Analysis): { label?: string; scenario?: string; tree: Analysis }[] {
  if (!analysis.scenarios) return [{ tree: analysis }];
  return analysis.scenarios.flatMap((s) =>
    s.parts.map((tree) => ({
      label: s.parts.length > 1 ? `in "${s.label}", fed from ${tree.study.source.id}` : `in "${s.label}"`,
      scenario: s.label,
      tree,
    })),
  );
}

/**
 * One scenario's tree with the merged findings that hold in that scenario, in place of the tree's own:
 * the NFPA 70 selective-coordination findings are worked out across scenarios after the trees'
 * findings are merged, so only the merged list has them. Findings about devices of another tree of the
 * same scenario mark nothing on this one.
 */
function withFindingsIn(tree: Analysis, merged: readonly Finding[], scenario: string): Analysis {
  const findings = merged.filter((f) => f.scenarios?.includes(scenario));
  const counts: Record<Severity, number> = { ok: 0, info: 0, warning: 0, fail: 0 };
  for (const finding of findings) counts[finding.severity]++;
  return { ...tree, findings, counts };
}

// Accepts the analysis; the table of fault currents at every bus, per scenario for a switched study.
function faultBlocks(analysis: Analysis): ReportBlock[] {
  const intro: ReportBlock = {
    type: 'paragraph',
    text: 'Symmetrical RMS currents at each bus, at the bus voltage. A line-to-ground value of 0 means the bus has no ground return (a delta or ungrounded system).',
  };
  if (!analysis.scenarios) return [intro, faultTable(analysis)];
  return [
    intro,
    ...treesOf(analysis).flatMap(({ label, tree }): ReportBlock[] => [
      { type: 'paragraph', text: `Fault currents ${label}:` },
      faultTable(tree),
    ]),
  ];
}

// Accepts one energised tree; the table of its buses.
function faultTable(analysis: Analysis): ReportBlock {
  const rows = analysis.study.buses.map((bus) => {
    const fault = analysis.faults.buses.get(bus.id)!;
    const amps = (value: number) => (Number.isFinite(value) ? formatAmps(value, 3) : 'no limit');
    return [
      bus.name ?? bus.id,
      formatVolts(bus.voltage),
      amps(fault.max.threePhase),
      amps(fault.max.lineToLine),
      amps(fault.max.lineToGround),
      Number.isFinite(fault.max.xr) ? significant(fault.max.xr, 3) : 'all reactance',
      amps(fault.min.threePhase),
      amps(fault.min.lineToLine),
      amps(fault.min.lineToGround),
    ];
  });
  return {
    type: 'table',
    columns: ['bus', 'voltage', '3φ max', 'L-L max', 'L-G max', 'X/R', '3φ min', 'L-L min', 'L-G min'],
    rows,
    numeric: [false, true, true, true, true, true, true, true, true],
  };
}

// Accepts the analysis; every device's settings with units.
function settingsBlocks(analysis: Analysis): ReportBlock[] {
  const trees = treesOf(analysis).map(({ tree }) => tree);
  const rows = analysis.study.devices.map((device) => {
    const network = trees.find((tree) => tree.network.devices.has(device.id))?.network;
    const bus = network && locationBusOf(network, device);
    return [
      device.name ?? device.id,
      bus ? (bus.name ?? bus.id) : 'not energised',
      settingsText(device.characteristic, analysis.study.frequency).join('; '),
    ];
  });
  // The windows in the scenarios the report covers (every one, or the one chosen), each row naming its own.
  const windows = settingsTableOf(analysis.study, { scenarios: analysis.scenarios?.map((s) => s.scenario.id) });
  const switched = windows.some((w) => w.scenarios);
  // One line per device (and scenario) whose recommendation misses a constraint, not one per setting.
  const notKept = [
    ...new Set(
      windows.filter((w) => w.notKept).map((w) => `${w.device}${switched ? ` (${w.scenarios})` : ''}: ${w.notKept}`),
    ),
  ];
  return [
    { type: 'table', columns: ['device', 'location', 'settings'], rows },
    ...(windows.length === 0
      ? []
      : [
          {
            type: 'paragraph' as const,
            text: `Setting windows: each adjustable setting with the device’s other settings and the rest of the study held as they are, the window in which no constraint fails, the recommended value, the constraints that set the window’s edges and the one that holds the recommended value where it is${switched ? ', in each scenario that energises the device (a row that reads the same in several scenarios names them all)' : ''}. ${RECOMMENDATION_NOTE} Every constraint not kept at a recommended setting is listed after the table, with its margin.`,
          },
          {
            type: 'table' as const,
            columns: [
              'device',
              'setting',
              'now',
              'window',
              'recommended',
              'binding constraints',
              ...(switched ? ['scenarios'] : []),
            ],
            rows: windows.map((w) => [
              w.device,
              w.setting,
              w.current,
              w.window,
              w.recommended,
              w.binding,
              ...(switched ? [w.scenarios] : []),
            ]),
          },
          notKept.length === 0
            ? { type: 'paragraph' as const, text: 'Every recommendation keeps every constraint.' }
            : { type: 'paragraph' as const, text: 'Constraints not kept at the recommended setting:' },
          ...(notKept.length === 0 ? [] : [{ type: 'list' as const, items: notKept }]),
        ]),
  ];
}

// Accepts the analysis; one figure per view of the study.
function sheetBlocks(analysis: Analysis): ReportBlock[] {
  if (analysis.study.views.length === 0)
    return [
      { type: 'paragraph', text: 'The study has no time-current sheets. Add one per protective path (discern paths).' },
    ];
  // A switched study draws each view in every scenario that energises its devices (titled with the scenario).
  return treesOf(analysis).flatMap(({ tree }, index) =>
    tree.study.views.map((view): ReportBlock => ({
      type: 'figure',
      caption: view.title ?? view.id,
      drawing: sheetOf(viewInputOf(tree, view.id), {
        idPrefix: analysis.scenarios ? `tcc-${index}-${view.id}` : `tcc-${view.id}`,
      }),
    })),
  );
}

// Accepts the analysis; the findings table and each finding but the passes written out, with the
// scenarios each holds in for a switched study (the labels `check` prints).
function findingBlocks(analysis: Analysis): ReportBlock[] {
  const rows = findingRows(analysis);
  const { counts } = analysis;
  const switched = analysis.scenarios !== undefined;
  // Every finding but a pass is written out: a note's sentence may be what limits it ("on illustrative
  // curves: this is no claim of selectivity"), which the table's title alone does not say.
  const writtenOut = rows.filter((row) => row.severity !== 'ok');
  const countsText = (c: Record<Severity, number>) =>
    `${c.fail} failing, ${c.warning} warning${c.warning === 1 ? '' : 's'}, ${c.info} note${c.info === 1 ? '' : 's'} and ${c.ok} passing check${c.ok === 1 ? '' : 's'}`;
  const perScenario = scenarioCountsOf(analysis).map(({ label, counts: c }) => `${label}: ${countsText(c)}.`);
  return [
    { type: 'paragraph', text: `${countsText(counts)}.` },
    ...(perScenario.length > 1
      ? [
          {
            type: 'paragraph' as const,
            text: 'By scenario (a finding holding in several scenarios counts in each):',
          },
          { type: 'list' as const, items: perScenario },
        ]
      : []),
    {
      type: 'table',
      columns: ['severity', 'finding', 'current range', 'worst margin', ...(switched ? ['scenarios'] : [])],
      rows: rows.map((row) => [row.severity, row.title, row.range, row.worst, ...(switched ? [row.scenarios] : [])]),
    },
    ...writtenOut.map((row): ReportBlock => ({
      type: 'list',
      items: [
        `${row.severity}: ${row.title}. ${row.explanation}`,
        ...(switched ? [`Holds in: ${row.scenarios}`] : []),
        ...(row.suggestion ? [`Suggested direction: ${row.suggestion}`] : []),
        ...(row.basis ? [`Basis: ${row.basis}`] : []),
      ],
    })),
  ];
}

// Accepts the analysis; each bus's worked calculation (in each scenario for a switched study).
function workBlocks(analysis: Analysis): ReportBlock[] {
  return treesOf(analysis).flatMap(({ label, tree }) =>
    tree.study.buses.map((bus): ReportBlock => ({
      type: 'work',
      title: `${bus.name ?? bus.id} (${formatVolts(bus.voltage)})${label ? ` ${label}` : ''}`,
      text: formatWork(tree.faults.buses.get(bus.id)!.work),
    })),
  );
}

/**
 * The conductor temperatures of the two fault conditions, in words: each default with its source, a
 * study's own setting as the study's.
 */
function conductorTemperatureText({ conductorTemperatures: { maximumFault, minimumFault } }: Study): string {
  const maximum =
    maximumFault === MAXIMUM_FAULT_TEMPERATURE
      ? '20 °C for maximum fault, as IEC 60909-0 takes it for the maximum short-circuit currents'
      : `${maximumFault} °C for maximum fault (the study's setting)`;
  const minimum =
    minimumFault === MINIMUM_FAULT_TEMPERATURE
      ? 'to operating temperature (90 °C) for minimum fault'
      : `to ${minimumFault} °C for minimum fault (the study's setting)`;
  return `${maximum}, and ${minimum}`;
}
