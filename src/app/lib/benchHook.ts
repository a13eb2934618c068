import { flushSync } from 'svelte';
import type { StudyContext } from '../state/context.ts';
import type { DocumentPath } from './documentPath.ts';
import type { StudyInput } from '../../engine/study/index.ts';

/** What `npm run bench` (DEVELOPERS.md, benchmarks, P4) calls in the page: timings only, no access to anything else. */
export interface BenchHook {
  /**
   * Sets the field at `path` to each of `values` in turn and returns, for each, the milliseconds
   * from the edit until the sheet's DOM is updated and laid out.
   */
  measureEdits(path: DocumentPath, values: unknown[]): number[];
  /** Moves the probe to each current (A at the reference voltage) and returns the milliseconds until its readout is laid out. */
  measureProbe(amps: number[]): number[];
  /** Paths of the numeric settings of the devices on the current sheet, for the benchmark to step. */
  settingPaths(): { path: DocumentPath; value: number }[];
  /**
   * Sets the field at `path` to `value` as the property editor does and resolves, in milliseconds from
   * the edit, when the page's work on it is done and laid out (`work`), when the next frame has been
   * painted (`paint`: a task queued from the first animation frame after the DOM update) and when the
   * checks' findings of the edit are on the page and painted (`findings`).
   */
  measureEdit(path: DocumentPath, value: unknown): Promise<{ work: number; paint: number; findings: number }>;
  /** Opens a study document (a generated one), as opening a file does; resolves once its findings are in. */
  open(document: unknown): Promise<void>;
}

/** Resolves after the next frame is painted: a task queued from the next animation frame runs after the paint. */
function afterPaint(): Promise<void> {
  return new Promise((resolve) =>
    requestAnimationFrame(() => {
      const channel = new MessageChannel();
      channel.port1.onmessage = () => resolve();
      channel.port2.postMessage(undefined);
    }),
  );
}

/** Resolves once the checks have answered the latest edit. */
async function checksDone(pending: () => boolean): Promise<void> {
  while (pending()) await new Promise((resolve) => setTimeout(resolve, 1));
}

/**
 * Installs `window.__discernBench`. The hook only times edits the user could make by hand.
 * @example installBenchHook(window, { study, analysis, probe, sheet })
 */
export function installBenchHook(target: Window, context: StudyContext): void {
  const { study, probe, analysis } = context;
  const layout = () => document.querySelector('[data-testid="sheet-svg"]')?.getBoundingClientRect();
  const hook: BenchHook = {
    measureEdits(path, values) {
      return values.map((value) => {
        const start = performance.now();
        study.edit(path, value, 'benchmark');
        flushSync();
        layout();
        return performance.now() - start;
      });
    },
    measureProbe(amps) {
      return amps.map((a) => {
        const start = performance.now();
        probe.moveTo(a);
        flushSync();
        document.querySelector('[data-testid="probe-readout"]')?.getBoundingClientRect();
        return performance.now() - start;
      });
    },
    async measureEdit(path, value) {
      const start = performance.now();
      study.edit(path, value, 'benchmark');
      flushSync();
      layout();
      const work = performance.now() - start;
      await afterPaint();
      const paint = performance.now() - start;
      await checksDone(() => analysis.pending);
      flushSync();
      await afterPaint();
      return { work, paint, findings: performance.now() - start };
    },
    async open(document) {
      study.load(document as StudyInput, 'generated.json');
      flushSync();
      await afterPaint();
      await checksDone(() => analysis.pending);
      await afterPaint();
    },
    settingPaths() {
      const found: { path: DocumentPath; value: number }[] = [];
      const visit = (node: unknown, path: (string | number)[]) => {
        if (typeof node === 'number' && path.length > 3) found.push({ path, value: node });
        else if (node !== null && typeof node === 'object' && !Array.isArray(node)) {
          for (const [key, child] of Object.entries(node)) visit(child, [...path, key]);
        }
      };
      const onSheet = new Set(study.view?.devices ?? []);
      (study.document.devices ?? []).forEach((device, i) => {
        if (onSheet.has(device.id)) visit(device.characteristic, ['devices', i, 'characteristic']);
      });
      return found;
    },
  };
  (target as unknown as { __discernBench: BenchHook }).__discernBench = hook;
}
