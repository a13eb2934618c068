import type { StudyInput } from '../../engine/study/index.ts';
import selective from '../../../demo/harrowmere-selective.json';

/** A study shipped in `demo/`, offered in the Study menu. */
export interface DemoStudy {
  fileName: string;
  name: string;
  document: StudyInput;
}

/**
 * What each demo is called in the Study menu: what it shows, as the README's table says it, so the
 * name is true of what opens (the selective scheme is selective between every series pair; its
 * transformer-protection and sensitivity notes are part of the lesson).
 */
export const DEMO_NAMES: Record<string, string> = {
  'harrowmere-selective.json': 'Selective settings: every series pair selective (protection notes to read)',
  'harrowmere-overlap.json': 'Overlapping settings, each finding explained',
  'harrowmere-fused.json': 'Fused primary: a transformer protection problem',
  'harrowmere-full.json': 'The whole site: 25 devices, every path',
  'harrowmere-standby.json': 'Standby generator, transfer switch and tie: selective in every scenario',
  'harrowmere-standby-overlap.json': 'Standby generator: selective on the utility, not on the generator',
};

/** The study the workbench opens on: the Harrowmere scheme with selective settings. */
export const DEFAULT_DEMO: DemoStudy = {
  fileName: 'harrowmere-selective.json',
  name: DEMO_NAMES['harrowmere-selective.json'],
  document: selective as StudyInput,
};

// Every demo study, bundled at build time (they are small); new files in demo/ appear by themselves.
const modules = import.meta.glob<StudyInput>('../../../demo/*.json', { eager: true, import: 'default' });

/**
 * The demo studies, the default first, then by file name.
 * @example DEMO_STUDIES.map((d) => d.fileName) // ['harrowmere-selective.json', …]
 */
export const DEMO_STUDIES: DemoStudy[] = [
  DEFAULT_DEMO,
  ...Object.entries(modules)
    .map(([path, document]) => {
      const fileName = path.split('/').pop()!;
      return { fileName, name: DEMO_NAMES[fileName] ?? document.name, document };
    })
    .filter((demo) => demo.fileName !== DEFAULT_DEMO.fileName)
    .sort((a, b) => a.fileName.localeCompare(b.fileName)),
];
