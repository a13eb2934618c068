import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import type { Download, Page } from 'playwright-core';
import { pageErrors, recordNotices, settled, startWorkbench, type Workbench } from './harness.ts';

// The selective demo opens first; its first device is "T1 primary relay" (R-T1).
const dialField = 'field-study.devices[0].characteristic.timeOvercurrent.timeDial';

let bench: Workbench;
beforeAll(async () => {
  bench = await startWorkbench(4205);
});
afterAll(async () => {
  await bench?.close();
});

/** Types a time dial for T1 primary relay in the inspector, as a user does. */
async function setDial(page: Page, value: string) {
  await page.getByTestId('tree-device-R-T1').click();
  await page.getByTestId(dialField).fill(value);
  await page.getByTestId(dialField).press('Tab');
  await settled(page);
}

/** Whether leaving the page would warn about unsaved work. */
function warnsOnLeaving(page: Page) {
  return page.evaluate(() => {
    const event = new Event('beforeunload', { cancelable: true });
    window.dispatchEvent(event);
    return event.defaultPrevented;
  });
}

/** Every download the page starts from now on. */
function downloadsOf(page: Page): Download[] {
  const downloads: Download[] = [];
  page.on('download', (download) => downloads.push(download));
  return downloads;
}

describe('a study with problems in Chromium', () => {
  it('Save asks first, writes what was typed, and leaves the study marked unsaved', async () => {
    const { page, context } = await bench.open();
    await setDial(page, '');
    await expect(page.getByTestId('study-problems').textContent()).resolves.toMatch(/timeDial: expected a number/);

    // Declining writes nothing.
    const asked: string[] = [];
    page.once('dialog', (dialog) => {
      asked.push(dialog.message());
      void dialog.dismiss();
    });
    const downloads = downloadsOf(page);
    await page.getByTestId('save').click();
    await expect.poll(() => asked.length).toBe(1);
    expect(asked[0]).toMatch(/^The study has 1 problem \(study\.devices\[0\]\.\S*timeDial\)\. Save it anyway\?/);
    expect(asked[0]).toMatch(/will not open until it is fixed/);
    expect(downloads).toEqual([]);

    // Going ahead writes the typed work, but the study is not called saved and leaving still warns.
    page.once('dialog', (dialog) => void dialog.accept());
    const download = page.waitForEvent('download');
    await page.getByTestId('save').click();
    const file = JSON.parse(readFileSync((await (await download).path())!, 'utf8'));
    expect(file.devices[0].characteristic.timeOvercurrent.timeDial).toBe('');
    await expect(page.getByTestId('study-name').textContent()).resolves.toContain('(unsaved changes)');
    // The mark is seen too, whole, however long the study's name: the name is what is cut short.
    const name = (await page.getByTestId('study-name').boundingBox())!;
    const mark = (await page.getByTestId('unsaved-mark').boundingBox())!;
    expect(mark.width).toBeGreaterThan(0);
    expect(mark.x + mark.width).toBeLessThanOrEqual(name.x + name.width + 0.5);
    expect(await warnsOnLeaving(page)).toBe(true);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('sheet, report and findings exports are refused, naming the problem, instead of showing the last valid study', async () => {
    const { page, context } = await bench.open();
    await setDial(page, '3');
    await setDial(page, '');
    const downloads = downloadsOf(page);
    // A refused report never says it is being written.
    const noticesSeen = await recordNotices(page);
    for (const kind of ['pdf', 'report-pdf', 'findings-md']) {
      await page.getByTestId('export-menu').selectOption(kind);
      await expect
        .poll(() => page.getByTestId('notice').textContent())
        .toMatch(
          /fix the 1 problem \(study\.devices\[0\]\.\S*timeDial\) before exporting: the export would show the last valid study/,
        );
      await page.getByTestId('notice').getByRole('button', { name: 'Dismiss' }).click();
    }
    await page.waitForTimeout(300);
    expect(downloads).toEqual([]);
    const notices = await noticesSeen();
    expect(notices.length).toBeGreaterThan(0);
    expect(notices.every((text) => text.startsWith('Export failed: fix the 1 problem'))).toBe(true);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });
});

describe('the Export and Demo menus with the keyboard', () => {
  it('arrow keys move through the Export menu without exporting; Enter exports the choice', async () => {
    const { page, context } = await bench.open();
    const downloads = downloadsOf(page);
    const menu = page.getByTestId('export-menu');
    await menu.focus();
    for (let i = 0; i < 3; i++) await page.keyboard.press('ArrowDown');
    await expect(menu.inputValue()).resolves.toBe('pdf');
    await page.waitForTimeout(300);
    expect(downloads).toEqual([]);
    const download = page.waitForEvent('download');
    await page.keyboard.press('Enter');
    expect((await download).suggestedFilename()).toMatch(/\.pdf$/);
    // The menu is back at its heading, ready for the next choice.
    await expect(menu.inputValue()).resolves.toBe('');
    // The button beside it acts on a choice made with the keyboard too.
    for (let i = 0; i < 2; i++) await page.keyboard.press('ArrowDown');
    const second = page.waitForEvent('download');
    await page.getByTestId('export-run').click();
    expect((await second).suggestedFilename()).toMatch(/\.png$/);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('arrow keys on the Demo menu leave the open study alone; opening the choice over unsaved work asks first', async () => {
    const { page, context } = await bench.open();
    await setDial(page, '5');
    const name = await page.getByTestId('study-name').textContent();
    const asked: string[] = [];
    page.on('dialog', (dialog) => {
      asked.push(dialog.message());
      void dialog.dismiss();
    });
    const menu = page.getByTestId('demo-menu');
    await menu.focus();
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press('ArrowDown');
    await page.waitForTimeout(300);
    expect(asked).toEqual([]);
    await expect(page.getByTestId('study-name').textContent()).resolves.toBe(name);
    expect(await menu.inputValue()).not.toBe('');
    // Choosing it asks before the unsaved edit is discarded; declining keeps the study.
    await page.getByTestId('demo-open').click();
    await expect.poll(() => asked.length).toBe(1);
    expect(asked[0]).toMatch(/unsaved changes/);
    await expect(page.getByTestId('study-name').textContent()).resolves.toBe(name);
    await expect(page.getByTestId(dialField).inputValue()).resolves.toBe('5');
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });
});
