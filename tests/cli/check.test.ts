import { describe, expect, it } from 'vitest';
import { checkCommand } from '../../src/cli/commands/check.ts';
import { CAUTION } from '../../src/engine/caution.ts';
import { runVerb } from './run.ts';

describe('discern check', () => {
  it('has the expected defaults: a findings table without passing rows, a summary and the caution; exit 0 when nothing fails', async () => {
    const { code, stdout } = await runVerb(['demo/harrowmere-selective.json'], checkCommand);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^Harrowmere Cold Store — selective scheme\n/);
    expect(stdout).toMatch(/\n0 fail, \d+ warning, \d+ info, \d+ ok\n/);
    expect(stdout).toContain(CAUTION);
    expect(stdout).not.toMatch(/^ok /m);
  });

  it('exits 1 on an overlap and explains it', async () => {
    const { code, stdout } = await runVerb(['demo/harrowmere-overlap.json'], checkCommand);
    expect(code).toBe(1);
    expect(stdout).toMatch(/^fail\s+Main 2000 A over MCC feeder 600 A: overlap\s+7200 A–\d+(\.\d+)? kA @ 480 V/m);
    expect(stdout).toMatch(/→ Raise Main 2000 A's instantaneous pickup/);
  });

  it('writes a Markdown or CSV report with --report, and lists passes with --all', async () => {
    const md = await runVerb(['demo/harrowmere-fused.json', '--report', 'out/findings.md', '--all'], checkCommand);
    expect(md.code).toBe(1);
    expect(String(md.files.get('out/findings.md'))).toMatch(
      /^# Coordination findings — Harrowmere Cold Store — fused primary/,
    );
    expect(md.stdout).toMatch(/^ok /m);
    const csv = await runVerb(['demo/harrowmere-fused.json', '--report', 'out/findings.csv'], checkCommand);
    expect(String(csv.files.get('out/findings.csv'))).toMatch(/^severity,kind,title/);
  });

  it('prints JSON with --json', async () => {
    const { code, stdout } = await runVerb(['demo/harrowmere-overlap.json', '--json'], checkCommand);
    expect(code).toBe(1);
    const json = JSON.parse(stdout);
    expect(json.findings.length).toBeGreaterThan(10);
    expect(json.pairs[0]).toMatchObject({ upstream: 'R-T1', downstream: 'MAIN' });
  });

  it('exits 2 with one line naming the field for a bad study, a bad report name or a missing file', async () => {
    const missing = await runVerb(['demo/nowhere.json'], checkCommand);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(
      /^demo\/nowhere\.json: expected a readable study file, got "demo\/nowhere\.json"\n$/,
    );
    const report = await runVerb(['demo/harrowmere-selective.json', '--report', 'out/x.txt'], checkCommand);
    expect(report.code).toBe(2);
    expect(report.stderr).toMatch(/^--report: expected a file name ending \.md or \.csv, got "out\/x\.txt"\n$/);
    const none = await runVerb([], checkCommand);
    expect(none.stderr).toMatch(/^check: expected a study file, got nothing\n$/);
  });
});
