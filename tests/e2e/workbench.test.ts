import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { Page } from 'playwright-core';
import { analyseStudy } from '../../src/engine/analysis.ts';
import { CAUTION } from '../../src/engine/caution.ts';
import { csvReport, markdownReport } from '../../src/engine/report/index.ts';
import { curveTemplates } from '../../src/engine/templates/index.ts';
import { probeAt } from '../../src/engine/probe.ts';
import { parseStudy, type StudyInput } from '../../src/engine/study/index.ts';
import { assertInDelta } from '../asserts.ts';
import { pageErrors, settled, startWorkbench, type Workbench } from './harness.ts';

const demoPath = fileURLToPath(new URL('../../demo/harrowmere-selective.json', import.meta.url));
const demo = JSON.parse(readFileSync(demoPath, 'utf8')) as StudyInput;
const devices = demo.devices ?? [];
const mainIndex = devices.findIndex((d) => d.id === 'MAIN');
const delayField = `field-study.devices[${mainIndex}].characteristic.shortTime.delay`;

let bench: Workbench;
beforeAll(async () => {
  bench = await startWorkbench(4183);
});
afterAll(async () => {
  await bench?.close();
});

/**
 * What a findings report must share with the command line's: its title, caution, and, row by row,
 * each finding's severity, check and title. Where a pair's time ratio is flat over a range the worst
 * point is a tie, which Chromium and Node break at different currents, so the cells and sentences
 * quoting that point are left out of the comparison.
 */
function markdownOutline(report: Buffer | string): string[] {
  return report
    .toString()
    .split('\n')
    .filter((line) => /^(# |> |### |\| )/.test(line))
    .map((line) => (line.startsWith('| ') ? line.split(' | ').slice(0, 3).join(' | ') : line));
}

/** The same for CSV: the first three fields (severity, check, title) of every row. */
function csvOutline(report: Buffer | string): string[] {
  return report
    .toString()
    .trimEnd()
    .split('\n')
    .map((line) => (line.match(/("([^"]|"")*"|[^,]*)(,|$)/g) ?? []).slice(0, 3).join(''));
}

/** The counts the findings panel shows, read from its data attributes. */
async function shownCounts(page: Page) {
  const summary = page.getByTestId('findings-summary');
  const read = async (name: string) => Number(await summary.getAttribute(`data-${name}`));
  return { fail: await read('fail'), warning: await read('warning'), ok: await read('ok'), info: await read('info') };
}

/** The outline of a band on the sheet (its fill path), which changes whenever its setting does. */
async function bandOutline(page: Page, deviceId: string) {
  return page.locator(`[data-testid="sheet-svg"] path[data-role="band-fill"][data-id="${deviceId}"]`).getAttribute('d');
}

/** Sets MAIN's short-time delay through the property editor, as a user types it. */
async function setMainDelay(page: Page, value: string) {
  await page.getByTestId('tree-device-MAIN').click();
  await page.getByTestId(delayField).fill(value);
  await settled(page);
}

describe('the workbench in Chromium', () => {
  it('has the expected defaults: the selective demo, its sheet, its findings and the caution line', async () => {
    const { page, context } = await bench.open();
    await expect(page.getByTestId('study-name').textContent()).resolves.toContain(demo.name);
    const view = demo.views![0];
    for (const id of view.devices) {
      await expect(page.locator(`[data-testid="sheet-svg"] [data-id="${id}"]`).count()).resolves.toBeGreaterThan(0);
    }
    // The findings come from the worker and match the engine's own analysis of the same file.
    const { counts } = analyseStudy(parseStudy(demo));
    expect(await shownCounts(page)).toEqual(counts);
    await expect(page.getByTestId('caution').textContent()).resolves.toContain(CAUTION);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('typing a setting redraws the band and re-runs the checks (MAIN short-time 0.4 s → 0.2 s overlaps its feeders)', async () => {
    const { page, context } = await bench.open();
    const before = await bandOutline(page, 'MAIN');
    await setMainDelay(page, '0.2');
    expect(await bandOutline(page, 'MAIN')).not.toBe(before);
    const changed = structuredClone(demo);
    (changed.devices![mainIndex].characteristic as { shortTime: { delay: number } }).shortTime.delay = 0.2;
    const expected = analyseStudy(parseStudy(changed));
    expect(expected.counts.fail).toBeGreaterThan(0);
    expect(await shownCounts(page)).toEqual(expected.counts);
    await context.close();
  });

  it('the arrow keys step a setting and undo/redo walk it back and forth', async () => {
    const { page, context } = await bench.open();
    const original = await bandOutline(page, 'MAIN');
    await page.getByTestId('tree-device-MAIN').click();
    const field = page.getByTestId(delayField);
    await field.press('ArrowDown');
    await expect(field.inputValue()).resolves.toBe('0.39');
    const stepped = await bandOutline(page, 'MAIN');
    expect(stepped).not.toBe(original);
    await page.getByTestId('undo').click();
    await expect(field.inputValue()).resolves.toBe('0.4');
    expect(await bandOutline(page, 'MAIN')).toBe(original);
    await page.getByTestId('redo').click();
    await expect(field.inputValue()).resolves.toBe('0.39');
    expect(await bandOutline(page, 'MAIN')).toBe(stepped);
    await context.close();
  });

  it('the probe reads the same minTime and maxTime as the engine at the pointer current', async () => {
    const { page, context } = await bench.open();
    const frame = (await page.locator('[data-testid="sheet-svg"] [data-role="plot-frame"]').boundingBox())!;
    await page.mouse.move(frame.x + frame.width * 0.62, frame.y + frame.height / 2);
    const readout = page.getByTestId('probe-readout');
    await readout.waitFor();
    const amps = Number(await readout.getAttribute('data-amps'));
    const view = demo.views![0];
    const expected = probeAt(analyseStudy(parseStudy(demo)), view.id, amps);
    const rows = page.getByTestId('probe-row');
    await expect(rows.count()).resolves.toBe(expected.readings.length);
    for (const reading of expected.readings) {
      const row = page.locator(`[data-testid="probe-row"][data-device="${reading.deviceId}"]`);
      assertInDelta(Number(await row.getAttribute('data-min')), reading.minTime, 1e-12);
      assertInDelta(Number(await row.getAttribute('data-max')), reading.maxTime, 1e-12);
    }
    await expect(page.getByTestId('probe-summary').textContent()).resolves.toBe(expected.summary);
    await context.close();
  });

  it('autosave brings an unsaved edit back after a reload, and warns before discarding it', async () => {
    const { page, context } = await bench.open();
    await setMainDelay(page, '0.25');
    const warns = () =>
      page.evaluate(() => {
        const event = new Event('beforeunload', { cancelable: true });
        window.dispatchEvent(event);
        return event.defaultPrevented;
      });
    expect(await warns()).toBe(true);
    await page.waitForTimeout(400);
    await page.reload();
    await page.getByTestId('sheet-svg').waitFor();
    await page.getByTestId('recovery-restore').first().click();
    await expect(page.getByTestId('recovered').textContent()).resolves.toMatch(
      /^\s*Recovered the unsaved study ".+" kept at /,
    );
    await page.getByTestId('tree-device-MAIN').click();
    await expect(page.getByTestId(delayField).inputValue()).resolves.toBe('0.25');
    // Saving makes the study clean: no warning any more.
    const download = page.waitForEvent('download');
    await page.getByTestId('save').click();
    await download;
    expect(await warns()).toBe(false);
    await context.close();
  });

  it('a bad study file is refused with its problems, and the open study stays as it was', async () => {
    const { page, context } = await bench.open();
    await setMainDelay(page, '0.3');
    const bad = structuredClone(demo) as StudyInput & { transformers: { impedance: unknown }[] };
    bad.name = 'A study that must not open';
    bad.transformers[0].impedance = '-5';
    await page.getByTestId('open-file').setInputFiles({
      name: 'bad.json',
      mimeType: 'application/json',
      buffer: Buffer.from(JSON.stringify(bad)),
    });
    const refused = page.getByTestId('refused');
    await refused.waitFor();
    await expect(refused.textContent()).resolves.toMatch(
      /study\.transformers\[0\]\.impedance: expected a percentage of at least 0\.5, got "-5"/,
    );
    await expect(page.getByTestId('study-name').textContent()).resolves.toContain(demo.name);
    await expect(page.getByTestId(delayField).inputValue()).resolves.toBe('0.3');
    await expect(page.getByTestId('undo').isEnabled()).resolves.toBe(true);
    // Text that is not JSON at all is refused the same way (the notice is rewritten in place: poll it).
    await page
      .getByTestId('open-file')
      .setInputFiles({ name: 'x.json', mimeType: 'application/json', buffer: Buffer.from('{') });
    await expect
      .poll(() => refused.textContent())
      .toMatch(/study: expected more JSON text at line 1:2, got the end of the text/);
    // A good file asks before it discards the unsaved edit; declining keeps the study.
    const asked: string[] = [];
    page.once('dialog', (dialog) => {
      asked.push(dialog.message());
      void dialog.dismiss();
    });
    const other = { ...structuredClone(demo), name: 'Another good study' };
    await page
      .getByTestId('open-file')
      .setInputFiles({ name: 'other.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(other)) });
    await expect.poll(() => asked.length).toBe(1);
    expect(asked[0]).toMatch(/unsaved changes/);
    await expect(page.getByTestId('study-name').textContent()).resolves.toContain(demo.name);
    await context.close();
  });

  it('each export produces its file: SVG, PNG, PDF, findings, pinned probes and the study', async () => {
    const { page, context } = await bench.open();
    const frame = (await page.locator('[data-testid="sheet-svg"] [data-role="plot-frame"]').boundingBox())!;
    await page.mouse.click(frame.x + frame.width * 0.5, frame.y + frame.height * 0.5);
    await page.getByTestId('pinned-list').waitFor();
    // The reports are the engine's own, exactly as the command line writes them.
    const analysis = analyseStudy(parseStudy(demo));
    const expectations: [string, RegExp, (bytes: Buffer) => void][] = [
      [
        'svg',
        /\.svg$/,
        (b) =>
          expect(b.toString('utf8')).toMatch(
            /^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg"[\s\S]*For review by a qualified engineer/,
          ),
      ],
      ['png', /\.png$/, (b) => expect(b.subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a')],
      ['pdf', /\.pdf$/, (b) => expect(b.subarray(0, 5).toString('latin1')).toBe('%PDF-')],
      [
        'findings-md',
        /-findings\.md$/,
        (b) => expect(markdownOutline(b)).toEqual(markdownOutline(markdownReport(analysis))),
      ],
      ['findings-csv', /-findings\.csv$/, (b) => expect(csvOutline(b)).toEqual(csvOutline(csvReport(analysis)))],
      ['probes-csv', /-probes\.csv$/, (b) => expect(b.toString('utf8').split('\n').length).toBeGreaterThan(3)],
      ['study-json', /\.json$/, (b) => expect(JSON.parse(b.toString('utf8'))).toEqual(demo)],
    ];
    for (const [kind, name, check] of expectations) {
      const download = page.waitForEvent('download');
      await page.getByTestId('export-menu').selectOption(kind);
      const file = await download;
      expect(file.suggestedFilename()).toMatch(name);
      const stream = await file.createReadStream();
      const chunks: Buffer[] = [];
      for await (const chunk of stream) chunks.push(chunk as Buffer);
      check(Buffer.concat(chunks));
    }
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('a new study is built from the tree: a transformer, a device from a template, a sheet', async () => {
    const { page, context } = await bench.open();
    await page.getByRole('button', { name: 'New', exact: true }).click();
    await expect(page.getByTestId('study-name').textContent()).resolves.toContain('New study');
    await page.getByTestId('tree-bus-BUS-1').click();
    await page.getByTestId('add-transformer').click();
    await page.getByTestId('tree-transformer-T-1').waitFor();
    const template = curveTemplates.find((t) => t.family === 'trip-unit')!;
    await page.getByTestId('template-add').selectOption(template.id);
    await page.getByTestId('tree-device-D-T-1').waitFor();
    await page.getByTestId('new-view').click();
    await expect(page.locator('[data-testid="sheet-svg"] path[data-id="D-T-1"]').count()).resolves.toBeGreaterThan(0);
    await expect(page.getByTestId('study-problems').count()).resolves.toBe(0);
    // Deleting the device takes its sheet with it; one undo brings both back.
    page.once('dialog', (dialog) => void dialog.accept());
    await page.getByTestId('delete-item').click();
    await expect(page.getByTestId('tree-device-D-T-1').count()).resolves.toBe(0);
    await page.getByTestId('undo').click();
    await expect(page.locator('[data-testid="sheet-svg"] path[data-id="D-T-1"]').count()).resolves.toBeGreaterThan(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });
});
