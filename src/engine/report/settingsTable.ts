import { CAUTION } from '../caution.ts';
import { expectedGot, InputError } from '../errors.ts';
import { significant } from '../quantity/format.ts';
import type { Study } from '../study/index.ts';
import { hasScenarios, scenarioLabel, scenarioPartsOf, scenariosOf } from '../scenario/index.ts';
import { notKeptOf, settingText, trialOf, windowIn, type SettingWindow, type Trial } from '../window/index.ts';
import { csvCell } from './csv.ts';

/** One row of the settings table: a device's setting now, its window, the recommendation and what binds it. */
export interface SettingsTableRow {
  deviceId: string;
  device: string;
  setting: string;
  /** The present setting with its unit: "0.4 s". */
  current: string;
  /** The feasible interval with the others held: "0.25–0.5 s", or "none". */
  window: string;
  /** The recommended value ("0.3 s"), "—" where no window exists. */
  recommended: string;
  /** The constraints at the window's lower and upper edges, or what closes it. */
  binding: string;
  /**
   * The constraints the device's recommended setting does not keep, with their margins, "; "-joined
   * ("clear below G1's damage curve up to 3740 A — -24.4 s at 891 A"); "" when it keeps every one or
   * there is no recommendation. The same on every row of one device in one scenario.
   */
  notKept: string;
  /**
   * The scenarios whose windows the row reads, "; "-joined with the labels `check` prints
   * ("Normal; Dock on the office feeder"); "" for a study without scenarios.
   */
  scenarios: string;
}

/** Options of `settingsTableOf`. */
export interface SettingsTableOptions {
  /** The devices to list (ids). @default every adjustable device of the study */
  deviceIds?: string[];
  /**
   * For a study with scenarios, the scenarios (ids) whose windows are worked out: each device in every
   * one of them that energises it. Ignored for a study without scenarios.
   * @default the first scenario that energises each device
   */
  scenarios?: string[];
}

/**
 * The study report's settings table: for every adjustable setting of every device (or those given),
 * the present value, the setting window with the others held, the recommended value, the binding
 * constraints of the window's edges and the constraints the recommendation does not keep
 * (`settingWindowOf`, without maps). In a switched study each device's window is worked out in each
 * scenario of `options.scenarios` that energises it (by default the first that does), and a row that
 * reads the same in several scenarios is given once, naming them all. Devices without settings are
 * left out.
 *
 * @example settingsMarkdown(settingsTableOf(study, { scenarios: ['on-generator'] }))
 */
export function settingsTableOf(study: Study, options: SettingsTableOptions = {}): SettingsTableRow[] {
  const { deviceIds = study.devices.map((d) => d.id), scenarios: chosen } = options;
  // One trial per tree, its network, fault levels and bands worked out once for all of its devices
  // (`windowIn` leaves a trial as it found it): a trial of its own for each device's window made a
  // 2,000-device study's table take 20 s.
  const trials = new Map<Study, Trial>();
  const windowOf = (tree: Study, id: string) => {
    let trial = trials.get(tree);
    if (!trial) trials.set(tree, (trial = trialOf(tree)));
    return windowIn(trial, id, { maps: false, remedies: false });
  };
  const known = new Set(study.devices.map((d) => d.id));
  const unknown = deviceIds.find((id) => !known.has(id));
  if (unknown !== undefined) throw new InputError('device', expectedGot(`one of ${[...known].join(', ')}`, unknown));
  if (!hasScenarios(study)) return deviceIds.flatMap((id) => rowsOf(windowOf(study, id)));
  const scenarios = scenariosOf(study).filter((s) => chosen === undefined || chosen.includes(s.id));
  // Each scenario's trees, split once: the one holding a device is where its window is worked out.
  const treesIn = new Map(scenarios.map((s) => [s, scenarioPartsOf(study, s).map((part) => part.study)]));
  return deviceIds.flatMap((id) => {
    const readings: { label: string; rows: SettingsTableRow[] }[] = [];
    for (const scenario of scenarios) {
      const tree = treesIn.get(scenario)!.find((part) => part.devices.some((d) => d.id === id));
      if (!tree) continue;
      readings.push({ label: scenarioLabel(scenario), rows: rowsOf(windowOf(tree, id)) });
      // Without a choice, the first scenario that energises the device (as `window` without --scenario).
      if (chosen === undefined) break;
    }
    return mergedRows(readings);
  });
}

// Accepts one device's rows in each scenario, in scenario order; each distinct row once, naming every
// scenario it reads the same in, ordered by setting (a setting's readings in scenario order).
function mergedRows(readings: { label: string; rows: SettingsTableRow[] }[]): SettingsTableRow[] {
  const merged = new Map<string, SettingsTableRow & { labels: string[] }>();
  const order = new Map<string, number>();
  for (const { label, rows } of readings)
    for (const row of rows) {
      if (!order.has(row.setting)) order.set(row.setting, order.size);
      const key = [row.setting, row.current, row.window, row.recommended, row.binding, row.notKept].join('\n');
      const known = merged.get(key);
      if (known) known.labels.push(label);
      else merged.set(key, { ...row, labels: [label] });
    }
  return [...merged.values()]
    .sort((a, b) => order.get(a.setting)! - order.get(b.setting)!)
    .map(({ labels, ...row }) => ({ ...row, scenarios: labels.join('; ') }));
}

/** The rows of one device's window. @example rowsOf(settingWindowOf(study, 'MAIN')) */
export function rowsOf(window: SettingWindow): SettingsTableRow[] {
  if (!window.adjustable) return [];
  const recommended = new Map(window.recommendation?.settings.map((s) => [s.key, s]) ?? []);
  const notKept = notKeptOf(window.recommendation?.margins ?? [])
    .map((m) => `${m.label} — ${m.result.text}`)
    .join('; ');
  const switchRows = window.switches.map((s) => ({
    deviceId: window.deviceId,
    device: window.deviceName,
    setting: s.label,
    current: settingText(s.key, s.current),
    window:
      s.options
        .filter((_, k) => s.feasible[k])
        .map((o) => settingText(s.key, o))
        .join(', ') || 'none',
    recommended: recommended.has(s.key) ? settingText(s.key, recommended.get(s.key)!.to) : '—',
    binding: heldText(recommended.get(s.key)?.binding),
    notKept,
    scenarios: '',
  }));
  const settingRows = window.settings.map((s) => {
    const interval = s.intervals[0];
    const unit = s.unit ? ` ${s.unit}` : '';
    const rec = recommended.get(s.key);
    return {
      deviceId: window.deviceId,
      device: window.deviceName,
      setting: s.label,
      // As the window command says it: a present value outside its window is marked.
      current: `${settingText(s.key, s.current, s.unit)}${s.inside ? '' : ' (outside)'}`,
      window: interval ? `${significant(interval.from, 4)}–${significant(interval.to, 4)}${unit}` : 'none',
      recommended: rec ? settingText(s.key, rec.to, s.unit) : '—',
      binding:
        (interval
          ? `from: ${interval.lower.label}; up to: ${interval.upper.label}`
          : `closed by: ${s.blocked.map((b) => b.label).join('; ')}`) + heldText(rec?.binding, '; '),
      notKept,
      scenarios: '',
    };
  });
  return [...switchRows, ...settingRows];
}

// Accepts the constraint a recommended value stops at (as the window command's "held there by") and
// what goes before it; the words for the binding column, or nothing.
function heldText(binding: { label: string } | undefined, before = ''): string {
  return binding ? `${before}recommended held by: ${binding.label}` : '';
}

/**
 * What the recommended value is and what it can still miss, for every table of setting windows to
 * state; each table then says where it names the constraints not kept.
 */
export const RECOMMENDATION_NOTE =
  'The recommended value is the fastest-clearing setting found at which no constraint the settings can change fails: it does not overlap the devices below or above, and keeps the withstand, inrush, motor-starting, load and code limits. Bounds the checks only warn about, such as a generator’s damage curve or clearing the minimum fault in the zone within the time allowed, can still be missed at it, as can limits no setting changes (interrupting duty). The recommendation changes the device’s settings together, so a recommended value can lie outside its own row’s window, which holds the other settings as they are now; and proposals for the whole study (the propose command and the Window tab), which set the devices one after another with those already set, can differ from these, which each hold the rest of the study as it is.';

const HEADERS = [
  'device',
  'setting',
  'now',
  'window (others held)',
  'recommended',
  'binding constraints',
  'not kept at the recommendation',
];
// A study with scenarios adds a last column naming the scenarios each row reads.
const headersOf = (rows: SettingsTableRow[]) => (rows.some((r) => r.scenarios) ? [...HEADERS, 'scenarios'] : HEADERS);
const cellsOf = (row: SettingsTableRow, headers: string[]) => [
  row.device,
  row.setting,
  row.current,
  row.window,
  row.recommended,
  row.binding,
  row.notKept,
  ...(headers.length > HEADERS.length ? [row.scenarios] : []),
];

/**
 * The settings table as a Markdown section, with the caution line.
 * @example settingsMarkdown(settingsTableOf(study)).startsWith('## Settings') // true
 */
export function settingsMarkdown(rows: SettingsTableRow[]): string {
  const escape = (cell: string) => cell.replace(/\|/g, '\\|');
  const headers = headersOf(rows);
  const lines = [
    '## Settings',
    '',
    `Each setting with the device’s other settings and the rest of the study held as they are. ${RECOMMENDATION_NOTE} Every constraint not kept at the recommended setting is named, with its margin, in the column “not kept at the recommendation”.`,
    '',
    `| ${headers.join(' | ')} |`,
    `| ${headers.map(() => '---').join(' | ')} |`,
    ...rows.map((row) => `| ${cellsOf(row, headers).map(escape).join(' | ')} |`),
    '',
    `_${CAUTION}_`,
    '',
  ];
  return lines.join('\n');
}

/**
 * The settings table as CSV (RFC 4180, formula-safe cells), a last row carrying the caution.
 * @example settingsCsv(settingsTableOf(study)).split('\r\n')[0] // 'device,setting,now,…'
 */
export function settingsCsv(rows: SettingsTableRow[]): string {
  const headers = headersOf(rows);
  const lines = [
    headers.map(csvCell).join(','),
    ...rows.map((row) => cellsOf(row, headers).map(csvCell).join(',')),
    `caution,${csvCell(CAUTION)}${','.repeat(headers.length - 2)}`,
  ];
  return `${lines.join('\r\n')}\r\n`;
}
