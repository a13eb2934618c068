import { describe, it, expect } from 'vitest';
import { fileStemOf } from '../../../src/app/lib/download.ts';

describe('download', () => {
  it('has the expected defaults', () => {
    expect(fileStemOf('')).toBe('study');
  });

  it('fileStemOf() makes a safe file name from a study name', () => {
    expect(fileStemOf('Harrowmere Cold Store — selective scheme')).toBe('harrowmere-cold-store-selective-scheme');
    expect(fileStemOf('Émergency / panel #2')).toBe('emergency-panel-2');
    expect(fileStemOf('x'.repeat(100))).toHaveLength(60);
  });
});
