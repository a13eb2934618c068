import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyseStudy } from '../../../src/engine/analysis.ts';
import { CAUTION } from '../../../src/engine/caution.ts';
import { csvReport, findingRows, jsonReport, markdownReport } from '../../../src/engine/report/index.ts';
import { parseStudy } from '../../../src/engine/study/index.ts';

const overlap = analyseStudy(parseStudy(readFileSync('demo/harrowmere-overlap.json', 'utf8')));

describe('reports', () => {
  it('has the expected defaults: failures first, then warnings, info and passes', () => {
    const order = findingRows(overlap).map((r) => r.severity);
    const rank = { fail: 0, warning: 1, info: 2, ok: 3 } as const;
    expect(order.map((s) => rank[s as keyof typeof rank])).toEqual(
      [...order.map((s) => rank[s as keyof typeof rank])].sort(),
    );
  });

  it('markdownReport carries the caution, a summary and every failure written out', () => {
    const md = markdownReport(overlap);
    expect(md).toContain(CAUTION);
    expect(md).toMatch(/\*\*Summary:\*\* \d+ fail, \d+ warning, \d+ info, \d+ ok\./);
    expect(md).toContain('### fail: Main 2000 A over MCC feeder 600 A: overlap');
  });

  it('markdownReport keeps hostile names from adding markup or breaking the table', () => {
    const text = readFileSync('demo/harrowmere-overlap.json', 'utf8').replace(
      '"Main 2000 A"',
      '"Main <script>x</script> | 2000 A"',
    );
    const md = markdownReport(analyseStudy(parseStudy(text)));
    expect(md).not.toContain('<script>');
    expect(md).toContain('&lt;script&gt;');
    expect(md).toContain('\\| 2000 A');
  });

  it('markdownReport shows link and image syntax in names as typed, never as a link', () => {
    const text = readFileSync('demo/harrowmere-overlap.json', 'utf8').replace(
      '"Main 2000 A"',
      '"![x](http://example.invalid/a.png) [y](javascript:alert(1)) <http://example.invalid>"',
    );
    const md = markdownReport(analyseStudy(parseStudy(text)));
    expect(md).not.toMatch(/!\[x\]\(|[^\\]\[y\]\(|<http/);
    expect(md).toContain('!\\[x\\](http://example.invalid/a.png)');
  });

  it('csvReport neutralises formula injection in names (OWASP CSV Injection)', () => {
    const text = readFileSync('demo/harrowmere-overlap.json', 'utf8').replace('"Main 2000 A"', '"-1+2 main"');
    const csv = csvReport(analyseStudy(parseStudy(text)));
    expect(csv).not.toMatch(/(^|,)"?-1\+2/m);
    expect(csv).toContain("'-1+2 main");
  });

  it('csvReport quotes cells with commas and quotes (RFC 4180) and ends with the caution', () => {
    const csv = csvReport(overlap);
    const lines = csv.trimEnd().split('\r\n');
    expect(lines[0]).toBe('severity,kind,title,range,worst,explanation,suggestion,basis');
    expect(lines.at(-1)).toContain('caution');
    expect(csv).toMatch(/"Between [^"]*, [^"]*"/);
  });

  it('jsonReport writes infinite times as null so the output is valid JSON', () => {
    const text = JSON.stringify(jsonReport(overlap));
    expect(text).not.toMatch(/Infinity|NaN/);
    const parsed = JSON.parse(text);
    expect(parsed.counts.fail).toBe(overlap.counts.fail);
    expect(parsed.caution).toBe(CAUTION);
  });
});
