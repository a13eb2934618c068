import type { StudyInput } from '../../engine/study/index.ts';
import selective from '../../../demo/harrowmere-selective.json';

/** A study shipped in `demo/`, offered in the Study menu. */
export interface DemoStudy {
  fileName: string;
  name: string;
  document: StudyInput;
}

/** The study the workbench opens on: the fully selective Harrowmere scheme. */
export const DEFAULT_DEMO: DemoStudy = {
  fileName: 'harrowmere-selective.json',
  name: selective.name,
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
    .map(([path, document]) => ({ fileName: path.split('/').pop()!, name: document.name, document }))
    .filter((demo) => demo.fileName !== DEFAULT_DEMO.fileName)
    .sort((a, b) => a.fileName.localeCompare(b.fileName)),
];
