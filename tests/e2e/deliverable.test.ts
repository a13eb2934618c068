import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { parseStudy } from '../../src/engine/study/index.ts';
import { pagePoints } from '../../src/plot/pdf.ts';
import { reportPagesOf, studyReportOf } from '../../src/report/index.ts';
import { mediaBoxesOf, toUnicodeOf } from '../pdfBytes.ts';
import { pageErrors, recordNotices, settled, startWorkbench, type Workbench } from './harness.ts';

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
    // A name cleared is said to be wrong in the dialog itself, where the user is looking.
    const details = page.getByTestId('study-details');
    const name = await details.getByTestId('detail-name').inputValue();
    await details.getByTestId('detail-name').fill('');
    await details.getByTestId('detail-name').press('Tab');
    await expect.poll(() => details.getByTestId('detail-name-problem').textContent()).toMatch(/^\s*name: expected/);
    await details.getByTestId('detail-name').fill(name);
    await details.getByTestId('detail-name').press('Tab');
    await expect.poll(() => details.getByTestId('detail-name-problem').count()).toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('sets the study options in their dialog: a bad value said there, the work following, saved in the file, undoable', async () => {
    const { context, page } = await bench.open();
    await page.getByTestId('options-open').click();
    const dialog = page.getByTestId('study-options');
    const minimum = dialog.getByTestId('option-conductorTemperatures-minimumFault');
    // Left out of the file, an option shows its default.
    expect(await minimum.inputValue()).toBe('');
    expect(await minimum.getAttribute('placeholder')).toBe('90');
    await minimum.fill('300');
    await minimum.press('Tab');
    await expect
      .poll(() => dialog.getByTestId('option-conductorTemperatures-minimumFault-problem').textContent())
      .toMatch(/minimum fault, °C: .*250/);
    await minimum.fill('150');
    await minimum.press('Tab');
    await expect.poll(() => dialog.getByTestId('option-conductorTemperatures-minimumFault-problem').count()).toBe(0);
    await dialog.getByTestId('option-coordination-edition').selectOption('2020');
    // A margin is added by its button, once chosen (arrow keys on the choice add nothing).
    await dialog.getByTestId('option-margin-kind').focus();
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('ArrowDown');
    await dialog.getByTestId('option-margin-kind').selectOption('relay/trip-unit');
    await dialog.getByTestId('option-add-margin').click();
    const margin = dialog.getByLabel('margin for relay/trip-unit pairs, s');
    await expect.poll(() => margin.inputValue()).toBe('0.2');
    expect(await dialog.getByLabel(/^margin for .* pairs, s$/).count()).toBe(1);
    // A margin out of range is said in the dialog, beside it.
    await margin.fill('9');
    await margin.press('Tab');
    await expect.poll(() => margin.getAttribute('aria-invalid')).toBe('true');
    await expect.poll(() => dialog.getByRole('alert').first().textContent()).toMatch(/at most 5, got "9"/);
    await margin.fill('0.2');
    await margin.press('Tab');
    await expect.poll(() => margin.getAttribute('aria-invalid')).toBe('false');
    await page.keyboard.press('Escape');
    // The minimum fault behind a cable is now worked out with its conductors at 150 °C, and at each
    // temperature set after.
    await page.getByTestId('tree-bus-MCC').click();
    await expect.poll(() => page.getByTestId('work').textContent()).toMatch(/C-MCC resistance at 150 °C/);
    await page.getByTestId('options-open').click();
    await minimum.fill('200');
    await minimum.press('Tab');
    await page.keyboard.press('Escape');
    await expect.poll(() => page.getByTestId('work').textContent()).toMatch(/C-MCC resistance at 200 °C/);
    const saved = page.waitForEvent('download');
    await page.getByTestId('export-menu').selectOption('study-json');
    const file = JSON.parse(readFileSync((await (await saved).path())!, 'utf8'));
    expect(file.conductorTemperatures).toEqual({ minimumFault: 200 });
    expect(file.coordination).toEqual({ edition: '2020', margins: { 'relay/trip-unit': 0.2 } });
    // Each change is one undo step; emptied, an option is taken out of the file again.
    await page.getByTestId('undo').click();
    await page.getByTestId('options-open').click();
    await expect.poll(() => minimum.inputValue()).toBe('150');
    await dialog.getByRole('button', { name: 'Remove' }).click();
    await expect.poll(() => dialog.getByLabel('margin for relay/trip-unit pairs, s').count()).toBe(0);
    await dialog.getByTestId('option-coordination-edition').selectOption('');
    await minimum.fill('');
    await minimum.press('Tab');
    await page.keyboard.press('Escape');
    const again = page.waitForEvent('download');
    await page.getByTestId('export-menu').selectOption('study-json');
    const cleared = JSON.parse(readFileSync((await (await again).path())!, 'utf8'));
    expect(cleared.conductorTemperatures ?? {}).toEqual({});
    expect(cleared.coordination ?? {}).toEqual({});
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

  it('redraws the diagram after an edit of what it draws, and moves only its finding marks after a setting edit', async () => {
    const { context, page } = await bench.open();
    await page.getByTestId('tab-one-line').click();
    const diagram = page.getByTestId('one-line-svg');
    await diagram.waitFor();
    // The site is printed under the title: an edit of it redraws the diagram (in its worker).
    await page.getByTestId('details-open').click();
    const dialog = page.getByTestId('study-details');
    await dialog.getByTestId('detail-site').fill('Bay 4 redrawn');
    await dialog.getByTestId('detail-site').press('Tab');
    await page.keyboard.press('Escape');
    await expect
      .poll(() => diagram.locator('text[data-role="one-line-details"]').first().textContent())
      .toMatch(/^Bay 4 redrawn/);
    // The MCC feeder's short-time delay down to 0.1 s: the findings, and so the marks, change.
    const marks = () =>
      diagram
        .locator('[data-layer="findings"] [data-id]')
        .evaluateAll((items) => items.map((i) => i.getAttribute('data-id')));
    const before = await marks();
    // Whether the panel says it is redrawing at any moment of the setting edit: it keeps the base, so never.
    await page.evaluate(() => {
      (window as unknown as { redrawn: boolean }).redrawn = false;
      new MutationObserver(() => {
        if (document.querySelector('[data-testid="one-line-redrawing"]'))
          (window as unknown as { redrawn: boolean }).redrawn = true;
      }).observe(document.body, { subtree: true, childList: true });
    });
    await page.getByTestId('tree-device-FDR-MCC').click();
    const delay = page.getByTestId(/field-study\.devices\[\d+\]\.characteristic\.shortTime\.delay/);
    await delay.fill('0.1');
    await delay.press('Tab');
    await settled(page);
    await expect.poll(marks).not.toEqual(before);
    expect(await page.evaluate(() => (window as unknown as { redrawn: boolean }).redrawn)).toBe(false);
    await expect(diagram.locator('text[data-role="one-line-details"]').first().textContent()).resolves.toMatch(
      /^Bay 4 redrawn/,
    );
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('a continuation bar of a wide bus selects the bus there, zoomed in, without moving the view', async () => {
    const { context, page } = await bench.open();
    await page.getByTestId('demo-menu').selectOption('harrowmere-full.json');
    await settled(page);
    // An edit to undo later: the main's long-time pickup.
    await page.getByTestId('tree-device-MAIN').click();
    await page.getByTestId('field-study.devices[1].characteristic.longTime.pickup').fill('0.9');
    await settled(page);
    await page.getByTestId('tab-one-line').click();
    const diagram = page.getByTestId('one-line-svg');
    // The main, selected for the edit, is brought into view; the whole diagram is shown again on asking,
    // its lines drawn and its text, too small to read, left out.
    await page.getByTestId('one-line-fit').click();
    const link = diagram.locator('path[data-role="one-line-continuation"]').first();
    // Attached, not "visible": a vertical line has no width to be seen by.
    await link.waitFor({ state: 'attached' });
    const busId = (await link.getAttribute('data-id'))!;
    // Zoom in on the last bar the link reaches, where its label is drawn, then click the label: the bus
    // is selected and marked there; the view stays.
    const reach = (await link.boundingBox())!;
    await page.mouse.move(reach.x + reach.width / 2 + 10, reach.y + reach.height - 4);
    for (let i = 0; i < 4; i++) await page.mouse.wheel(0, -100);
    const zoomed = await diagram.getAttribute('viewBox');
    // The bar's label is the one of that bus now in the panel.
    const panelBox = (await diagram.boundingBox())!;
    const labels = diagram.locator(`text[data-role="one-line-continued-label"][data-id="${busId}"]`);
    await labels.first().waitFor();
    let continued = labels.first();
    for (let i = 0; i < (await labels.count()); i++) {
      const at = (await labels.nth(i).boundingBox())!;
      if (at.y > panelBox.y && at.y + at.height < panelBox.y + panelBox.height) continued = labels.nth(i);
    }
    await continued.click();
    await expect.poll(() => page.getByTestId(`tree-bus-${busId}`).getAttribute('aria-selected')).toBe('true');
    await expect.poll(() => diagram.getByTestId('one-line-selected').getAttribute('data-id')).toBe(busId);
    expect(await diagram.getAttribute('viewBox')).toBe(zoomed);
    const marked = (await diagram.getByTestId('one-line-selected').boundingBox())!;
    const label = (await continued.boundingBox())!;
    expect(Math.abs(marked.y + marked.height / 2 - (label.y + label.height / 2))).toBeLessThan(60);
    // An edit rebuilds the diagram (here, undoing one made before): the mark and the view stay.
    await page.getByTestId('undo').click();
    await settled(page);
    expect(await diagram.getAttribute('viewBox')).toBe(zoomed);
    expect(await diagram.getByTestId('one-line-selected').boundingBox()).toEqual(marked);
    // A choice in the tree is brought into view once: zoomed away from it, an edit leaves the view be.
    await page.getByTestId('tree-device-MAIN').click();
    await expect.poll(() => diagram.getByTestId('one-line-selected').getAttribute('data-id')).toBe('MAIN');
    const panel = (await diagram.boundingBox())!;
    await page.mouse.move(panel.x + panel.width - 5, panel.y + panel.height - 5);
    for (let i = 0; i < 6; i++) await page.mouse.wheel(0, -100);
    const away = await diagram.getAttribute('viewBox');
    await page.getByTestId('redo').click();
    await settled(page);
    expect(await diagram.getAttribute('viewBox')).toBe(away);
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
    // The click that adds nothing says why.
    await expect(page.getByTestId('sheets-for-paths-note').textContent()).resolves.toMatch(/already has its sheet/);
    await page.getByTestId('undo').click();
    await expect.poll(() => menu.locator('option').count()).toBe(before);
    await expect.poll(() => page.getByTestId('sheets-for-paths-note').count()).toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('exports the whole study report as one print-ready page', async () => {
    const { context, page } = await bench.open();
    await settled(page);
    const noticesSeen = await recordNotices(page);
    const download = page.waitForEvent('download');
    await page.getByTestId('export-menu').selectOption('report-html');
    const html = readFileSync((await (await download).path())!, 'utf8');
    expect(html).toMatch(/^<!DOCTYPE html>/);
    for (const title of ['Scope and method', 'One-line diagram', 'Fault currents', 'Device settings', 'Findings'])
      expect(html).toContain(title);
    expect(html).toContain('qualified engineer');
    // The page said it was writing the report while it was written, and says nothing once it is done.
    expect(await noticesSeen()).toEqual(['Writing the study report…']);
    await expect.poll(() => page.getByTestId('notice').count()).toBe(0);
    await context.close();
  });

  it('prints the sheet and the report to PDF on the chosen paper, with DejaVu Sans embedded so Ω and ≥ survive', async () => {
    const { context, page } = await bench.open();
    // The site is printed on every sheet and on the report.
    await page.getByTestId('details-open').click();
    const site = page.getByTestId('study-details').getByTestId('detail-site');
    await site.fill('Bay 4: earth path 1.2 Ω, margin ≥ 0.3 s');
    await site.press('Tab');
    await page.keyboard.press('Escape');
    await settled(page);
    const document = JSON.parse((await downloaded(page, 'study-json')).toString('utf8'));
    const rounded = ([width, height]: [number, number]) => [width, height].map((n) => Math.round(n * 100) / 100);

    // The sheet on A3, in the usual orientation for a sheet (landscape, as `discern plot` prints).
    await page.getByTestId('export-paper').selectOption('a3');
    const sheet = await downloaded(page, 'pdf');
    expect(sheet.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(sheet.toString('latin1')).toContain('/FontFile2');
    // Written by the plot layer's own writer, as the command line's is.
    expect(sheet.toString('latin1')).toContain('/Producer (discern)');
    expect(mediaBoxesOf(sheet)).toEqual([rounded(pagePoints('a3', 'landscape'))]);
    for (const char of 'Ω≥') expect(toUnicodeOf(sheet).has(char.codePointAt(0)!), `${char} in the sheet`).toBe(true);

    // The report on A4 turned landscape: every page that size, as many pages as the command line lays out.
    await page.getByTestId('export-paper').selectOption('a4');
    await page.getByTestId('export-orientation').selectOption('landscape');
    const report = await downloaded(page, 'report-pdf', /-report\.pdf$/);
    expect(report.toString('latin1')).toContain('/FontFile2');
    const expectedPages = reportPagesOf(studyReportOf(analyseStudy(parseStudy(document))), {
      paper: 'a4',
      orientation: 'landscape',
    }).length;
    expect(mediaBoxesOf(report)).toEqual(Array(expectedPages).fill(rounded(pagePoints('a4', 'landscape'))));
    for (const char of 'Ω≥×') expect(toUnicodeOf(report).has(char.codePointAt(0)!), `${char} in the report`).toBe(true);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });
});

// Accepts a page and a choice of the Export menu; the bytes of the file it downloads.
async function downloaded(page: Page, kind: string, name?: RegExp): Promise<Buffer> {
  const download = page.waitForEvent('download');
  await page.getByTestId('export-menu').selectOption(kind);
  const file = await download;
  if (name) expect(file.suggestedFilename()).toMatch(name);
  return readFileSync((await file.path())!);
}
