import { CAUTION } from '../caution.ts';
import { significant } from '../quantity/format.ts';
import type { Study } from '../study/index.ts';
import { treeHolding } from '../scenario/index.ts';
import { settingText, settingWindowOf, type SettingWindow } from '../window/index.ts';
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
}

/** Options of `settingsTableOf`. */
export interface SettingsTableOptions {
  /** The devices to list (ids). @default every adjustable device of the study */
  deviceIds?: string[];
}

/**
 * The study report's settings table: for every adjustable setting of every device (or those given),
 * the present value, the setting window with the others held, the recommended value and the binding
 * constraints of the window's edges (`settingWindowOf`, without maps; in a switched study, in the first
 * scenario that energises the device). Devices without settings are left out.
 *
 * @example settingsMarkdown(settingsTableOf(study))
 */
export function settingsTableOf(study: Study, options: SettingsTableOptions = {}): SettingsTableRow[] {
  const { deviceIds = study.devices.map((d) => d.id) } = options;
  return deviceIds.flatMap((id) => {
    // A switched study: the window in the first scenario that energises the device.
    const tree = treeHolding(study, id);
    return tree ? rowsOf(settingWindowOf(tree, id, { maps: false, remedies: false })) : [];
  });
}

/** The rows of one device's window. @example rowsOf(settingWindowOf(study, 'MAIN')) */
export function rowsOf(window: SettingWindow): SettingsTableRow[] {
  if (!window.adjustable) return [];
  const recommended = new Map(window.recommendation?.settings.map((s) => [s.key, s]) ?? []);
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
    binding: '',
  }));
  const settingRows = window.settings.map((s) => {
    const interval = s.intervals[0];
    const unit = s.unit ? ` ${s.unit}` : '';
    const rec = recommended.get(s.key);
    return {
      deviceId: window.deviceId,
      device: window.deviceName,
      setting: s.label,
      current: settingText(s.key, s.current, s.unit),
      window: interval ? `${significant(interval.from, 4)}–${significant(interval.to, 4)}${unit}` : 'none',
      recommended: rec ? settingText(s.key, rec.to, s.unit) : '—',
      binding: interval
        ? `from: ${interval.lower.label}; up to: ${interval.upper.label}`
        : `closed by: ${s.blocked.map((b) => b.label).join('; ')}`,
    };
  });
  return [...switchRows, ...settingRows];
}

const HEADERS = ['device', 'setting', 'now', 'window (others held)', 'recommended', 'binding constraints'];
const cellsOf = (row: SettingsTableRow) => [
  row.device,
  row.setting,
  row.current,
  row.window,
  row.recommended,
  row.binding,
];

/**
 * The settings table as a Markdown section, with the caution line.
 * @example settingsMarkdown(settingsTableOf(study)).startsWith('## Settings') // true
 */
export function settingsMarkdown(rows: SettingsTableRow[]): string {
  const escape = (cell: string) => cell.replace(/\|/g, '\\|');
  const lines = [
    '## Settings',
    '',
    'Each setting with the device’s other settings and the rest of the study held as they are; the recommended value is the fastest-clearing setting that keeps every constraint.',
    '',
    `| ${HEADERS.join(' | ')} |`,
    `| ${HEADERS.map(() => '---').join(' | ')} |`,
    ...rows.map((row) => `| ${cellsOf(row).map(escape).join(' | ')} |`),
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
  const lines = [
    HEADERS.map(csvCell).join(','),
    ...rows.map((row) => cellsOf(row).map(csvCell).join(',')),
    `caution,${csvCell(CAUTION)},,,,`,
  ];
  return `${lines.join('\r\n')}\r\n`;
}
