import { mkdirSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { pageErrors, settled, startWorkbench, type Workbench } from './harness.ts';

let bench: Workbench;
beforeAll(async () => {
  bench = await startWorkbench(4195);
});
afterAll(async () => {
  await bench?.close();
});

describe('the Window panel in Chromium', () => {
  it('has the expected defaults: a hint until a device is selected, then the map with its labelled edges and both marks', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('tab-window').click();
    await expect(page.getByTestId('window-panel').textContent()).resolves.toMatch(/Select a device/);
    await page.getByTestId('tree-device-MAIN').click();
    await page.getByTestId('window-map').waitFor();
    await page.getByTestId('window-map').scrollIntoViewIfNeeded();
    const labels = await page.getByTestId('edge-label').allTextContents();
    expect(labels.length).toBeGreaterThan(1);
    expect(labels.join(' ')).toMatch(/coordinate with|carry|offered/);
    await expect(page.getByTestId('map-current').count()).resolves.toBe(1);
    await expect(page.getByTestId('map-recommended').count()).resolves.toBe(1);
    mkdirSync('out', { recursive: true });
    await page.screenshot({ path: 'out/window-panel.png' });
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it("names what the recommendation still misses: on the generator, the breaker against the machine's damage curve", async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('demo-menu').selectOption('harrowmere-standby.json');
    await settled(page);
    await page.getByTestId('scenario-menu').selectOption('on-generator');
    await settled(page);
    await page.getByTestId('tree-device-GEN-CB').click();
    await page.getByTestId('tab-window').click();
    // NFPA 70 445.12(A) accepts the machine's inherent protection: the checks warn, and the window says so.
    await page.getByTestId('window-missed').waitFor();
    await expect(page.getByTestId('window-missed').textContent()).resolves.toMatch(
      /^\s*Not kept at the recommendation: clear below .+ damage curve .+ s at .+ A\)/,
    );
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('a click inside the map applies that setting as one undoable step, and the findings follow', async () => {
    const { page, context } = await bench.open();
    await page.getByTestId('tree-device-MAIN').click();
    await page.getByTestId('tab-window').click();
    await page.getByTestId('window-map').waitFor();
    await page.getByTestId('window-map').scrollIntoViewIfNeeded();
    const before = await page.getByTestId('map-current').getAttribute('cx');
    const cells = page.locator('[data-testid="window-map"] rect.feasible');
    const count = await cells.count();
    expect(count).toBeGreaterThan(0);
    const box = (await cells.nth(0).boundingBox())!;
    await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
    await settled(page);
    await page.waitForFunction(
      (old) => document.querySelector('[data-testid="map-current"]')?.getAttribute('cx') !== old,
      before,
    );
    await expect(page.getByTestId('window-status').textContent()).resolves.toMatch(/a window exists/);
    await page.keyboard.press('Control+z');
    await settled(page);
    await page.waitForFunction(
      (old) => document.querySelector('[data-testid="map-current"]')?.getAttribute('cx') === old,
      before,
    );
    // A click where no setting keeps every constraint writes nothing, and says why.
    const outside = await page.evaluate(() => {
      const frame = document.querySelector('[data-testid="window-map"] rect.frame')!.getBoundingClientRect();
      const cells = [...document.querySelectorAll('[data-testid="window-map"] rect.feasible')].map((r) =>
        r.getBoundingClientRect(),
      );
      for (let y = frame.top + 2; y < frame.bottom - 2; y += 3)
        for (let x = frame.left + 2; x < frame.right - 2; x += 3)
          if (!cells.some((c) => x >= c.left - 1 && x <= c.right + 1 && y >= c.top - 1 && y <= c.bottom + 1))
            return { x, y };
      return undefined;
    });
    expect(outside).toBeDefined();
    const undoLabel = await page.getByTestId('undo').getAttribute('title');
    await page.mouse.click(outside!.x, outside!.y);
    await expect(page.getByTestId('window-map-note').textContent()).resolves.toMatch(/does not keep every constraint/);
    await expect(page.getByTestId('undo').getAttribute('title')).resolves.toBe(undoLabel);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('proposes settings for the overlap demo as a reviewable list; accepting applies them as one step and clears the failures', async () => {
    const { page, context } = await bench.open();
    await proposeOnTheOverlapDemo(page);
    expect(await page.getByTestId('proposal-change').count()).toBeGreaterThan(3);
    await expect(page.getByTestId('proposal').textContent()).resolves.toMatch(
      /failing findings in the whole\s+study: \d+\s*→\s*0/,
    );
    const failsBefore = await page.locator('[data-testid="finding"].fail').count();
    expect(failsBefore).toBeGreaterThan(0);
    await page.getByTestId('proposal-accept').click();
    await settled(page);
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="finding"].fail').length === 0);
    await page.keyboard.press('Control+z');
    await settled(page);
    await page.waitForFunction(
      (n) => document.querySelectorAll('[data-testid="finding"].fail').length === n,
      failsBefore,
    );
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('a proposal worked out before an edit says so and is not applied', async () => {
    const { page, context } = await bench.open();
    await proposeOnTheOverlapDemo(page);
    await expect(page.getByTestId('proposal-accept').isEnabled()).resolves.toBe(true);
    await page.getByTestId('tree-device-FDR-MCC').click();
    const delay = page.getByTestId(/field-study\.devices\[\d+\]\.characteristic\.shortTime\.delay/);
    await delay.fill('0.3');
    await delay.press('Tab');
    await settled(page);
    await page.getByTestId('proposal-stale').waitFor();
    await expect(page.getByTestId('proposal-accept').isDisabled()).resolves.toBe(true);
    // An edit that leaves a problem (the last valid study still shown) is an edit too.
    await page.getByTestId('proposal').getByRole('button', { name: 'Dismiss' }).click();
    await page.getByTestId('propose-study').click();
    await page.getByTestId('proposal').waitFor();
    await expect(page.getByTestId('proposal-accept').isEnabled()).resolves.toBe(true);
    await delay.fill('soon');
    await delay.press('Tab');
    await page.getByTestId('proposal-stale').waitFor();
    await expect(page.getByTestId('proposal-accept').isDisabled()).resolves.toBe(true);
    // Nor is anything proposed while the study has problems: it would be worked out for the last valid study.
    await page.getByTestId('propose-study').click();
    await expect(page.getByTestId('proposal-error').textContent()).resolves.toMatch(
      /^No proposal while the study has problems/,
    );
    await expect(page.getByTestId('proposal').count()).resolves.toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });
});

// Accepts a page; the overlap demo opened, with settings proposed for the whole study.
async function proposeOnTheOverlapDemo(page: Page): Promise<void> {
  await page.getByTestId('demo-menu').selectOption('harrowmere-overlap.json');
  await settled(page);
  await page.getByTestId('tab-window').click();
  await page.getByTestId('propose-study').click();
  await page.getByTestId('proposal').waitFor();
}
