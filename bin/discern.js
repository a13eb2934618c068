#!/usr/bin/env node
// The installed `discern` command: runs the TypeScript CLI through tsx, so no build step is needed.
import { register } from 'tsx/esm/api';

register();
await import('../src/cli/main.ts');
