import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';
import { analyseScenarios } from '../../src/engine/scenario/index.ts';
import { parseStudy } from '../../src/engine/study/index.ts';
import { pageErrors, settled, startWorkbench, type Workbench } from './harness.ts';

// Screenshots of each scenario, for a person to look at (out/ is not committed).
const SHOTS = fileURLToPath(new URL('../../out/screens/', import.meta.url));
const overlap = parseStudy(
  readFileSync(fileURLToPath(new URL('../../demo/harrowmere-standby-overlap.json', import.meta.url)), 'utf8'),
);
// The generator breaker's findings, as the engine finds them in every scenario.
const generatorFindings = analyseScenarios(overlap).findings.filter(
  (f) => f.subjects.includes('GEN-CB') && (f.severity === 'fail' || f.severity === 'warning'),
);

let bench: Workbench;
beforeAll(async () => {
  bench = await startWorkbench(4193);
});
afterAll(async () => {
  await bench?.close();
});

/** The ids of the findings the panel lists. */
async function listed(page: Page): Promise<string[]> {
  return page.getByTestId('finding').evaluateAll((items) => items.map((i) => i.getAttribute('data-finding-id')!));
}

describe('operating scenarios in Chromium', () => {
  it('has the expected defaults: a study without scenarios shows no scenario picker', async () => {
    const { page, context } = await bench.open();
    await expect(page.getByTestId('scenario-picker').count()).resolves.toBe(0);
    await expect(page.getByTestId('every-scenario-faults').count()).resolves.toBe(0);
    await expect(page.getByTestId('tree-dark').count()).resolves.toBe(0);
    await context.close();
  });

  it('the standby demo on the generator shows the generator, and its breaker overlap; back to normal it is gone', async () => {
    expect(generatorFindings.length).toBeGreaterThan(0);
    expect(generatorFindings.every((f) => f.scenarios?.join() === 'On generator')).toBe(true);
    const { page, context } = await bench.open();
    await page.getByTestId('demo-menu').selectOption('harrowmere-standby-overlap.json');
    await settled(page);
    const menu = page.getByTestId('scenario-menu');
    await expect(menu.inputValue()).resolves.toBe('normal');
    await expect(menu.locator('option').evaluateAll((options) => options.map((o) => o.textContent))).resolves.toEqual([
      'Normal',
      'On generator',
      'Dock on the office feeder',
    ]);
    await expect(page.getByTestId('tree-generator-G1').count()).resolves.toBe(0);
    await expect(page.getByTestId('tree-dark-bus-GEN').count()).resolves.toBe(1);
    expect((await listed(page)).filter((id) => generatorFindings.some((f) => f.id === id))).toEqual([]);

    await menu.selectOption({ label: 'On generator' });
    await expect(page.getByTestId('tree-generator-G1').isVisible()).resolves.toBe(true);
    await expect(page.getByTestId('tree-switch-ATS').textContent()).resolves.toMatch(/on the emergency side/);
    await expect(page.getByTestId('tree-dark-source-UTIL').count()).resolves.toBe(1);
    await expect(page.getByTestId('scenario-sources').textContent()).resolves.toBe('fed by G1');
    const shown = await listed(page);
    for (const finding of generatorFindings) {
      expect(shown).toContain(finding.id);
      await expect(
        page.locator(`[data-finding-id="${finding.id}"] [data-testid="finding-scenarios"]`).textContent(),
      ).resolves.toBe('On generator');
    }
    // The generator's sheet hatches the overlap in this scenario.
    await page.getByTestId('view-menu').selectOption('emergency-generator');
    const overlapFinding = generatorFindings.find((f) => f.kind === 'coordination')!;
    await expect(
      page.locator(`[data-testid="sheet-svg"] [data-role^="region-"][data-id="${overlapFinding.id}"]`).count(),
    ).resolves.toBeGreaterThan(0);
    await page.screenshot({ path: `${SHOTS}scenario-on-generator.png` });

    await menu.selectOption({ label: 'Normal' });
    await expect(page.getByTestId('tree-generator-G1').count()).resolves.toBe(0);
    expect((await listed(page)).filter((id) => generatorFindings.some((f) => f.id === id))).toEqual([]);
    await expect(page.getByTestId('tree-source-UTIL').isVisible()).resolves.toBe(true);
    await page.screenshot({ path: `${SHOTS}scenario-normal.png` });
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it("the generator, its breaker's setting window and a proposal are reachable on the generator without a page error", async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('demo-menu').selectOption('harrowmere-standby-overlap.json');
    await settled(page);
    await page.getByTestId('scenario-menu').selectOption('on-generator');
    await page.getByTestId('tree-generator-G1').click();
    await expect(page.getByTestId('properties').textContent()).resolves.toMatch(/G1/);
    await page.getByTestId('tree-switch-ATS').click();
    await expect(page.getByTestId('properties').textContent()).resolves.toMatch(/ATS/);
    await page.getByTestId('tree-device-GEN-CB').click();
    await page.getByTestId('tab-window').click();
    await expect(page.getByTestId('window-panel').textContent()).resolves.toMatch(/Generator breaker 600 A/);
    await page.getByTestId('propose-study').click();
    await page.locator('[data-testid="proposal"], [data-testid="proposal-error"]').first().waitFor();
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('the study report of the standby demo is exported with a section per scenario', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('demo-menu').selectOption('harrowmere-standby-overlap.json');
    await settled(page);
    const download = page.waitForEvent('download');
    await page.getByTestId('export-menu').selectOption('report-html');
    const html = readFileSync((await (await download).path())!, 'utf8');
    expect(html).toMatch(/^<!DOCTYPE html>/);
    for (const text of ['Fault currents in &quot;On generator&quot;', 'Fault currents in &quot;Normal&quot;'])
      expect(html).toContain(text);
    // "Writing the study report…" stood while it was written, and is gone once it is.
    await expect.poll(() => page.getByTestId('notice').count()).toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('every scenario at once: all findings, and a fault line of each scenario on the sheet', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('demo-menu').selectOption('harrowmere-standby-overlap.json');
    await settled(page);
    await page.getByTestId('findings-every-scenario').check();
    await page.locator('.filters input[value="all"]').check();
    await expect(listed(page)).resolves.toHaveLength(analyseScenarios(overlap).findings.length);
    await page.getByTestId('view-menu').selectOption('emergency');
    await page.getByTestId('every-scenario-faults').check();
    const labels = await page
      .locator('[data-testid="sheet-svg"] text[data-role="fault-label"]')
      .evaluateAll((items) => items.map((i) => i.textContent ?? ''));
    expect(labels.some((text) => /^On generator: EMP /.test(text))).toBe(true);
    expect(labels.some((text) => /^Normal, Dock on the office feeder: EMP /.test(text))).toBe(true);
    await page.screenshot({ path: `${SHOTS}scenario-every-fault-line.png` });
    // On the generator the service sheet has nothing energised to draw, and says so.
    await page.getByTestId('scenario-menu').selectOption('on-generator');
    await page.getByTestId('view-menu').selectOption('service');
    await expect(page.getByTestId('sheet-dark').textContent()).resolves.toMatch(
      /de-energised in the scenario "On generator"/,
    );
    await page.getByTestId('tab-one-line').click();
    // The diagram is drawn in its worker: it comes a moment after the tab opens.
    await page.locator('[data-testid="one-line-svg"] [data-id="G1"]').first().waitFor({ state: 'attached' });
    await expect(page.locator('[data-testid="one-line-svg"] [data-id="SWBD"]').count()).resolves.toBe(0);
    await page.screenshot({ path: `${SHOTS}scenario-one-line-generator.png` });
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });
});
