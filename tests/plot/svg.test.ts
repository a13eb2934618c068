import { JSDOM } from 'jsdom';
import { describe, expect, it } from 'vitest';
import { sheetOf } from '../../src/plot/sheet.ts';
import { escapeXml, svgOf } from '../../src/plot/svg.ts';
import { fixtureInput } from './fixtures.ts';

const { DOMParser } = new JSDOM('').window;
const parse = (svg: string) => new DOMParser().parseFromString(svg, 'image/svg+xml');
const HOSTILE = '<script>alert("x")</script> & \'q\'';

describe('svgOf', () => {
  it('has the expected defaults', () => {
    const svg = svgOf(sheetOf(fixtureInput()));
    expect(
      svg.startsWith(
        '<svg xmlns="http://www.w3.org/2000/svg" width="960" height="720" viewBox="0 0 960 720" font-family="DejaVu Sans, Arial, Helvetica, sans-serif"',
      ),
    ).toBe(true);
    expect(svg).toContain('<title>Relay over LV breaker, 480 V base</title>');
  });

  it('svgOf writes SVG that parses as XML with no parsererror', () => {
    const doc = parse(svgOf(sheetOf(fixtureInput())));
    expect(doc.getElementsByTagName('parsererror')).toHaveLength(0);
    expect(doc.documentElement.tagName).toBe('svg');
    expect(doc.querySelectorAll('pattern')).toHaveLength(1);
    expect(doc.querySelectorAll('[data-role="band-fill"]')).toHaveLength(2);
    expect(doc.querySelectorAll('[data-role="withstand"][stroke-dasharray="7 4"]').length).toBeGreaterThan(0);
  });

  it('svgOf is deterministic: the same sheet gives the same bytes', () => {
    expect(svgOf(sheetOf(fixtureInput()))).toBe(svgOf(sheetOf(fixtureInput())));
  });

  it('svgOf escapes hostile names in every text slot', () => {
    const base = fixtureInput();
    const input = fixtureInput({
      study: HOSTILE,
      view: HOSTILE,
      title: HOSTILE,
      preparedBy: HOSTILE,
      date: HOSTILE,
      notes: HOSTILE,
      caution: HOSTILE,
      bands: base.bands.map((b) => ({ ...b, id: HOSTILE + b.id, label: HOSTILE })),
      withstand: base.withstand.map((w) => ({
        ...w,
        id: HOSTILE,
        label: HOSTILE,
        curve: { ...w.curve, label: HOSTILE },
      })),
      starting: base.starting.map((s) => ({ ...s, id: `${HOSTILE}m`, label: HOSTILE })),
      markers: base.markers.map((m) => ({ ...m, label: HOSTILE, elementId: HOSTILE })),
      faultLines: base.faultLines.map((f) => ({ ...f, label: HOSTILE, busId: HOSTILE })),
      regions: base.regions.map((r) => ({ ...r, label: HOSTILE, findingId: HOSTILE })),
    });
    const svg = svgOf(sheetOf(input, { width: 1400, height: 1000 }));
    expect(svg).not.toContain('<script');
    expect(svg).not.toContain('"x")');
    const doc = parse(svg);
    expect(doc.getElementsByTagName('parsererror')).toHaveLength(0);
    expect(doc.getElementsByTagName('script')).toHaveLength(0);
    const texts = [...doc.querySelectorAll('text, title, desc')].map((t) => t.textContent ?? '');
    // Title, description, title block (study, view, date, prepared by, notes), caution, legend and plot labels all carry it back intact.
    const whole = texts.filter((t) => t.includes('<script>')).length;
    expect(whole).toBeGreaterThanOrEqual(10);
    for (const id of [...doc.querySelectorAll('[data-id]')].map((e) => e.getAttribute('data-id')))
      expect(id).not.toBeNull();
  });

  it('escapeXml drops what XML 1.0 forbids: vertical tab, NUL, U+FFFE/U+FFFF, lone surrogates', () => {
    expect(escapeXml('a\u000bb\u0000c\uFFFEd\uFFFFe\uD800f\tg')).toBe('abcdef\tg');
    expect(escapeXml('\u{1F600}')).toBe('\u{1F600}');
  });

  it('escapeXml escapes &, <, >, and both quotes', () => {
    expect(escapeXml('<a href="x">Tom & Jerry\'s</a>')).toBe(
      '&lt;a href=&quot;x&quot;&gt;Tom &amp; Jerry&apos;s&lt;/a&gt;',
    );
  });
});
