/** Column alignment: numbers right, words left. */
export type Align = 'left' | 'right';

/** How `formatTable` fits a table into a width. */
export interface TableFit {
  /** Widest line allowed, in characters (e.g. 120 for a terminal or a pasted report). */
  maxWidth: number;
  /** The column whose cells wrap onto more lines to make the table fit; the others keep their width. */
  wrapColumn: number;
  /** Narrowest the wrapped column may become, in characters. @default 20 */
  minWrapWidth?: number;
}

/**
 * Lays out rows as a plain-text table with a header and a rule, columns padded to their widest cell.
 * With `fit`, the wrap column is narrowed so no line exceeds `fit.maxWidth` (unless the other columns
 * alone are wider) and its cells continue on the following lines, the other cells left blank there.
 * Used by the CLI for fault and findings tables; output pastes cleanly into reports.
 *
 * @example formatTable(['bus', 'kA'], [['SWBD', '29.8']], ['left', 'right'])
 * @example formatTable(headers, rows, [], { maxWidth: 120, wrapColumn: 1 })
 */
export function formatTable(headers: string[], rows: string[][], align: Align[] = [], fit?: TableFit): string {
  const widths = headers.map((header, c) => Math.max(header.length, ...rows.map((row) => (row[c] ?? '').length)));
  if (fit) {
    const { maxWidth, wrapColumn, minWrapWidth = 20 } = fit;
    const others = widths.reduce((sum, w, c) => (c === wrapColumn ? sum : sum + w), 0) + 2 * (widths.length - 1);
    widths[wrapColumn] = Math.min(widths[wrapColumn], Math.max(minWrapWidth, maxWidth - others));
  }
  const line = (cells: string[]) =>
    cells
      .map((cell, c) => (align[c] === 'right' ? cell.padStart(widths[c]) : cell.padEnd(widths[c])))
      .join('  ')
      .trimEnd();
  const lines = (row: string[]) => {
    if (!fit) return [line(row)];
    const wrapped = wrapText(row[fit.wrapColumn] ?? '', widths[fit.wrapColumn]);
    return wrapped.map((part, i) => line(row.map((cell, c) => (c === fit.wrapColumn ? part : i === 0 ? cell : ''))));
  };
  return [line(headers), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.flatMap(lines)].join('\n');
}

/**
 * Breaks text into lines of at most `width` characters at spaces; a word longer than `width` is cut.
 * Always returns at least one line.
 *
 * @example wrapText('Main over feeder: thin margin', 12) // ['Main over', 'feeder: thin', 'margin']
 */
export function wrapText(text: string, width: number): string[] {
  if (!(width >= 1)) throw new RangeError(`expected a width of at least 1, got "${width}"`);
  const lines: string[] = [];
  let current = '';
  for (let word of text.split(/\s+/).filter(Boolean)) {
    while (word.length > width) {
      if (current) lines.push(current);
      current = '';
      lines.push(word.slice(0, width));
      word = word.slice(width);
    }
    if (!current) current = word;
    else if (current.length + 1 + word.length <= width) current += ` ${word}`;
    else {
      lines.push(current);
      current = word;
    }
  }
  if (current || lines.length === 0) lines.push(current);
  return lines;
}

/** Amps for a table: whole amps grouped by spaces, three figures below 10 A; "—" for nothing, "∞" for unbounded. @example tableAmps(28421.1) // "28 421" */
export function tableAmps(amps: number | undefined): string {
  if (amps === undefined) return '—';
  if (amps === Infinity) return '∞';
  // A relay's secondary currents and the smallest pickups are fractions of an ampere: three figures, not 0.
  if (amps > 0 && amps < 10) return String(Number(amps.toPrecision(3)));
  return Math.round(amps)
    .toString()
    .replace(/\B(?=(\d{3})+(?!\d))/g, ' ');
}
