import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { radialStudy } from '../../bench/radialStudy.ts';
import { pageErrors, settled, startWorkbench, studyOpened, type Workbench } from './harness.ts';

// A generated 500-device study (the benchmarks' generator): its tree and its findings are long lists,
// drawn only where they are on screen.
const large = radialStudy(500);

let bench: Workbench;
beforeAll(async () => {
  bench = await startWorkbench(4186);
});
afterAll(async () => {
  await bench?.close();
});

async function openLarge(page: Page): Promise<void> {
  await page.getByTestId('open-file').setInputFiles({
    name: 'large.json',
    mimeType: 'application/json',
    buffer: Buffer.from(JSON.stringify(large)),
  });
  await studyOpened(page, large.name);
  await settled(page);
}

const focusedKey = (page: Page) => page.evaluate(() => document.activeElement?.getAttribute('data-key'));

describe('a 500-device study in Chromium', () => {
  it('has the expected defaults: every row counted, only the rows on screen drawn, one tab stop', async () => {
    const { page, context } = await bench.open();
    await openLarge(page);
    const tree = page.locator('[role="tree"]');
    expect(Number(await tree.getAttribute('data-rows'))).toBeGreaterThan(500);
    expect(await tree.locator('[role="treeitem"]').count()).toBeLessThan(120);
    await expect(tree.locator('[role="treeitem"][tabindex="0"]').count()).resolves.toBe(1);
    await page.getByLabel('all', { exact: true }).check();
    const list = page.getByTestId('findings').locator('ol');
    expect(Number(await list.getAttribute('data-rows'))).toBeGreaterThan(500);
    expect(await page.getByTestId('finding').count()).toBeLessThan(80);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('the arrow keys, Home and End move through the whole tree, drawing the rows they reach', async () => {
    const { page, context } = await bench.open();
    await openLarge(page);
    const tree = page.locator('[role="tree"]');
    await tree.locator('[role="treeitem"][tabindex="0"]').focus();
    await page.keyboard.press('End');
    const last = await focusedKey(page);
    expect(last).toMatch(/^(bus|motor|cable|transformer|device):/);
    await page.keyboard.press('ArrowUp');
    const beforeLast = await focusedKey(page);
    expect(beforeLast).not.toBe(last);
    await page.keyboard.press('ArrowDown');
    await expect(focusedKey(page)).resolves.toBe(last);
    await page.keyboard.press('Home');
    await expect(focusedKey(page)).resolves.toBe(`source:${large.source.id}`);
    // The focused row is on screen, within the tree's scroller.
    const inView = await page.evaluate(() => {
      const item = document.activeElement!.getBoundingClientRect();
      const scroller = document.activeElement!.closest('.tree-part')!.getBoundingClientRect();
      return item.top >= scroller.top - 1 && item.bottom <= scroller.bottom + 1;
    });
    expect(inView).toBe(true);
    await page.keyboard.press('Enter');
    await expect(page.getByTestId('properties').textContent()).resolves.toMatch(/source|utility/i);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('scrolling the findings draws the later ones; a device chosen from one is brought into view in the tree', async () => {
    const { page, context } = await bench.open();
    await openLarge(page);
    await page.getByLabel('all', { exact: true }).check();
    const first = await page.getByTestId('finding').first().getAttribute('data-finding-id');
    await page
      .getByTestId('findings')
      .locator('ol')
      .evaluate((list) => (list.scrollTop = list.scrollHeight));
    await expect.poll(() => page.getByTestId('finding').first().getAttribute('data-finding-id')).not.toBe(first);
    const id = await page.getByTestId('finding').last().getAttribute('data-finding-id');
    const finding = page.locator(`[data-finding-id="${id}"]`);
    await finding.locator('button.head').click();
    const subject = finding.locator('.subjects button').last();
    const device = await subject.textContent();
    await subject.click();
    const row = page.getByTestId(`tree-device-${device}`);
    await expect(row.getAttribute('aria-selected')).resolves.toBe('true');
    await expect(row.isVisible()).resolves.toBe(true);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('the one-line diagram opens on the top of the site and draws what is near the view; the whole is there on asking', async () => {
    const { page, context } = await bench.open();
    await openLarge(page);
    await page.getByTestId('tab-one-line').click();
    const diagram = page.getByTestId('one-line-svg');
    await diagram.waitFor();
    const viewBox = async () => (await diagram.getAttribute('viewBox'))!.split(' ').map(Number);
    // The 500-device diagram is about twenty times as tall as wide: fitted whole, every label would be
    // under a pixel. It opens on its top, the source and the service transformers in view.
    const [, y, width, height] = await viewBox();
    expect(y).toBe(0);
    expect(height).toBeLessThan(width);
    await expect(diagram.locator(`[data-id="${large.source.id}"]`).count()).resolves.toBeGreaterThan(0);
    const drawn = await diagram.locator('path, rect, text').count();
    expect(drawn).toBeLessThan(2000);
    // A bus far down chosen in the tree is brought into view and drawn there.
    await page.locator('[role="tree"] [role="treeitem"][tabindex="0"]').focus();
    await page.keyboard.press('End');
    const last = (await page.evaluate(() => document.activeElement?.getAttribute('data-key')))!;
    await page.keyboard.press('Enter');
    const lastId = last.slice(last.indexOf(':') + 1);
    await expect.poll(() => diagram.getByTestId('one-line-selected').getAttribute('data-id')).toBe(lastId);
    expect((await viewBox())[1]).toBeGreaterThan(height);
    await expect(diagram.locator(`text[data-id="${lastId}"]`).count()).resolves.toBeGreaterThan(0);
    // "Whole system": all of it in the view box, drawn as its lines (its text would be under a pixel).
    await page.getByTestId('one-line-fit').click();
    await expect.poll(async () => (await viewBox())[3]).toBeGreaterThan(20 * width);
    await expect(diagram.locator('text[data-role="one-line-label"]').count()).resolves.toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });
});
