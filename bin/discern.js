#!/usr/bin/env node
// The installed `discern` command. It runs the bundle `npm install` builds (dist-cli/, through the
// `prepare` script), which starts in a fraction of a second; without it, it runs the TypeScript
// sources through tsx. `npm run discern` always runs the sources.
import { existsSync } from 'node:fs';

const bundle = new URL('../dist-cli/discern.js', import.meta.url);
if (existsSync(bundle)) {
  await import(bundle.href);
} else {
  const { register } = await import('tsx/esm/api');
  register();
  await import('../src/cli/main.ts');
}
