import { describe, expect, it } from 'vitest';
import { expectedGot, InputError } from '../../src/engine/errors.ts';

describe('InputError', () => {
  it('has the expected defaults: one line, the path, then what was expected and what came', () => {
    const error = new InputError('study.transformers[1].impedance', expectedGot('a percentage greater than 0', '-5'));
    expect(error.message).toBe('study.transformers[1].impedance: expected a percentage greater than 0, got "-5"');
    expect(error.path).toBe('study.transformers[1].impedance');
  });

  it('keeps to one line when the path holds a line break (a file name may)', () => {
    const error = new InputError('odd\nname.json', expectedGot('a readable study file', 'odd\nname.json'));
    expect(error.message).toBe('odd\\u000aname.json: expected a readable study file, got "odd\\nname.json"');
    expect(error.message).not.toContain('\n');
  });
});
