import { describe, expect, it } from 'vitest';
import type { Box } from '../../../src/plot/geometry.ts';
import { pdfOfPages } from '../../../src/plot/pdf.ts';
import { pageContentOf, type PagePlacement } from '../../../src/plot/pdf/pageContent.ts';
import { createPdfWriter } from '../../../src/plot/pdf/pdfWriter.ts';
import { createStandardFont } from '../../../src/plot/pdf/standardFont.ts';
import type { Drawing } from '../../../src/plot/svg.ts';
import { entry, pagesOf, readPdf } from './pdfReader.ts';

const PAGE_HEIGHT = 792;

// A drawing in two halves: a line and a label in each, a hatch in the right one, a frame round both.
const halves: Drawing = {
  width: 400,
  height: 200,
  fontFamily: 'DejaVu Sans',
  title: 'Two halves',
  description: 'A line and a label in each half, a hatch in the right one, a frame round both.',
  patterns: [{ id: 'h1', colour: '#D55E00', angle: 45, spacing: 6, strokeWidth: 1, cross: false }],
  layers: [
    {
      name: 'shapes',
      items: [
        { type: 'rect', role: 'frame', x: 0, y: 0, width: 400, height: 200, fill: 'none', stroke: '#333333' },
        { type: 'path', role: 'left-line', d: 'M20,50L180,50', stroke: '#0072B2', strokeWidth: 2, fill: 'none' },
        { type: 'path', role: 'right-line', d: 'M220,150L380,150', stroke: '#0072B2', strokeWidth: 2, fill: 'none' },
        { type: 'path', role: 'region', d: 'M250,20L350,20L350,80L250,80Z', patternId: 'h1', stroke: 'none' },
      ],
    },
    {
      name: 'labels',
      items: [
        { type: 'text', role: 'label', x: 100, y: 100, text: 'left half', size: 10, anchor: 'middle', fill: '#1a1a1a' },
        {
          type: 'text',
          role: 'label',
          x: 300,
          y: 100,
          text: 'right half',
          size: 10,
          anchor: 'middle',
          fill: '#1a1a1a',
        },
      ],
    },
  ],
};

// The right half, shown 1.5 times its size in a 300 × 300 pt box 100 pt from the page's top-left corner.
const rightHalf: Box = { x: 200, y: 0, width: 200, height: 200 };
const tile: PagePlacement = { drawing: halves, x: 100, y: 100, width: 300, height: 300, window: rightHalf };

// Accepts placements; their page's content stream, drawn with the standard faces on a Letter-high page.
function contentOf(placements: PagePlacement[]): string {
  const fonts = { normal: createStandardFont('F1', 'normal'), bold: createStandardFont('F2', 'bold') };
  return pageContentOf(placements, { writer: createPdfWriter(), fonts, pageHeight: PAGE_HEIGHT }).content;
}

// Accepts a content stream; the operands of its first `cm` as a function from drawing px to page points.
function placementOf(content: string): (x: number, y: number) => [number, number] {
  const [a, b, c, d, e, f] = /^q\n([-\d. ]+) cm\n/.exec(content)![1].split(' ').map(Number);
  return (x, y) => [a * x + c * y + e, b * x + d * y + f];
}

describe('pageContentOf', () => {
  it('places a drawing without a window as it always has: scaled whole into its box, clipped to the drawing', () => {
    expect(contentOf([{ drawing: halves, x: 100, y: 100, width: 300, height: 150 }])).toBe(
      [
        'q',
        '0.75 0 0 -0.75 100 692 cm',
        '0 0 400 200 re W n',
        '1 1 1 rg',
        '0 0 400 200 re f',
        '4 M',
        'q\n0.2 0.2 0.2 RG 1 w\n0 0 400 200 re\nS\nQ',
        'q\n0 0.447 0.698 RG 2 w\n20 50 m 180 50 l\nS\nQ',
        'q\n0 0.447 0.698 RG 2 w\n220 150 m 380 150 l\nS\nQ',
        'q\n/Pattern cs /P1 scn\n250 20 m 350 20 l 350 80 l 250 80 l h\nf\nQ',
        'BT /F1 10 Tf 0.102 0.102 0.102 rg 1 0 0 -1 80.842 100 Tm (left half) Tj ET',
        'BT /F1 10 Tf 0.102 0.102 0.102 rg 1 0 0 -1 277.28 100 Tm (right half) Tj ET',
        'Q',
      ].join('\n'),
    );
  });

  it('draws a window that is the whole drawing exactly as no window', () => {
    const whole = { drawing: halves, x: 100, y: 100, width: 300, height: 150 };
    expect(contentOf([{ ...whole, window: { x: 0, y: 0, width: 400, height: 200 } }])).toBe(contentOf([whole]));
  });

  it('maps a window onto its box, corner to corner, and clips and whitens the window alone', () => {
    const content = contentOf([tile]);
    const toPage = placementOf(content);
    // Page points are y-up: the box's top edge is 100 pt below the page's top.
    expect(toPage(rightHalf.x, rightHalf.y)).toEqual([100, PAGE_HEIGHT - 100]);
    expect(toPage(rightHalf.x + rightHalf.width, rightHalf.y + rightHalf.height)).toEqual([400, PAGE_HEIGHT - 400]);
    expect(content.split('\n').slice(2, 5)).toEqual(['200 0 200 200 re W n', '1 1 1 rg', '200 0 200 200 re f']);
  });

  it('writes only what can show in a window: the right half’s line, hatch and label and the frame, not the left half’s', () => {
    const content = contentOf([tile]);
    expect(content).toContain('220 150 m 380 150 l');
    expect(content).toContain('250 20 m 350 20 l 350 80 l 250 80 l h');
    expect(content).toContain('(right half) Tj');
    expect(content).toContain('0 0 400 200 re\nS');
    expect(content).not.toContain('20 50 m 180 50 l');
    expect(content).not.toContain('(left half)');
  });

  it('keeps a label that starts outside the window but reaches into it', () => {
    const straddling: Drawing = {
      ...halves,
      patterns: [],
      layers: [
        {
          name: 'labels',
          items: [
            { type: 'text', role: 'label', x: 190, y: 100, text: 'seam', size: 10, anchor: 'start', fill: '#1a1a1a' },
          ],
        },
      ],
    };
    expect(contentOf([{ ...tile, drawing: straddling }])).toContain('(seam) Tj');
  });

  it('rejects a window with no area, naming the side', () => {
    expect(() => contentOf([{ ...tile, window: { ...rightHalf, height: 0 } }])).toThrow(
      /^window\.height: expected a size in px greater than 0, got "0"$/,
    );
  });
});

describe('pdfOfPages with a window', () => {
  it('turns a hatch in a window by the window’s transform, so it lines up with the shape it fills', async () => {
    const file = readPdf(await pdfOfPages([[tile]], { paper: 'letter', orientation: 'portrait' }));
    const [page] = pagesOf(file);
    const pattern = entry(file, /\/Pattern << ([^>]*) >>/.exec(page.body)![1], 'P1');
    const [a, b, c, d, e, f] = /\/Matrix \[([^\]]+)\]/.exec(pattern.body)![1].split(' ').map(Number);
    // rotate(45°) then 1.5 pt per px, flipped, with the window's left edge (200 px) on the box's (100 pt).
    const k = 1.5 * Math.SQRT1_2;
    expect([a, b, c, d]).toEqual([k, -k, -k, -k].map((v) => Number(v.toFixed(6))));
    expect([e, f]).toEqual([100 - 200 * 1.5, PAGE_HEIGHT - 100]);
  });
});
