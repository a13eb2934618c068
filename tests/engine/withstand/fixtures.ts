import {
  studySchema,
  type Cable,
  type Motor,
  type StudyInput,
  type Transformer,
} from '../../../src/engine/study/index.ts';

type Input<K extends 'transformers' | 'cables' | 'motors'> = NonNullable<StudyInput[K]>[number];

/** A transformer as the study file would give it, parsed (units to SI, defaults filled). Inputs invented. */
export function transformerOf(input: Partial<Input<'transformers'>> = {}): Transformer {
  return studySchema.shape.transformers.def.innerType.def.element.parse({
    id: 'T1',
    from: 'HV',
    to: 'LV',
    rating: 2500,
    primary: 13_800,
    secondary: 480,
    impedance: 5.75,
    ...input,
  });
}

/** A cable as the study file would give it, parsed. Inputs invented. */
export function cableOf(input: Partial<Input<'cables'>> = {}): Cable {
  return studySchema.shape.cables.def.innerType.def.element.parse({
    id: 'C1',
    from: 'SWBD',
    to: 'MCC',
    size: '4/0',
    length: 100,
    ...input,
  });
}

/** A motor as the study file would give it, parsed. Inputs invented. */
export function motorOf(input: Partial<Input<'motors'>> = {}): Motor {
  return studySchema.shape.motors.def.innerType.def.element.parse({ id: 'M1', bus: 'MCC', hp: 100, ...input });
}

/** The hand-worked IEEE C57.109 Category II case unit: 2500 kVA, 13.8 kV–480 V, 5.75 %Z, liquid-immersed, Category II (invented). */
export const T2500 = { rating: 2500, primary: 13_800, secondary: 480, impedance: 5.75 } as const;
