import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { pageErrors, SCREEN_SIZES as SIZES, settled, startWorkbench, type Workbench } from './harness.ts';

// What an engineer reads off the workbench is drawn whole: the probe readout's clearing times and
// the setting-window map's edge labels.

let bench: Workbench;
beforeAll(async () => {
  bench = await startWorkbench(4176);
});
afterAll(async () => {
  await bench?.close();
});

/** The "cleared by" cells (header and values) not wholly inside both the readout box and the sheet. */
function clippedClearingCells(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const inside = (a: DOMRect, b: DOMRect) =>
      a.left >= b.left - 0.5 && a.right <= b.right + 0.5 && a.top >= b.top - 0.5 && a.bottom <= b.bottom + 0.5;
    const box = document.querySelector('[data-testid="readout-box"]')!.getBoundingClientRect();
    const host = document.querySelector('.sheet-host')!.getBoundingClientRect();
    const readout = document.querySelector('[data-testid="probe-readout"]')!;
    const cells = [
      readout.querySelector('thead th:nth-child(4)')!,
      ...readout.querySelectorAll('[data-testid="probe-row"] td:last-child'),
    ];
    return cells
      .filter((cell) => !inside(cell.getBoundingClientRect(), box) || !inside(cell.getBoundingClientRect(), host))
      .map((cell) => cell.textContent ?? '');
  });
}

/** Edge labels of the shown map that leave its plot box or cross a tick label, and the whole labels of shortened ones. */
function mapLabelProblems(page: Page): Promise<{ outside: string[]; onTicks: string[]; titles: string[] }> {
  return page.evaluate(() => {
    const map = document.querySelector('[data-testid="window-map"]')!;
    const frame = (map.querySelector('rect.frame') as SVGGraphicsElement).getBBox();
    const ticks = [...map.querySelectorAll('text.tick')].map((t) => (t as SVGGraphicsElement).getBBox());
    const labels = [...map.querySelectorAll('[data-testid="edge-label"]')] as SVGTextElement[];
    const meets = (a: DOMRect, b: DOMRect) =>
      a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
    const outside = labels.filter((l) => {
      const b = l.getBBox();
      return (
        b.x < frame.x ||
        b.x + b.width > frame.x + frame.width ||
        b.y < frame.y ||
        b.y + b.height > frame.y + frame.height
      );
    });
    return {
      outside: outside.map((l) => l.getAttribute('data-label') ?? ''),
      onTicks: labels
        .filter((l) => ticks.some((t) => meets(l.getBBox(), t)))
        .map((l) => l.getAttribute('data-label') ?? ''),
      titles: labels.map((l) => `${l.querySelector('title')?.textContent} = ${l.getAttribute('data-label')}`),
    };
  });
}

describe('text an engineer reads is drawn whole, in Chromium', () => {
  for (const [width, height] of SIZES)
    it(`at ${width} × ${height} the probe readout shows its whole "cleared by" column, wherever the probe is`, async () => {
      const { page, context } = await bench.open();
      await page.setViewportSize({ width, height });
      await settled(page);
      await page.waitForTimeout(300);
      const svg = (await page.getByTestId('sheet-svg').boundingBox())!;
      const frame = await page.evaluate(() => {
        const b = (
          document.querySelector('[data-testid="sheet-svg"] [data-role="plot-frame"]') as SVGGraphicsElement
        ).getBBox();
        return { x: b.x, width: b.width };
      });
      for (const along of [0.02, 0.3, 0.55, 0.8, 0.99]) {
        await page.mouse.move(svg.x + frame.x + frame.width * along, svg.y + svg.height / 2);
        await page.getByTestId('probe-readout').waitFor();
        expect(await page.getByTestId('probe-row').count()).toBeGreaterThan(1);
        // The box is placed from its measured width, a frame after it is drawn.
        await expect.poll(() => clippedClearingCells(page)).toEqual([]);
      }
      expect(pageErrors(page)).toEqual([]);
      await context.close();
    });

  it('the setting-window map of the whole-site demo keeps every edge label inside its plot box and off the ticks', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('demo-menu').selectOption('harrowmere-full.json');
    await settled(page);
    await page.getByTestId('tab-window').click();
    for (const device of ['MAIN', 'R-T1']) {
      await page.getByTestId(`tree-device-${device}`).click();
      await page.getByTestId('window-map').waitFor();
      const tabs = page.locator('.map-tabs [role="tab"]');
      const maps = Math.max(1, await tabs.count());
      for (let i = 0; i < maps; i++) {
        if (i > 0) await tabs.nth(i).click();
        const { outside, onTicks, titles } = await mapLabelProblems(page);
        expect({ device, map: i, outside, onTicks }).toEqual({ device, map: i, outside: [], onTicks: [] });
        // Each label keeps its whole text as a tooltip, shortened or not.
        for (const t of titles) expect(t).toMatch(/^(.+) = \1$/);
      }
    }
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });
});
