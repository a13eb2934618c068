// Runs before `npm test`: the browser tests drive Debian's Chromium, so a fresh machine gets it here.
import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';

const CHROMIUM = '/usr/bin/chromium';
const FONT = '/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf';

const need = [];
if (!existsSync(CHROMIUM)) need.push('chromium');
if (!existsSync(FONT)) need.push('fonts-dejavu-core');

if (need.length > 0) {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot) {
    console.error(`browser tests need ${need.join(' and ')}: run  sudo apt-get install -y ${need.join(' ')}`);
    process.exit(1);
  }
  console.log(`installing ${need.join(', ')} from Debian's packages for the browser tests`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-q'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-q', '--no-install-recommends', ...need], { stdio: 'inherit', env });
}
