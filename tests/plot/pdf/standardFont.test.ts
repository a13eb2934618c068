import { describe, expect, it } from 'vitest';
import { createStandardFont } from '../../../src/plot/pdf/standardFont.ts';
import { createPdfWriter } from '../../../src/plot/pdf/pdfWriter.ts';
import { textWidth } from '../../../src/plot/textWidth.ts';

describe('createStandardFont', () => {
  it('has the expected defaults: WinAnsi bytes for Latin-1 and the 0x80–0x9f block (ISO 32000-1 Annex D.2)', () => {
    const font = createStandardFont('F1', 'normal');
    expect(font.name).toBe('F1');
    expect(font.encode('A µ °').operand).toBe('(A \\265 \\260)');
    expect(font.encode('– — • € ’').operand).toBe('(\\226 \\227 \\225 \\200 \\222)');
  });

  it('spells out engineering symbols WinAnsi lacks, prints "?" for the rest, and measures what it prints', () => {
    const font = createStandardFont('F2', 'bold');
    const { operand, advance } = font.encode('R ≥ 2 Ω ж');
    expect(operand).toBe('(R >= 2 Ohm ?)');
    expect(advance).toBeCloseTo(textWidth('R >= 2 Ohm ?', 1, 'bold'), 12);
  });

  it('prints a letter typed as a base and a combining accent as its accented letter (Unicode NFC), and drops an accent with no composed form', () => {
    const font = createStandardFont('F1', 'normal');
    expect(font.encode('Jose\u0301 Nun\u0303ez').operand).toBe(font.encode('José Nuñez').operand);
    expect(font.encode('Jose\u0301').operand).toBe('(Jos\\351)');
    expect(font.encode('Jose\u0301').advance).toBeCloseTo(textWidth('José', 1), 12);
    expect(font.encode('q\u0307').operand).toBe('(q)');
  });

  it('writes a Type1 font dictionary only once referenced', () => {
    const writer = createPdfWriter();
    const font = createStandardFont('F2', 'bold');
    font.write(writer);
    const root = writer.reserve();
    const id = font.reference(writer);
    expect(font.reference(writer)).toBe(id);
    font.write(writer);
    writer.object(root, '<< /Type /Catalog >>');
    const info = writer.reserve();
    writer.object(info, '<< >>');
    expect(Buffer.from(writer.finish(root, info)).toString('latin1')).toContain(
      `${id} 0 obj\n<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica-Bold /Encoding /WinAnsiEncoding >>`,
    );
  });
});
