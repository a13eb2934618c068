import { describe, it, expect } from 'vitest';
import { fieldLabel } from '../../../src/app/lib/fieldLabel.ts';

describe('fieldLabel', () => {
  it('has the expected defaults', () => {
    expect(fieldLabel('pickup')).toBe('pickup');
  });

  it('fieldLabel() uses the trade names of settings, else plain words', () => {
    expect(fieldLabel('timeDial')).toBe('time dial');
    expect(fieldLabel('shortTime')).toBe('short-time');
    expect(fieldLabel('xr')).toBe('X/R');
    expect(fieldLabel('faultFrequency')).toBe('fault frequency');
    expect(fieldLabel(0)).toBe('#1');
  });
});
