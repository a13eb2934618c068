import { describe, it, expect } from 'vitest';
import {
  fieldInfoAt,
  initialValueOf,
  missingFieldsAt,
  schemaNodeAt,
  STUDY_JSON_SCHEMA,
} from '../../../src/app/lib/fieldInfo.ts';

const document = {
  discern: 1,
  name: 'Harrowmere',
  source: { kind: 'infinite', id: 'SRC', bus: 'MV' },
  buses: [{ id: 'MV', voltage: '12.47 kV' }],
  transformers: [{ id: 'T1', from: 'MV', to: 'SWBD', rating: 1500, primary: 12470, secondary: 480, impedance: 5.75 }],
  devices: [
    {
      id: 'R-T1',
      feeds: 'T1',
      characteristic: {
        kind: 'relay',
        ct: '100:5',
        timeOvercurrent: { curve: 'ieee-very-inverse', pickup: 5, timeDial: 2 },
      },
    },
  ],
};

describe('fieldInfo', () => {
  it('has the expected defaults', () => {
    expect(STUDY_JSON_SCHEMA.properties?.buses).toBeDefined();
    expect(fieldInfoAt(document, ['nowhere'])).toBeUndefined();
  });

  it('initialValueOf() adds a field at its default, and a choice without one unchosen: no code letter is guessed', () => {
    const withMotor = { ...document, motors: [{ id: 'M1', bus: 'MV', hp: 100 }] };
    expect(initialValueOf(fieldInfoAt(withMotor, ['motors', 0, 'codeLetter']))).toBe('');
    expect(initialValueOf(fieldInfoAt(withMotor, ['motors', 0, 'lockedRotor']))).toBe(6);
    expect(initialValueOf(fieldInfoAt(document, ['transformers', 0, 'connection']))).toBe('delta-wye');
    expect(initialValueOf(fieldInfoAt(document, ['devices', 0, 'system']))).toBe('');
  });

  it('fieldInfoAt() offers a quantity for fields that take numbers or text with units', () => {
    const info = fieldInfoAt(document, ['buses', 0, 'voltage'])!;
    expect(info.control).toBe('quantity');
    expect(info.description).toMatch(/12\.47 kV/);
  });

  it('fieldInfoAt() offers the schema choices for an enum, with its default', () => {
    const info = fieldInfoAt(document, ['transformers', 0, 'connection'])!;
    expect(info.control).toBe('choice');
    expect(info.choices).toEqual(['delta-wye', 'delta-delta', 'wye-wye', 'wye-delta']);
    expect(info.defaultValue).toBe('delta-wye');
  });

  it('fieldInfoAt() follows a device characteristic by its kind', () => {
    expect(fieldInfoAt(document, ['devices', 0, 'characteristic', 'timeOvercurrent', 'timeDial'])?.control).toBe(
      'number',
    );
    expect(fieldInfoAt(document, ['devices', 0, 'characteristic', 'kind'])?.control).toBe('fixed');
    expect(
      schemaNodeAt(STUDY_JSON_SCHEMA, document, ['devices', 0, 'characteristic'])?.properties?.timeOvercurrent,
    ).toBeDefined();
  });

  it('fieldInfoAt() offers a switch for booleans and a choice for unions of literals', () => {
    expect(fieldInfoAt(document, ['transformers', 0, 'supervised'])?.control).toBe('boolean');
    expect(fieldInfoAt(document, ['transformers', 0, 'phases'])?.choices).toEqual([1, 3]);
  });

  it('fieldInfoAt() says which fields the schema requires', () => {
    expect(fieldInfoAt(document, ['transformers', 0, 'rating'])?.required).toBe(true);
    expect(fieldInfoAt(document, ['transformers', 0, 'xr'])?.required).toBe(false);
    expect(fieldInfoAt(document, ['devices', 0, 'characteristic', 'kind'])?.required).toBe(true);
  });

  it('missingFieldsAt() lists the optional fields an item leaves out', () => {
    const missing = missingFieldsAt(document, ['transformers', 0]).map((m) => m.key);
    expect(missing).toContain('xr');
    expect(missing).toContain('connection');
    expect(missing).not.toContain('rating');
  });
});
