import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { BrowserContext, Page } from 'playwright-core';
import type { StudyInput } from '../../src/engine/study/index.ts';
import { pageErrors, settled, startWorkbench, studyOpened, type Workbench } from './harness.ts';

const demoPath = fileURLToPath(new URL('../../demo/harrowmere-selective.json', import.meta.url));
const demo = JSON.parse(readFileSync(demoPath, 'utf8')) as StudyInput;
const mainIndex = (demo.devices ?? []).findIndex((d) => d.id === 'MAIN');
const delayField = `field-study.devices[${mainIndex}].characteristic.shortTime.delay`;

let bench: Workbench;
beforeAll(async () => {
  bench = await startWorkbench(4191);
});
afterAll(async () => {
  await bench?.close();
});

/** Collects Content-Security-Policy violations the page reports, from its first script on. */
async function watchPolicy(context: BrowserContext): Promise<void> {
  await context.addInitScript(() => {
    const seen: string[] = [];
    (window as unknown as { policyViolations: string[] }).policyViolations = seen;
    document.addEventListener('securitypolicyviolation', (event) =>
      seen.push(`${event.violatedDirective} ${event.blockedURI}`),
    );
  });
}

/**
 * Makes the page's storage refuse every write of more than 1,000 characters while
 * `window.refuseStorage` is true, as a nearly full quota does (a whole study no longer fits; a note does).
 */
async function refusableStorage(context: BrowserContext): Promise<void> {
  await context.addInitScript(() => {
    const setItem = Storage.prototype.setItem;
    Storage.prototype.setItem = function (key: string, value: string) {
      if ((window as unknown as { refuseStorage?: boolean }).refuseStorage && value.length > 1000)
        throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
      return setItem.call(this, key, value);
    };
  });
}

/** A fresh page on the workbench whose context gets `prepare` before anything loads. */
async function openWith(prepare: (context: BrowserContext) => Promise<void> = async () => {}) {
  const context = await bench.browser.newContext({ viewport: { width: 1280, height: 800 }, acceptDownloads: true });
  await prepare(context);
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  (page as Page & { errors?: string[] }).errors = errors;
  const warnings: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'warning' || message.type() === 'error') warnings.push(message.text());
  });
  await page.goto(bench.url);
  await page.getByTestId('sheet-svg').waitFor();
  await settled(page);
  return { context, page, warnings };
}

/** Reloads without waiting for anything first, as a crash-and-restart or an impatient F5 would. */
async function reloadAtOnce(page: Page): Promise<void> {
  await page.reload();
  await page.getByTestId('sheet-svg').waitFor();
}

/** A valid study `levels` cables deep: one 480 V bus below the other, each fed by a 1 ft run. */
function deepStudy(levels: number): StudyInput {
  const buses = [{ id: 'B0', voltage: '480 V' }];
  const cables = [];
  for (let i = 1; i <= levels; i++) {
    buses.push({ id: `B${i}`, voltage: '480 V' });
    cables.push({ id: `C${i}`, from: `B${i - 1}`, to: `B${i}`, size: '500 kcmil', length: '1 ft' });
  }
  return {
    discern: 1,
    name: `A study ${levels} levels deep`,
    frequency: 60,
    source: { kind: 'utility', id: 'U', bus: 'B0', max: { available: '50 kA', xr: 10 } },
    buses,
    cables,
    devices: [],
    views: [],
  } as StudyInput;
}

async function setMainDelay(page: Page, value: string): Promise<void> {
  await page.getByTestId('tree-device-MAIN').click();
  await page.getByTestId(delayField).fill(value);
}

describe('the workbench keeps the work', () => {
  it('has the expected defaults: no offer, no storage message, the strict policy header and no violation', async () => {
    const { page, context, warnings } = await openWith(watchPolicy);
    await expect(page.getByTestId('recovery-offer').count()).resolves.toBe(0);
    await expect(page.getByTestId('autosave-refused').count()).resolves.toBe(0);
    const response = await page.request.get(bench.url);
    expect(response.headers()['content-security-policy']).toMatch(/frame-ancestors 'none'/);
    expect(response.headers()['content-security-policy']).not.toMatch(/unsafe-(eval|inline)/);
    // Reading a study runs the schemas: zod is jitless, so no Function probe is reported.
    await setMainDelay(page, '0.35');
    await settled(page);
    expect(await page.evaluate(() => (window as unknown as { policyViolations: string[] }).policyViolations)).toEqual(
      [],
    );
    expect(warnings).toEqual([]);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('an edit that leaves a problem (a field cleared to retype it), then a reload: offered back exactly as left', async () => {
    const { page, context } = await openWith();
    const sheetBefore = await page.getByTestId('sheet-svg').boundingBox();
    await setMainDelay(page, '');
    await page.getByTestId('study-problems').waitFor();
    // The problems bar sits beside the fields: it neither covers the sheet nor moves it.
    const bar = (await page.getByTestId('study-problems').boundingBox())!;
    const sheet = (await page.getByTestId('sheet-svg').boundingBox())!;
    expect(sheet).toEqual(sheetBefore);
    expect(bar.x + bar.width <= sheet.x || bar.y >= sheet.y + sheet.height || bar.y + bar.height <= sheet.y).toBe(true);
    await reloadAtOnce(page);
    const offer = page.getByTestId('recovery-offer');
    await offer.waitFor();
    await expect(offer.textContent()).resolves.toContain(demo.name);
    await expect(page.getByTestId('recovery-version').first().textContent()).resolves.toMatch(/1 problem to fix/);
    // Nothing replaced the kept copy while the offer waited: reload again and it is still offered.
    await reloadAtOnce(page);
    await offer.waitFor();
    await page.getByTestId('recovery-restore').first().click();
    await expect(offer.count()).resolves.toBe(0);
    await expect(page.getByTestId('study-problems').textContent()).resolves.toMatch(
      new RegExp(`study\\.devices\\[${mainIndex}\\]\\.characteristic\\.shortTime\\.delay: `),
    );
    await expect(page.getByTestId('recovered').textContent()).resolves.toMatch(/with 1 problem to fix/);
    // Nothing is checked while the restored copy has problems: no findings, not even those of the
    // study shown before it, and the sheet says why it is not drawn.
    await expect(page.getByTestId('findings').textContent()).resolves.toMatch(/Not checked: the study has problems/);
    await expect(page.getByTestId('findings-summary').getAttribute('data-ok')).resolves.toBe('0');
    await page.getByTestId('sheet-problems').waitFor();
    await page.getByTestId('study-problems').locator('button').first().click();
    await expect(page.getByTestId(delayField).inputValue()).resolves.toBe('');
    // Fixed and saved: the study is whole again, and the recovered banner has gone.
    await page.getByTestId(delayField).fill('0.4');
    await expect(page.getByTestId('study-problems').count()).resolves.toBe(0);
    await expect.poll(() => page.getByTestId('findings-summary').getAttribute('data-ok')).not.toBe('0');
    const download = page.waitForEvent('download');
    await page.getByTestId('recovered-save').click();
    await download;
    await expect(page.getByTestId('recovered').count()).resolves.toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('a time dial typed as people write it ("2.50", "2.", ".5") is that number, shown as typed while it is typed', async () => {
    const { page, context } = await openWith();
    // The selective demo's first device, T1 primary relay: its time dial is a plain number, not a quantity.
    await page.getByTestId('tree-device-R-T1').click();
    const dial = page.getByTestId('field-study.devices[0].characteristic.timeOvercurrent.timeDial');
    for (const typed of ['2.50', '2.', '.5']) {
      await dial.fill(typed);
      await expect(page.getByTestId('study-problems').count()).resolves.toBe(0);
      await expect(dial.inputValue()).resolves.toBe(typed);
    }
    // Deleting the last figure of "2.35" leaves "2.3" under the cursor, not a rewritten field.
    await dial.fill('2.35');
    await dial.press('End');
    await dial.press('Backspace');
    await dial.press('Backspace');
    await expect(dial.inputValue()).resolves.toBe('2.');
    await expect(page.getByTestId('study-problems').count()).resolves.toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('a valid edit and an immediate reload: the edit is kept, and the offer lists the kept versions', async () => {
    const { page, context } = await openWith();
    await setMainDelay(page, '0.25');
    await reloadAtOnce(page);
    await page.getByTestId('recovery-offer').waitFor();
    const versions = page.getByTestId('recovery-version');
    await expect(versions.first().textContent()).resolves.toMatch(/unsaved changes/);
    await expect(versions.first().textContent()).resolves.toContain(demo.name);
    // Closing the offer without a choice keeps the work: the newest copy comes back. A dialog's close
    // event comes in a task after the key, so the offer is awaited to go, not counted at once.
    await page.keyboard.press('Escape');
    await page.getByTestId('recovery-offer').waitFor({ state: 'detached' });
    await page.getByTestId('tree-device-MAIN').click();
    await expect(page.getByTestId(delayField).inputValue()).resolves.toBe('0.25');
    // Replacing the study (a demo, after confirming the discard) takes the recovered banner away.
    await expect(page.getByTestId('recovered').count()).resolves.toBe(1);
    page.once('dialog', (dialog) => void dialog.accept());
    await page.getByTestId('demo-menu').selectOption('harrowmere-selective.json');
    await expect(page.getByTestId('recovered').count()).resolves.toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('discarding the kept copies is the user’s choice, and only then does the demo take their place', async () => {
    const { page, context } = await openWith();
    await setMainDelay(page, '0.3');
    await reloadAtOnce(page);
    page.once('dialog', (dialog) => void dialog.accept());
    await page.getByTestId('recovery-discard').click();
    await expect(page.getByTestId('recovery-offer').count()).resolves.toBe(0);
    await reloadAtOnce(page);
    await expect(page.getByTestId('recovery-offer').count()).resolves.toBe(0);
    await page.getByTestId('tree-device-MAIN').click();
    await expect(page.getByTestId(delayField).inputValue()).resolves.toBe('0.4');
    await context.close();
  });

  it('storage that refuses a write: the user is told at once, offered a file, and the older copy is marked out of date', async () => {
    const { page, context } = await openWith(refusableStorage);
    await setMainDelay(page, '0.25');
    await page.waitForFunction(() =>
      Object.keys(localStorage).some((key) => localStorage.getItem(key)?.includes('0.25')),
    );
    await page.evaluate(() => ((window as unknown as { refuseStorage: boolean }).refuseStorage = true));
    await page.getByTestId(delayField).fill('0.3');
    const refused = page.getByTestId('autosave-refused');
    await refused.waitFor();
    await expect(refused.textContent()).resolves.toMatch(
      /Autosave failed:.*the browser's storage is full.*Save the study to a file.*marked out of date/s,
    );
    const download = page.waitForEvent('download');
    await page.getByTestId('autosave-save').click();
    const file = await download;
    const chunks: Buffer[] = [];
    for await (const chunk of await file.createReadStream()) chunks.push(chunk as Buffer);
    const saved = JSON.parse(Buffer.concat(chunks).toString('utf8')) as StudyInput;
    expect((saved.devices![mainIndex].characteristic as { shortTime: { delay: unknown } }).shortTime.delay).toBe(0.3);
    await expect(refused.count()).resolves.toBe(0);
    // After a reload the kept copy is not passed off as the latest work.
    await reloadAtOnce(page);
    await expect(page.getByTestId('recovery-stale').textContent()).resolves.toMatch(/refused to keep/);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('a study 200 levels deep opens whole, and nothing of the previous study stays on screen', async () => {
    const { page, context } = await openWith();
    const deep = deepStudy(200);
    await page.getByTestId('open-file').setInputFiles({
      name: 'deep.json',
      mimeType: 'application/json',
      buffer: Buffer.from(JSON.stringify(deep)),
    });
    await studyOpened(page, deep.name);
    // Every row is in the tree (the source, 201 buses, 200 cables); only those on screen are drawn, so
    // the deepest bus is reached from the keyboard.
    const tree = page.locator('[role="tree"]');
    await expect(tree.getAttribute('data-rows')).resolves.toBe('402');
    await tree.locator('[role="treeitem"][tabindex="0"]').focus();
    await page.keyboard.press('End');
    await expect(page.evaluate(() => document.activeElement?.getAttribute('data-testid'))).resolves.toBe(
      'tree-bus-B200',
    );
    await expect(page.getByTestId('tree-device-MAIN').count()).resolves.toBe(0);
    await expect(page.getByTestId('refused').count()).resolves.toBe(0);
    await expect(page.locator('[data-testid="sheet-svg"] [data-id="MAIN"]').count()).resolves.toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('a file that cannot be opened leaves the open study, its edits and its kept copy as they were', async () => {
    const { page, context } = await openWith();
    await setMainDelay(page, '0.3');
    const bad = { ...deepStudy(3), cables: [{ id: 'C1', from: 'B0', to: 'B1', size: 'lots', length: '1 ft' }] };
    await page.getByTestId('open-file').setInputFiles({
      name: 'bad.json',
      mimeType: 'application/json',
      buffer: Buffer.from(JSON.stringify(bad)),
    });
    const refused = page.getByTestId('refused');
    await refused.waitFor();
    await expect(refused.textContent()).resolves.toMatch(/bad\.json.*was not opened.*unchanged/s);
    await expect(page.getByTestId('study-name').textContent()).resolves.toContain(demo.name);
    await expect(page.getByTestId(delayField).inputValue()).resolves.toBe('0.3');
    await expect(page.getByTestId('tree-bus-B1').count()).resolves.toBe(0);
    // A study saved in Latin-1 ("Köln" with the ö as the single byte 0xF6) is refused, not misread.
    await page.getByTestId('open-file').setInputFiles({
      name: 'latin1.json',
      mimeType: 'application/json',
      buffer: Buffer.from(JSON.stringify({ ...deepStudy(1), name: 'K\u00f6ln' }), 'latin1'),
    });
    await expect
      .poll(() => refused.textContent())
      .toMatch(/latin1\.json.*was not opened.*study: expected UTF-8 text, got "byte 0xF6 at line 1, column \d+"/s);
    await expect(page.getByTestId('study-name').textContent()).resolves.toContain(demo.name);
    await reloadAtOnce(page);
    await page.getByTestId('recovery-restore').first().click();
    await page.getByTestId('tree-device-MAIN').click();
    await expect(page.getByTestId(delayField).inputValue()).resolves.toBe('0.3');
    await context.close();
  });

  it('a cable edited into a loop is refused with a message naming the field, and the page carries on', async () => {
    const { page, context } = await openWith();
    const cables = demo.cables ?? [];
    const mcc = cables.findIndex((c) => c.id === 'C-MCC');
    const dock = cables.findIndex((c) => c.id === 'C-DOCK');
    // First the MCC is fed through the dock bus (still a tree), then the dock bus from the MCC: a loop.
    await page.getByTestId('tree-cable-C-MCC').click();
    await page.getByTestId(`field-study.cables[${mcc}].from`).fill('DOCK');
    await page.getByTestId('tree-cable-C-DOCK').click();
    await page.getByTestId(`field-study.cables[${dock}].from`).fill('MCC');
    await expect(page.getByTestId('study-problems').textContent()).resolves.toMatch(
      /study\.buses\[\d+\]: expected a bus connected to the source .*in a loop/,
    );
    await page.getByTestId('undo').click();
    await expect(page.getByTestId('study-problems').count()).resolves.toBe(0);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });

  it('deleting a cable takes the bus it feeds and what hangs below, asks first, and one undo brings it all back', async () => {
    const { page, context } = await openWith();
    await page.getByTestId('tree-cable-C-MCC').click();
    const asked: string[] = [];
    page.once('dialog', (dialog) => {
      asked.push(dialog.message());
      void dialog.accept();
    });
    await page.getByTestId('delete-item').click();
    expect(asked[0]).toMatch(/^Delete cable C-MCC\? This also deletes .*bus MCC/);
    await expect(page.getByTestId('tree-cable-C-MCC').count()).resolves.toBe(0);
    await expect(page.getByTestId('tree-bus-MCC').count()).resolves.toBe(0);
    await expect(page.getByTestId('study-problems').count()).resolves.toBe(0);
    await page.getByTestId('undo').click();
    await expect(page.getByTestId('tree-bus-MCC').count()).resolves.toBe(1);
    expect(pageErrors(page)).toEqual([]);
    await context.close();
  });
});
