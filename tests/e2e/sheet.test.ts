import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { parseStudy, type StudyInput } from '../../src/engine/study/index.ts';
import { curveTemplates } from '../../src/engine/templates/index.ts';
import { pageErrors, settled, startWorkbench, type Workbench } from './harness.ts';

const readDemo = (name: string) =>
  JSON.parse(readFileSync(fileURLToPath(new URL(`../../demo/${name}`, import.meta.url)), 'utf8')) as StudyInput;
const overlap = readDemo('harrowmere-overlap.json');
const selective = readDemo('harrowmere-selective.json');

let bench: Workbench;
beforeAll(async () => {
  bench = await startWorkbench(4184);
});
afterAll(async () => {
  await bench?.close();
});

describe('the sheet and its links in Chromium', () => {
  it('has the expected defaults: a handle on each adjustable band and no probe until the pointer comes', async () => {
    const { page, context } = await bench.open();
    await expect(page.getByTestId('handle-MAIN').count()).resolves.toBe(1);
    await expect(page.getByTestId('probe-readout').count()).resolves.toBe(0);
    await context.close();
  });

  it('opening a finding hatches its region and marks its devices; selecting a device lists its findings', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('demo-menu').selectOption('harrowmere-overlap.json');
    await settled(page);
    const analysis = analyseStudy(parseStudy(overlap));
    const shown = new Set(overlap.views![0].devices);
    const target = analysis.findings.find(
      (f) => f.severity === 'fail' && f.status === 'overlap' && f.subjects.every((s) => shown.has(s)),
    )!;
    await page.locator(`[data-finding-id="${target.id}"] button.head`).click();
    await expect(
      page.locator(`[data-testid="sheet-svg"] .selected[data-role="region-overlap"][data-id="${target.id}"]`).count(),
    ).resolves.toBe(1);
    for (const id of target.subjects) {
      await expect(
        page.locator(`[data-testid="sheet-svg"] path.highlighted[data-id="${id}"]`).count(),
      ).resolves.toBeGreaterThan(0);
    }
    await expect(page.locator(`[data-finding-id="${target.id}"] .explanation`).textContent()).resolves.toBe(
      target.explanation,
    );
    await page.getByTestId('tree-device-FDR-MCC').click();
    const listed = await page
      .getByTestId('finding')
      .evaluateAll((items) => items.map((i) => i.getAttribute('data-finding-id')));
    const expected = analysis.findings
      .filter((f) => f.subjects.includes('FDR-MCC') && (f.severity === 'fail' || f.severity === 'warning'))
      .map((f) => f.id);
    expect(listed).toEqual(expected);
    await context.close();
  });

  it("clicking a curve's label on the sheet selects its device", async () => {
    const { page, context } = await bench.open();
    await page.locator('[data-testid="sheet-svg"] text[data-role="label"][data-id="MAIN"]').click();
    await expect(page.getByTestId('properties').textContent()).resolves.toMatch(/device MAIN/);
    await expect(page.locator('[data-testid="pinned-list"] .pin').count()).resolves.toBe(0);
    await context.close();
  });

  it('dragging a band handle moves its pickup and delay, and one undo puts both back', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('tree-device-MAIN').click();
    const index = selective.devices!.findIndex((d) => d.id === 'MAIN');
    const pickup = page.getByTestId(`field-study.devices[${index}].characteristic.longTime.pickup`);
    const delay = page.getByTestId(`field-study.devices[${index}].characteristic.longTime.delay`);
    const [pickupBefore, delayBefore] = [await pickup.inputValue(), await delay.inputValue()];
    const box = (await page.getByTestId('handle-MAIN').boundingBox())!;
    const [x, y] = [box.x + box.width / 2, box.y + box.height / 2];
    await page.mouse.move(x, y);
    await page.mouse.down();
    for (let i = 1; i <= 5; i++) await page.mouse.move(x + 8 * i, y - 6 * i);
    await page.mouse.up();
    expect(Number(await pickup.inputValue())).toBeGreaterThan(Number(pickupBefore));
    expect(Number(await delay.inputValue())).toBeGreaterThan(Number(delayBefore));
    await expect(page.locator('[data-testid="pinned-list"] .pin').count()).resolves.toBe(0);
    await page.getByTestId('undo').click();
    await expect(pickup.inputValue()).resolves.toBe(pickupBefore);
    await expect(delay.inputValue()).resolves.toBe(delayBefore);
    await context.close();
  });

  it('the keyboard moves the probe along the sheet and Enter pins it', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('sheet').focus();
    await page.keyboard.press('ArrowRight');
    const readout = page.getByTestId('probe-readout');
    await readout.waitFor();
    const first = Number(await readout.getAttribute('data-amps'));
    await page.keyboard.press('Shift+ArrowRight');
    const second = Number(await readout.getAttribute('data-amps'));
    expect(second / first).toBeCloseTo(10 ** 0.5, 6);
    await page.keyboard.press('Enter');
    await expect(page.getByTestId('pinned-line').count()).resolves.toBe(1);
    await context.close();
  });

  it('a new sheet for a device shows it and the devices above it; the tree adds another device to it', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('tree-device-FDR-DOCK').click();
    await page.getByTestId('new-view').click();
    const svg = page.locator('[data-testid="sheet-svg"]');
    await expect(svg.locator('[data-id="FDR-DOCK"]').count()).resolves.toBeGreaterThan(0);
    await expect(svg.locator('[data-id="MAIN"]').count()).resolves.toBeGreaterThan(0);
    await expect(svg.locator('path[data-id="FDR-MCC"]').count()).resolves.toBe(0);
    await page.getByTestId('add-to-view-FDR-MCC').click();
    await expect(svg.locator('path[data-id="FDR-MCC"]').count()).resolves.toBeGreaterThan(0);
    const options = await page.getByTestId('view-menu').locator('option').count();
    expect(options).toBe(selective.views!.length + 1);
    await context.close();
  });

  it('a mistyped setting shows its problem by the field while the sheet keeps the last good drawing', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('tree-device-MAIN').click();
    const index = selective.devices!.findIndex((d) => d.id === 'MAIN');
    const before = await page.locator('path[data-role="band-fill"][data-id="MAIN"]').getAttribute('d');
    await page.getByTestId(`field-study.devices[${index}].characteristic.shortTime.delay`).fill('abc');
    await expect(page.locator('.problem').first().textContent()).resolves.toMatch(
      /expected a time such as "0\.3 s", got "abc"/,
    );
    expect(await page.locator('path[data-role="band-fill"][data-id="MAIN"]').getAttribute('d')).toBe(before);
    const path = `study\\.devices\\[${index}\\]\\.characteristic\\.shortTime\\.delay`;
    await expect(page.getByTestId('study-problems').textContent()).resolves.toMatch(
      new RegExp(`${path}: expected a time such as "0\\.3 s", got "abc"`),
    );
    await context.close();
  });

  it('CSV points import into a fuse with a preview; a bad row is named', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('demo-menu').selectOption('harrowmere-fused.json');
    await settled(page);
    await page.getByTestId('tree-device-F-T1').click();
    await page.getByTestId('csv-import-open').click();
    const text = page.getByTestId('csv-text');
    await text.fill('curve,current,time\nminimum-melting,100,abc\n');
    await expect(page.getByTestId('csv-problem').textContent()).resolves.toMatch(
      /row 2: expected a time in seconds greater than 0, got "abc"/,
    );
    // A file whose total clearing is faster than its own minimum melting would be refused by the study:
    // the dialog refuses it first.
    await text.fill('curve,current,time\nmin,150,300\nmin,3000,0.01\nmax,100,200\nmax,1000,0.005\n');
    await expect(page.getByTestId('csv-import-problem').textContent()).resolves.toMatch(
      /would not be accepted: totalClearing/,
    );
    await expect(page.getByTestId('csv-apply').isDisabled()).resolves.toBe(true);
    // Total-clearing rows alone go to total clearing; left of the minimum melting curve in place they are
    // imported with a warning (the other curve may be the next file).
    await text.fill('curve,current,time\ntotal-clearing,10,300\ntotal-clearing,20,0.01\n');
    await expect(page.getByTestId('csv-import-warning').textContent()).resolves.toMatch(
      /do not fit the minimum melting curve left in place/,
    );
    await expect(page.getByTestId('csv-apply').isDisabled()).resolves.toBe(false);
    await text.fill(
      [
        'curve,current,time',
        'minimum-melting,150,300',
        'minimum-melting,400,10',
        'minimum-melting,2000,0.01',
        'total-clearing,170,300',
        'total-clearing,450,10',
        'total-clearing,2200,0.02',
      ].join('\n'),
    );
    await expect(page.getByTestId('csv-preview').locator('table').count()).resolves.toBe(2);
    const before = await page.locator('path[data-role="band-fill"][data-id="F-T1"]').getAttribute('d');
    await page.getByTestId('csv-apply').click();
    await settled(page);
    await expect(page.getByTestId('properties').textContent()).resolves.toMatch(/minimum melting \(3\)/);
    expect(await page.locator('path[data-role="band-fill"][data-id="F-T1"]').getAttribute('d')).not.toBe(before);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('a template from curves/ protects an unprotected transformer with a new device', async () => {
    const { page, context } = await bench.open();
    const template = curveTemplates.find((t) => t.family === 'trip-unit')!;
    await page.getByTestId('tree-transformer-T2').click();
    await page.getByTestId('template-add').selectOption(template.id);
    await page.getByTestId('tree-device-D-T2').waitFor();
    await expect(page.getByTestId('properties').textContent()).resolves.toMatch(/device D-T2/);
    await context.close();
  });

  it('the reading guide opens and steps through the sheet', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('guide-open').click();
    const guide = page.getByTestId('guide');
    await expect(guide.textContent()).resolves.toMatch(/Step 1 of \d+/);
    await guide.getByRole('button', { name: 'Next →' }).click();
    await expect(guide.textContent()).resolves.toMatch(/Step 2 of \d+[\s\S]*A band is what one device does/);
    await context.close();
  });
});
