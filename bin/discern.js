#!/usr/bin/env node
// The `discern` command (installed, and `npm run discern`). It runs the bundle `npm install` builds
// (dist-cli/, through the `prepare` script), which starts in a fraction of a second. Where there is
// no bundle, or a source file changed after it was built, it runs the TypeScript sources through tsx
// instead, so the command never answers with yesterday's engine.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const bundle = new URL('../dist-cli/discern.js', import.meta.url);
const sources = fileURLToPath(new URL('../src/', import.meta.url));

/** True when some file under src/ is newer than the bundle (a checkout or an edit since `npm install`). */
function bundleIsStale() {
  if (!existsSync(sources)) return false;
  const built = statSync(bundle).mtimeMs;
  for (const file of readdirSync(sources, { recursive: true })) {
    if (statSync(`${sources}${file}`).mtimeMs > built) return true;
  }
  return false;
}

if (existsSync(bundle) && !bundleIsStale()) {
  await import(bundle.href);
} else {
  if (existsSync(bundle)) {
    process.stderr.write(
      'discern: src/ changed after dist-cli/ was built; running the sources (npm run prepare rebuilds)\n',
    );
  }
  const { register } = await import('tsx/esm/api');
  register();
  await import('../src/cli/main.ts');
}
