import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';

describe('browser test ports', () => {
  it('gives every browser test file a port of its own: test files run side by side, and one server shared by two would close under the other', () => {
    const folder = new URL('./', import.meta.url);
    const ports = readdirSync(folder)
      .filter((name) => name.endsWith('.test.ts'))
      .flatMap((name) =>
        [...readFileSync(new URL(name, folder), 'utf8').matchAll(/startWorkbench\((\d+)\)/g)].map(
          (m) => `${m[1]} ${name}`,
        ),
      );
    expect(ports.length).toBeGreaterThan(5);
    const byPort = new Map<string, string[]>();
    for (const entry of ports) {
      const [port, name] = entry.split(' ');
      byPort.set(port, [...(byPort.get(port) ?? []), name]);
    }
    expect([...byPort].filter(([, names]) => names.length > 1)).toEqual([]);
    // The benchmarks serve the workbench on 4190 while no test runs, but keep it apart all the same.
    expect(byPort.has('4190')).toBe(false);
  });
});
