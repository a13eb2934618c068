import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { checkCommand } from '../../src/cli/commands/check.ts';
import { CAUTION } from '../../src/engine/caution.ts';
import { runVerb, spawnDiscern } from './run.ts';

describe('discern check', () => {
  it('has the expected defaults: a findings table without passing rows, a summary and the caution; exit 0 when nothing fails', async () => {
    const { code, stdout } = await runVerb(['demo/harrowmere-selective.json'], checkCommand);
    expect(code).toBe(0);
    expect(stdout).toMatch(/^Harrowmere Cold Store — selective scheme\n/);
    expect(stdout).toMatch(/\n0 fail, \d+ warning, \d+ info, \d+ ok\n/);
    expect(stdout.replace(/\s+/g, ' ')).toContain(CAUTION);
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
    expect(String(md.files.get('out/findings.md'))).toMatch(
      /\n`counts: \d+ fail, \d+ thin margin, \d+ not provable, \d+ warning, \d+ info, \d+ ok`\n/,
    );
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

  it('fails a 10 kA breaker on a 45 kA switchboard (NFPA 70 110.9) with exit 1', async () => {
    // 45 kA at X/R 8 against a UL 489 10 kA rating (PF 50 %, X/R √3): duty 1.4404 × 45 kA = 64.8 kA (python3).
    const { code, stdout } = await runVerb(['tests/fixtures/studies/interrupting-duty.json'], checkCommand);
    expect(code).toBe(1);
    expect(stdout).toMatch(/^fail\s+Lighting feeder 100 A: rated 10 kA, duty 64\.8 kA\s+64\.8 kA @ 480 V/m);
    expect(stdout).toMatch(/\ncounts: 1 fail, 0 thin margin, 0 not provable, 0 warning, \d+ info, \d+ ok\n$/);
  });

  it('ends a real process with exit 1 on the interrupting-duty failure, the counts line last', () => {
    const { code, stdout } = spawnDiscern(['check', 'tests/fixtures/studies/interrupting-duty.json', '--strict']);
    expect(code).toBe(1);
    expect(stdout.trimEnd().split('\n').at(-1)).toMatch(/^counts: 1 fail, /);
  });

  it('ends quietly when the reader closes the pipe early (`discern check … | head`)', () => {
    // 200 kB of findings, more than a pipe holds: the writes meet a closed pipe once `head` has its bytes.
    const piped = spawnSync(
      'bash',
      ['-c', 'node_modules/.bin/tsx src/cli/main.ts check demo/harrowmere-full.json --json --all | head -c 30'],
      { encoding: 'utf8' },
    );
    expect(piped.stdout).toMatch(/^\{\n {2}"study": "Harrowmere/);
    expect(piped.stderr).toBe('');
  });

  it('ends with one line counting each class, and exits 1 under --strict on thin margins or unprovable regions', async () => {
    // The full demo has regions not provable from curves and no failures: 0 by default, 1 with --strict.
    const plain = await runVerb(['demo/harrowmere-full.json'], checkCommand);
    expect(plain.code).toBe(0);
    const counts = plain.stdout.trimEnd().split('\n').at(-1)!;
    const match = /^counts: 0 fail, (\d+) thin margin, (\d+) not provable, (\d+) warning, (\d+) info, (\d+) ok$/.exec(
      counts,
    );
    expect(match).not.toBeNull();
    expect(Number(match![2])).toBeGreaterThan(0);
    const strict = await runVerb(['demo/harrowmere-full.json', '--strict'], checkCommand);
    expect(strict.code).toBe(1);
    // The selective demo has neither: --strict still passes it.
    const selective = await runVerb(['demo/harrowmere-selective.json', '--strict'], checkCommand);
    expect(selective.code).toBe(0);
    expect(selective.stdout).toMatch(
      /\ncounts: 0 fail, 0 thin margin, 0 not provable, \d+ warning, \d+ info, \d+ ok\n$/,
    );
    // The classes add up to the findings.
    const json = JSON.parse((await runVerb(['demo/harrowmere-full.json', '--json'], checkCommand)).stdout);
    const sum = match!.slice(1).reduce((total, n) => total + Number(n), 0) + 0;
    expect(sum).toBe(json.findings.length);
  });

  it('keeps every line within 120 columns, wrapping long finding titles and explanations', async () => {
    const { stdout } = await runVerb(['demo/harrowmere-overlap.json'], checkCommand);
    const widest = Math.max(...stdout.split('\n').map((line) => [...line].length));
    expect(widest).toBeLessThanOrEqual(120);
    expect(stdout).toMatch(/\n {10}\S/); // a wrapped title continues under its column
  });

  it('lists --strict in its help', async () => {
    const { code, stdout } = await runVerb(['--help'], checkCommand);
    expect(code).toBe(0);
    expect(stdout).toMatch(/--strict\s+also exit 1 on a thin margin or a region not provable from curves/);
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
