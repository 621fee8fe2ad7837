import Papa from 'papaparse';
import { type FieldIssue, validationFailed } from '../common/errors/app-error.js';
import { parseTarget, type TargetColumns, type TargetField } from './target-values.js';

/** The import's columns, in the order of the header the editor offers. */
export const CSV_COLUMNS = [
  'name',
  'ra',
  'dec',
  'extent_arcsec',
  'flux_mjy',
  'rest_ghz',
  'velocity_km_s',
  'convention',
  'redshift',
] as const;
export type CsvColumn = (typeof CSV_COLUMNS)[number];
const REQUIRED: CsvColumn[] = ['name', 'ra', 'dec'];
export const MAX_CSV_ROWS = 1000;

const COLUMN_OF: Record<TargetField, CsvColumn> = {
  name: 'name',
  ra: 'ra',
  dec: 'dec',
  extentArcsec: 'extent_arcsec',
  fluxDensityMJy: 'flux_mjy',
  restGHz: 'rest_ghz',
  velocityKmS: 'velocity_km_s',
  convention: 'convention',
  redshift: 'redshift',
};

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

export interface CsvRowError {
  /** A column of the header, or `row` for a row that cannot be read as a whole. */
  column: CsvColumn | 'row';
  message: string;
}

export interface CsvRow {
  /** The row's first line in the file (the header is line 1). */
  line: number;
  /** The row's cells by column, as written (trimmed). */
  cells: Partial<Record<CsvColumn, string>>;
  values: TargetColumns | null;
  /** What could be read of the row, errors or not (for the preview). */
  read: Partial<TargetColumns>;
  errors: CsvRowError[];
}

/**
 * Reads a target list (papaparse, RFC 4180 quoting) with the header CSV_COLUMNS in any order
 * and case; only name, ra and dec are required. Rows are checked one by one with the form's own
 * rules. A header that cannot be used is a 400 on `csv`; a bad row is only marked.
 */
export function parseTargetCsv(text: string): CsvRow[] {
  const csv = text.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
  const records: { data: string[]; cursor: number; errors: string[] }[] = [];
  Papa.parse<string[]>(csv, {
    header: false,
    skipEmptyLines: 'greedy',
    step: (r) =>
      records.push({ data: r.data, cursor: r.meta.cursor, errors: r.errors.map((e) => e.message) }),
  });
  const [head, ...body] = records;
  if (!head) throw csvIssue('The CSV is empty: it needs a header line and a row per target');
  const header = head.data.map((h) => h.trim().toLowerCase());
  const unknown = header.filter((h) => !(CSV_COLUMNS as readonly string[]).includes(h));
  if (unknown.length)
    throw csvIssue(
      `Unknown column${unknown.length > 1 ? 's' : ''} ${unknown.map((u) => `"${u}"`).join(', ')}; the columns are ${CSV_COLUMNS.join(', ')}`,
    );
  const missing = REQUIRED.filter((c) => !header.includes(c));
  if (missing.length) throw csvIssue(`The header lacks ${missing.join(', ')}`);
  const twice = header.filter((h, i) => header.indexOf(h) !== i);
  if (twice.length) throw csvIssue(`Column ${twice[0]} appears twice in the header`);
  if (body.length === 0) throw csvIssue('The CSV has a header but no target');
  if (body.length > MAX_CSV_ROWS)
    throw csvIssue(`The CSV has ${body.length} rows; import at most ${MAX_CSV_ROWS} at a time`);

  // Line numbers: count newlines up to each row's end, less those inside its quoted cells.
  let counted = 0;
  let newlines = 0;
  return body.map((record) => {
    for (; counted < record.cursor; counted++) if (csv.charCodeAt(counted) === 10) newlines++;
    const endsLine = csv.charCodeAt(record.cursor - 1) === 10;
    const inside = record.data.reduce((n, cell) => n + (cell.split('\n').length - 1), 0);
    const line = newlines + (endsLine ? 0 : 1) - inside;
    return readRow(line, header as CsvColumn[], record.data, record.errors);
  });
}

function readRow(line: number, header: CsvColumn[], data: string[], parseErrors: string[]): CsvRow {
  const errors: CsvRowError[] = parseErrors.map((message) => ({ column: 'row', message }));
  if (data.length > header.length)
    errors.push({
      column: 'row',
      message: `The row has ${data.length} cells; the header has ${header.length} columns`,
    });
  const cells: Partial<Record<CsvColumn, string>> = {};
  header.forEach((column, i) => {
    cells[column] = (data[i] ?? '').trim();
  });
  const text = (c: CsvColumn) => cells[c] ?? '';
  const number = (c: CsvColumn): number | null => {
    const cell = text(c);
    if (cell === '') return null;
    if (!NUMBER.test(cell)) {
      errors.push({ column: c, message: `${c} must be a number, got "${cell}"` });
      return null;
    }
    return Number(cell);
  };
  const fields = {
    name: text('name'),
    ra: text('ra'),
    dec: text('dec'),
    extentArcsec: number('extent_arcsec'),
    fluxDensityMJy: number('flux_mjy'),
    restGHz: number('rest_ghz'),
    velocityKmS: number('velocity_km_s'),
    convention: text('convention') === '' ? null : text('convention'),
    redshift: number('redshift'),
  };
  const { values, read, issues } = parseTarget(fields, (field) => COLUMN_OF[field]);
  errors.push(...issues.map((i) => ({ column: i.path as CsvColumn, message: i.message })));
  return { line, cells, values: errors.length ? null : values, read, errors };
}

const csvIssue = (message: string) =>
  validationFailed([{ path: 'csv', message } satisfies FieldIssue], message);
