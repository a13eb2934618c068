/** The study details a person edits, in the order they are asked for (the study file's top-level fields). */
export const STUDY_DETAIL_FIELDS = [
  { key: 'name', label: 'name', multiline: false },
  { key: 'site', label: 'site', multiline: false },
  { key: 'client', label: 'client', multiline: false },
  { key: 'date', label: 'date', multiline: false },
  { key: 'preparedBy', label: 'prepared by', multiline: false },
  { key: 'checkedBy', label: 'checked by', multiline: false },
  { key: 'description', label: 'description', multiline: true },
  { key: 'notes', label: 'notes', multiline: true },
] as const;

/** One row of the revision log as written in the file. */
export interface RevisionRow {
  revision?: string;
  date?: string;
  by?: string;
  description?: string;
}

/**
 * The revision log of a study document as written (rows that are not objects are skipped, so a
 * half-typed file still shows what it has).
 * @example revisionsOf({ revisions: [{ revision: 'A' }] }) // [{ revision: 'A' }]
 */
export function revisionsOf(document: unknown): RevisionRow[] {
  const list = (document as { revisions?: unknown } | null)?.revisions;
  if (!Array.isArray(list)) return [];
  return list.map((row) => (row !== null && typeof row === 'object' ? (row as RevisionRow) : {}));
}

/**
 * The mark of the next revision: one past the last letter (A, B, … Z, then AA) or number (1, 2, …);
 * "A" for the first.
 * @example nextRevisionMark([{ revision: 'B' }]) // 'C'
 */
export function nextRevisionMark(revisions: RevisionRow[]): string {
  const last = revisions.at(-1)?.revision?.trim() ?? '';
  if (last === '') return 'A';
  if (/^\d+$/.test(last)) return String(Number(last) + 1);
  if (/^[A-Y]$/i.test(last)) return String.fromCharCode(last.charCodeAt(0) + 1).toUpperCase();
  return `${last}A`;
}
