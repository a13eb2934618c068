import { significant } from '../quantity/format.ts';
import type { SettingValue } from './settings.ts';

/**
 * A setting's value as a table shows it: numbers to four significant figures with their unit,
 * the instantaneous switch as on/off, I²t as in/out, "—" for an absent element.
 *
 * @example settingText('shortTime.i2t', true, '') // 'in'
 */
export function settingText(key: string, value: SettingValue | undefined, unit = ''): string {
  if (value === undefined) return '—';
  if (typeof value === 'boolean') {
    if (key === 'shortTime.i2t') return value ? 'in' : 'out';
    return value ? 'on' : 'off';
  }
  return `${significant(value, 4)}${unit ? ` ${unit}` : ''}`;
}

/**
 * The changed settings of a before/after list in words: "short-time delay 0.4 s → 0.3 s, instantaneous trip on → off".
 *
 * @example changesText([{ key: 'shortTime.delay', label: 'short-time delay', unit: 's', from: 0.4, to: 0.3 }])
 */
export function changesText(
  rows: { key: string; label: string; unit: string; from: SettingValue | undefined; to: SettingValue | undefined }[],
): string {
  return rows
    .filter((row) => row.from !== row.to && row.to !== undefined)
    .map(
      (row) => `${row.label} ${settingText(row.key, row.from, row.unit)} → ${settingText(row.key, row.to, row.unit)}`,
    )
    .join(', ');
}
