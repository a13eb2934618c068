// Writes out/snapshots.html: every SVG snapshot in tests/output, with any "-changed" version beside
// it, for review by eye. Run with `npx tsx scripts/snapshots-page.ts` and open the file in a browser.
import { existsSync, mkdirSync, readdirSync, writeFileSync } from 'node:fs';
import { join, relative } from 'node:path';

const root = join(import.meta.dirname, '..');
const outputDir = join(root, 'tests', 'output');
const pageDir = join(root, 'out');
const names = readdirSync(outputDir)
  .filter((f) => f.endsWith('.svg') && !f.endsWith('-changed.svg'))
  .map((f) => f.slice(0, -4))
  .sort();

const escape = (text: string) => text.replace(/[&<>"]/g, (c) => `&#${c.charCodeAt(0)};`);
const source = (file: string) => escape(relative(pageDir, join(outputDir, file)));
const sections = names.map((name) => {
  const changed = existsSync(join(outputDir, `${name}-changed.svg`));
  const images = [
    `<figure><img src="${source(`${name}.svg`)}" alt="${escape(name)}"><figcaption>snapshot</figcaption></figure>`,
  ];
  if (changed)
    images.push(
      `<figure><img src="${source(`${name}-changed.svg`)}" alt="${escape(name)} changed"><figcaption>changed</figcaption></figure>`,
    );
  return `<section><h2>${escape(name)}${changed ? ' (changed)' : ''}</h2>${images.join('')}</section>`;
});

mkdirSync(pageDir, { recursive: true });
writeFileSync(
  join(pageDir, 'snapshots.html'),
  `<!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><title>Sheet snapshots</title>
<style>body{font-family:'DejaVu Sans',Arial,sans-serif;margin:2rem}section{margin-bottom:3rem}
figure{display:inline-block;margin:0 1rem 0 0}img{width:640px;border:1px solid #ccc}</style></head>
<body><h1>Sheet snapshots (${names.length})</h1>${sections.join('\n')}</body></html>\n`,
);
console.log(`out/snapshots.html: ${names.length} snapshots`);
