import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CAUTION } from '../../../src/engine/caution.ts';
import { settingsCsv, settingsMarkdown, settingsTableOf } from '../../../src/engine/report/settingsTable.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

const study = parseStudy(readFileSync('demo/harrowmere-overlap.json', 'utf8'));

describe('settingsTableOf', () => {
  it('has the expected defaults: a row per adjustable setting of every device, fuses and breakers left out', () => {
    const rows = settingsTableOf(study);
    expect(new Set(rows.map((r) => r.deviceId))).not.toContain('EM-BR');
    const delay = rows.find((r) => r.deviceId === 'MAIN' && r.setting === 'short-time delay')!;
    expect(delay).toMatchObject({ device: 'Main 2000 A', current: '0.4 s' });
    expect(delay.window).toBe('none');
    expect(delay.binding).toMatch(/^closed by: coordinate with MCC feeder 600 A below/);
    expect(rows.find((r) => r.deviceId === 'MAIN' && r.setting === 'instantaneous trip')).toMatchObject({
      current: 'on',
      recommended: 'off',
    });
  });

  it('renders Markdown and CSV with the caution', () => {
    const rows = settingsTableOf(study, { deviceIds: ['R-T1'] });
    expect(rows.map((r) => r.setting)).toEqual([
      'instantaneous element',
      'instantaneous pickup',
      'time dial',
      'pickup (tap)',
    ]);
    const md = settingsMarkdown(rows);
    expect(md).toMatch(/^## Settings\n/);
    expect(md).toMatch(
      /^\| T1 primary relay \| time dial \| 6 \| [\d.]+–[\d.]+ \| [\d.]+ \| from: coordinate with Main 2000 A below/m,
    );
    expect(md).toContain(CAUTION);
    const csv = settingsCsv(rows);
    expect(csv.split('\r\n')[0]).toBe('device,setting,now,window (others held),recommended,binding constraints');
    expect(csv).toContain(CAUTION);
  });
});
