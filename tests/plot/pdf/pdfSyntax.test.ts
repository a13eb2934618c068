import { describe, expect, it } from 'vitest';
import { hex4, pdfDate, pdfLiteral, pdfNumber, pdfTextString } from '../../../src/plot/pdf/pdfSyntax.ts';

describe('pdfSyntax', () => {
  it('has the expected defaults: numbers to 3 decimals, no trailing zeros, no exponent, no "-0"', () => {
    expect(pdfNumber(12.34567)).toBe('12.346');
    expect(pdfNumber(2)).toBe('2');
    expect(pdfNumber(-0.0001)).toBe('0');
    expect(pdfNumber(0.7071068, 6)).toBe('0.707107');
    expect(pdfNumber(1.5e-6, 6)).toBe('0.000002');
    expect(pdfNumber(6.123e-17, 6)).toBe('0');
  });

  it('pdfLiteral escapes backslash and parentheses and writes other bytes in octal (ISO 32000-1 §7.3.4.2)', () => {
    expect(pdfLiteral('a (b) \\')).toBe('(a \\(b\\) \\\\)');
    expect(pdfLiteral('\xb5\n')).toBe('(\\265\\012)');
  });

  it('pdfTextString writes UTF-16BE with a byte-order mark; hex4 pads to four digits', () => {
    expect(pdfTextString('AΩ')).toBe('<FEFF004103A9>');
    expect(hex4(36)).toBe('0024');
  });

  it('pdfDate writes the instant in UTC and names options.date when it does not parse', () => {
    expect(pdfDate('2026-12-02T10:30:05+02:00')).toBe('D:20261202083005Z');
    expect(() => pdfDate('the second of December')).toThrow(
      /^options\.date: expected an ISO date, got "the second of December"$/,
    );
  });
});
