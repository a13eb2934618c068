import type { Analysis } from '../engine/analysis.ts';
import { CAUTIONS } from '../engine/caution.ts';
import { formatAmps, formatVolts, significant } from '../engine/quantity/index.ts';
import { findingRows } from '../engine/report/findingsTable.ts';
import { settingsTableOf } from '../engine/report/settingsTable.ts';
import { settingsText } from '../engine/report/settingsText.ts';
import { locationBusOf } from '../engine/network/index.ts';
import { formatWork } from '../engine/work.ts';
import { oneLineOf } from '../plot/oneLine/index.ts';
import { sheetOf } from '../plot/sheet.ts';
import type { Drawing } from '../plot/svg.ts';
import { viewInputOf } from '../plot/viewInput.ts';

/** One piece of a report section, rendered by each format in its own way. */
export type ReportBlock =
  | { type: 'paragraph'; text: string }
  | { type: 'list'; items: string[] }
  | { type: 'table'; columns: string[]; rows: string[][]; numeric?: boolean[] }
  | { type: 'figure'; caption: string; drawing: Drawing }
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
        blocks: [
          {
            type: 'figure',
            caption: 'The system as modelled, with maximum and minimum fault currents',
            drawing: oneLineOf(analysis),
          },
        ],
      },
      { id: 'faults', title: 'Fault currents', blocks: faultBlocks(analysis) },
      { id: 'settings', title: 'Device settings', blocks: settingsBlocks(analysis) },
      { id: 'sheets', title: 'Time-current sheets', blocks: sheetBlocks(analysis) },
      { id: 'findings', title: 'Findings', blocks: findingBlocks(analysis) },
      { id: 'appendix', title: 'Appendix: worked fault calculations', blocks: workBlocks(analysis) },
    ],
  };
}

// Accepts the analysis; the models and standards used and the assumptions behind the numbers.
function methodBlocks(analysis: Analysis): ReportBlock[] {
  const { study } = analysis;
  const source = study.source;
  const sourceText =
    source.kind === 'infinite'
      ? 'The source is taken as an infinite bus (no source impedance): the largest possible fault currents.'
      : source.kind === 'generator'
        ? `The source is generator ${source.id}, modelled at maximum by its subtransient reactance X″d and at minimum by its sustained current (IEEE Std 551).`
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
        'Transformers: nameplate impedance on their own rating and X/R; cables: NFPA 70 Chapter 9 Table 9 resistance and reactance at 75 °C for maximum fault, raised to operating temperature for minimum fault, unless the study gives its own values.',
        motors > 0
          ? `Motor contribution: ${motors} motors as first-cycle sources at the multiples of full-load current entered in the study (common practice: 4 × for low-voltage induction motors); none at minimum conditions.`
          : 'Motor contribution: none modelled.',
        'Relays: IEEE C37.112 and IEC 60255-151 inverse-time characteristics with CT ratio, instantaneous element and breaker interrupting time; low-voltage trip units: long-time, short-time, instantaneous and ground-fault functions with tolerance bands; thermal-magnetic breakers and fuses: digitised curves from the device data.',
        'Withstand curves: IEEE C57.109 (liquid-immersed) and IEEE C57.12.59 (dry-type) transformer through-fault curves; ICEA P-32-382 conductor short-circuit limits; transformer magnetising inrush at 8–12 × full-load current for 0.1 s (common practice).',
        `Coordination: every series pair is checked over the currents both devices can see, up to the maximum fault at the downstream device, with the required margins below; below one half-cycle (${significant(study.coordination.halfCycle, 3)} s) curves cannot prove selectivity, and such regions are reported as not provable from curves.`,
        `Code limits: NFPA 70 (${study.coordination.edition} edition) 450.3 for transformer overcurrent protection.`,
      ],
    },
    ...(margins.length > 0
      ? [
          { type: 'paragraph' as const, text: 'Required margins by pair kind:' },
          { type: 'list' as const, items: margins },
        ]
      : []),
  ];
}

// Accepts the analysis; the table of fault currents at every bus.
function faultBlocks(analysis: Analysis): ReportBlock[] {
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
  return [
    {
      type: 'paragraph',
      text: 'Symmetrical RMS currents at each bus, at the bus voltage. A line-to-ground value of 0 means the bus has no ground return (a delta or ungrounded system).',
    },
    {
      type: 'table',
      columns: ['bus', 'voltage', '3φ max', 'L-L max', 'L-G max', 'X/R', '3φ min', 'L-L min', 'L-G min'],
      rows,
      numeric: [false, true, true, true, true, true, true, true, true],
    },
  ];
}

// Accepts the analysis; every device's settings with units.
function settingsBlocks(analysis: Analysis): ReportBlock[] {
  const rows = analysis.study.devices.map((device) => [
    device.name ?? device.id,
    `${locationBusOf(analysis.network, device).name ?? locationBusOf(analysis.network, device).id}`,
    settingsText(device.characteristic).join('; '),
  ]);
  const windows = settingsTableOf(analysis.study);
  return [
    { type: 'table', columns: ['device', 'location', 'settings'], rows },
    ...(windows.length === 0
      ? []
      : [
          {
            type: 'paragraph' as const,
            text: 'Setting windows: each adjustable setting with the device’s other settings and the rest of the study held as they are, the window in which every constraint holds, the recommended value (the fastest-clearing setting that keeps every constraint) and the constraints that set the window’s edges.',
          },
          {
            type: 'table' as const,
            columns: ['device', 'setting', 'now', 'window', 'recommended', 'binding constraints'],
            rows: windows.map((w) => [w.device, w.setting, w.current, w.window, w.recommended, w.binding]),
          },
        ]),
  ];
}

// Accepts the analysis; one figure per view of the study.
function sheetBlocks(analysis: Analysis): ReportBlock[] {
  if (analysis.study.views.length === 0)
    return [
      { type: 'paragraph', text: 'The study has no time-current sheets. Add one per protective path (discern paths).' },
    ];
  return analysis.study.views.map((view) => ({
    type: 'figure',
    caption: view.title ?? view.id,
    drawing: sheetOf(viewInputOf(analysis, view.id), { idPrefix: `tcc-${view.id}` }),
  }));
}

// Accepts the analysis; the findings table and each finding needing attention written out.
function findingBlocks(analysis: Analysis): ReportBlock[] {
  const rows = findingRows(analysis);
  const { counts } = analysis;
  const attention = rows.filter((row) => row.severity === 'fail' || row.severity === 'warning');
  return [
    {
      type: 'paragraph',
      text: `${counts.fail} failing, ${counts.warning} warnings, ${counts.info} notes and ${counts.ok} passing checks.`,
    },
    {
      type: 'table',
      columns: ['severity', 'finding', 'current range', 'worst margin'],
      rows: rows.map((row) => [row.severity, row.title, row.range, row.worst]),
    },
    ...attention.map((row): ReportBlock => ({
      type: 'list',
      items: [
        `${row.severity}: ${row.title}. ${row.explanation}`,
        ...(row.suggestion ? [`Suggested direction: ${row.suggestion}`] : []),
        ...(row.basis ? [`Basis: ${row.basis}`] : []),
      ],
    })),
  ];
}

// Accepts the analysis; each bus's worked calculation.
function workBlocks(analysis: Analysis): ReportBlock[] {
  return analysis.study.buses.map((bus) => ({
    type: 'work',
    title: `${bus.name ?? bus.id} (${formatVolts(bus.voltage)})`,
    text: formatWork(analysis.faults.buses.get(bus.id)!.work),
  }));
}
