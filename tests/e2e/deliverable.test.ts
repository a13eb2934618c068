import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { pageErrors, settled, startWorkbench, type Workbench } from './harness.ts';

let bench: Workbench;
beforeAll(async () => {
  bench = await startWorkbench(4197);
});
afterAll(async () => {
  await bench?.close();
});

describe('the study deliverable in the workbench', () => {
  it('edits the study details and revision log, undoably, and saves them in the study file', async () => {
    const { context, page } = await bench.open();
    await page.getByTestId('details-open').click();
    const dialog = page.getByTestId('study-details');
    await dialog.getByTestId('detail-site').fill('Harrowmere Cold Store, Unit 4');
    await dialog.getByTestId('detail-site').press('Tab');
    await dialog.getByTestId('detail-checkedBy').fill('A. Reviewer');
    await dialog.getByTestId('detail-checkedBy').press('Tab');
    await dialog.getByTestId('add-revision').click();
    await expect.poll(() => dialog.getByLabel('revision 1 revision').inputValue()).toBe('A');
    await page.keyboard.press('Escape');
    const saved = page.waitForEvent('download');
    await page.getByTestId('export-menu').selectOption('study-json');
    const file = JSON.parse(readFileSync((await (await saved).path())!, 'utf8'));
    expect(file.site).toBe('Harrowmere Cold Store, Unit 4');
    expect(file.checkedBy).toBe('A. Reviewer');
    expect(file.revisions).toHaveLength(1);
    await page.getByTestId('undo').click();
    await page.getByTestId('details-open').click();
    await expect.poll(() => page.getByTestId('detail-checkedBy').inputValue()).toBe('A. Reviewer');
    await expect.poll(() => page.getByLabel('revision 1 revision').count()).toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('draws the one-line diagram and links its selection both ways with the tree', async () => {
    const { context, page } = await bench.open();
    await page.getByTestId('tab-one-line').click();
    const diagram = page.getByTestId('one-line-svg');
    await diagram.waitFor();
    expect(await diagram.locator('[data-role="one-line-bus"]').count()).toBeGreaterThan(3);
    // Diagram → tree: clicking the main's label selects it in the tree.
    await diagram.locator('text[data-role="one-line-label"][data-id="MAIN"]').first().click();
    await expect.poll(() => page.getByTestId('tree-device-MAIN').getAttribute('aria-selected')).toBe('true');
    // Tree → diagram: choosing a bus in the tree marks it on the diagram.
    await page.getByTestId('tree-bus-MCC').click();
    await expect.poll(() => diagram.getByTestId('one-line-selected').getAttribute('data-id')).toBe('MCC');
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('adds a sheet for every protective path in one undoable step, and not twice', async () => {
    const { context, page } = await bench.open();
    const menu = page.getByTestId('view-menu');
    const before = await menu.locator('option').count();
    await page.getByTestId('sheets-for-paths').click();
    await expect.poll(() => menu.locator('option').count()).toBeGreaterThan(before);
    const after = await menu.locator('option').count();
    await page.getByTestId('sheets-for-paths').click();
    expect(await menu.locator('option').count()).toBe(after);
    await page.getByTestId('undo').click();
    await expect.poll(() => menu.locator('option').count()).toBe(before);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('exports the whole study report as one print-ready page', async () => {
    const { context, page } = await bench.open();
    await settled(page);
    const download = page.waitForEvent('download');
    await page.getByTestId('export-menu').selectOption('report-html');
    const html = readFileSync((await (await download).path())!, 'utf8');
    expect(html).toMatch(/^<!DOCTYPE html>/);
    for (const title of ['Scope and method', 'One-line diagram', 'Fault currents', 'Device settings', 'Findings'])
      expect(html).toContain(title);
    expect(html).toContain('qualified engineer');
    await context.close();
  });
});
