/** Column alignment: numbers right, words left. */
export type Align = 'left' | 'right';

/**
 * Lays out rows as a plain-text table with a header and a rule, columns padded to their widest cell.
 * Used by the CLI for fault and findings tables; output pastes cleanly into reports.
 *
 * @example formatTable(['bus', 'kA'], [['SWBD', '29.8']], ['left', 'right'])
 */
export function formatTable(headers: string[], rows: string[][], align: Align[] = []): string {
  const widths = headers.map((header, c) => Math.max(header.length, ...rows.map((row) => (row[c] ?? '').length)));
  const line = (cells: string[]) =>
    cells
      .map((cell, c) => (align[c] === 'right' ? cell.padStart(widths[c]) : cell.padEnd(widths[c])))
      .join('  ')
      .trimEnd();
  return [line(headers), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}

/** Amps for a table: whole amps grouped by spaces; "—" for nothing, "∞" for unbounded. @example tableAmps(28421.1) // "28 421" */
export function tableAmps(amps: number | undefined): string {
  if (amps === undefined) return '—';
  if (amps === Infinity) return '∞';
  return Math.round(amps)
    .toString()
    .replace(/\B(?=(\d{3})+(?!\d))/g, ' ');
}
